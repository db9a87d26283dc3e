/**
 * Exact integer division with a stated rounding rule. Money is integer minor units and
 * quantities are integers, so every value the library books is one `a × b ÷ c` rounded
 * once; doing it in BigInt keeps the product exact however large it gets.
 */

/**
 * `'half-even'` (banker's rounding: a tie goes to the even neighbour) is the library's rule
 * for costs: ties then round up as often as down, so a long run of issue costs carries no
 * systematic bias (the rule of IEEE 754 and ISO 80000-1 Annex B). `'half-away-from-zero'` is
 * the calculator rule, offered for documents whose reader expects it.
 */
export type RoundingMode = 'half-even' | 'half-away-from-zero';

/** The rule every cost and value in this library is rounded with. */
export const MONEY_ROUNDING: RoundingMode = 'half-even';

/** `n ÷ d` rounded to an integer by `mode`. `d` must not be zero. */
export function divRound(n: bigint, d: bigint, mode: RoundingMode = MONEY_ROUNDING): bigint {
  if (d === 0n) throw new RangeError('division by zero');
  if (d < 0n) return divRound(-n, -d, mode);
  const q = n / d; // truncates toward zero
  const r = n - q * d;
  if (r === 0n) return q;
  const twice = 2n * (r < 0n ? -r : r);
  const away = n < 0n ? q - 1n : q + 1n;
  if (twice > d) return away;
  if (twice < d) return q;
  if (mode === 'half-away-from-zero') return away;
  return q % 2n === 0n ? q : away;
}

/** Throws unless `v` is an integer JavaScript can hold exactly. */
export function assertSafeInteger(v: number, what: string): void {
  if (!Number.isSafeInteger(v)) throw new RangeError(`${what} must be a safe integer, got ${v}`);
}

/** An exact bigint back to a number, refusing one past 2^53 rather than losing digits. */
export function toSafeNumber(v: bigint, what: string): number {
  const n = Number(v);
  assertSafeInteger(n, what);
  return n;
}

/**
 * `a × b ÷ c` rounded once by `mode`, for integer arguments (minor units, stock units).
 * The product is formed exactly, so `mulDivRound(value, part, whole)` splits a value
 * without any floating-point step.
 */
export function mulDivRound(
  a: number,
  b: number,
  c: number,
  mode: RoundingMode = MONEY_ROUNDING,
): number {
  assertSafeInteger(a, 'a');
  assertSafeInteger(b, 'b');
  assertSafeInteger(c, 'c');
  return toSafeNumber(divRound(BigInt(a) * BigInt(b), BigInt(c), mode), 'result');
}

/** 10^decimals as a number: the count of smallest steps in one whole unit. */
export function scaleOf(decimals: number): number {
  if (!Number.isInteger(decimals) || decimals < 0 || decimals > 6) {
    throw new RangeError(`decimals must be an integer 0–6, got ${decimals}`);
  }
  return 10 ** decimals;
}
