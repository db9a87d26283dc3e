/**
 * The tiled region, defined exactly: the outline offset inward by the gap with mitred
 * corners, minus every obstacle offset outward by the gap with mitred corners. Offsets are
 * built in the grid's frame (the floor rotated by −layoutAngle), where the grid is axis-aligned.
 *
 * Where a feature is narrower than twice the gap the offset ring folds over itself; the
 * folded part winds the wrong way and the winding rule (outline winding > 0, obstacle
 * winding ≤ 0) drops it, which is what the gap means: nothing can be laid there.
 */
import { cleanRing, offsetRingMitre, rotatePoints, toCcw } from '../geometry/polygon';
import { buildEdgeSet, type EdgeSet } from '../geometry/sweep';
import type { Point } from '../types';

export interface TiledRegion {
  /** Offset outline (CCW) in the grid frame. */
  outline: Point[];
  /** Offset obstacles (CCW) in the grid frame. */
  holes: Point[][];
  edges: EdgeSet;
  angleDeg: number;
}

export function buildRegion(
  outline: Point[],
  obstacles: Point[][],
  gapMm: number,
  angleDeg: number,
): TiledRegion {
  const o = offsetRingMitre(toCcw(rotatePoints(cleanRing(outline), -angleDeg)), -gapMm);
  const holes = obstacles.map((ob) =>
    offsetRingMitre(toCcw(rotatePoints(cleanRing(ob), -angleDeg)), gapMm),
  );
  const edges = buildEdgeSet([{ ring: o, cls: 0 }, ...holes.map((ring) => ({ ring, cls: 1 }))], 2);
  return { outline: o, holes, edges, angleDeg };
}

/** Grid-frame point to world coordinates. */
export function toWorld(x: number, y: number, angleDeg: number): Point {
  if (angleDeg === 0) return [x, y];
  const r = (angleDeg * Math.PI) / 180;
  const c = Math.cos(r);
  const s = Math.sin(r);
  return [x * c - y * s, x * s + y * c];
}

/** World point to the grid frame. */
export function toGrid(x: number, y: number, angleDeg: number): Point {
  return toWorld(x, y, -angleDeg);
}
