/**
 * The pieces of one cut cell, assembled from its slices (convex parts, one per trapezoid
 * of the sweep). Slices that touch along a horizontal line are one piece. A cell holding
 * several pieces (a column splitting the tile) is still one cut tile: the pieces are cut
 * from one tile, and the cell's size is that of its thinnest piece, since that is the one
 * that breaks off.
 */
import type { CutKind } from '../types';

/** Convex part of a cell: left and right sides as flat point lists from bottom to top. */
export interface Slice {
  ys: number;
  ye: number;
  area: number;
  left: number[];
  right: number[];
}

export interface CellAnalysis {
  /** Shorter side of the bounding box of the cell's thinnest piece. */
  size: number;
  kind: CutKind;
  /** For straight cuts: the width of the kept part across the cut. */
  keptMm: number;
  pieces: number;
  /** Piece outlines (flat x, y lists), only when geometry was asked for. */
  rings: number[][];
}

/** Pieces under this area (mm²) are specks of the 1 mm² tolerance, not pieces. */
const SPECK_MM2 = 1;
const EPS = 1e-7;

/** Slices smaller than this (mm²) are floating-point dust (a grid line a femtometre off a wall). */
const DUST_MM2 = 1e-6;

function find(parent: Int32Array, i: number): number {
  while (parent[i] !== i) i = parent[i] = parent[parent[i]];
  return i;
}

export function analyseCell(
  all: Slice[],
  c0: number,
  r0: number,
  p: number,
  geometry: boolean,
): CellAnalysis {
  const slices: Slice[] = [];
  for (const s of all) if (s.area >= DUST_MM2) slices.push(s);
  slices.sort((a, b) => a.ys - b.ys || a.left[0] - b.left[0]);
  const n = slices.length;
  const parent = new Int32Array(n);
  for (let i = 0; i < n; i++) parent[i] = i;
  // up[i]: slices stacked on i; down[i]: how many slices i sits on.
  const upCount = new Int32Array(n);
  const downCount = new Int32Array(n);
  const upOf = new Int32Array(n).fill(-1);
  for (let a = 0; a < n; a++) {
    const A = slices[a];
    const aL = A.left[A.left.length - 2];
    const aR = A.right[A.right.length - 2];
    for (let b = a + 1; b < n; b++) {
      const B = slices[b];
      if (B.ys > A.ye + EPS) break;
      if (Math.abs(B.ys - A.ye) > EPS) continue;
      const overlap = Math.min(aR, B.right[0]) - Math.max(aL, B.left[0]);
      if (overlap <= EPS) continue;
      parent[find(parent, a)] = find(parent, b);
      upCount[a]++;
      downCount[b]++;
      upOf[a] = b;
    }
  }
  // Per piece: area and bounding box.
  const area = new Map<number, number[]>(); // root -> [area, minX, minY, maxX, maxY]
  for (let i = 0; i < n; i++) {
    const s = slices[i];
    const r = find(parent, i);
    let box = area.get(r);
    if (!box) area.set(r, (box = [0, Infinity, Infinity, -Infinity, -Infinity]));
    box[0] += s.area;
    for (let q = 0; q < s.left.length; q += 2) box[1] = Math.min(box[1], s.left[q]);
    for (let q = 0; q < s.right.length; q += 2) box[3] = Math.max(box[3], s.right[q]);
    box[2] = Math.min(box[2], s.ys);
    box[4] = Math.max(box[4], s.ye);
  }
  let size = Infinity;
  let biggest: number[] | null = null;
  let real = 0;
  let only: number[] | null = null;
  for (const box of area.values()) {
    if (!biggest || box[0] > biggest[0]) biggest = box;
    if (box[0] < SPECK_MM2) continue;
    real++;
    only = box;
    size = Math.min(size, box[3] - box[1], box[4] - box[2]);
  }
  if (real === 0 && biggest) {
    size = Math.min(biggest[3] - biggest[1], biggest[4] - biggest[2]);
    only = biggest;
    real = 1;
  }
  let kind: CutKind = 'shaped';
  let keptMm = 0;
  if (real === 1 && only) {
    kind = straightKind(only, c0, r0, p);
    if (kind === 'left-part' || kind === 'right-part') keptMm = only[3] - only[1];
    else if (kind !== 'shaped') keptMm = only[4] - only[2];
  }
  const rings = geometry ? buildRings(slices, upCount, downCount, upOf) : [];
  return { size, kind, keptMm, pieces: real, rings };
}

/** A rectangle spanning the tile one way and touching one side is a straight cut. */
function straightKind(box: number[], c0: number, r0: number, p: number): CutKind {
  const [a, minX, minY, maxX, maxY] = box;
  const w = maxX - minX;
  const h = maxY - minY;
  if (Math.abs(a - w * h) > SPECK_MM2) return 'shaped';
  const tol = 1e-6 * Math.max(1, p);
  const spansY = Math.abs(minY - r0) < tol && Math.abs(maxY - (r0 + p)) < tol;
  const spansX = Math.abs(minX - c0) < tol && Math.abs(maxX - (c0 + p)) < tol;
  if (spansY && !spansX) {
    if (Math.abs(minX - c0) < tol) return 'left-part';
    if (Math.abs(maxX - (c0 + p)) < tol) return 'right-part';
  } else if (spansX && !spansY) {
    if (Math.abs(minY - r0) < tol) return 'bottom-part';
    if (Math.abs(maxY - (r0 + p)) < tol) return 'top-part';
  }
  return 'shaped';
}

/**
 * Outlines for the plan: slices stacked one-on-one are merged into one y-monotone ring
 * (left side up, right side down); where a piece forks, a new ring starts, so a forked
 * piece is drawn as adjoining rings.
 */
function buildRings(
  slices: Slice[],
  upCount: Int32Array,
  downCount: Int32Array,
  upOf: Int32Array,
): number[][] {
  const n = slices.length;
  const used = new Uint8Array(n);
  const rings: number[][] = [];
  for (let i = 0; i < n; i++) {
    if (used[i]) continue;
    const left: number[] = [];
    const right: number[] = [];
    let s = i;
    for (;;) {
      used[s] = 1;
      appendChain(left, slices[s].left);
      appendChain(right, slices[s].right);
      const up = upOf[s];
      if (upCount[s] !== 1 || up < 0 || downCount[up] !== 1 || used[up]) break;
      s = up;
    }
    const ring = left.slice();
    for (let q = right.length - 2; q >= 0; q -= 2) ring.push(right[q], right[q + 1]);
    rings.push(dedupeRing(ring));
  }
  return rings;
}

function appendChain(into: number[], pts: number[]): void {
  for (let q = 0; q < pts.length; q += 2) {
    const n = into.length;
    if (n >= 2 && Math.abs(into[n - 2] - pts[q]) < EPS && Math.abs(into[n - 1] - pts[q + 1]) < EPS)
      continue;
    into.push(pts[q], pts[q + 1]);
  }
}

function dedupeRing(ring: number[]): number[] {
  const out: number[] = [];
  for (let q = 0; q < ring.length; q += 2) {
    const n = out.length;
    if (n >= 2 && Math.abs(out[n - 2] - ring[q]) < EPS && Math.abs(out[n - 1] - ring[q + 1]) < EPS)
      continue;
    out.push(ring[q], ring[q + 1]);
  }
  if (
    out.length >= 4 &&
    Math.abs(out[0] - out[out.length - 2]) < EPS &&
    Math.abs(out[1] - out[out.length - 1]) < EPS
  ) {
    out.length -= 2;
  }
  return out;
}
