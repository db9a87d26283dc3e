/**
 * Choosing where the grid starts.
 *
 * 'centre' does what installers do with a tape: find the centre lines of the room (of the
 * tiled region's bounding box) and put either a tile edge or a tile middle on each, whichever
 * leaves the wider cut at the two walls; opposite walls then get equal cuts.
 *
 * 'auto' searches offsets for the best layout: the largest smallest cut, then the fewest
 * cut tiles, then the fewest tiles out of boxes. Every candidate is scored exactly with the
 * scanline tiler, starting from the centred origin, so the result is never worse than
 * 'centre'. Candidates: per axis, the offsets that keep the straight walls' cuts widest
 * (solved exactly by bisection on the circle of offsets modulo the pitch), combined; then a
 * compass search around the best; small floors also get a coarse scan for angled walls. The
 * number of scorings is budgeted by floor size (about 60 for a 40,000-tile hall, at
 * least 12 for the largest floors).
 * Rotating the grid by 90° is not searched: a square grid turned 90° about its origin is the
 * same grid, so it cannot change any count.
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
): AutoResult {
  // Budget of exact scorings, by floor size: a scoring costs about one pass over the cells.
  let area = 0;
  for (let k = 0; k < rings.length; k++) area += (k === 0 ? 1 : -1) * Math.abs(ringArea(rings[k]));
  const cells = Math.max(1, area / (p * p));
  const budget = Math.max(12, Math.min(600, Math.floor(2.5e6 / cells)));

  const search = new Search(es, p, start, budget);
  // 1. Per axis, the offsets that keep every straight wall's cut as wide as possible.
  const cx = [start.x, ...axisOptima(rings, p, 0)];
  const cy = [start.y, ...axisOptima(rings, p, 1)];
  // Most promising combinations first (index 1 on each axis is the all-walls optimum).
  const combos: [number, number][] = [];
  for (let i = 0; i < cx.length; i++) for (let j = 0; j < cy.length; j++) combos.push([i, j]);
  const rank = ([i, j]: [number, number]) =>
    Math.max(i === 0 ? 1.5 : i, j === 0 ? 1.5 : j) * 10 + i + j;
  combos.sort((u, v) => rank(u) - rank(v));
  for (const [i, j] of combos) search.try(cx[i], cy[j]);
  // 2. Pattern search around the best so far.
  search.refine(p / 8);
  // 3. Small floors: a coarse scan too (angled walls), refined again.
  if (search.left() > 80) {
    const k = Math.min(8, Math.floor(Math.sqrt(search.left() / 3)));
    for (let a = 0; a < k; a++)
      for (let b = 0; b < k; b++) search.try(((a + 0.5) / k) * p, ((b + 0.5) / k) * p);
    search.refine(p / (2 * k));
  }
  return { x: search.bx, y: search.by, score: search.best, evaluated: search.evaluated };
}

class Search {
  bx: number;
  by: number;
  best: GridScore;
  evaluated = 1;
  private readonly tried = new Set<string>();

  constructor(
    private readonly es: EdgeSet,
    private readonly p: number,
    start: { x: number; y: number },
    private readonly budget: number,
  ) {
    this.bx = start.x;
    this.by = start.y;
    this.best = scoreOrigin(es, start.x, start.y, p);
    this.tried.add(this.key(start.x, start.y));
  }

  left(): number {
    return this.budget - this.evaluated;
  }

  private key(x: number, y: number): string {
    return `${mod(x, this.p).toFixed(3)},${mod(y, this.p).toFixed(3)}`;
  }

  /** Scores (x, y) and keeps it if better; true when it improved. */
  try(x: number, y: number): boolean {
    if (this.evaluated >= this.budget) return false;
    const k = this.key(x, y);
    if (this.tried.has(k)) return false;
    this.tried.add(k);
    this.evaluated++;
    const s = scoreOrigin(this.es, x, y, this.p);
    if (!better(s, this.best)) return false;
    this.best = s;
    this.bx = x;
    this.by = y;
    return true;
  }

  /** Compass search: step along ±x, ±y; halve the step when nothing improves. */
  refine(step: number): void {
    while (step >= 0.25 && this.left() > 0) {
      const { bx, by } = this;
      const moved =
        this.try(bx + step, by) ||
        this.try(bx - step, by) ||
        this.try(bx, by + step) ||
        this.try(bx, by - step);
      if (!moved) step /= 2;
    }
  }
}

function ringArea(r: Point[]): number {
  let s = 0;
  for (let i = 0, j = r.length - 1; i < r.length; j = i++)
    s += (r[j][0] - r[i][0]) * (r[j][1] + r[i][1]);
  return s / 2;
}

/**
 * Offsets for one axis (0: x from near-vertical walls, 1: y from near-horizontal walls)
 * that maximise the narrowest cut at those walls. A wall at `a` with the floor on its
 * rising side leaves a piece (o − a) mod p; on its falling side (a − o) mod p. A cut of at
 * least t forbids an arc of length t of grid positions per wall, so the best t is found by
 * bisection on the free part of the circle, and the middles of the free arcs are returned.
 * Done twice: with every wall, and with walls at least a tile long (short column faces
 * rarely leave a thin piece, since the tile is notched around them).
 */
function axisOptima(rings: Point[][], p: number, axis: 0 | 1): number[] {
  const all: { pos: number; rising: boolean; len: number }[] = [];
  const tan1 = Math.tan(Math.PI / 180);
  rings.forEach((ring, k) => {
    for (let i = 0; i < ring.length; i++) {
      const a = ring[i];
      const b = ring[(i + 1) % ring.length];
      const along = axis === 0 ? b[1] - a[1] : b[0] - a[0];
      const across = axis === 0 ? b[0] - a[0] : b[1] - a[1];
      if (Math.abs(across) > tan1 * Math.abs(along) || along === 0) continue;
      // Left normal (−dy, dx) points into a CCW outline and out of a CCW obstacle.
      const normal = axis === 0 ? -(b[1] - a[1]) : b[0] - a[0];
      const rising = k === 0 ? normal > 0 : normal < 0;
      all.push({
        pos: axis === 0 ? (a[0] + b[0]) / 2 : (a[1] + b[1]) / 2,
        rising,
        len: Math.abs(along),
      });
    }
  });
  const out: number[] = [];
  for (const walls of [all, all.filter((w) => w.len >= p)]) {
    if (walls.length === 0) continue;
    let lo = 0;
    let hi = p;
    for (let it = 0; it < 40; it++) {
      const t = (lo + hi) / 2;
      if (freeArcs(walls, p, t).length) lo = t;
      else hi = t;
    }
    const arcs = freeArcs(walls, p, lo * (1 - 1e-9));
    arcs.sort((u, v) => v[1] - v[0] - (u[1] - u[0]));
    for (const [s, e] of arcs.slice(0, 3)) out.push(mod((s + e) / 2, p));
  }
  return out;
}

/** Free arcs [start, end) of [0, p) where every wall's cut is at least t. */
function freeArcs(
  walls: { pos: number; rising: boolean }[],
  p: number,
  t: number,
): [number, number][] {
  const banned: [number, number][] = [];
  const ban = (from: number, len: number) => {
    const s = mod(from, p);
    if (s + len <= p) banned.push([s, s + len]);
    else banned.push([s, p], [0, s + len - p]);
  };
  // Rising wall at a: o in [a, a + t) leaves (o − a) < t. Falling: o in (a − t, a] leaves (a − o) < t.
  for (const w of walls) ban(w.rising ? w.pos : w.pos - t, t);
  banned.sort((u, v) => u[0] - v[0]);
  const free: [number, number][] = [];
  let cur = 0;
  for (const [s, e] of banned) {
    if (s > cur) free.push([cur, s]);
    cur = Math.max(cur, e);
  }
  if (cur < p) free.push([cur, p]);
  // Join an arc that wraps past p with the one starting at 0.
  if (free.length > 1 && free[0][0] === 0 && free[free.length - 1][1] === p) {
    const last = free.pop() as [number, number];
    free[0] = [last[0], free[0][1] + p];
  }
  return free.filter(([s, e]) => e - s > 1e-9);
}
