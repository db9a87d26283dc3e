/**
 * Plain validation of a takeoff input (no schema library, so it runs anywhere, live in a
 * page). Every problem names the field as a path (`obstacles[2]`, `tile.pitchMm`) and, for
 * geometry, the point where it happens.
 */
import { pointInRing, pointSegmentDistance, signedArea } from './geometry/polygon';
import { floorRule, regionArea } from './geometry/sweep';
import { buildRegion } from './layout/region';
import { DEFAULT_RATES } from './rates';
import type { Point, TakeoffProblem } from './types';
import { checkRing, findRingTouch } from './validate-ring';

export const LIMITS = Object.freeze({
  minPitchMm: 100,
  maxPitchMm: 1500,
  minGapMm: 0,
  maxGapMm: 50,
  maxAreaM2: 100_000,
  maxVertices: 5_000,
  /** Points closer than this to an edge count as on it (doorways, obstacles at a wall). */
  onEdgeTolMm: 1,
  maxLevellingDepthMm: 200,
});

/** Thrown by computeTakeoff for bad input; `problems` is what validateTakeoffInput returns. */
export class TakeoffInputError extends Error {
  constructor(public readonly problems: TakeoffProblem[]) {
    super(
      `Invalid takeoff input: ${problems
        .slice(0, 3)
        .map((p) => `${p.field || 'input'}: ${p.message}`)
        .join('; ')}${problems.length > 3 ? ` (and ${problems.length - 3} more)` : ''}`,
    );
    this.name = 'TakeoffInputError';
  }
}

type Obj = Record<string, unknown>;
const isObj = (v: unknown): v is Obj => typeof v === 'object' && v !== null && !Array.isArray(v);
const isNum = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v);

/** Reads a ring of points; reports malformed points. Returns null when unusable. */
function readRing(v: unknown, field: string, out: TakeoffProblem[]): Point[] | null {
  if (!Array.isArray(v)) {
    out.push({ field, message: 'must be a list of [x, y] points' });
    return null;
  }
  for (let i = 0; i < v.length; i++) {
    const p = v[i];
    if (!Array.isArray(p) || p.length !== 2 || !isNum(p[0]) || !isNum(p[1])) {
      out.push({
        field: `${field}[${i}]`,
        message: 'must be a point [x, y] of finite numbers (mm)',
      });
      return null;
    }
  }
  return v as Point[];
}

function checkRange(
  v: unknown,
  field: string,
  min: number,
  max: number,
  out: TakeoffProblem[],
  unit = 'mm',
): void {
  if (v === undefined) return;
  if (!isNum(v)) out.push({ field, message: 'must be a number' });
  else if (v < min || v > max)
    out.push({ field, message: `must be between ${min} and ${max} ${unit} (got ${v})` });
}

/**
 * A floor narrower than twice the expansion gap has no room to tile: the gap's inward
 * offset turns inside out, and a folded offset would be counted as floor. The region the
 * engine would tile can never be larger than the floor, so that is the test; it is refused
 * with a clear message rather than tiled wrongly. (A local fold at a short jog in a wall is
 * fine: the winding rule drops it, and the area stays below the floor's.)
 */
function gapClosesUp(outline: Point[], input: Record<string, unknown>): TakeoffProblem | null {
  const rates = isObj(input['rates']) ? input['rates'] : {};
  const gap = isNum(input['gapMm'])
    ? input['gapMm']
    : isNum(rates['gapMm'])
      ? rates['gapMm']
      : DEFAULT_RATES.gapMm;
  if (!(gap > 0) || gap > LIMITS.maxGapMm) return null;
  const region = buildRegion(outline, [], gap, 0);
  const floorArea = Math.abs(signedArea(outline));
  if (regionArea(region.edges, floorRule) <= floorArea * (1 + 1e-9)) return null;
  return {
    field: 'gapMm',
    message: `the floor is narrower than twice the ${gap} mm gap, so the gap closes up; measure again or reduce the gap`,
    point: outline[0],
  };
}

/** All problems with the input; an empty list means computeTakeoff will accept it. */
export function validateTakeoffInput(input: unknown): TakeoffProblem[] {
  const out: TakeoffProblem[] = [];
  if (!isObj(input)) return [{ field: '', message: 'input must be an object' }];

  // Scalars first: they are cheap and independent of the geometry.
  const tile = input['tile'];
  let pitch = NaN;
  if (!isObj(tile)) out.push({ field: 'tile', message: 'must be an object with pitchMm' });
  else if (!isNum(tile['pitchMm']))
    out.push({ field: 'tile.pitchMm', message: 'must be a number' });
  else {
    pitch = tile['pitchMm'];
    checkRange(pitch, 'tile.pitchMm', LIMITS.minPitchMm, LIMITS.maxPitchMm, out);
  }
  checkRange(input['gapMm'], 'gapMm', LIMITS.minGapMm, LIMITS.maxGapMm, out);
  checkRange(input['overagePct'], 'overagePct', 0, 100, out, '%');
  const pack = input['packSize'];
  if (pack !== undefined && (!isNum(pack) || !Number.isInteger(pack) || pack < 1)) {
    out.push({ field: 'packSize', message: 'must be a whole number of tiles, at least 1' });
  }
  const minCut = input['minCutMm'];
  if (minCut !== undefined && (!isNum(minCut) || minCut < 0 || (isNum(pitch) && minCut >= pitch))) {
    out.push({
      field: 'minCutMm',
      message: 'must be a number from 0 up to (not including) the pitch',
    });
  }
  const angle = input['layoutAngleDeg'];
  if (angle !== undefined && !isNum(angle))
    out.push({ field: 'layoutAngleDeg', message: 'must be a number' });
  const origin = input['origin'];
  if (
    origin !== undefined &&
    origin !== 'auto' &&
    origin !== 'centre' &&
    !(isObj(origin) && isNum(origin['x']) && isNum(origin['y']))
  ) {
    out.push({ field: 'origin', message: "must be 'auto', 'centre' or { x, y } in mm" });
  }
  for (const flag of ['skirtObstacles', 'suggestOrigin']) {
    if (input[flag] !== undefined && typeof input[flag] !== 'boolean')
      out.push({ field: flag, message: 'must be true or false' });
  }
  checkRates(input['rates'], out);

  // Geometry.
  const outlineRaw = readRing(input['outline'], 'outline', out);
  const obstaclesRaw = input['obstacles'] ?? [];
  const obstacles: (Point[] | null)[] = [];
  if (!Array.isArray(obstaclesRaw))
    out.push({ field: 'obstacles', message: 'must be a list of polygons' });
  else obstaclesRaw.forEach((o, k) => obstacles.push(readRing(o, `obstacles[${k}]`, out)));
  const zones = readZones(input['zones'], out);
  const patternRings = checkPattern(input['pattern'], out);

  const counted: [string, number][] = [
    ['outline', outlineRaw?.length ?? 0],
    ['obstacles', obstacles.reduce((s, o) => s + (o?.length ?? 0), 0)],
    ['zones', zones.reduce((s, z) => s + (z.ring?.length ?? 0), 0)],
    ['pattern', patternRings.reduce((s, z) => s + (z.ring?.length ?? 0), 0)],
  ];
  let total = 0;
  for (const [field, n] of counted) {
    total += n;
    if (total > LIMITS.maxVertices) {
      out.push({
        field,
        message: `the floor has more than ${LIMITS.maxVertices} vertices in all (outline, obstacles, zones)`,
      });
      return out; // Too big to check further within a live edit's budget.
    }
  }

  if (!outlineRaw) return out;
  const outline = checkRing(outlineRaw, 'outline', out);
  if (outline) {
    const areaM2 = Math.abs(signedArea(outline)) / 1e6;
    if (areaM2 > LIMITS.maxAreaM2 * (1 + 1e-9)) {
      out.push({
        field: 'outline',
        message: `floor area ${Math.round(areaM2)} m² is over the ${LIMITS.maxAreaM2} m² limit`,
      });
    }
    const gapClosure = gapClosesUp(outline, input);
    if (gapClosure) out.push(gapClosure);
  }
  const goodObstacles: { ring: Point[]; k: number }[] = [];
  obstacles.forEach((raw, k) => {
    if (!raw) return;
    const ring = checkRing(raw, `obstacles[${k}]`, out);
    if (!ring) return;
    if (outline) {
      const outside = ringOutside(ring, outline);
      if (outside) {
        out.push({
          field: `obstacles[${k}]`,
          message: 'lies (partly) outside the outline',
          point: outside,
        });
        return;
      }
    }
    goodObstacles.push({ ring, k });
  });
  checkObstacleOverlaps(goodObstacles, out);
  if (outline) checkDoorways(input['doorways'], outline, out);
  else if (input['doorways'] !== undefined && !Array.isArray(input['doorways'])) {
    out.push({ field: 'doorways', message: 'must be a list of { from, to }' });
  }
  for (const z of [...zones, ...patternRings]) if (z.ring) checkRing(z.ring, z.field, out);
  return out;
}

/** A point of `ring` outside `outline` (or where their edges cross), or null. */
function ringOutside(ring: Point[], outline: Point[]): Point | null {
  const tol = LIMITS.onEdgeTolMm;
  for (const p of ring) {
    if (pointInRing(p, outline)) continue;
    if (onRing(p, outline, tol)) continue;
    return p;
  }
  for (let a = 0; a < ring.length; a++) {
    const p = ring[a];
    const q = ring[(a + 1) % ring.length];
    const mid: Point = [(p[0] + q[0]) / 2, (p[1] + q[1]) / 2];
    if (!pointInRing(mid, outline) && !onRing(mid, outline, tol)) return mid;
  }
  const touch = findRingTouch(ring, outline, 0, true);
  return touch;
}

function onRing(p: Point, ring: Point[], tol: number): boolean {
  for (let a = 0; a < ring.length; a++)
    if (pointSegmentDistance(p, ring[a], ring[(a + 1) % ring.length]) <= tol) return true;
  return false;
}

/** A point strictly inside a simple ring: an edge midpoint nudged inward. */
function interiorPoint(ring: Point[]): Point {
  const ccw = signedArea(ring) > 0;
  let best: Point = ring[0];
  let bestLen = -1;
  for (let a = 0; a < ring.length; a++) {
    const p = ring[a];
    const q = ring[(a + 1) % ring.length];
    const len = Math.hypot(q[0] - p[0], q[1] - p[1]);
    if (len <= bestLen) continue;
    bestLen = len;
    const nx = (-(q[1] - p[1]) / len) * (ccw ? 1 : -1);
    const ny = ((q[0] - p[0]) / len) * (ccw ? 1 : -1);
    const d = Math.min(0.01, len * 1e-4);
    best = [(p[0] + q[0]) / 2 + nx * d, (p[1] + q[1]) / 2 + ny * d];
  }
  return best;
}

function checkObstacleOverlaps(list: { ring: Point[]; k: number }[], out: TakeoffProblem[]): void {
  const boxes = list.map(({ ring }) => {
    let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity; // prettier-ignore
    for (const p of ring) {
      minX = Math.min(minX, p[0]);
      maxX = Math.max(maxX, p[0]);
      minY = Math.min(minY, p[1]);
      maxY = Math.max(maxY, p[1]);
    }
    return { minX, minY, maxX, maxY };
  });
  const order = list.map((_, i) => i).sort((a, b) => boxes[a].minX - boxes[b].minX);
  for (let s = 0; s < order.length; s++) {
    const a = order[s];
    for (let t = s + 1; t < order.length; t++) {
      const b = order[t];
      if (boxes[b].minX > boxes[a].maxX) break;
      if (boxes[b].minY > boxes[a].maxY || boxes[b].maxY < boxes[a].minY) continue;
      const A = list[a].ring;
      const B = list[b].ring;
      const cross = findRingTouch(A, B, 0, true);
      const inside =
        cross ??
        (pointInRing(interiorPoint(B), A) ? interiorPoint(B) : null) ??
        (pointInRing(interiorPoint(A), B) ? interiorPoint(A) : null);
      if (inside) {
        const [k1, k2] = [list[a].k, list[b].k].sort((u, v) => u - v);
        out.push({
          field: `obstacles[${k2}]`,
          message: `overlaps obstacles[${k1}]`,
          point: inside,
        });
      }
    }
  }
}

function checkDoorways(v: unknown, outline: Point[], out: TakeoffProblem[]): void {
  if (v === undefined) return;
  if (!Array.isArray(v)) {
    out.push({ field: 'doorways', message: 'must be a list of { from, to }' });
    return;
  }
  const tol = LIMITS.onEdgeTolMm;
  v.forEach((d, k) => {
    const field = `doorways[${k}]`;
    if (!isObj(d))
      return void out.push({ field, message: 'must be { from: [x, y], to: [x, y], ramp? }' });
    const pts = [d['from'], d['to']];
    for (const [n, p] of pts.entries()) {
      if (!Array.isArray(p) || p.length !== 2 || !isNum(p[0]) || !isNum(p[1])) {
        return void out.push({
          field: `${field}.${n === 0 ? 'from' : 'to'}`,
          message: 'must be a point [x, y]',
        });
      }
    }
    if (d['ramp'] !== undefined && typeof d['ramp'] !== 'boolean')
      out.push({ field: `${field}.ramp`, message: 'must be true or false' });
    const from = d['from'] as Point;
    const to = d['to'] as Point;
    if (Math.hypot(to[0] - from[0], to[1] - from[1]) <= tol) {
      return void out.push({
        field,
        message: 'has no width (from and to are the same point)',
        point: from,
      });
    }
    for (let a = 0; a < outline.length; a++) {
      const p = outline[a];
      const q = outline[(a + 1) % outline.length];
      if (pointSegmentDistance(from, p, q) <= tol && pointSegmentDistance(to, p, q) <= tol) return;
    }
    const off = onRing(from, outline, tol) ? to : from;
    out.push({
      field,
      message: 'is not on an edge of the outline (from and to must lie on the same wall)',
      point: off,
    });
  });
}

interface NamedRing {
  field: string;
  ring: Point[] | null;
}

function readZones(v: unknown, out: TakeoffProblem[]): NamedRing[] {
  const rings: NamedRing[] = [];
  if (v === undefined) return rings;
  if (!isObj(v)) {
    out.push({ field: 'zones', message: 'must be { adhesive?, levelling? }' });
    return rings;
  }
  const adhesive = v['adhesive'] ?? [];
  if (!Array.isArray(adhesive))
    out.push({ field: 'zones.adhesive', message: 'must be a list of polygons' });
  else
    adhesive.forEach((z, k) =>
      rings.push({ field: `zones.adhesive[${k}]`, ring: readRing(z, `zones.adhesive[${k}]`, out) }),
    );
  const lev = v['levelling'] ?? [];
  if (!Array.isArray(lev))
    out.push({ field: 'zones.levelling', message: 'must be a list of { polygon, depthMm }' });
  else {
    lev.forEach((z, k) => {
      const field = `zones.levelling[${k}]`;
      if (!isObj(z)) return void out.push({ field, message: 'must be { polygon, depthMm }' });
      if (!isNum(z['depthMm']) || z['depthMm'] <= 0 || z['depthMm'] > LIMITS.maxLevellingDepthMm) {
        out.push({
          field: `${field}.depthMm`,
          message: `must be more than 0 and at most ${LIMITS.maxLevellingDepthMm} mm`,
        });
      }
      rings.push({
        field: `${field}.polygon`,
        ring: readRing(z['polygon'], `${field}.polygon`, out),
      });
    });
  }
  return rings;
}

function checkPattern(v: unknown, out: TakeoffProblem[]): NamedRing[] {
  const rings: NamedRing[] = [];
  if (v === undefined) return rings;
  const field = 'pattern';
  const str = (x: unknown) => typeof x === 'string' && x.length > 0;
  if (!isObj(v)) return (out.push({ field, message: 'must be an object with a kind' }), rings);
  const kind = v['kind'];
  const colours = v['colours'];
  switch (kind) {
    case 'single':
      if (v['colour'] !== undefined && !str(v['colour']))
        out.push({ field: 'pattern.colour', message: 'must be a colour name' });
      break;
    case 'chequer':
      if (!Array.isArray(colours) || colours.length !== 2 || !colours.every(str)) {
        out.push({ field: 'pattern.colours', message: 'must be two colour names' });
      }
      break;
    case 'stripes':
      if (!Array.isArray(colours) || colours.length < 1 || !colours.every(str)) {
        out.push({ field: 'pattern.colours', message: 'must be a list of colour names' });
      }
      if (
        v['widthTiles'] !== undefined &&
        !(Number.isInteger(v['widthTiles']) && (v['widthTiles'] as number) >= 1)
      ) {
        out.push({
          field: 'pattern.widthTiles',
          message: 'must be a whole number of tiles, at least 1',
        });
      }
      if (
        v['direction'] !== undefined &&
        v['direction'] !== 'rows' &&
        v['direction'] !== 'columns'
      ) {
        out.push({ field: 'pattern.direction', message: "must be 'rows' or 'columns'" });
      }
      break;
    case 'border':
      if (
        !(Number.isInteger(v['rows']) && (v['rows'] as number) >= 1 && (v['rows'] as number) <= 100)
      ) {
        out.push({
          field: 'pattern.rows',
          message: 'must be a whole number of rows from 1 to 100',
        });
      }
      if (!str(v['borderColour']))
        out.push({ field: 'pattern.borderColour', message: 'must be a colour name' });
      if (!str(v['fieldColour']))
        out.push({ field: 'pattern.fieldColour', message: 'must be a colour name' });
      break;
    case 'bays': {
      if (!str(v['baseColour']))
        out.push({ field: 'pattern.baseColour', message: 'must be a colour name' });
      const bays = v['bays'];
      if (!Array.isArray(bays)) {
        out.push({ field: 'pattern.bays', message: 'must be a list of { polygon, colour }' });
        break;
      }
      bays.forEach((b, k) => {
        const f = `pattern.bays[${k}]`;
        if (!isObj(b)) return void out.push({ field: f, message: 'must be { polygon, colour }' });
        if (!str(b['colour'])) out.push({ field: `${f}.colour`, message: 'must be a colour name' });
        rings.push({ field: `${f}.polygon`, ring: readRing(b['polygon'], `${f}.polygon`, out) });
      });
      break;
    }
    default:
      out.push({
        field: 'pattern.kind',
        message: "must be 'single', 'chequer', 'stripes', 'border' or 'bays'",
      });
  }
  return rings;
}

function checkRates(v: unknown, out: TakeoffProblem[]): void {
  if (v === undefined) return;
  if (!isObj(v)) return void out.push({ field: 'rates', message: 'must be an object' });
  for (const [key, value] of Object.entries(v)) {
    const field = `rates.${key}`;
    if (!(key in DEFAULT_RATES)) out.push({ field, message: 'is not a known rate' });
    else if (value === undefined) continue;
    else if (key === 'anchoring') {
      if (value !== 'tape' && value !== 'mastic')
        out.push({ field, message: "must be 'tape' or 'mastic'" });
    } else if (!isNum(value) || value < 0)
      out.push({ field, message: 'must be a number, zero or more' });
    else if (['packSize', 'crewSize'].includes(key) && !(Number.isInteger(value) && value >= 1)) {
      out.push({ field, message: 'must be a whole number, at least 1' });
    } else if (
      [
        'adhesiveKitKg',
        'primerPackL',
        'fillerBagKg',
        'tapeRollMm',
        'masticCartridgeMm',
        'skirtingStockMm',
        'rampStockMm',
        'hoursPerDay',
        'layM2PerHourPerFitter',
        'adhesiveLayM2PerHourPerFitter',
        'adhesivePotLifeMin',
        'skirtingMPerHour',
        'productionBatchM2',
      ].includes(key) &&
      value <= 0
    ) {
      out.push({ field, message: 'must be more than zero' });
    }
  }
}
