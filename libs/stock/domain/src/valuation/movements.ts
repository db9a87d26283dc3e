/**
 * The movements as valuation sees them: what a movement does to a product's quantity and
 * value, whatever its batch or location. Quantities are integer steps of the stock unit
 * (see quantity.ts); unit costs are minor units per whole unit.
 */
import type { Minor } from '../money';

/** Movement kinds of the ledger. */
export type MovementKind =
  | 'receipt'
  | 'issue'
  | 'return'
  | 'adjustment'
  | 'count-correction'
  | 'write-off'
  | 'transfer';

/**
 * One movement for valuation. `quantity` is positive except for adjustments and count
 * corrections, which are signed (+ found, − missing).
 * - receipt: goods in at `unitCost` (required), which moves the average.
 * - issue, write-off: out at the running average.
 * - return: back from a job at `unitCost` if given (the cost it left at), else the average.
 * - adjustment, count-correction: + at `unitCost` if given else the average; − like an issue.
 * - transfer: between locations of the same firm; changes neither quantity nor cost.
 * - `value` (any kind): the exact value to book instead, for a reversing movement that must
 *   undo exactly what the original booked. An outflow's value is capped at the stock's value,
 *   and the outflow that empties the stock still takes all that is left.
 */
export type ValuationMovement = (
  | { kind: 'receipt'; quantity: number; unitCost: Minor }
  | { kind: 'issue' | 'write-off' | 'transfer'; quantity: number }
  | { kind: 'return' | 'adjustment' | 'count-correction'; quantity: number; unitCost?: Minor }
) & { value?: Minor };

/** Options shared by the valuation methods. */
export interface ValuationOptions {
  /** Decimals of the stock unit (0 for tiles, kits, boxes). */
  decimals?: number;
  /** The tenant lets stock go below zero (otherwise such a movement is refused). */
  allowNegative?: boolean;
}

/** What one movement booked: signed quantity and value (+ into stock, − out of it). */
export interface CostLine {
  index: number;
  kind: MovementKind;
  quantity: number;
  value: Minor;
  /**
   * Weighted average only: the cost difference settled when goods arrive while stock is
   * below zero (the units issued short were booked at the last known cost; this is what
   * their real cost differed by). Positive adds to the cost of what was issued.
   */
  settlement: Minor;
}

/** Signed quantity change of a movement: + in, − out, 0 for a transfer. */
export function signedQuantity(m: ValuationMovement): number {
  switch (m.kind) {
    case 'receipt':
    case 'return':
      return m.quantity;
    case 'issue':
    case 'write-off':
      return -m.quantity;
    case 'adjustment':
    case 'count-correction':
      return m.quantity;
    case 'transfer':
      return 0;
  }
}
