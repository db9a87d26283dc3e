/**
 * Weighted-average cost (IAS 2.25 allows it, with FIFO; LIFO is not allowed).
 *
 * The state carries the stock's exact value in minor units, never a rounded average: an
 * outflow of q from Q units worth V is costed V × q ÷ Q, rounded once (half-even). The
 * rounding difference stays in the stock's value and the movement that empties the stock
 * takes all that is left, so at every step
 *   value = Σ values booked in − Σ costs booked out − Σ settlements, exactly,
 * and no stock means no value. The average shown (`averageUnitCost`) is V ÷ Q per whole unit
 * rounded half-even for display and for counts; it is never fed back into the books.
 */
import { fail } from '../problems';
import { extendCost, type Minor } from '../money';
import { mulDivRound, scaleOf } from '../rounding';
import {
  signedQuantity,
  type CostLine,
  type ValuationMovement,
  type ValuationOptions,
} from './movements';

/** A product's running valuation: what a balance summary row stores. */
export interface AverageCostState {
  quantity: number;
  value: Minor;
  /** Last average per whole unit while stock was above zero; costs issues below zero. */
  lastUnitCost: Minor | null;
}

/** The state before any movement. */
export const EMPTY_STOCK: AverageCostState = Object.freeze({
  quantity: 0,
  value: 0,
  lastUnitCost: null,
});

/** State after a whole sequence, with what each movement booked. */
export interface AverageCostResult extends AverageCostState {
  /** V ÷ Q per whole unit, rounded half-even; null with no stock. */
  averageUnitCost: Minor | null;
  lines: CostLine[];
}

/** V ÷ Q per whole stock unit, rounded half-even; null when there is no stock. */
export function averageUnitCost(state: AverageCostState, decimals = 0): Minor | null {
  if (state.quantity <= 0) return null;
  return mulDivRound(state.value, scaleOf(decimals), state.quantity);
}

/** The unit cost an inflow without its own cost comes in at: the average, else the last. */
function currentUnitCost(state: AverageCostState, decimals: number, field: string): Minor {
  const cost = averageUnitCost(state, decimals) ?? state.lastUnitCost;
  if (cost === null) fail(field, 'no-cost-known', 'no cost is known yet: give the unit cost');
  return cost;
}

/**
 * Costs an outflow of q > 0; allows going below zero only when told to. `exact` (a reversal's
 * value) replaces the average share while stock remains, capped at the stock's value.
 */
function outflow(
  s: AverageCostState,
  q: number,
  o: Required<ValuationOptions>,
  field: string,
  exact?: Minor,
) {
  const covered = Math.min(q, Math.max(s.quantity, 0));
  const short = q - covered;
  if (short > 0 && !o.allowNegative) {
    fail(field, 'insufficient-stock', `only ${s.quantity} in stock, ${q} asked for`);
  }
  // The movement that empties the stock takes all its value: no rounding residue is left.
  let cost =
    covered === s.quantity
      ? s.value
      : exact !== undefined && short === 0
        ? Math.min(Math.max(exact, 0), s.value)
        : mulDivRound(s.value, covered, s.quantity);
  if (short > 0) {
    const unit =
      s.lastUnitCost ?? fail(field, 'no-cost-known', 'no cost is known to go below zero');
    cost += extendCost(short, unit, o.decimals);
  }
  return { cost, settlement: 0 };
}

/**
 * Books an inflow of r > 0 worth v. Arriving while stock is below zero, the part that fills
 * the hole replaces units that were issued at the last known cost: the difference between
 * their real cost (their share of v) and what they were booked at is the settlement.
 */
function inflow(s: AverageCostState, r: number, v: Minor) {
  if (s.quantity >= 0) return { cost: v, settlement: 0 };
  const hole = Math.min(r, -s.quantity);
  const booked = hole === -s.quantity ? -s.value : mulDivRound(s.value, hole, s.quantity);
  const real = hole === r ? v : mulDivRound(v, hole, r);
  return { cost: v, settlement: real - booked };
}

/**
 * Applies one movement; returns the new state and what it booked. Throws StockInputError
 * (`insufficient-stock`, `no-cost-known`) for a movement that cannot be booked.
 */
export function applyAverageCost(
  state: AverageCostState,
  m: ValuationMovement,
  options: ValuationOptions = {},
  index = 0,
): { state: AverageCostState; line: CostLine } {
  const o = { decimals: options.decimals ?? 0, allowNegative: options.allowNegative ?? false };
  const field = `movements[${index}].quantity`;
  const dq = signedQuantity(m);
  let value = 0;
  let settlement = 0;
  if (dq > 0) {
    const given = 'unitCost' in m ? m.unitCost : undefined;
    const worth =
      m.value ??
      extendCost(
        dq,
        given ?? currentUnitCost(state, o.decimals, `movements[${index}].unitCost`),
        o.decimals,
      );
    ({ cost: value, settlement } = inflow(state, dq, worth));
  } else if (dq < 0) {
    ({ cost: value, settlement } = outflow(state, -dq, o, field, m.value));
    value = -value;
  }
  const next: AverageCostState = {
    quantity: state.quantity + dq,
    value: state.value + value - settlement,
    lastUnitCost: state.lastUnitCost,
  };
  next.lastUnitCost = averageUnitCost(next, o.decimals) ?? state.lastUnitCost;
  return { state: next, line: { index, kind: m.kind, quantity: dq, value, settlement } };
}

/** Folds a product's movements, in ledger order, into its weighted-average valuation. */
export function weightedAverageCost(
  movements: readonly ValuationMovement[],
  options: ValuationOptions = {},
  start: AverageCostState = EMPTY_STOCK,
): AverageCostResult {
  let state = start;
  const lines: CostLine[] = [];
  movements.forEach((m, i) => {
    const r = applyAverageCost(state, m, options, i);
    state = r.state;
    lines.push(r.line);
  });
  return { ...state, averageUnitCost: averageUnitCost(state, options.decimals), lines };
}
