/** Plain polygon helpers on `[x, y][]` rings (no closing point), millimetres. */
import type { Point, Polygon } from '../types';

/** Shoelace signed area: positive for counter-clockwise rings (y up). */
export function signedArea(ring: readonly Point[]): number {
  let sum = 0;
  const n = ring.length;
  for (let i = 0, j = n - 1; i < n; j = i++) {
    sum += (ring[j][0] - ring[i][0]) * (ring[j][1] + ring[i][1]);
  }
  return sum / 2;
}

export function perimeter(ring: readonly Point[]): number {
  let sum = 0;
  const n = ring.length;
  for (let i = 0, j = n - 1; i < n; j = i++) {
    sum += Math.hypot(ring[i][0] - ring[j][0], ring[i][1] - ring[j][1]);
  }
  return sum;
}

/**
 * Drops a repeated closing point and consecutive duplicates (closer than `eps`), so a
 * ring typed with its first point again, or a double click, still works.
 */
export function cleanRing(ring: readonly Point[], eps = 1e-9): Point[] {
  const out: Point[] = [];
  for (const p of ring) {
    const last = out[out.length - 1];
    if (last && Math.abs(last[0] - p[0]) <= eps && Math.abs(last[1] - p[1]) <= eps) continue;
    out.push([p[0], p[1]]);
  }
  while (out.length > 1) {
    const a = out[0];
    const b = out[out.length - 1];
    if (Math.abs(a[0] - b[0]) <= eps && Math.abs(a[1] - b[1]) <= eps) out.pop();
    else break;
  }
  return out;
}

/** The ring counter-clockwise (copy). */
export function toCcw(ring: readonly Point[]): Point[] {
  const copy = ring.map((p) => [p[0], p[1]] as Point);
  return signedArea(copy) < 0 ? copy.reverse() : copy;
}

/**
 * Offsets a counter-clockwise ring by `d` along its outward normals (d < 0 goes inward)
 * with mitred corners: each offset vertex is where the two shifted edge lines meet. With
 * unit outward normals n1, n2 of the edges before and after a vertex v, the meeting point
 * is v + d·(n1 + n2) / (1 + n1·n2), which stays well-conditioned for nearly straight joins.
 */
export function offsetRingMitre(ccw: readonly Point[], d: number): Point[] {
  const n = ccw.length;
  if (d === 0) return ccw.map((p) => [p[0], p[1]] as Point);
  const nx = new Float64Array(n);
  const ny = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const a = ccw[i];
    const b = ccw[(i + 1) % n];
    const len = Math.hypot(b[0] - a[0], b[1] - a[1]);
    // Outward normal of a CCW ring: the right-hand normal of the edge direction.
    nx[i] = (b[1] - a[1]) / len;
    ny[i] = -(b[0] - a[0]) / len;
  }
  const out: Point[] = [];
  for (let i = 0; i < n; i++) {
    const prev = (i + n - 1) % n;
    const denom = 1 + nx[prev] * nx[i] + ny[prev] * ny[i];
    const v = ccw[i];
    // denom → 0 only for a 180° spike, which validation rejects as self-touching.
    const k = d / Math.max(denom, 1e-12);
    out.push([v[0] + k * (nx[prev] + nx[i]), v[1] + k * (ny[prev] + ny[i])]);
  }
  return out;
}

/** Winding-number point-in-polygon; points on the boundary may go either way. */
export function pointInRing(pt: Point, ring: readonly Point[]): boolean {
  const [x, y] = pt;
  let inside = false;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
    const xi = ring[i][0];
    const yi = ring[i][1];
    const xj = ring[j][0];
    const yj = ring[j][1];
    if (yi > y !== yj > y && x < ((xj - xi) * (y - yi)) / (yj - yi) + xi) inside = !inside;
  }
  return inside;
}

/** Distance from point p to segment ab. */
export function pointSegmentDistance(p: Point, a: Point, b: Point): number {
  const dx = b[0] - a[0];
  const dy = b[1] - a[1];
  const len2 = dx * dx + dy * dy;
  let t = len2 > 0 ? ((p[0] - a[0]) * dx + (p[1] - a[1]) * dy) / len2 : 0;
  t = Math.max(0, Math.min(1, t));
  return Math.hypot(p[0] - (a[0] + t * dx), p[1] - (a[1] + t * dy));
}

function orient(a: Point, b: Point, c: Point): number {
  return (b[0] - a[0]) * (c[1] - a[1]) - (b[1] - a[1]) * (c[0] - a[0]);
}

/**
 * Whether closed segments ab and cd share a point, with tolerance `eps` (mm) for touching.
 * Returns a point of contact or null.
 */
export function segmentsTouch(a: Point, b: Point, c: Point, d: Point, eps: number): Point | null {
  const d1 = orient(c, d, a);
  const d2 = orient(c, d, b);
  const d3 = orient(a, b, c);
  const d4 = orient(a, b, d);
  if (((d1 > 0 && d2 < 0) || (d1 < 0 && d2 > 0)) && ((d3 > 0 && d4 < 0) || (d3 < 0 && d4 > 0))) {
    const t = d1 / (d1 - d2);
    return [a[0] + t * (b[0] - a[0]), a[1] + t * (b[1] - a[1])];
  }
  if (pointSegmentDistance(a, c, d) <= eps) return [a[0], a[1]];
  if (pointSegmentDistance(b, c, d) <= eps) return [b[0], b[1]];
  if (pointSegmentDistance(c, a, b) <= eps) return [c[0], c[1]];
  if (pointSegmentDistance(d, a, b) <= eps) return [d[0], d[1]];
  return null;
}

/** Shortest distance between segments ab and cd. */
export function segmentDistance(a: Point, b: Point, c: Point, d: Point): number {
  if (segmentsTouch(a, b, c, d, 0)) return 0;
  return Math.min(
    pointSegmentDistance(a, c, d),
    pointSegmentDistance(b, c, d),
    pointSegmentDistance(c, a, b),
    pointSegmentDistance(d, a, b),
  );
}

/** Rotates points about (0, 0) by `deg` counter-clockwise. */
export function rotatePoints(ring: readonly Point[], deg: number): Point[] {
  if (deg === 0) return ring.map((p) => [p[0], p[1]] as Point);
  const r = (deg * Math.PI) / 180;
  const c = Math.cos(r);
  const s = Math.sin(r);
  return ring.map((p) => [p[0] * c - p[1] * s, p[0] * s + p[1] * c] as Point);
}

export function boundingBox(rings: readonly (readonly Point[])[]): {
  minX: number;
  minY: number;
  maxX: number;
  maxY: number;
} {
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  for (const ring of rings) {
    for (const p of ring) {
      if (p[0] < minX) minX = p[0];
      if (p[0] > maxX) maxX = p[0];
      if (p[1] < minY) minY = p[1];
      if (p[1] > maxY) maxY = p[1];
    }
  }
  return { minX, minY, maxX, maxY };
}

export type { Polygon };
