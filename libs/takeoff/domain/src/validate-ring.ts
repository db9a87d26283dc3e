/** Ring checks for validation: enough points, non-zero area, no self-intersection. */
import { cleanRing, segmentsTouch, signedArea } from './geometry/polygon';
import type { Point, TakeoffProblem } from './types';

/** Area below this (mm²) is "zero area". */
const ZERO_AREA_MM2 = 1;

/** Checks one ring; returns the cleaned ring (no repeated points) or null when unusable. */
export function checkRing(raw: Point[], field: string, out: TakeoffProblem[]): Point[] | null {
  const ring = cleanRing(raw);
  if (ring.length < 3) {
    out.push({
      field,
      message: `needs at least 3 distinct points (has ${ring.length})`,
      point: ring[0],
    });
    return null;
  }
  if (collinear(ring)) {
    out.push({ field, message: 'has zero area (its points lie on one line)', point: ring[0] });
    return null;
  }
  const x = selfIntersection(ring);
  if (x) {
    out.push({ field, message: 'crosses or touches itself', point: x });
    return null;
  }
  if (Math.abs(signedArea(ring)) < ZERO_AREA_MM2) {
    out.push({ field, message: 'has zero area (its points lie on one line)', point: ring[0] });
    return null;
  }
  return ring;
}

/** All points on one line (within a millionth of a millimetre per metre of extent). */
function collinear(ring: Point[]): boolean {
  const a = ring[0];
  let far = a;
  let best = 0;
  for (const p of ring) {
    const d = Math.hypot(p[0] - a[0], p[1] - a[1]);
    if (d > best) {
      best = d;
      far = p;
    }
  }
  if (best === 0) return true;
  for (const p of ring) {
    const cross = (far[0] - a[0]) * (p[1] - a[1]) - (far[1] - a[1]) * (p[0] - a[0]);
    if (Math.abs(cross) / best > 1e-6) return false;
  }
  return true;
}

interface Seg {
  a: Point;
  b: Point;
  idx: number;
  minX: number;
  maxX: number;
  minY: number;
  maxY: number;
}

function segments(ring: Point[]): Seg[] {
  return ring.map((a, idx) => {
    const b = ring[(idx + 1) % ring.length];
    return {
      a,
      b,
      idx,
      minX: Math.min(a[0], b[0]),
      maxX: Math.max(a[0], b[0]),
      minY: Math.min(a[1], b[1]),
      maxY: Math.max(a[1], b[1]),
    };
  });
}

/** Pairs of segments whose boxes overlap (within eps), found by a sweep on y. */
function forEachCandidatePair(
  s1: Seg[],
  s2: Seg[] | null,
  eps: number,
  visit: (p: Seg, q: Seg) => Point | null,
): Point | null {
  const all = s2 ? s1.concat(s2) : s1;
  const n1 = s1.length;
  const order = all.map((_, i) => i).sort((p, q) => all[p].minY - all[q].minY);
  const active: number[] = [];
  for (const k of order) {
    const s = all[k];
    let m = 0;
    for (let q = 0; q < active.length; q++)
      if (all[active[q]].maxY >= s.minY - eps) active[m++] = active[q];
    active.length = m;
    for (let q = 0; q < m; q++) {
      const a = active[q];
      if (s2 && a < n1 === k < n1) continue;
      const t = all[a];
      if (t.maxX < s.minX - eps || t.minX > s.maxX + eps) continue;
      const hit = s2 && a >= n1 ? visit(s, t) : visit(t, s);
      if (hit) return hit;
    }
    active.push(k);
  }
  return null;
}

/** A point where the ring crosses or touches itself, or null. */
export function selfIntersection(ring: Point[]): Point | null {
  const n = ring.length;
  const segs = segments(ring);
  let scale = 1;
  for (const p of ring) scale = Math.max(scale, Math.abs(p[0]), Math.abs(p[1]));
  const eps = 1e-9 * scale;
  return forEachCandidatePair(segs, null, eps, (p, q) => {
    const d = Math.abs(p.idx - q.idx);
    if (d === 1 || d === n - 1) {
      // Neighbours share a vertex; they are wrong only if they fold back onto each other.
      const [first, second] = (p.idx + 1) % n === q.idx ? [p, q] : [q, p];
      const ux = first.b[0] - first.a[0];
      const uy = first.b[1] - first.a[1];
      const vx = second.b[0] - second.a[0];
      const vy = second.b[1] - second.a[1];
      const cross = ux * vy - uy * vx;
      const dot = ux * vx + uy * vy;
      if (Math.abs(cross) <= 1e-12 * Math.hypot(ux, uy) * Math.hypot(vx, vy) && dot < 0)
        return first.b;
      return null;
    }
    return segmentsTouch(p.a, p.b, q.a, q.b, eps);
  });
}

/**
 * A point where an edge of ring a meets an edge of ring b, or null. With `properOnly`,
 * touching (a column against a wall, two plinths side by side) is allowed and only a real
 * crossing counts.
 */
export function findRingTouch(
  a: Point[],
  b: Point[],
  eps: number,
  properOnly: boolean,
): Point | null {
  // segmentsTouch with a negative tolerance reports proper crossings only.
  return forEachCandidatePair(segments(a), segments(b), eps, (p, q) =>
    segmentsTouch(p.a, p.b, q.a, q.b, properOnly ? -1 : eps),
  );
}
