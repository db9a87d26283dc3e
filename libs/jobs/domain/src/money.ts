/**
 * Money as integer minor units (pence, cents), written and read as decimal text without ever
 * passing through a float. `digits` is the currency's minor-unit exponent (ISO 4217: 2 for
 * GBP and EUR, 0 for JPY, 3 for BHD).
 */

function checkDigits(digits: number): void {
  if (!Number.isInteger(digits) || digits < 0 || digits > 4) {
    throw new RangeError(`Minor-unit digits must be 0–4 (got ${digits}).`);
  }
}

/** 123456 → "1234.56" (digits 2); −5 → "-0.05". No grouping, no symbol: for CSV and forms. */
export function formatMinor(valueMinor: number, digits = 2): string {
  checkDigits(digits);
  if (!Number.isSafeInteger(valueMinor)) {
    throw new RangeError(`Money must be a whole number of minor units (got ${valueMinor}).`);
  }
  const sign = valueMinor < 0 ? '-' : '';
  const text = String(Math.abs(valueMinor)).padStart(digits + 1, '0');
  if (digits === 0) return sign + text;
  return `${sign}${text.slice(0, -digits)}.${text.slice(-digits)}`;
}

/**
 * Reads money typed by a person or found in a spreadsheet: "1,250.00", "£1250", "€ 99.5",
 * "-12". Returns minor units, or null when it is not money or has more decimals than the
 * currency has (rounding someone's figure silently would be wrong). Commas are read as
 * thousands separators only.
 */
export function parseMoneyToMinor(text: string, digits = 2): number | null {
  checkDigits(digits);
  const cleaned = text
    .trim()
    .replace(/^[£$€]\s*/u, '')
    .replace(/^(-)\s*[£$€]\s*/u, '$1');
  const m = /^(-?)(\d{1,3}(?:,\d{3})+|\d+)(?:\.(\d*))?$/.exec(cleaned);
  if (!m) return null;
  const [, sign, whole, fraction = ''] = m;
  if (fraction.length > digits) return null;
  const minorText = whole.replaceAll(',', '') + fraction.padEnd(digits, '0');
  const value = Number(minorText);
  if (!Number.isSafeInteger(value)) return null;
  return sign && value !== 0 ? -value : value;
}

/** Adds minor units, refusing to leave the range where integers are exact. */
export function addMinor(a: number, b: number): number {
  const sum = a + b;
  if (!Number.isSafeInteger(sum)) throw new RangeError('Money total out of range.');
  return sum;
}
