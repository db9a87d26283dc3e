/**
 * Public input and result types of the takeoff engine. Lengths are millimetres, areas in
 * the result are square metres unless the name says `Mm2`.
 */
import type { TakeoffRates } from './rates';

/** A point `[x, y]` in millimetres. */
export type Point = [number, number];
/** A polygon as a list of points; closing point optional, either winding. */
export type Polygon = Point[];

export interface Doorway {
  from: Point;
  to: Point;
  /** An edge ramp is fitted along this doorway. */
  ramp?: boolean;
}

export interface LevellingZone {
  polygon: Polygon;
  /** Average depth of filler in millimetres. */
  depthMm: number;
}

/** Colour names are free text (the catalogue's colour); they key the per-colour counts. */
export type Pattern =
  | { kind: 'single'; colour?: string }
  | { kind: 'chequer'; colours: [string, string] }
  /** Stripes of `widthTiles` tiles cycling through `colours`, along rows or columns. */
  | { kind: 'stripes'; colours: string[]; widthTiles?: number; direction?: 'rows' | 'columns' }
  /**
   * A border of `rows` tiles along the walls: a tile is a border tile when its centre lies
   * within `rows × pitch` of the tiled region's outer edge (so the cut row counts as one).
   */
  | { kind: 'border'; rows: number; borderColour: string; fieldColour: string }
  /** Painted bays / walkways: a tile takes a bay's colour when its centre is inside the bay. */
  | { kind: 'bays'; baseColour: string; bays: { polygon: Polygon; colour: string }[] };

export type OriginOption = 'auto' | 'centre' | { x: number; y: number };

export interface TakeoffInput {
  /** The floor's walls: a simple polygon, either winding. */
  outline: Polygon;
  /** Columns, plinths, pits: simple polygons inside the outline, not overlapping each other. */
  obstacles?: Polygon[];
  /** Openings on outline edges; `from` and `to` must lie on the same edge. */
  doorways?: Doorway[];
  tile: {
    /** Laid pitch of a square tile in mm (100–1500). */
    pitchMm: number;
  };
  /** Expansion gap at walls and around obstacles, default 5 mm (0–50). */
  gapMm?: number;
  /** Grid origin: a tile corner sits on it. Default `'centre'`. */
  origin?: OriginOption;
  /**
   * Rotation of the tile grid in degrees, counter-clockwise (default 0). 45 gives a diagonal
   * layout. Not searched by `'auto'`: for square tiles 0° and 90° give the same grid.
   */
  layoutAngleDeg?: number;
  /** Extra tiles on top of the pieces needed, percent (default from rates). */
  overagePct?: number;
  /** Tiles per box (default from rates). */
  packSize?: number;
  /** Pieces thinner than this are slivers; default pitch / 5. */
  minCutMm?: number;
  pattern?: Pattern;
  zones?: { adhesive?: Polygon[]; levelling?: LevellingZone[] };
  /** Overrides of {@link DEFAULT_RATES}; unspecified fields keep their default. */
  rates?: Partial<TakeoffRates>;
  /** Skirting (and corner trims) around obstacles too; default true. */
  skirtObstacles?: boolean;
  /** Look for an origin without slivers when the chosen one has some (default true). */
  suggestOrigin?: boolean;
}

/** One problem found in an input: the field (path) and, where it helps, the point. */
export interface TakeoffProblem {
  field: string;
  message: string;
  point?: Point;
}

/** How a cut piece was cut, for offcut reuse: a straight cut across the whole tile. */
export type CutKind =
  /** Full height, keeps the tile's left part (it meets the field on its left). */
  'left-part' | 'right-part' | 'bottom-part' | 'top-part' | 'shaped';

export interface CutTile {
  /** Grid column and row of the cell. */
  i: number;
  j: number;
  colour: string;
  areaMm2: number;
  /** Shorter side of the bounding box of the thinnest piece in the cell. */
  sizeMm: number;
  sliver: boolean;
  kind: CutKind;
  /** Filled with the offcut of another cut tile of the same row or column. */
  fromOffcut: boolean;
  /** The pieces in world coordinates: each ring a flat list x0, y0, x1, y1, … */
  rings: number[][];
}

export interface TakeoffWarning {
  code:
    | 'slivers'
    | 'obstacle-near-wall'
    | 'zone-outside-floor'
    | 'production-batch'
    | 'acclimatisation'
    | 'empty-layout';
  severity: 'info' | 'warning';
  message: string;
  point?: Point;
  /** Machine-readable details (e.g. the suggested origin). */
  data?: Record<string, unknown>;
}

export interface ColourCount {
  colour: string;
  full: number;
  cut: number;
  offcutsReused: number;
  /** Tiles that must come out of boxes: full + cut − offcuts reused. */
  needed: number;
  /** Needed + overage, rounded up to whole packs. */
  toOrder: number;
  packs: number;
  areaM2: number;
}

/**
 * The layout plan in compact form. Full tiles are runs of one row and one colour:
 * `fullRuns` holds quadruples `[iStart, iEnd (exclusive), j, colourIndex]`; cell (i, j) is
 * the square with corners origin + R(angle)·(i·p, j·p) … ((i+1)·p, (j+1)·p). Use
 * {@link cellCorners} to draw one.
 */
export interface TakeoffPlan {
  origin: { x: number; y: number };
  pitchMm: number;
  angleDeg: number;
  colours: string[];
  fullRuns: number[];
  cutTiles: CutTile[];
  /** The tiled region (after gaps) in world coordinates, for drawing. */
  regionOutline: Polygon;
  regionHoles: Polygon[];
}

export interface TakeoffResult {
  netAreaM2: number;
  perimeterMm: number;
  tiledAreaM2: number;
  tiles: {
    full: number;
    cut: number;
    offcutsReused: number;
    needed: number;
    toOrder: number;
    packs: number;
    byColour: ColourCount[];
    /** Tiles per m² of tiled area at this pitch (1 / pitch²). */
    perM2: number;
  };
  cuts: { smallestMm: number | null; slivers: number; minCutMm: number };
  origin: { x: number; y: number; mode: 'auto' | 'centre' | 'given' };
  skirtingMm: number;
  corners: { internal: number; external: number };
  rampMm: number;
  materials: Materials;
  labour: Labour;
  warnings: TakeoffWarning[];
  plan: TakeoffPlan;
}

export interface Materials {
  skirting: { lengthMm: number; pieces: number; stockLengthMm: number };
  cornerTrims: { internal: number; external: number };
  ramps: { lengthMm: number; pieces: number; stockLengthMm: number };
  adhesive: { areaM2: number; kg: number; kits: number; mixes: number };
  primer: { areaM2: number; litres: number; packs: number };
  filler: { areaM2: number; kg: number; bags: number };
  anchoring: { method: 'tape' | 'mastic'; lengthMm: number; units: number };
}

export interface Labour {
  hours: {
    laying: number;
    cutting: number;
    adhesive: number;
    levelling: number;
    skirting: number;
    total: number;
  };
  crewSize: number;
  /** Working days for the crew (hours / (crew × hours per day)), not rounded. */
  crewDays: number;
  /** Crew days rounded up to whole days. */
  crewDaysRoundedUp: number;
}
