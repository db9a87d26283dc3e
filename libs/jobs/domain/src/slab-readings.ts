/**
 * Slab readings from the site survey and their pass / warn / fail against the limits.
 */
import {
  DEFAULT_SLAB_LIMITS,
  emissionToImperial,
  emissionToMetric,
  type LimitRule,
  type ReadingKind,
  type SlabLimits,
} from './slab-limits';

/** How each kind of reading may be taken. */
export const READING_METHODS = {
  relative_humidity: ['hood_hygrometer', 'in_slab_probe'],
  moisture_emission: ['calcium_chloride'],
  surface_regularity: ['straightedge_2m'],
  air_temperature: ['thermometer'],
  slab_temperature: ['surface_probe', 'infrared'],
} as const satisfies Record<ReadingKind, readonly string[]>;

export type ReadingMethod = (typeof READING_METHODS)[ReadingKind][number];

/** Plain words for each method, for messages and the survey form. */
export const METHOD_LABELS: Readonly<Record<ReadingMethod, string>> = {
  hood_hygrometer: 'hood hygrometer',
  in_slab_probe: 'in-slab probe',
  calcium_chloride: 'calcium chloride test',
  straightedge_2m: '2 m straightedge',
  thermometer: 'thermometer',
  surface_probe: 'surface probe',
  infrared: 'infrared thermometer',
};

export const KIND_LABELS: Readonly<Record<ReadingKind, string>> = {
  relative_humidity: 'Relative humidity',
  moisture_emission: 'Moisture emission',
  surface_regularity: 'Surface regularity',
  air_temperature: 'Air temperature',
  slab_temperature: 'Slab temperature',
};

/** Emission may be entered in either unit; the limit is kept in lb/1000 ft²/24 h. */
export type EmissionUnit = 'lb_per_1000ft2_24h' | 'g_per_m2_24h';

/**
 * One reading. `value` is in %, the emission unit, mm (the largest gap under the
 * straightedge) or °C by kind. `id` and `location` ("bay 2 by the door") travel into the
 * warnings so people can find the spot again.
 */
export interface SlabReading {
  readonly kind: ReadingKind;
  readonly method: ReadingMethod;
  readonly value: number;
  readonly unit?: EmissionUnit;
  readonly id?: string;
  readonly location?: string;
}

/** Plausible ranges: a value outside is a typing slip, not a reading. */
const RANGES: Readonly<Record<ReadingKind, readonly [number, number]>> = {
  relative_humidity: [0, 100],
  moisture_emission: [0, 100],
  surface_regularity: [0, 200],
  air_temperature: [-40, 80],
  slab_temperature: [-40, 80],
};

/** What is wrong with a reading, in words ([] when it can be evaluated). */
export function readingProblems(reading: SlabReading): string[] {
  // Input may come from JSON or an old settings row: check the kind before trusting it.
  if (!Object.hasOwn(READING_METHODS, reading.kind)) {
    return [`Unknown reading kind "${String(reading.kind)}".`];
  }
  const problems: string[] = [];
  const methods: readonly string[] = READING_METHODS[reading.kind];
  if (!methods.includes(reading.method)) {
    problems.push(`${KIND_LABELS[reading.kind]} is measured by ${methods.join(' or ')}.`);
  }
  if (reading.unit !== undefined && reading.kind !== 'moisture_emission') {
    problems.push('Only moisture emission readings take a unit.');
  }
  const [lo, hi] = RANGES[reading.kind];
  const value = valueInLimitUnit(reading);
  if (!Number.isFinite(value) || value < lo || value > hi) {
    problems.push(`${KIND_LABELS[reading.kind]} must be between ${lo} and ${hi}.`);
  }
  return problems;
}

/** Thrown by `evaluateReading` for a reading with problems; the API maps it to 400. */
export class SlabReadingError extends Error {
  constructor(readonly problems: readonly string[]) {
    super(problems.join(' '));
    this.name = 'SlabReadingError';
  }
}

export type ReadingStatus = 'pass' | 'warn' | 'fail';

export interface ReadingEvaluation {
  readonly status: ReadingStatus;
  readonly limit: LimitRule;
  /** The value in the limit's unit (emission in g/m² converted to lb/1000 ft²). */
  readonly value: number;
  readonly message: string;
  readonly source: string;
}

function valueInLimitUnit(r: SlabReading): number {
  return r.kind === 'moisture_emission' && r.unit === 'g_per_m2_24h'
    ? emissionToImperial(r.value)
    : r.value;
}

/** At most two decimals, no trailing zeros, no locale (messages go into PDFs and e-mails). */
export function formatFigure(n: number): string {
  return String(Math.round(n * 100) / 100);
}

function describe(r: SlabReading, value: number): string {
  const m = METHOD_LABELS[r.method];
  if (r.kind === 'moisture_emission') {
    return `Moisture emission ${formatFigure(value)} lb/1000 ft²/24 h (${formatFigure(emissionToMetric(value))} g/m²/24 h, ${m})`;
  }
  const unit =
    r.kind === 'relative_humidity' ? ' %' : r.kind === 'surface_regularity' ? ' mm' : ' °C';
  return `${KIND_LABELS[r.kind]} ${formatFigure(value)}${unit} (${m})`;
}

/** What to do about a failed reading; the manufacturer's instructions still govern. */
export const FAIL_ADVICE: Readonly<Record<ReadingKind, string>> = {
  relative_humidity:
    'The slab is too wet to lay on: let it dry and re-test, or use a moisture barrier the manufacturer approves.',
  moisture_emission:
    'The slab gives off too much moisture: let it dry and re-test, or use a moisture barrier the manufacturer approves.',
  surface_regularity: 'Level the floor (smoothing compound or grinding) before fitting.',
  air_temperature: 'Warm the room and let the tiles acclimatise before fitting.',
  slab_temperature: 'Warm the room until the slab comes up to temperature before fitting.',
};

// Readings carry at most two decimals; this only absorbs binary rounding at the boundary.
const EPSILON = 1e-9;

/**
 * Pass, warn or fail for one reading. A reading exactly at the limit passes the limit (the
 * standards say "≤ 75 %", "≥ 15 °C") but lies inside the warning band.
 */
export function evaluateReading(
  reading: SlabReading,
  limits: SlabLimits = DEFAULT_SLAB_LIMITS,
): ReadingEvaluation {
  const problems = readingProblems(reading);
  if (problems.length) throw new SlabReadingError(problems);
  const limit = limits[reading.kind];
  const value = valueInLimitUnit(reading);
  // Signed distance to the limit, positive on the passing side.
  const headroom = limit.bound === 'max' ? limit.value - value : value - limit.value;
  const status: ReadingStatus =
    headroom < -EPSILON ? 'fail' : headroom <= limit.warnMargin + EPSILON ? 'warn' : 'pass';
  const limitText = `${formatFigure(limit.value)} ${limit.unit}`;
  const what = describe(reading, value);
  const side = limit.bound === 'max' ? 'over' : 'below';
  const message =
    status === 'fail'
      ? `${what} is ${side} the ${limitText} limit. ${FAIL_ADVICE[reading.kind]}`
      : status === 'warn'
        ? `${what} is close to the ${limitText} limit: re-test before fitting.`
        : `${what} is within the ${limitText} limit.`;
  return { status, limit, value, message, source: limit.source };
}
