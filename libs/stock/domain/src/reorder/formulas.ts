/**
 * The textbook reorder formulas, each alone so each can be checked alone. Quantities are in
 * stock steps (see quantity.ts) and may be fractional here; the suggestion rounds them.
 */

/*
 * The standard normal quantile (inverse CDF), for the z of a service level. Acklam's rational
 * approximation (relative error below 1.15e-9 over (0, 1)): a central rational function and
 * a tail one in √(−2 ln p). Service levels the stores person picks (0.5–0.9999) never come
 * near where its error would matter for a count of boxes.
 */
const A = [
  -3.969683028665376e1, 2.209460984245205e2, -2.759285104469687e2, 1.38357751867269e2,
  -3.066479806614716e1, 2.506628277459239,
];
const B = [
  -5.447609879822406e1, 1.615858368580409e2, -1.556989798598866e2, 6.680131188771972e1,
  -1.328068155288572e1,
];
const C = [
  -7.784894002430293e-3, -3.223964580411365e-1, -2.400758277161838, -2.549732539343734,
  4.374664141464968, 2.938163982698783,
];
const D = [7.784695709041462e-3, 3.224671290700398e-1, 2.445134137142996, 3.754408661907416];
const P_LOW = 0.02425;

/** Horner evaluation of coefficients highest power first. */
const poly = (c: readonly number[], x: number): number => c.reduce((s, k) => s * x + k, 0);

/** Lower-tail quantile for p < P_LOW; the upper tail is its mirror. */
function tail(p: number): number {
  const q = Math.sqrt(-2 * Math.log(p));
  return poly(C, q) / (poly(D, q) * q + 1);
}

/**
 * z such that P(Z ≤ z) = p for a standard normal Z: 0.95 → 1.6449, 0.99 → 2.3263.
 * Throws for p outside the open interval (0, 1), where z is infinite.
 */
export function inverseNormalCdf(p: number): number {
  if (!(p > 0 && p < 1)) throw new RangeError(`p must be in (0, 1), got ${p}`);
  if (p < P_LOW) return tail(p);
  if (p > 1 - P_LOW) return -tail(1 - p);
  const q = p - 0.5;
  const r = q * q;
  return (poly(A, r) * q) / (poly(B, r) * r + 1);
}

/** z for a cycle service level (the chance of not running out during one lead time). */
export function serviceLevelZ(serviceLevel: number): number {
  if (!(serviceLevel >= 0.5 && serviceLevel < 1)) {
    throw new RangeError(`service level must be in [0.5, 1), got ${serviceLevel}`);
  }
  return inverseNormalCdf(serviceLevel);
}

/**
 * Safety stock = z × σ(daily demand) × √(lead time days): daily demands taken as
 * independent, so the spread over L days grows with √L.
 */
export function safetyStock(z: number, sdDaily: number, leadTimeDays: number): number {
  return z * sdDaily * Math.sqrt(leadTimeDays);
}

/** Reorder point = mean daily demand × lead time days + safety stock. */
export function reorderPoint(meanDaily: number, leadTimeDays: number, safety: number): number {
  return meanDaily * leadTimeDays + safety;
}

/**
 * Economic order quantity (Harris 1913): √(2 × annual demand × cost per order ÷ holding
 * cost per unit per year). Costs in the same money unit (minor units cancel out); zero
 * demand orders nothing. Holding cost must be positive.
 */
export function economicOrderQuantity(
  annualDemand: number,
  costPerOrder: number,
  holdingCostPerUnitYear: number,
): number {
  if (!(holdingCostPerUnitYear > 0)) throw new RangeError('holding cost must be positive');
  if (annualDemand <= 0 || costPerOrder <= 0) return 0;
  return Math.sqrt((2 * annualDemand * costPerOrder) / holdingCostPerUnitYear);
}
