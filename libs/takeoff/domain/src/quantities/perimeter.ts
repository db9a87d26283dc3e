/** Skirting, corner trims and edge ramps from the outline, obstacles and doorways. */
import type { Doorway, Point } from '../types';

export interface PerimeterQuantities {
  skirtingMm: number;
  internal: number;
  external: number;
  rampMm: number;
  rampPieces: number;
  doorwayMm: number;
}

/**
 * Corner trims: an outline vertex whose interior angle is under 180° takes an internal
 * trim, over 180° an external one; an obstacle's corners stick into the room, so its convex
 * corners take external trims (and its reflex ones internal). Vertices turning less than
 * `minTurnDeg` are straight joins (a curve given as a polyline), not corners.
 */
export function perimeterQuantities(
  outlineCcw: Point[],
  obstaclesCcw: Point[][],
  doorways: Doorway[],
  skirtObstacles: boolean,
  minTurnDeg: number,
  rampStockMm: number,
): PerimeterQuantities {
  let internal = 0;
  let external = 0;
  const count = (ring: Point[], convexIsInternal: boolean) => {
    const n = ring.length;
    for (let i = 0; i < n; i++) {
      const a = ring[(i + n - 1) % n];
      const b = ring[i];
      const c = ring[(i + 1) % n];
      const ux = b[0] - a[0];
      const uy = b[1] - a[1];
      const vx = c[0] - b[0];
      const vy = c[1] - b[1];
      const turn = Math.atan2(ux * vy - uy * vx, ux * vx + uy * vy); // > 0: left turn = convex (CCW)
      if (Math.abs(turn) < (minTurnDeg * Math.PI) / 180) continue;
      if (turn > 0 === convexIsInternal) internal++;
      else external++;
    }
  };
  count(outlineCcw, true);
  let skirtingMm = ringLength(outlineCcw);
  if (skirtObstacles) {
    for (const ob of obstaclesCcw) {
      count(ob, false);
      skirtingMm += ringLength(ob);
    }
  }
  let doorwayMm = 0;
  let rampMm = 0;
  let rampPieces = 0;
  for (const d of doorways) {
    const len = Math.hypot(d.to[0] - d.from[0], d.to[1] - d.from[1]);
    doorwayMm += len;
    if (d.ramp) {
      rampMm += len;
      rampPieces += Math.ceil(len / rampStockMm - 1e-9);
    }
  }
  skirtingMm = Math.max(0, skirtingMm - doorwayMm);
  return { skirtingMm, internal, external, rampMm, rampPieces, doorwayMm };
}

export function ringLength(ring: Point[]): number {
  let s = 0;
  for (let i = 0; i < ring.length; i++) {
    const a = ring[i];
    const b = ring[(i + 1) % ring.length];
    s += Math.hypot(b[0] - a[0], b[1] - a[1]);
  }
  return s;
}
