/**
 * The textbook reorder formulas, each alone so each can be checked alone. Quantities are in
 * stock steps (see quantity.ts) and may be fractional here; the suggestion rounds them.
 */
import { inverseNormalCdf } from './normal';

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
