/**
 * Limits for slab readings taken at the site survey, each default naming its source, and the
 * unit conversion for moisture emission. A firm may override a limit in its settings (a
 * manufacturer's own figure, for example); the source then says so.
 */

/** NIST SP 811, Appendix B: 1 lb (avoirdupois) = 0.45359237 kg exactly. */
export const KG_PER_LB = 0.45359237;
/** NIST SP 811, Appendix B: 1 ft² = 0.09290304 m² exactly. */
export const M2_PER_FT2 = 0.09290304;
/** 1 lb/1000 ft²/24 h in g/m²/24 h (≈ 4.8824), from the two factors above. */
export const G_M2_PER_LB_1000FT2 = (KG_PER_LB * 1000) / (1000 * M2_PER_FT2);

/** Moisture vapour emission: lb/1000 ft²/24 h → g/m²/24 h. */
export function emissionToMetric(lbPer1000Ft2: number): number {
  return lbPer1000Ft2 * G_M2_PER_LB_1000FT2;
}

/** Moisture vapour emission: g/m²/24 h → lb/1000 ft²/24 h. */
export function emissionToImperial(gPerM2: number): number {
  return gPerM2 / G_M2_PER_LB_1000FT2;
}

/** What is measured. Air and slab temperature are separate: both must be warm enough. */
export type ReadingKind =
  | 'relative_humidity'
  | 'moisture_emission'
  | 'surface_regularity'
  | 'air_temperature'
  | 'slab_temperature';

export const READING_KINDS: readonly ReadingKind[] = [
  'relative_humidity',
  'moisture_emission',
  'surface_regularity',
  'air_temperature',
  'slab_temperature',
];

/**
 * One limit. `max`: the reading fails above `value`; `min`: it fails below. A reading within
 * `warnMargin` of the limit on the passing side is a warning: close enough that the next
 * test, another spot or a change of weather may fail it.
 */
export interface LimitRule {
  readonly bound: 'max' | 'min';
  readonly value: number;
  readonly warnMargin: number;
  /** Unit of `value`, as shown to people. */
  readonly unit: string;
  readonly source: string;
}

export type SlabLimits = Readonly<Record<ReadingKind, LimitRule>>;

/** Surface regularity classes: maximum gap under a 2 m straightedge, mm (BS 8204). */
export const REGULARITY_CLASSES = { SR1: 3, SR2: 5, SR3: 10 } as const;
export type RegularityClass = keyof typeof REGULARITY_CLASSES;

/**
 * The warning band, our decision: 5 % of the limit for quantities measured from a true zero
 * (humidity, emission, millimetres); 1 °C for temperatures, where a percentage of a Celsius
 * figure means nothing. So RH warns from 71.25 %, emission from 2.85 lb, SR2 from 4.75 mm,
 * temperature up to 16 °C.
 */
export function defaultWarnMargin(kind: ReadingKind, value: number): number {
  return kind === 'air_temperature' || kind === 'slab_temperature' ? 1 : value * 0.05;
}

const rule = (
  kind: ReadingKind,
  bound: 'max' | 'min',
  value: number,
  unit: string,
  source: string,
): LimitRule => ({ bound, value, warnMargin: defaultWarnMargin(kind, value), unit, source });

/** The limit rule of a surface regularity class. */
export function regularityLimit(cls: RegularityClass): LimitRule {
  return rule(
    'surface_regularity',
    'max',
    REGULARITY_CLASSES[cls],
    'mm',
    `BS 8204 class ${cls}: ${REGULARITY_CLASSES[cls]} mm max. gap under a 2 m straightedge`,
  );
}

/** The defaults, each naming its source. */
export const DEFAULT_SLAB_LIMITS: SlabLimits = {
  relative_humidity: rule(
    'relative_humidity',
    'max',
    75,
    '%',
    'BS 8203 (hood hygrometer); ASTM F2170 in-slab probe as summarised in ASTM F710 guidance',
  ),
  moisture_emission: rule(
    'moisture_emission',
    'max',
    3,
    'lb/1000 ft²/24 h',
    'ASTM F1869 calcium chloride test',
  ),
  surface_regularity: regularityLimit('SR2'),
  air_temperature: rule(
    'air_temperature',
    'min',
    15,
    '°C',
    'common practice for interlocking PVC tiles',
  ),
  slab_temperature: rule(
    'slab_temperature',
    'min',
    15,
    '°C',
    'common practice for interlocking PVC tiles',
  ),
};

/** A firm's override of one limit: a new value (and optionally margin and source). */
export interface LimitOverride {
  readonly value?: number;
  readonly warnMargin?: number;
  readonly source?: string;
}

/**
 * The limits with a firm's overrides applied. A new value without a margin gets the default
 * band for that value; without a source it reads "firm's setting". Throws RangeError for a
 * negative margin or a value that is not finite (settings validation should stop those).
 */
export function resolveSlabLimits(
  overrides: Partial<Record<ReadingKind, LimitOverride>> = {},
  base: SlabLimits = DEFAULT_SLAB_LIMITS,
): SlabLimits {
  const out = { ...base } as Record<ReadingKind, LimitRule>;
  for (const kind of READING_KINDS) {
    const o = overrides[kind];
    if (!o) continue;
    const value = o.value ?? base[kind].value;
    const warnMargin =
      o.warnMargin ??
      (o.value === undefined ? base[kind].warnMargin : defaultWarnMargin(kind, value));
    if (!Number.isFinite(value) || !Number.isFinite(warnMargin) || warnMargin < 0) {
      throw new RangeError(`Bad limit for ${kind}: value ${value}, margin ${warnMargin}.`);
    }
    const source = o.source ?? (o.value === undefined ? base[kind].source : "firm's setting");
    out[kind] = { ...base[kind], value, warnMargin, source };
  }
  return out;
}
