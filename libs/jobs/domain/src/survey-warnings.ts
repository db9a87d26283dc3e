/**
 * The warnings a job and its quote show for failed slab readings: one per kind of reading,
 * so five wet spots make one "slab too wet" line rather than five.
 */
import { DEFAULT_SLAB_LIMITS, type ReadingKind, type SlabLimits } from './slab-limits';
import {
  FAIL_ADVICE,
  KIND_LABELS,
  evaluateReading,
  formatFigure,
  type SlabReading,
} from './slab-readings';

/** Said beside every survey warning: we advise, the rules that apply decide. */
export const GOVERNING_NOTE =
  "Local codes, the manufacturer's instructions and licensed practice govern.";

export interface SurveyWarning {
  readonly kind: ReadingKind;
  /** Short line for a banner: "Slab too wet". */
  readonly title: string;
  /** The whole sentence, with counts, the worst value and what to do. */
  readonly message: string;
  readonly source: string;
  readonly failed: number;
  readonly total: number;
  /** The worst failed reading, in the limit's unit. */
  readonly worst: { readonly value: number; readonly id?: string; readonly location?: string };
  /** Ids of the failed readings that have one. */
  readonly readingIds: readonly string[];
}

const TITLES: Readonly<Record<ReadingKind, string>> = {
  relative_humidity: 'Slab too wet',
  moisture_emission: 'Slab too wet',
  surface_regularity: 'Floor not flat enough',
  air_temperature: 'Room too cold',
  slab_temperature: 'Slab too cold',
};

/**
 * Warnings for the failed readings, one per kind in a fixed order. Readings that only warn
 * do not appear: the survey screen shows those itself. Throws SlabReadingError for an
 * invalid reading (the API validates readings before storing them).
 */
export function surveyWarnings(
  readings: readonly SlabReading[],
  limits: SlabLimits = DEFAULT_SLAB_LIMITS,
): SurveyWarning[] {
  const byKind = new Map<ReadingKind, { reading: SlabReading; value: number }[]>();
  const totals = new Map<ReadingKind, number>();
  for (const reading of readings) {
    const result = evaluateReading(reading, limits);
    totals.set(reading.kind, (totals.get(reading.kind) ?? 0) + 1);
    if (result.status !== 'fail') continue;
    const list = byKind.get(reading.kind) ?? [];
    list.push({ reading, value: result.value });
    byKind.set(reading.kind, list);
  }
  const kinds = Object.keys(TITLES) as ReadingKind[];
  return kinds.flatMap((kind) => {
    const failed = byKind.get(kind);
    if (!failed) return [];
    const limit = limits[kind];
    // Worst = furthest past the limit.
    const sign = limit.bound === 'max' ? 1 : -1;
    const worst = failed.reduce((a, b) => (sign * b.value > sign * a.value ? b : a));
    const total = totals.get(kind) ?? failed.length;
    const at = worst.reading.location ? ` at ${worst.reading.location}` : '';
    const limitText = `${formatFigure(limit.value)} ${limit.unit}`;
    const side = limit.bound === 'max' ? 'over' : 'below';
    const message =
      `${failed.length} of ${total} ${KIND_LABELS[kind].toLowerCase()} readings ${side} ` +
      `${limitText} (worst ${formatFigure(worst.value)} ${limit.unit}${at}). ${FAIL_ADVICE[kind]} ` +
      GOVERNING_NOTE;
    return [
      {
        kind,
        title: TITLES[kind],
        message,
        source: limit.source,
        failed: failed.length,
        total,
        worst: { value: worst.value, id: worst.reading.id, location: worst.reading.location },
        readingIds: failed.flatMap((f) => (f.reading.id ? [f.reading.id] : [])),
      },
    ];
  });
}
