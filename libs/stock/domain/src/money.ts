/**
 * Money as integer minor units (pence, cents): a `number` that is always a safe integer, so
 * it crosses JSON and PostgreSQL `bigint` columns unchanged. The tenant's currency fixes
 * the minor digits (ISO 4217: GBP and EUR 2, JPY 0, KWD 3).
 */
import { assertSafeInteger, divRound, scaleOf, toSafeNumber, type RoundingMode } from './rounding';

/** Integer minor units of the tenant's currency. */
export type Minor = number;

const DECIMAL = /^([+-]?)(\d+)(?:\.(\d+))?$/;

/**
 * Parses a decimal string ("40.00", "-3.5", "12") into an integer count of 10^-digits
 * steps. More digits than allowed are refused, never rounded away silently.
 */
export function parseDecimal(text: string, digits: number): number {
  const m = DECIMAL.exec(text.trim());
  if (!m) throw new RangeError(`not a decimal number: "${text}"`);
  const [, sign, whole, frac = ''] = m;
  if (frac.length > digits) {
    throw new RangeError(`"${text}" has more than ${digits} decimal places`);
  }
  const steps = BigInt(whole + frac.padEnd(digits, '0'));
  return toSafeNumber(sign === '-' ? -steps : steps, text);
}

/** Formats an integer count of 10^-digits steps as a plain decimal: 4300 → "43.00". */
export function formatDecimal(steps: number, digits: number): string {
  assertSafeInteger(steps, 'steps');
  const scale = scaleOf(digits);
  const abs = Math.abs(steps);
  const whole = Math.floor(abs / scale);
  const frac = digits > 0 ? '.' + String(abs % scale).padStart(digits, '0') : '';
  return `${steps < 0 ? '-' : ''}${whole}${frac}`;
}

/** "40.00" → 4000 for a currency with `digits` minor digits (default 2). */
export function parseMoney(text: string, digits = 2): Minor {
  return parseDecimal(text, digits);
}

/** 4300 → "43.00". No currency sign: the page formats that for the tenant's locale. */
export function formatMoney(minor: Minor, digits = 2): string {
  return formatDecimal(minor, digits);
}

/**
 * Value of `quantity` (in 10^-decimals steps of a stock unit) at `unitCost` minor units per
 * whole stock unit, rounded once: 12 kits at 43.00 → 51600; 2.345 m of skirting at 3.00/m
 * (2345 steps, decimals 3) → 704 (7.035 rounds half-even to 7.04).
 */
export function extendCost(
  quantity: number,
  unitCost: Minor,
  decimals = 0,
  mode?: RoundingMode,
): Minor {
  assertSafeInteger(quantity, 'quantity');
  assertSafeInteger(unitCost, 'unitCost');
  const n = BigInt(quantity) * BigInt(unitCost);
  return toSafeNumber(divRound(n, BigInt(scaleOf(decimals)), mode), 'value');
}
