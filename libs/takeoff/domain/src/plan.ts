/** Helpers for drawing the plan from {@link TakeoffPlan} (SVG or canvas). */
import { toWorld } from './layout/region';
import type { Point, TakeoffPlan } from './types';

/** The four corners (world mm, counter-clockwise) of grid cell (i, j). */
export function cellCorners(
  plan: Pick<TakeoffPlan, 'origin' | 'pitchMm' | 'angleDeg'>,
  i: number,
  j: number,
): Point[] {
  const { origin, pitchMm: p, angleDeg } = plan;
  const corner = (a: number, b: number): Point => {
    const w = toWorld(a * p, b * p, angleDeg);
    return [origin.x + w[0], origin.y + w[1]];
  };
  return [corner(i, j), corner(i + 1, j), corner(i + 1, j + 1), corner(i, j + 1)];
}

/** Calls `visit` for every full tile in the plan with its cell and colour name. */
export function forEachFullTile(
  plan: TakeoffPlan,
  visit: (i: number, j: number, colour: string) => void,
): void {
  const runs = plan.fullRuns;
  for (let r = 0; r < runs.length; r += 4) {
    for (let i = runs[r]; i < runs[r + 1]; i++) visit(i, runs[r + 2], plan.colours[runs[r + 3]]);
  }
}

/** An SVG path `d` for a flat ring x0, y0, x1, y1, … */
export function ringPath(ring: number[]): string {
  let d = '';
  for (let q = 0; q < ring.length; q += 2) d += `${q === 0 ? 'M' : 'L'}${ring[q]} ${ring[q + 1]}`;
  return d + 'Z';
}
