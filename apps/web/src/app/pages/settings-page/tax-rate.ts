/**
 * Tax rates are kept as integer basis points (2000 = 20 %) and typed as percentages with up to
 * two decimals. The conversion works on the digits of the text, never through a float, so
 * "17.5" is exactly 1750 and "0.29" exactly 29 (0.29 * 100 in floating point is 28.999…).
 */

/** The highest rate a firm can set: 100 %. */
export const MAX_TAX_RATE_BP = 10_000;

const PERCENT = /^\s*(\d{1,3})(?:[.,](\d{1,2}))?\s*%?\s*$/;

/**
 * Basis points from a percentage as typed ("20", "17.5", "0.01", "12,5 %"); null when the text
 * is not a percentage with at most two decimals between 0 and 100.
 */
export function percentToBasisPoints(text: string): number | null {
  const match = PERCENT.exec(text);
  if (!match) return null;
  const whole = Number.parseInt(match[1], 10);
  const hundredths = Number.parseInt((match[2] ?? '').padEnd(2, '0'), 10);
  const bp = whole * 100 + hundredths;
  return bp <= MAX_TAX_RATE_BP ? bp : null;
}

/** A percentage to show for basis points: 2000 → "20", 1750 → "17.5", 1 → "0.01". */
export function basisPointsToPercent(bp: number): string {
  if (!Number.isInteger(bp) || bp < 0) throw new RangeError(`Not a rate in basis points: ${bp}`);
  const whole = Math.trunc(bp / 100);
  const hundredths = bp % 100;
  if (hundredths === 0) return String(whole);
  return `${whole}.${String(hundredths).padStart(2, '0').replace(/0$/, '')}`;
}
