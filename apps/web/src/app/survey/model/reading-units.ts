/**
 * How readings are entered and shown: the unit of each kind, and moisture emission in both
 * units (lb/1000 ft²/24 h as ASTM F1869 states the limit; g/m²/24 h by NIST SP 811 factors).
 */
import {
  KIND_LABELS,
  METHOD_LABELS,
  READING_KINDS,
  READING_METHODS,
  emissionToImperial,
  emissionToMetric,
  formatFigure,
  type EmissionUnit,
  type ReadingKind,
  type ReadingMethod,
} from '@latchwork/jobs-domain';

export const EMISSION_UNIT_LABELS: Readonly<Record<EmissionUnit, string>> = {
  lb_per_1000ft2_24h: 'lb/1000 ft²/24 h',
  g_per_m2_24h: 'g/m²/24 h',
};

export const KIND_OPTIONS = READING_KINDS.map((kind) => ({
  value: kind,
  label: KIND_LABELS[kind],
}));

/** The methods a kind of reading is taken by, for the method select. */
export function methodOptions(kind: ReadingKind): { value: ReadingMethod; label: string }[] {
  return READING_METHODS[kind].map((m) => ({ value: m, label: METHOD_LABELS[m] }));
}

/** The unit a value of this kind is entered in. */
export function unitLabel(kind: ReadingKind, unit: EmissionUnit | null = null): string {
  switch (kind) {
    case 'relative_humidity':
      return '%';
    case 'moisture_emission':
      return EMISSION_UNIT_LABELS[unit ?? 'lb_per_1000ft2_24h'];
    case 'surface_regularity':
      return 'mm';
    default:
      return '°C';
  }
}

/** The same emission in the other unit, e.g. "= 14.65 g/m²/24 h"; null for other kinds. */
export function otherUnitText(
  kind: ReadingKind,
  value: number | null,
  unit: EmissionUnit | null,
): string | null {
  if (kind !== 'moisture_emission' || value === null || !Number.isFinite(value)) return null;
  return unit === 'g_per_m2_24h'
    ? `= ${formatFigure(emissionToImperial(value))} ${EMISSION_UNIT_LABELS.lb_per_1000ft2_24h}`
    : `= ${formatFigure(emissionToMetric(value))} ${EMISSION_UNIT_LABELS.g_per_m2_24h}`;
}

/** A reading's value as the table shows it: emission in both units. */
export function valueText(kind: ReadingKind, value: number, unit: EmissionUnit | null): string {
  const main = `${formatFigure(value)} ${unitLabel(kind, unit)}`;
  const other = otherUnitText(kind, value, unit);
  return other ? `${main} (${other.slice(2)})` : main;
}

/** Now as a `datetime-local` value in the browser's time zone (the form's default). */
export function localNow(now = new Date()): string {
  const local = new Date(now.getTime() - now.getTimezoneOffset() * 60_000);
  return local.toISOString().slice(0, 16);
}
