/**
 * The reorder suggestion for one product: whether to order, how much, and the reasons in
 * words the stores person can check. The nightly job and the "suggest orders" button both
 * call it; it only computes.
 *
 * Demand over the lead time has two sources: the forecast (mean daily issues × lead time)
 * and what jobs have already reserved for delivery within the lead time. By default the
 * reservations *consume* the forecast (the larger of the two is used), because the issue
 * history is itself made of past jobs' reservations being issued: adding both would count
 * the same kind of demand twice. A tenant whose reservations are extra to the usual flow
 * can set `demandMode: 'add'` (the textbook "position minus committed stock").
 */
import { packsToCover } from '../quantity';
import { scaleOf } from '../rounding';
import { demandStats } from './demand';
import { economicOrderQuantity, safetyStock, serviceLevelZ } from './formulas';

/** What the suggestion needs to know about a product. Quantities in stock steps. */
export interface ReorderProduct {
  /** Steps per pack; orders are whole packs. */
  packSize: number;
  decimals?: number;
  leadTimeDays: number;
  /** Days a unit keeps once received; null or absent for goods that do not expire. */
  shelfLifeDays?: number | null;
  /** Cost of placing one order, minor units. */
  orderCost: number;
  /** Cost of holding one whole unit for a year, minor units. */
  holdingCostPerUnitYear: number;
}

/** Where the product's stock stands now. */
export interface StockPosition {
  onHand: number;
  /** Ordered from suppliers and not yet received. */
  onOrder: number;
  /** Reserved for jobs that will draw it within the lead time. */
  reservedWithinLeadTime: number;
}

/** The tenant's reorder settings. */
export interface ReorderSettings {
  /** Chance of not running out during a lead time, 0.5 ≤ level < 1 (e.g. 0.95). */
  serviceLevel: number;
  demandMode?: 'consume' | 'add';
  daysPerYear?: number;
}

/** Why the suggestion says what it says. */
export interface ReorderReason {
  code:
    | 'no-demand'
    | 'above-reorder-point'
    | 'at-or-below-reorder-point'
    | 'economic-order-quantity'
    | 'capped-by-shelf-life'
    | 'lift-above-reorder-point'
    | 'shelf-life-shorter-than-need'
    | 'rounded-up-to-packs';
  message: string;
}

/** The answer: order or not, how much (whole packs), and every figure behind it. */
export interface ReorderSuggestion {
  order: boolean;
  quantity: number;
  packs: number;
  meanDaily: number;
  sdDaily: number;
  z: number;
  safetyStock: number;
  leadTimeDemand: number;
  /** Rounded up to a whole step: rounding down would reorder a little late. */
  reorderPoint: number;
  /** On hand + on order (− reserved in `add` mode). */
  position: number;
  eoq: number;
  /** Most that can be used before it expires (shelf life × mean daily demand), or null. */
  expiryCap: number | null;
  reasons: ReorderReason[];
}

const fmt = (x: number): string => (Number.isInteger(x) ? String(x) : x.toFixed(2));

/**
 * Suggests an order for one product from its daily demand history (one figure per calendar
 * day, zeros included — see dailyDemandSeries), its stock position and the settings.
 */
export function reorderSuggestion(
  product: ReorderProduct,
  position: StockPosition,
  dailyHistory: readonly number[],
  settings: ReorderSettings,
): ReorderSuggestion {
  const { mean, sd } = demandStats(dailyHistory);
  const L = product.leadTimeDays;
  const z = serviceLevelZ(settings.serviceLevel);
  const safety = safetyStock(z, sd, L);
  const forecast = mean * L;
  const add = settings.demandMode === 'add';
  const reserved = position.reservedWithinLeadTime;
  const leadTimeDemand = add ? forecast : Math.max(forecast, reserved);
  // reorderPoint(mean, L, safety) with the reservations' say in the lead-time demand; the
  // epsilon keeps float noise (50.000000001) from adding a whole unit.
  const rop = Math.ceil(leadTimeDemand + safety - 1e-9);
  const pos = position.onHand + position.onOrder - (add ? reserved : 0);
  const perStepHolding = product.holdingCostPerUnitYear / scaleOf(product.decimals ?? 0);
  const annual = mean * (settings.daysPerYear ?? 365);
  const eoq = economicOrderQuantity(annual, product.orderCost, perStepHolding);
  const expiryCap = product.shelfLifeDays ? product.shelfLifeDays * mean : null;
  const base = { meanDaily: mean, sdDaily: sd, z, safetyStock: safety, leadTimeDemand };
  const figures = { ...base, reorderPoint: rop, position: pos, eoq, expiryCap };
  const reasons: ReorderReason[] = [];

  if (leadTimeDemand + safety <= 0 && pos >= 0) {
    reasons.push({ code: 'no-demand', message: 'No issues in the history and nothing reserved.' });
    return { order: false, quantity: 0, packs: 0, ...figures, reasons };
  }
  if (pos > rop) {
    reasons.push({
      code: 'above-reorder-point',
      message: `Stock position ${fmt(pos)} is above the reorder point ${rop}.`,
    });
    return { order: false, quantity: 0, packs: 0, ...figures, reasons };
  }
  reasons.push({
    code: 'at-or-below-reorder-point',
    message: `Stock position ${fmt(pos)} is at or below the reorder point ${rop} (lead-time demand ${fmt(leadTimeDemand)} + safety stock ${fmt(safety)}).`,
  });
  let wanted = eoq;
  reasons.push({
    code: 'economic-order-quantity',
    message: `Economic order quantity ${fmt(eoq)}.`,
  });
  if (expiryCap !== null && wanted > expiryCap) {
    wanted = expiryCap;
    reasons.push({
      code: 'capped-by-shelf-life',
      message: `Capped at ${fmt(expiryCap)}: what can be used within the ${product.shelfLifeDays}-day shelf life.`,
    });
  }
  const lift = rop - pos + 1;
  if (lift > wanted) {
    wanted = lift;
    reasons.push({
      code: 'lift-above-reorder-point',
      message: `Raised to ${fmt(lift)} to bring the stock position above the reorder point.`,
    });
    if (expiryCap !== null && lift > expiryCap) {
      reasons.push({
        code: 'shelf-life-shorter-than-need',
        message:
          'More than can be used before it expires at the usual rate: check the reserved jobs.',
      });
    }
  }
  // The same epsilon as the reorder point: an EOQ of 50.00000000000001 (float noise from
  // mean × 365) must order 50, not 51.
  const packs = Math.max(1, packsToCover(wanted - 1e-9, product.packSize));
  const quantity = packs * product.packSize;
  if (quantity !== wanted) {
    reasons.push({
      code: 'rounded-up-to-packs',
      message: `Rounded up to ${packs} whole pack${packs === 1 ? '' : 's'} (${quantity}).`,
    });
  }
  return { order: true, quantity, packs, ...figures, reasons };
}
