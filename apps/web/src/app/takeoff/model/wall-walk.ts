/**
 * Walking the walls, as a surveyor measures a room: stand at a corner facing along the first
 * wall, measure it, turn left or right by the corner's angle, measure the next, and so on
 * until back at the start. x to the right, y up, so a left turn is counter-clockwise.
 */
import type { Point } from '@latchwork/takeoff';

export interface Wall {
  /** Length of the wall in mm. */
  lengthMm: number;
  /** Turn at the wall's end, degrees (0–180); ignored after the last wall. */
  turnDeg: number;
  turn: 'left' | 'right';
}

export interface Walk {
  start: Point;
  /** Direction of the first wall, degrees counter-clockwise from +x. */
  headingDeg: number;
  walls: Wall[];
}

/** Points closer than this (mm) to the start count as back at the start. */
export const CLOSE_TOL_MM = 0.5;

/** Coordinates are kept to a micrometre: float noise below that is not a measurement. */
const round = (v: number): number => Math.round(v * 1000) / 1000 + 0;

/**
 * cos and sin of a heading in degrees, exact for multiples of 90° so that rectilinear rooms
 * close exactly (Math.cos(π/2) is 6e-17, not 0).
 */
export function direction(deg: number): Point {
  const d = ((deg % 360) + 360) % 360;
  if (d === 0) return [1, 0];
  if (d === 90) return [0, 1];
  if (d === 180) return [-1, 0];
  if (d === 270) return [0, -1];
  const r = (d * Math.PI) / 180;
  return [Math.cos(r), Math.sin(r)];
}

export interface WalkedOutline {
  /** The corners, starting at the walk's start. */
  points: Point[];
  /** How far the last wall ends from the start, mm (0 when the walk closes). */
  gapMm: number;
}

/**
 * The outline a walk describes. When the last wall ends back at the start, that point is not
 * repeated; otherwise the outline closes with a straight wall and `gapMm` says how long it is.
 */
export function pointsFromWalk(walk: Walk): WalkedOutline {
  const points: Point[] = [[walk.start[0], walk.start[1]]];
  let heading = walk.headingDeg;
  let x = walk.start[0];
  let y = walk.start[1];
  walk.walls.forEach((wall, k) => {
    const [dx, dy] = direction(heading);
    x += wall.lengthMm * dx;
    y += wall.lengthMm * dy;
    points.push([round(x), round(y)]);
    if (k < walk.walls.length - 1) heading += wall.turn === 'left' ? wall.turnDeg : -wall.turnDeg;
  });
  const last = points[points.length - 1];
  const gapMm = Math.hypot(last[0] - walk.start[0], last[1] - walk.start[1]);
  if (points.length > 1 && gapMm <= CLOSE_TOL_MM) {
    points.pop();
    return { points, gapMm: 0 };
  }
  return { points, gapMm: round(gapMm) };
}

/** Signed turn from heading `a` to heading `b`, degrees in (−180, 180]. */
function turnBetween(a: number, b: number): number {
  let t = (((b - a) % 360) + 360) % 360;
  if (t > 180) t -= 360;
  return t;
}

const headingOf = (p: Point, q: Point): number =>
  (Math.atan2(q[1] - p[1], q[0] - p[0]) * 180) / Math.PI;

/**
 * The walk around a closed outline: one wall per edge, back to the first point, with the turn
 * at every corner (the last wall's turn brings the heading back to the first wall's).
 */
export function walkFromPoints(points: Point[]): Walk {
  const n = points.length;
  if (n < 2) return { start: points[0] ?? [0, 0], headingDeg: 0, walls: [] };
  const headings = points.map((p, k) => headingOf(p, points[(k + 1) % n]));
  const walls = points.map((p, k): Wall => {
    const q = points[(k + 1) % n];
    const t = turnBetween(headings[k], headings[(k + 1) % n]);
    return {
      lengthMm: round(Math.hypot(q[0] - p[0], q[1] - p[1])),
      turnDeg: Math.abs(Math.round(t * 1e6) / 1e6),
      turn: t >= 0 ? 'left' : 'right',
    };
  });
  return { start: points[0], headingDeg: Math.round(headings[0] * 1e6) / 1e6, walls };
}

/**
 * Closes an open walk: sets the turn at the current last wall and adds the wall straight back
 * to the start. A walk already closed comes back unchanged.
 */
export function closeWalk(walk: Walk): Walk {
  const { points, gapMm } = pointsFromWalk(walk);
  if (gapMm === 0 || walk.walls.length === 0) return walk;
  const last = points[points.length - 1];
  const prev = points[points.length - 2];
  const t = turnBetween(headingOf(prev, last), headingOf(last, walk.start));
  const walls = walk.walls.slice();
  walls[walls.length - 1] = {
    ...walls[walls.length - 1],
    turnDeg: Math.abs(Math.round(t * 1e6) / 1e6),
    turn: t >= 0 ? 'left' : 'right',
  };
  walls.push({ lengthMm: gapMm, turnDeg: 90, turn: 'left' });
  return { ...walk, walls };
}
