/** Areas of adhesive and levelling zones within the floor, and zones drawn outside it. */
import { cleanRing, signedArea, toCcw } from '../geometry/polygon';
import { buildEdgeSet, regionArea } from '../geometry/sweep';
import type { Point, TakeoffWarning } from '../types';

const ccw = (r: Point[]) => toCcw(cleanRing(r));

/** Area (mm²) of the union of `zones` that lies in `outline` and outside every obstacle. */
export function zonesInFloorMm2(zones: Point[][], outline: Point[], obstacles: Point[][]): number {
  if (zones.length === 0) return 0;
  const es = buildEdgeSet(
    [
      { ring: ccw(outline), cls: 0 },
      ...obstacles.map((o) => ({ ring: ccw(o), cls: 1 })),
      ...zones.map((z) => ({ ring: ccw(z), cls: 2 })),
    ],
    3,
  );
  return regionArea(es, (w) => w[0] > 0 && w[1] <= 0 && w[2] > 0);
}

/** A warning per zone with part of it outside the outline (beyond a 100 mm² / 0.1 % slack). */
export function zonesOutsideWarnings(
  zones: { field: string; ring: Point[] }[],
  outline: Point[],
): TakeoffWarning[] {
  const out: TakeoffWarning[] = [];
  const o = ccw(outline);
  for (const { field, ring } of zones) {
    const z = ccw(ring);
    const es = buildEdgeSet(
      [
        { ring: z, cls: 0 },
        { ring: o, cls: 1 },
      ],
      2,
    );
    const outside = regionArea(es, (w) => w[0] > 0 && w[1] <= 0);
    const total = Math.abs(signedArea(z));
    if (outside > Math.max(100, total * 1e-3)) {
      out.push({
        code: 'zone-outside-floor',
        severity: 'warning',
        message: `${field}: ${(outside / 1e6).toFixed(2)} m² of the zone lies outside the floor and is not counted`,
        point: z[0],
        data: { field, outsideM2: outside / 1e6 },
      });
    }
  }
  return out;
}
