/**
 * Scanline tiling of a region: for each row band of the grid, the region's trapezoids (see
 * geometry/sweep.ts) are spread over the columns. Columns that a trapezoid covers from side
 * to side get its height × pitch through a difference array (O(1) per trapezoid); only the
 * columns its slanted sides pass through get an exact "slice" (trapezoid ∩ column strip,
 * integrated analytically). Work is O(rows + cells + slices), i.e. linear in the tiles, and
 * no tile is clipped against the whole floor.
 */
import { floorRule, Sweeper, type EdgeSet } from '../geometry/sweep';
import { analyseCell, type CellAnalysis, type Slice } from './pieces';

/** Overlap tolerance of the definitions: within 1 mm² of the tile is full, above 1 mm² is cut. */
export const AREA_TOL_MM2 = 1;

export interface RasterOptions {
  ox: number;
  oy: number;
  pitch: number;
  /** Keep full-tile runs and the rings of cut pieces (for the plan). */
  geometry: boolean;
}

export interface CutCell extends CellAnalysis {
  i: number;
  j: number;
  area: number;
}

export interface RasterResult {
  full: number;
  cut: number;
  /** Area of the region, mm². */
  area: number;
  smallest: number;
  /** Triples [iStart, iEnd (exclusive), j]. Empty unless `geometry`. */
  fullRuns: number[];
  cutCells: CutCell[];
}

const SLICE_STRIDE = 18;

/** Lays the grid over the region selected by {@link floorRule} and classifies every cell. */
export function rasterize(es: EdgeSet, opt: RasterOptions): RasterResult {
  const { ox, oy, pitch: p, geometry } = opt;
  const res: RasterResult = {
    full: 0,
    cut: 0,
    area: 0,
    smallest: Infinity,
    fullRuns: [],
    cutCells: [],
  };
  if (es.n === 0) return res;
  const sweeper = new Sweeper(es, floorRule);
  const ev = es.events;
  let evPtr = 0;
  const jMin = Math.floor((es.minY - oy) / p);
  const jMax = Math.floor((es.maxY - oy) / p);
  const fullTol = p * p - AREA_TOL_MM2;

  const traps: number[] = []; // ya, yb, xLa, xLb, xRa, xRb
  const sink = (ya: number, yb: number, xLa: number, xLb: number, xRa: number, xRb: number) => {
    traps.push(ya, yb, xLa, xLb, xRa, xRb);
  };
  let cover = new Float64Array(64);
  let diff = new Float64Array(64);
  const slices: number[] = [];
  const ranges: number[] = []; // kF0, kF1, ya, yb
  let bucketStart = new Int32Array(64);
  let bucketIdx = new Int32Array(64);

  for (let j = jMin; j <= jMax; j++) {
    const Y0 = oy + j * p;
    const Y1 = oy + (j + 1) * p;
    traps.length = 0;
    while (evPtr < ev.length && ev[evPtr] <= Y0) evPtr++;
    let ya = Y0;
    while (evPtr < ev.length && ev[evPtr] < Y1) {
      const yb = ev[evPtr++];
      if (yb > ya) sweeper.slab(ya, yb, sink);
      ya = yb;
    }
    if (Y1 > ya) sweeper.slab(ya, Y1, sink);
    if (traps.length === 0) continue;

    // Column span of this row.
    let cMin = Infinity;
    let cMax = -Infinity;
    for (let t = 0; t < traps.length; t += 6) {
      const lo = Math.floor((Math.min(traps[t + 2], traps[t + 3]) - ox) / p);
      const hi = Math.floor((Math.max(traps[t + 4], traps[t + 5]) - ox) / p);
      if (lo < cMin) cMin = lo;
      if (hi > cMax) cMax = hi;
    }
    const width = cMax - cMin + 1;
    if (cover.length < width + 2) {
      cover = new Float64Array(2 * width + 2);
      diff = new Float64Array(2 * width + 2);
      bucketStart = new Int32Array(2 * width + 3);
    }
    cover.fill(0, 0, width + 1);
    diff.fill(0, 0, width + 1);
    slices.length = 0;
    ranges.length = 0;

    for (let t = 0; t < traps.length; t += 6) {
      const ta = traps[t];
      const tb = traps[t + 1];
      const xLa = traps[t + 2];
      const xLb = traps[t + 3];
      const xRa = traps[t + 4];
      const xRb = traps[t + 5];
      const h = tb - ta;
      res.area += (h * (xRa - xLa + (xRb - xLb))) / 2;
      const maxL = Math.max(xLa, xLb);
      const minR = Math.min(xRa, xRb);
      const kF0 = Math.ceil((maxL - ox) / p);
      const kF1 = Math.floor((minR - ox) / p) - 1;
      const hasFull = kF1 >= kF0;
      if (hasFull) {
        diff[kF0 - cMin] += h * p;
        diff[kF1 + 1 - cMin] -= h * p;
        ranges.push(kF0, kF1, ta, tb);
      }
      const kP0 = Math.floor((Math.min(xLa, xLb) - ox) / p);
      const kP1 = Math.floor((Math.max(xRa, xRb) - ox) / p);
      for (let k = kP0; k <= kP1; k++) {
        if (hasFull && k === kF0) {
          k = kF1;
          continue;
        }
        const c0 = ox + k * p;
        const before = slices.length;
        const a = cutSlice(slices, k, c0, c0 + p, ta, tb, xLa, xLb, xRa, xRb);
        if (a > 0) cover[k - cMin] += a;
        else slices.length = before;
      }
    }
    let run = 0;
    for (let t = 0; t < width; t++) {
      run += diff[t];
      cover[t] += run;
    }

    // Bucket slices by column so a cut cell finds its own quickly.
    const nSlices = slices.length / SLICE_STRIDE;
    bucketStart.fill(0, 0, width + 2);
    for (let s = 0; s < nSlices; s++) bucketStart[slices[s * SLICE_STRIDE] - cMin + 1]++;
    for (let t = 0; t < width + 1; t++) bucketStart[t + 1] += bucketStart[t];
    if (bucketIdx.length < nSlices) bucketIdx = new Int32Array(2 * nSlices);
    const fillPos = bucketStart.slice(0, width + 1);
    for (let s = 0; s < nSlices; s++) bucketIdx[fillPos[slices[s * SLICE_STRIDE] - cMin]++] = s;

    let runStart = -1;
    for (let t = 0; t <= width; t++) {
      const a = t < width ? cover[t] : 0;
      const isFull = a >= fullTol;
      if (isFull) {
        res.full++;
        if (runStart < 0) runStart = t;
      } else {
        if (runStart >= 0 && geometry) res.fullRuns.push(runStart + cMin, t + cMin, j);
        runStart = -1;
        if (a > AREA_TOL_MM2) {
          const k = t + cMin;
          const cell = collectCell(
            k,
            ox + k * p,
            p,
            slices,
            bucketIdx,
            bucketStart[t],
            bucketStart[t + 1],
            ranges,
          );
          const info = analyseCell(cell, ox + k * p, Y0, p, geometry);
          res.cut++;
          if (info.size < res.smallest) res.smallest = info.size;
          res.cutCells.push({ i: k, j, area: a, ...info });
        }
      }
    }
  }
  return res;
}

/** Gathers a cut cell's slices: its exact ones and the side-to-side rectangles. */
function collectCell(
  k: number,
  c0: number,
  p: number,
  slices: number[],
  idx: Int32Array,
  from: number,
  to: number,
  ranges: number[],
): Slice[] {
  const out: Slice[] = [];
  for (let q = from; q < to; q++) {
    const b = idx[q] * SLICE_STRIDE;
    const nL = slices[b + 4];
    const nR = slices[b + 11];
    out.push({
      ys: slices[b + 1],
      ye: slices[b + 2],
      area: slices[b + 3],
      left: slices.slice(b + 5, b + 5 + 2 * nL),
      right: slices.slice(b + 12, b + 12 + 2 * nR),
    });
  }
  for (let r = 0; r < ranges.length; r += 4) {
    if (k < ranges[r] || k > ranges[r + 1]) continue;
    const ya = ranges[r + 2];
    const yb = ranges[r + 3];
    out.push({
      ys: ya,
      ye: yb,
      area: (yb - ya) * p,
      left: [c0, ya, c0, yb],
      right: [c0 + p, ya, c0 + p, yb],
    });
  }
  return out;
}

/**
 * Appends the slice of trapezoid ∩ strip [c0, c1] × [ya, yb] to `out` and returns its area
 * (≤ 0 when empty). The slice is convex: left side max(c0, L(y)), right side min(c1, R(y)),
 * over the heights where L(y) ≤ c1 and R(y) ≥ c0; each side has at most one kink.
 * Layout: col, ys, ye, area, nL, 3 left points (x, y), nR, 3 right points.
 */
function cutSlice(
  out: number[],
  col: number,
  c0: number,
  c1: number,
  ya: number,
  yb: number,
  xLa: number,
  xLb: number,
  xRa: number,
  xRb: number,
): number {
  const h = yb - ya;
  let ys = ya;
  let ye = yb;
  // L(y) ≤ c1
  if (xLa > c1 && xLb > c1) return 0;
  if (xLa > c1) ys = Math.max(ys, ya + ((c1 - xLa) / (xLb - xLa)) * h);
  else if (xLb > c1) ye = Math.min(ye, ya + ((c1 - xLa) / (xLb - xLa)) * h);
  // R(y) ≥ c0
  if (xRa < c0 && xRb < c0) return 0;
  if (xRa < c0) ys = Math.max(ys, ya + ((c0 - xRa) / (xRb - xRa)) * h);
  else if (xRb < c0) ye = Math.min(ye, ya + ((c0 - xRa) / (xRb - xRa)) * h);
  if (!(ye > ys)) return 0;
  // Plain arithmetic, no closures: this runs once per boundary cell and slab.
  const sL = (xLb - xLa) / h;
  const sR = (xRb - xRa) / h;
  // Kinks: where L crosses c0, where R crosses c1.
  let kL = NaN;
  if ((xLa - c0) * (xLb - c0) < 0) {
    const y = ya + ((c0 - xLa) / (xLb - xLa)) * h;
    if (y > ys && y < ye) kL = y;
  }
  let kR = NaN;
  if ((xRa - c1) * (xRb - c1) < 0) {
    const y = ya + ((c1 - xRa) / (xRb - xRa)) * h;
    if (y > ys && y < ye) kR = y;
  }
  let b1 = kL;
  let b2 = kR;
  if (Number.isNaN(b1) || b2 < b1) {
    b1 = kR;
    b2 = kL;
  }
  // Exact area: the width is linear between the sorted breakpoints.
  const lxs = clampX(xLa + (ys - ya) * sL, c0, c1);
  const rxs = clampX(xRa + (ys - ya) * sR, c0, c1);
  const lxe = clampX(xLa + (ye - ya) * sL, c0, c1);
  const rxe = clampX(xRa + (ye - ya) * sR, c0, c1);
  let area = 0;
  let yPrev = ys;
  let wPrev = rxs - lxs;
  for (let q = 0; q < 3; q++) {
    const y = q === 0 ? b1 : q === 1 ? b2 : ye;
    if (!(y > yPrev)) continue;
    const wNow = clampX(xRa + (y - ya) * sR, c0, c1) - clampX(xLa + (y - ya) * sL, c0, c1);
    area += ((wPrev + wNow) * (y - yPrev)) / 2;
    yPrev = y;
    wPrev = wNow;
  }
  if (!(area > 0)) return 0;
  out.push(col, ys, ye, area);
  if (Number.isNaN(kL)) out.push(2, lxs, ys, lxe, ye, 0, 0);
  else out.push(3, lxs, ys, c0, kL, lxe, ye);
  if (Number.isNaN(kR)) out.push(2, rxs, ys, rxe, ye, 0, 0);
  else out.push(3, rxs, ys, c1, kR, rxe, ye);
  return area;
}

function clampX(x: number, c0: number, c1: number): number {
  return x < c0 ? c0 : x > c1 ? c1 : x;
}
