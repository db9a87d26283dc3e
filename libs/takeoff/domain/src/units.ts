/**
 * Imperial helpers. Exact definitions from NIST SP 811 (appendix B): 1 ft = 0.3048 m,
 * 1 in = 0.0254 m, 1 ft² = 0.09290304 m².
 */
export const MM_PER_INCH = 25.4;
export const MM_PER_FOOT = 304.8;
export const M2_PER_FT2 = 0.09290304;

/** Millimetres from feet and inches (inches may be fractional, e.g. 6.5). */
export function mmFromFeetInches(feet: number, inches = 0): number {
  return feet * MM_PER_FOOT + inches * MM_PER_INCH;
}

/** Millimetres from inches. */
export function mmFromInches(inches: number): number {
  return inches * MM_PER_INCH;
}

/** Feet and inches (inches in [0, 12)) from millimetres; sign on the feet. */
export function feetInchesFromMm(mm: number): { feet: number; inches: number } {
  const sign = mm < 0 ? -1 : 1;
  const totalInches = Math.abs(mm) / MM_PER_INCH;
  let feet = Math.floor(totalInches / 12);
  // Rounded to a billionth of an inch so 304.8 mm reads 1 ft 0 in, not 1 ft 1.8e-15 in.
  let inches = Math.round((totalInches - feet * 12) * 1e9) / 1e9;
  // Guard against 11.9999999 from binary fractions.
  if (inches >= 12) {
    feet += 1;
    inches = 0;
  }
  return { feet: sign * feet, inches };
}

/** Square metres from square feet. */
export function m2FromFt2(ft2: number): number {
  return ft2 * M2_PER_FT2;
}

/** Square feet from square metres. */
export function ft2FromM2(m2: number): number {
  return m2 / M2_PER_FT2;
}

/** Millimetres from metres. */
export function mmFromM(m: number): number {
  return m * 1000;
}
