/**
 * A horizontal sweep over the edges of several classes of rings (the floor outline, the
 * obstacles, a zone…). Between two consecutive "event" heights — every vertex height and
 * every height where two edges cross — no edges cross, so their left-to-right order is
 * fixed and the region selected by a winding rule is a row of trapezoids. Everything the
 * engine measures (areas, tile coverage, cut pieces) is built from these trapezoids, which
 * makes overlapping obstacles, obstacles reaching past the walls and self-overlapping
 * offsets come out right without a general polygon boolean.
 */
import type { Point } from '../types';

export interface EdgeSet {
  n: number;
  x0: Float64Array;
  y0: Float64Array;
  x1: Float64Array;
  y1: Float64Array;
  /** dx/dy of the edge. */
  slope: Float64Array;
  /** Winding change when the edge is crossed left to right (ring CCW: +1 downward edges). */
  w: Int8Array;
  cls: Uint8Array;
  /** Edge indices sorted by y0. */
  order: Uint32Array;
  /** Sorted distinct heights where the edge order may change. */
  events: Float64Array;
  minX: number;
  maxX: number;
  minY: number;
  maxY: number;
  classes: number;
}

export interface ClassedRing {
  ring: readonly Point[];
  cls: number;
}

/** Builds the edge set; horizontal edges are dropped (they never change a winding). */
export function buildEdgeSet(rings: readonly ClassedRing[], classes: number): EdgeSet {
  let total = 0;
  for (const r of rings) total += r.ring.length;
  const x0 = new Float64Array(total);
  const y0 = new Float64Array(total);
  const x1 = new Float64Array(total);
  const y1 = new Float64Array(total);
  const slope = new Float64Array(total);
  const w = new Int8Array(total);
  const cls = new Uint8Array(total);
  let n = 0;
  let minX = Infinity;
  let maxX = -Infinity;
  let minY = Infinity;
  let maxY = -Infinity;
  for (const { ring, cls: c } of rings) {
    const m = ring.length;
    for (let i = 0; i < m; i++) {
      const a = ring[i];
      const b = ring[(i + 1) % m];
      if (a[0] < minX) minX = a[0];
      if (a[0] > maxX) maxX = a[0];
      if (a[1] < minY) minY = a[1];
      if (a[1] > maxY) maxY = a[1];
      if (a[1] === b[1]) continue;
      const up = b[1] > a[1];
      const lo = up ? a : b;
      const hi = up ? b : a;
      x0[n] = lo[0];
      y0[n] = lo[1];
      x1[n] = hi[0];
      y1[n] = hi[1];
      slope[n] = (hi[0] - lo[0]) / (hi[1] - lo[1]);
      w[n] = up ? -1 : 1;
      cls[n] = c;
      n++;
    }
  }
  const order = new Uint32Array(n);
  for (let i = 0; i < n; i++) order[i] = i;
  order.sort((a, b) => y0[a] - y0[b]);
  const ys: number[] = [];
  for (let i = 0; i < n; i++) ys.push(y0[i], y1[i]);
  findCrossingHeights(x0, y0, x1, y1, order, n, ys);
  ys.sort((a, b) => a - b);
  const events: number[] = [];
  for (const y of ys) if (events.length === 0 || events[events.length - 1] !== y) events.push(y);
  return {
    n,
    x0,
    y0,
    x1,
    y1,
    slope,
    w,
    cls,
    order,
    events: Float64Array.from(events),
    minX,
    maxX,
    minY,
    maxY,
    classes,
  };
}

/** Pushes the height of every proper crossing of two edges (a y-sweep with x-box pruning). */
function findCrossingHeights(
  x0: Float64Array,
  y0: Float64Array,
  x1: Float64Array,
  y1: Float64Array,
  order: Uint32Array,
  n: number,
  out: number[],
): void {
  let active: number[] = [];
  for (let k = 0; k < n; k++) {
    const e = order[k];
    const ey0 = y0[e];
    active = active.filter((a) => y1[a] > ey0);
    const exMin = Math.min(x0[e], x1[e]);
    const exMax = Math.max(x0[e], x1[e]);
    for (const a of active) {
      if (Math.max(x0[a], x1[a]) < exMin || Math.min(x0[a], x1[a]) > exMax) continue;
      const y = properCrossingY(x0[a], y0[a], x1[a], y1[a], x0[e], y0[e], x1[e], y1[e]);
      if (y !== null) out.push(y);
    }
    active.push(e);
  }
}

function properCrossingY(
  ax: number,
  ay: number,
  bx: number,
  by: number,
  cx: number,
  cy: number,
  dx: number,
  dy: number,
): number | null {
  const d1 = (dx - cx) * (ay - cy) - (dy - cy) * (ax - cx);
  const d2 = (dx - cx) * (by - cy) - (dy - cy) * (bx - cx);
  const d3 = (bx - ax) * (cy - ay) - (by - ay) * (cx - ax);
  const d4 = (bx - ax) * (dy - ay) - (by - ay) * (dx - ax);
  if (((d1 > 0 && d2 < 0) || (d1 < 0 && d2 > 0)) && ((d3 > 0 && d4 < 0) || (d3 < 0 && d4 > 0))) {
    const t = d1 / (d1 - d2);
    return ay + t * (by - ay);
  }
  return null;
}

/** Receives one trapezoid: left edge from xLa (at ya) to xLb (at yb), right edge likewise. */
export type TrapezoidSink = (
  ya: number,
  yb: number,
  xLa: number,
  xLb: number,
  xRa: number,
  xRb: number,
) => void;

/** Whether a point with these winding numbers per class is in the region. */
export type InsideRule = (wind: Int32Array) => boolean;

/**
 * Walks slabs bottom to top. Call {@link Sweeper.slab} with increasing, non-overlapping
 * [ya, yb] whose interiors contain no event height (split at `events` and anything else).
 */
export class Sweeper {
  private next = 0;
  private active: number[] = [];
  private readonly key: Float64Array;
  private readonly xa: Float64Array;
  private readonly xb: Float64Array;
  private readonly wind: Int32Array;

  constructor(
    private readonly es: EdgeSet,
    private readonly inside: InsideRule,
  ) {
    this.key = new Float64Array(es.n);
    this.xa = new Float64Array(es.n);
    this.xb = new Float64Array(es.n);
    this.wind = new Int32Array(es.classes);
  }

  /** Emits the region's trapezoids in [ya, yb], left to right; returns how many. */
  slab(ya: number, yb: number, sink: TrapezoidSink): number {
    const es = this.es;
    const { order, y0, y1, x0, slope, w, cls } = es;
    while (this.next < es.n && y0[order[this.next]] < yb) this.active.push(order[this.next++]);
    const act = this.active;
    let m = 0;
    for (let k = 0; k < act.length; k++) if (y1[act[k]] > ya) act[m++] = act[k];
    act.length = m;
    if (m === 0) return 0;
    const { key, xa, xb } = this;
    for (let k = 0; k < m; k++) {
      const e = act[k];
      const a = x0[e] + (ya - y0[e]) * slope[e];
      const b = x0[e] + (yb - y0[e]) * slope[e];
      xa[e] = a;
      xb[e] = b;
      key[e] = a + b;
    }
    // Insertion sort: the order barely changes from one slab to the next.
    for (let k = 1; k < m; k++) {
      const e = act[k];
      const ke = key[e];
      let q = k - 1;
      while (q >= 0 && key[act[q]] > ke) {
        act[q + 1] = act[q];
        q--;
      }
      act[q + 1] = e;
    }
    const wind = this.wind;
    wind.fill(0);
    let inside = false;
    let left = -1;
    let count = 0;
    for (let k = 0; k < m; k++) {
      const e = act[k];
      wind[cls[e]] += w[e];
      const now = this.inside(wind);
      if (now && !inside) left = e;
      else if (!now && inside) {
        sink(ya, yb, xa[left], xb[left], xa[e], xb[e]);
        count++;
      }
      inside = now;
    }
    return count;
  }
}

/** Area (mm²) of the region selected by `inside`, by summing trapezoids between events. */
export function regionArea(es: EdgeSet, inside: InsideRule): number {
  const sweeper = new Sweeper(es, inside);
  let area = 0;
  const ev = es.events;
  for (let k = 0; k + 1 < ev.length; k++) {
    sweeper.slab(ev[k], ev[k + 1], (ya, yb, xLa, xLb, xRa, xRb) => {
      area += ((yb - ya) * (xRa - xLa + (xRb - xLb))) / 2;
    });
  }
  return area;
}

/** Inside rule for the tiled region: inside the (offset) outline, outside every obstacle. */
export const floorRule: InsideRule = (wind) => wind[0] > 0 && wind[1] <= 0;
