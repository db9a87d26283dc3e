/**
 * The floor being edited, in the form the page edits it (rectangles by position and size,
 * doorways by wall and offset), and its translation into the engine's input. Lengths in mm.
 */
import type { Point, TakeoffInput, TakeoffRates } from '@latchwork/takeoff';
import type { Units } from './lengths';
import { type Walk, walkFromPoints } from './wall-walk';

/** An axis-aligned rectangle by its lower-left corner and size. */
export interface RectDraft {
  x: number;
  y: number;
  w: number;
  l: number;
}

/** A column or plinth: a rectangle, or any polygon given by its corners. */
export type ObstacleDraft = ({ kind: 'rect' } & RectDraft) | { kind: 'polygon'; points: Point[] };

export interface DoorwayDraft {
  /** Index of the outline wall (edge from point `wall` to the next). */
  wall: number;
  /** Distance from the wall's first corner to the opening, mm. */
  offsetMm: number;
  widthMm: number;
  ramp: boolean;
}

export interface LevellingDraft extends RectDraft {
  depthMm: number;
}

export type PatternKind = 'single' | 'border' | 'chequer' | 'stripes' | 'bays';

export interface PatternDraft {
  kind: PatternKind;
  /** Single colour; field colour of a border; base colour of bays; first of chequer/stripes. */
  colour: string;
  /** Border colour; second chequer colour. */
  colour2: string;
  borderRows: number;
  /** Stripes: colour names, comma-separated. */
  stripeColours: string;
  stripeWidth: number;
  stripeDirection: 'rows' | 'columns';
  bays: (RectDraft & { colour: string })[];
}

export type OriginDraft =
  | { mode: 'auto' }
  | { mode: 'centre' }
  | { mode: 'point'; x: number; y: number };

export type OutlineSource = 'rectangle' | 'walls' | 'points';

export interface FloorDraft {
  name: string;
  units: Units;
  outline: Point[];
  /** Which tool last shaped the outline (the tab the page opens on). */
  source: OutlineSource;
  walk: Walk;
  obstacles: ObstacleDraft[];
  doorways: DoorwayDraft[];
  adhesive: RectDraft[];
  levelling: LevellingDraft[];
  pitchMm: number;
  gapMm: number;
  origin: OriginDraft;
  pattern: PatternDraft;
}

export const PITCH_PRESETS_MM: readonly number[] = [500, 490, 457.2, 400];

export function rectPoints(r: RectDraft): Point[] {
  return [
    [r.x, r.y],
    [r.x + r.w, r.y],
    [r.x + r.w, r.y + r.l],
    [r.x, r.y + r.l],
  ];
}

/** A new floor: a 6.0 × 6.5 m single garage at 500 mm pitch, grid centred. */
export function exampleFloor(units: Units): FloorDraft {
  const outline = rectPoints({ x: 0, y: 0, w: 6000, l: 6500 });
  return {
    name: 'Single garage',
    units,
    outline,
    source: 'rectangle',
    walk: walkFromPoints(outline),
    obstacles: [],
    doorways: [{ wall: 0, offsetMm: 600, widthMm: 4800, ramp: true }],
    adhesive: [],
    levelling: [],
    pitchMm: 500,
    gapMm: 5,
    origin: { mode: 'centre' },
    pattern: {
      kind: 'single',
      colour: 'Slate grey',
      colour2: 'Signal yellow',
      borderRows: 1,
      stripeColours: 'Slate grey, Signal yellow',
      stripeWidth: 2,
      stripeDirection: 'rows',
      bays: [],
    },
  };
}

/** The two ends of a doorway on its wall; null when the wall does not exist. */
export function doorwayEnds(outline: Point[], d: DoorwayDraft): [Point, Point] | null {
  const p = outline[d.wall];
  const q = outline[(d.wall + 1) % outline.length];
  if (!p || !q || outline.length < 2) return null;
  const len = Math.hypot(q[0] - p[0], q[1] - p[1]);
  if (len === 0) return null;
  const ux = (q[0] - p[0]) / len;
  const uy = (q[1] - p[1]) / len;
  const at = (s: number): Point => [p[0] + ux * s, p[1] + uy * s];
  return [at(d.offsetMm), at(d.offsetMm + d.widthMm)];
}

function patternInput(p: PatternDraft): TakeoffInput['pattern'] {
  const list = (s: string) =>
    s
      .split(',')
      .map((c) => c.trim())
      .filter(Boolean);
  switch (p.kind) {
    case 'single':
      return { kind: 'single', colour: p.colour };
    case 'border':
      return { kind: 'border', rows: p.borderRows, borderColour: p.colour2, fieldColour: p.colour };
    case 'chequer':
      return { kind: 'chequer', colours: [p.colour, p.colour2] };
    case 'stripes':
      return {
        kind: 'stripes',
        colours: list(p.stripeColours),
        widthTiles: p.stripeWidth,
        direction: p.stripeDirection,
      };
    case 'bays':
      return {
        kind: 'bays',
        baseColour: p.colour,
        bays: p.bays.map((b) => ({ polygon: rectPoints(b), colour: b.colour })),
      };
  }
}

/**
 * The engine's input for the draft. `suggestOrigin` is off while editing: the search behind a
 * sliver warning's suggestion costs about ten layouts; the page asks for it separately.
 */
export function takeoffInputOf(
  f: FloorDraft,
  rates: TakeoffRates,
  suggestOrigin = false,
): TakeoffInput {
  const origin: TakeoffInput['origin'] =
    f.origin.mode === 'point' ? { x: f.origin.x, y: f.origin.y } : f.origin.mode;
  return {
    outline: f.outline,
    obstacles: f.obstacles.map((o) => (o.kind === 'rect' ? rectPoints(o) : o.points)),
    doorways: f.doorways.map((d) => {
      const ends = doorwayEnds(f.outline, d);
      // A doorway on a wall that no longer exists still reaches the validator, which names it.
      const [from, to] = ends ?? [
        [NaN, NaN],
        [NaN, NaN],
      ];
      return { from, to, ramp: d.ramp };
    }),
    tile: { pitchMm: f.pitchMm },
    gapMm: f.gapMm,
    origin,
    pattern: patternInput(f.pattern),
    zones: {
      adhesive: f.adhesive.map(rectPoints),
      levelling: f.levelling.map((z) => ({ polygon: rectPoints(z), depthMm: z.depthMm })),
    },
    rates,
    suggestOrigin,
  };
}
