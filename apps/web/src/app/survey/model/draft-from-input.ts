/**
 * A saved takeoff version's input turned back into the floor editor's draft, so "Edit floor"
 * opens what was saved. Axis-aligned rectangles become rectangles (editable by size), other
 * shapes stay polygons; a zone that is not a rectangle is edited as its bounding box, the
 * closest the editor's zone fields can hold.
 */
import type { Point, TakeoffInput } from '@latchwork/takeoff';
import {
  type DoorwayDraft,
  type FloorDraft,
  type ObstacleDraft,
  type RectDraft,
  exampleFloor,
} from '../../takeoff/model/floor-draft';
import type { Units } from '../../takeoff/model/lengths';
import { walkFromPoints } from '../../takeoff/model/wall-walk';

/** The polygon's bounding box; `exact` when the polygon is that box. */
function boxOf(points: Point[]): { rect: RectDraft; exact: boolean } {
  const xs = points.map((p) => p[0]);
  const ys = points.map((p) => p[1]);
  const x = Math.min(...xs);
  const y = Math.min(...ys);
  const rect = { x, y, w: Math.max(...xs) - x, l: Math.max(...ys) - y };
  const ring =
    points.length > 4 && points[0]?.join() === points.at(-1)?.join() ? points.slice(0, -1) : points;
  const exact =
    ring.length === 4 &&
    ring.every(
      ([px, py]) =>
        (px === rect.x || px === rect.x + rect.w) && (py === rect.y || py === rect.y + rect.l),
    ) &&
    new Set(ring.map((p) => p.join())).size === 4;
  return { rect, exact };
}

const rectOf = (points: Point[]): RectDraft => boxOf(points).rect;

/** The wall a doorway lies on and where along it: the editor places doorways that way. */
function doorwayOf(outline: Point[], from: Point, to: Point, ramp: boolean): DoorwayDraft | null {
  for (let wall = 0; wall < outline.length; wall++) {
    const p = outline[wall];
    const q = outline[(wall + 1) % outline.length];
    if (!p || !q) continue;
    const len = Math.hypot(q[0] - p[0], q[1] - p[1]);
    if (len === 0) continue;
    // Distance of a point from the wall's line, and how far along the wall it lies.
    const off = (r: Point) =>
      Math.abs((q[0] - p[0]) * (r[1] - p[1]) - (q[1] - p[1]) * (r[0] - p[0])) / len;
    const along = (r: Point) =>
      ((r[0] - p[0]) * (q[0] - p[0]) + (r[1] - p[1]) * (q[1] - p[1])) / len;
    if (off(from) > 1 || off(to) > 1) continue;
    const a = along(from);
    const b = along(to);
    if (Math.min(a, b) < -1 || Math.max(a, b) > len + 1) continue;
    return { wall, offsetMm: Math.min(a, b), widthMm: Math.abs(b - a), ramp };
  }
  return null;
}

function patternOf(input: TakeoffInput, base: FloorDraft['pattern']): FloorDraft['pattern'] {
  const p = input.pattern;
  switch (p?.kind) {
    case undefined:
      return base;
    case 'single':
      return { ...base, kind: 'single', colour: p.colour ?? base.colour };
    case 'border':
      return {
        ...base,
        kind: 'border',
        borderRows: p.rows,
        colour: p.fieldColour,
        colour2: p.borderColour,
      };
    case 'chequer':
      return { ...base, kind: 'chequer', colour: p.colours[0], colour2: p.colours[1] };
    case 'stripes':
      return {
        ...base,
        kind: 'stripes',
        stripeColours: p.colours.join(', '),
        stripeWidth: p.widthTiles ?? base.stripeWidth,
        stripeDirection: p.direction ?? base.stripeDirection,
      };
    case 'bays':
      return {
        ...base,
        kind: 'bays',
        colour: p.baseColour,
        bays: p.bays.map((b) => ({ ...rectOf(b.polygon), colour: b.colour })),
      };
  }
}

/** The editor's draft of a saved input, named after the area, in the firm's units. */
export function draftFromInput(input: TakeoffInput, name: string, units: Units): FloorDraft {
  const base = exampleFloor(units);
  const outline = input.outline.map(([x, y]) => [x, y] as Point);
  const obstacles: ObstacleDraft[] = (input.obstacles ?? []).map((points) => {
    const { rect, exact } = boxOf(points);
    return exact ? { kind: 'rect', ...rect } : { kind: 'polygon', points };
  });
  const origin: FloorDraft['origin'] =
    typeof input.origin === 'object'
      ? { mode: 'point', x: input.origin.x, y: input.origin.y }
      : { mode: input.origin ?? 'centre' };
  return {
    ...base,
    name,
    outline,
    source: 'points',
    walk: walkFromPoints(outline),
    obstacles,
    doorways: (input.doorways ?? []).flatMap((d) => {
      const found = doorwayOf(outline, d.from, d.to, d.ramp ?? false);
      return found ? [found] : [];
    }),
    adhesive: (input.zones?.adhesive ?? []).map(rectOf),
    levelling: (input.zones?.levelling ?? []).map((z) => ({
      ...rectOf(z.polygon),
      depthMm: z.depthMm,
    })),
    pitchMm: input.tile.pitchMm,
    gapMm: input.gapMm ?? base.gapMm,
    origin,
    pattern: patternOf(input, base.pattern),
  };
}
