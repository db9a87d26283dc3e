/**
 * Reading and writing lengths as people type them on site: millimetres or metres for metric,
 * feet and inches for imperial. Conversions use the engine's NIST SP 811 factors
 * (1 ft = 0.3048 m, 1 in = 25.4 mm exactly), so nothing here has its own constants.
 */
import { MM_PER_FOOT, MM_PER_INCH, feetInchesFromMm } from '@latchwork/takeoff';

export type Units = 'metric' | 'imperial';

/** What a bare number (no unit mark) means in a field: floor lengths in feet, small ones in inches. */
export type BareUnit = 'mm' | 'ft' | 'in';

const NUMBER = String.raw`\d+(?:\.\d*)?|\.\d+`;
/** `6 1/2` or `1/2`: a whole number and a fraction, as tapes are read. */
const FRACTION = String.raw`(?:(\d+)\s+)?(\d+)\s*/\s*(\d+)`;

const METRIC = new RegExp(String.raw`^(${NUMBER})\s*(mm|cm|m)?$`, 'i');
const FEET_MARK = String.raw`(?:'|′|ft|feet|foot)`;
const INCH_MARK = String.raw`(?:"|″|''|in|inch|inches)`;
const IMPERIAL = new RegExp(
  String.raw`^(?:(${NUMBER})\s*${FEET_MARK})?\s*(?:(${FRACTION}|${NUMBER})\s*${INCH_MARK})?$`,
  'i',
);
const BARE = new RegExp(String.raw`^(${NUMBER})$`);
const FRACTION_ONLY = new RegExp(String.raw`^${FRACTION}$`);

const METRIC_FACTOR: Record<string, number> = { mm: 1, cm: 10, m: 1000 };

/**
 * A length in mm from text such as `6000`, `6.5 m`, `19' 8"`, `19 ft 8 1/2 in`, `236"` or a
 * bare number in `bare` units. Negative values take a leading minus. Null when unreadable.
 */
export function parseLength(
  text: string,
  units: Units,
  bare: BareUnit = defaultBare(units),
): number | null {
  let t = text.trim();
  let sign = 1;
  if (t.startsWith('-') || t.startsWith('−')) {
    sign = -1;
    t = t.slice(1).trim();
  }
  if (t === '') return null;
  const mm = readPositive(t, bare);
  return mm === null ? null : sign * mm;
}

function readPositive(t: string, bare: BareUnit): number | null {
  if (BARE.test(t)) return Number(t) * mmPer(bare);
  const fraction = FRACTION_ONLY.exec(t);
  if (fraction) return fractionValue(fraction[1], fraction[2], fraction[3]) * mmPer(bare);
  const metric = METRIC.exec(t);
  if (metric) return Number(metric[1]) * METRIC_FACTOR[(metric[2] ?? 'mm').toLowerCase()];
  const imperial = IMPERIAL.exec(t);
  if (imperial && (imperial[1] !== undefined || imperial[2] !== undefined)) {
    const feet = imperial[1] === undefined ? 0 : Number(imperial[1]);
    let inches = 0;
    if (imperial[2] !== undefined) {
      inches =
        imperial[5] !== undefined
          ? fractionValue(imperial[3], imperial[4], imperial[5])
          : Number(imperial[2]);
    }
    return feet * MM_PER_FOOT + inches * MM_PER_INCH;
  }
  return null;
}

function fractionValue(whole: string | undefined, num: string, den: string): number {
  const d = Number(den);
  return d === 0 ? NaN : (whole === undefined ? 0 : Number(whole)) + Number(num) / d;
}

function mmPer(bare: BareUnit): number {
  return bare === 'mm' ? 1 : bare === 'ft' ? MM_PER_FOOT : MM_PER_INCH;
}

function defaultBare(units: Units): BareUnit {
  return units === 'metric' ? 'mm' : 'ft';
}

/** Rounds to `places` decimals and drops trailing zeros: 8.250 → "8.25", 6.0 → "6". */
function trim(value: number, places: number): string {
  const s = value.toFixed(places);
  return s.includes('.') ? s.replace(/\.?0+$/, '') : s;
}

/**
 * A length for a form field, in a form {@link parseLength} reads back: `6000` (mm) or
 * `19' 8.25"`. Imperial keeps inches to 1/100 in, metric to 0.1 mm.
 */
export function formatLengthInput(mm: number, units: Units): string {
  if (units === 'metric') return trim(mm, 1);
  const sign = mm < 0 ? '-' : '';
  const { feet, inches } = feetInchesFromMm(Math.abs(mm));
  let ft = feet;
  let inch = Number(inches.toFixed(2));
  if (inch >= 12) {
    ft += 1;
    inch = 0;
  }
  if (ft === 0) return `${sign}${trim(inch, 2)}"`;
  return inch === 0 ? `${sign}${ft}'` : `${sign}${ft}' ${trim(inch, 2)}"`;
}

/** A length to read (labels, dimensions): metres for long runs, mm for small ones. */
export function formatLength(mm: number, units: Units): string {
  if (units === 'imperial') return formatLengthInput(mm, units);
  return Math.abs(mm) >= 1000 ? `${trim(mm / 1000, 3)} m` : `${trim(mm, 1)} mm`;
}
