/**
 * Choosing where the grid starts.
 *
 * 'centre' does what installers do with a tape: find the centre lines of the room (of the
 * tiled region's bounding box) and put either a tile edge or a tile middle on each, whichever
 * leaves the wider cut at the two walls; opposite walls then get equal cuts.
 *
 * 'auto' searches offsets for the best layout: the largest smallest cut, then the fewest
 * cut tiles, then the fewest tiles out of boxes. Candidates per axis are the middles (and
 * their opposites) of the gaps between the walls' positions modulo the pitch — a grid line
 * there is as far as it can be from every wall — plus even samples; each is scored exactly
 * with the scanline tiler, by coordinate ascent starting from the centred origin, so the
 * result is never worse than 'centre'. Rotating the grid by 90° is not searched: a square
 * grid turned 90° about its origin is the same grid, so it cannot change any count.
 */
import type { EdgeSet } from '../geometry/sweep';
import type { Point } from '../types';
import { pairOffcuts } from './offcuts';
import { rasterize } from './raster';

export interface GridScore {
  smallest: number;
  cut: number;
  tiles: number;
  full: number;
}

/** Centred origin for the region (grid frame). */
export function centreOrigin(rings: Point[][], p: number): { x: number; y: number } {
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  for (const pt of rings[0] ?? []) {
    minX = Math.min(minX, pt[0]);
    maxX = Math.max(maxX, pt[0]);
    minY = Math.min(minY, pt[1]);
    maxY = Math.max(maxY, pt[1]);
  }
  return { x: centreAxis(minX, maxX, p), y: centreAxis(minY, maxY, p) };
}

function centreAxis(lo: number, hi: number, p: number): number {
  const c = (lo + hi) / 2;
  const cutAt = (o: number) => {
    const l = mod(o - lo, p);
    const r = mod(hi - o, p);
    return Math.min(l < 1e-9 ? p : l, r < 1e-9 ? p : r);
  };
  const edge = c;
  const middle = c - p / 2;
  return cutAt(middle) > cutAt(edge) + 1e-9 ? middle : edge;
}

export function mod(a: number, p: number): number {
  const r = a % p;
  return r < 0 ? r + p : r;
}

/** Exact score of a grid origin (no geometry kept). */
export function scoreOrigin(es: EdgeSet, ox: number, oy: number, p: number): GridScore {
  const r = rasterize(es, { ox, oy, pitch: p, geometry: false });
  const saved = pairOffcuts(
    r.cutCells.map((c) => ({ i: c.i, j: c.j, kind: c.kind, keptMm: c.keptMm, colour: 0 })),
    p,
  ).length;
  return { smallest: r.smallest, cut: r.cut, full: r.full, tiles: r.full + r.cut - saved };
}

/** Whether score a is better than b (larger smallest cut, then fewer cuts, then fewer tiles). */
export function better(a: GridScore, b: GridScore): boolean {
  const tol = 1e-6;
  if (a.smallest > b.smallest + tol) return true;
  if (a.smallest < b.smallest - tol) return false;
  if (a.cut !== b.cut) return a.cut < b.cut;
  return a.tiles < b.tiles;
}

/** Candidate offsets (in [0, p)) for one axis, best-first by distance from wall positions. */
function axisCandidates(coords: number[], p: number, keep: number): number[] {
  const res = [...new Set(coords.map((c) => Math.round(mod(c, p) * 1e4) / 1e4))].sort((a, b) => a - b);
  const cand: number[] = [];
  for (let k = 0; k < res.length; k++) {
    const a = res[k];
    const b = k + 1 < res.length ? res[k + 1] : res[0] + p;
    const mid = (a + b) / 2;
    cand.push(mod(mid, p), mod(mid + p / 2, p));
  }
  for (let s = 0; s < 8; s++) cand.push((s * p) / 8);
  // Rank by the distance from the grid line to the nearest wall position (circular).
  const dist = (o: number) => {
    let d = p;
    for (const r of res) {
      const x = Math.abs(o - r);
      d = Math.min(d, x, p - x);
    }
    return d;
  };
  const uniq = [...new Set(cand.map((c) => Math.round(c * 1e4) / 1e4))];
  uniq.sort((a, b) => dist(b) - dist(a));
  return uniq.slice(0, keep);
}

export interface AutoResult {
  x: number;
  y: number;
  score: GridScore;
  evaluated: number;
}

/** Searches grid offsets, starting from (and never worse than) `start`. */
export function autoOrigin(
  es: EdgeSet,
  rings: Point[][],
  p: number,
  start: { x: number; y: number },
  perAxis = 10,
): AutoResult {
  const xs: number[] = [];
  const ys: number[] = [];
  for (const ring of rings) {
    for (const pt of ring) {
      xs.push(pt[0]);
      ys.push(pt[1]);
    }
  }
  const cx = axisCandidates(xs, p, perAxis);
  const cy = axisCandidates(ys, p, perAxis);
  let bx = start.x;
  let by = start.y;
  let best = scoreOrigin(es, bx, by, p);
  let evaluated = 1;
  const tried = new Set<string>([`${mod(bx, p).toFixed(4)},${mod(by, p).toFixed(4)}`]);
  for (let round = 0; round < 2; round++) {
    let improved = false;
    for (const axis of [0, 1] as const) {
      for (const c of axis === 0 ? cx : cy) {
        const x = axis === 0 ? c : bx;
        const y = axis === 1 ? c : by;
        const key = `${mod(x, p).toFixed(4)},${mod(y, p).toFixed(4)}`;
        if (tried.has(key)) continue;
        tried.add(key);
        const s = scoreOrigin(es, x, y, p);
        evaluated++;
        if (better(s, best)) {
          best = s;
          bx = x;
          by = y;
          improved = true;
        }
      }
    }
    if (!improved) break;
  }
  return { x: bx, y: by, score: best, evaluated };
}
