/** Warnings the estimator must see before quoting. */
import { segmentDistance } from '../geometry/polygon';
import type { TakeoffRates } from '../rates';
import type { ColourCount, Point, TakeoffWarning } from '../types';

/** Obstacles with a strip narrower than one tile between them and a wall. */
export function obstacleNearWallWarnings(
  outline: Point[],
  obstacles: Point[][],
  pitch: number,
): TakeoffWarning[] {
  const out: TakeoffWarning[] = [];
  obstacles.forEach((ob, k) => {
    let best = Infinity;
    let at: Point = ob[0];
    let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity; // prettier-ignore
    for (const p of ob) {
      minX = Math.min(minX, p[0]);
      maxX = Math.max(maxX, p[0]);
      minY = Math.min(minY, p[1]);
      maxY = Math.max(maxY, p[1]);
    }
    for (let a = 0; a < outline.length; a++) {
      const p = outline[a];
      const q = outline[(a + 1) % outline.length];
      // Skip walls whose box is farther than a tile from the obstacle's box.
      if (Math.min(p[0], q[0]) > maxX + pitch || Math.max(p[0], q[0]) < minX - pitch) continue;
      if (Math.min(p[1], q[1]) > maxY + pitch || Math.max(p[1], q[1]) < minY - pitch) continue;
      for (let b = 0; b < ob.length; b++) {
        const d = segmentDistance(ob[b], ob[(b + 1) % ob.length], p, q);
        if (d < best) {
          best = d;
          at = ob[b];
        }
      }
    }
    // Touching the wall (built in) leaves no strip; a strip under one tile means thin cuts.
    if (best > 1e-6 && best < pitch) {
      out.push({
        code: 'obstacle-near-wall',
        severity: 'warning',
        message: `obstacles[${k}] is ${Math.round(best)} mm from a wall, less than one tile (${pitch} mm): expect thin cuts in that strip`,
        point: at,
        data: { obstacle: k, distanceMm: best },
      });
    }
  });
  return out;
}

export function batchWarnings(
  byColour: ColourCount[],
  pitch: number,
  r: TakeoffRates,
): TakeoffWarning[] {
  const big = byColour.filter((c) => (c.toOrder * pitch * pitch) / 1e6 > r.productionBatchM2);
  if (big.length === 0) return [];
  return [
    {
      code: 'production-batch',
      severity: 'warning',
      message: `${big.map((c) => c.colour).join(', ')}: more than one production batch usually covers (${r.productionBatchM2} m²); ask the supplier for tiles from one batch per colour, since shades differ between batches`,
      data: { colours: big.map((c) => c.colour), batchM2: r.productionBatchM2 },
    },
  ];
}

export function acclimatisationWarning(r: TakeoffRates): TakeoffWarning {
  return {
    code: 'acclimatisation',
    severity: 'info',
    message: `Tiles must lie in the room at least ${r.acclimatiseHours} h before fitting; warm the room to at least ${r.minRoomTempC} °C if it is colder`,
    data: { hours: r.acclimatiseHours, minTempC: r.minRoomTempC },
  };
}
