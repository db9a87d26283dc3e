/**
 * SVG geometry for the plan, from the engine's compact plan. Full tiles come as runs of one row
 * and one colour, so each colour is one path of run outlines (a 40,000-tile hall is a few
 * hundred path segments, not 40,000 elements); the tile joints are an SVG pattern laid over
 * them. Coordinates are world millimetres, y up; the plan component flips y once.
 */
import { type Point, type TakeoffPlan, cellCorners, ringPath } from '@latchwork/takeoff';
import { colourFill } from '../model/colour-fill';

/** Coordinates to 0.1 mm: finer than a pixel at any zoom the plan allows, and shorter paths. */
const r = (v: number): number => Math.round(v * 10) / 10;

function ring(points: Point[]): string {
  let d = '';
  points.forEach(([x, y], k) => (d += `${k === 0 ? 'M' : 'L'}${r(x)} ${r(y)}`));
  return d + 'Z';
}

export interface ColourLayer {
  colour: string;
  fill: string;
  /** One path of all the colour's full tiles. */
  d: string;
}

export interface CutShape {
  /** Index into the plan's cut tiles. */
  k: number;
  d: string;
  fill: string;
  sizeMm: number;
  sliver: boolean;
  fromOffcut: boolean;
  centre: Point;
}

/** The full tiles as one path per colour. */
export function fullTileLayers(plan: TakeoffPlan): ColourLayer[] {
  const parts = plan.colours.map(() => [] as string[]);
  const runs = plan.fullRuns;
  for (let q = 0; q < runs.length; q += 4) {
    const [i0, i1, j, c] = [runs[q], runs[q + 1], runs[q + 2], runs[q + 3]];
    const first = cellCorners(plan, i0, j);
    const last = cellCorners(plan, i1 - 1, j);
    parts[c].push(ring([first[0], last[1], last[2], first[3]]));
  }
  return plan.colours.map((colour, c) => ({
    colour,
    fill: colourFill(colour),
    d: parts[c].join(''),
  }));
}

/** Every cut tile as its own shape (they carry a size to show on hover). */
export function cutShapes(plan: TakeoffPlan): CutShape[] {
  return plan.cutTiles.map((t, k) => {
    const [a, , c] = cellCorners(plan, t.i, t.j);
    return {
      k,
      d: t.rings.map(ringPath).join(''),
      fill: colourFill(t.colour),
      sizeMm: t.sizeMm,
      sliver: t.sliver,
      fromOffcut: t.fromOffcut,
      centre: [(a[0] + c[0]) / 2, (a[1] + c[1]) / 2],
    };
  });
}

/** The tiled region (outline less the gaps) with its holes, for an even-odd fill. */
export function regionPath(plan: TakeoffPlan): string {
  return [plan.regionOutline, ...plan.regionHoles].map(ring).join('');
}

export function polygonPath(points: Point[]): string {
  return points.length ? ring(points) : '';
}

export interface WallDimension {
  /** Where the label sits: the wall's midpoint, pushed outward. */
  at: Point;
  lengthMm: number;
  /** Text angle in screen degrees (y down), kept upright. */
  angleDeg: number;
}

/**
 * A label per outline wall, outside the floor. `offset` is how far out, in mm (the component
 * passes a few pixels' worth at the current zoom).
 */
export function wallDimensions(outline: Point[], offset: number): WallDimension[] {
  const n = outline.length;
  let area = 0;
  for (let k = 0; k < n; k++) {
    const [x0, y0] = outline[k];
    const [x1, y1] = outline[(k + 1) % n];
    area += x0 * y1 - x1 * y0;
  }
  const ccw = area > 0;
  return outline.map((p, k) => {
    const q = outline[(k + 1) % n];
    const len = Math.hypot(q[0] - p[0], q[1] - p[1]);
    const ux = len ? (q[0] - p[0]) / len : 1;
    const uy = len ? (q[1] - p[1]) / len : 0;
    // Outward normal: right of the direction of travel for a counter-clockwise outline.
    const nx = ccw ? uy : -uy;
    const ny = ccw ? -ux : ux;
    // Screen angle: y flips, so the angle changes sign; turn upside-down text the right way up.
    let angle = (-Math.atan2(uy, ux) * 180) / Math.PI;
    if (angle > 90) angle -= 180;
    if (angle <= -90) angle += 180;
    return {
      at: [(p[0] + q[0]) / 2 + nx * offset, (p[1] + q[1]) / 2 + ny * offset],
      lengthMm: len,
      angleDeg: angle,
    };
  });
}

/** The box around the given points, or a 1 m square at the origin when there are none. */
export function boundsOf(points: Point[]): {
  minX: number;
  minY: number;
  maxX: number;
  maxY: number;
} {
  if (points.length === 0) return { minX: 0, minY: 0, maxX: 1000, maxY: 1000 };
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity; // prettier-ignore
  for (const [x, y] of points) {
    minX = Math.min(minX, x);
    minY = Math.min(minY, y);
    maxX = Math.max(maxX, x);
    maxY = Math.max(maxY, y);
  }
  return { minX, minY, maxX, maxY };
}
