/**
 * Plain checks of a ledger movement before it is booked (no schema library, so the page can
 * run them too). Each problem names its field; `invalid` ones are the API's 400, `conflict`
 * ones (expired batch, not enough stock) its 409. An empty list means the movement may go.
 */
import type { BatchStock } from './batches/picking';
import { isExpired } from './batches/picking';
import { dayNumber } from './reorder/demand';
import { problem, type StockProblem } from './problems';
import { scaleOf } from './rounding';
import type { MovementKind } from './valuation/movements';

/** A movement as the API receives it. Quantities in stock steps; money in minor units. */
export interface MovementInput {
  kind: MovementKind;
  quantity: unknown;
  unitCost?: unknown;
  batchCode?: string | null;
  fromLocation?: string | null;
  toLocation?: string | null;
  /** A receipt that creates its batch gives its dates. */
  newBatch?: { code: string; received: string; expiry?: string | null } | null;
  writeOffReason?: 'damaged' | 'expired' | 'lost' | null;
}

/** What the checks may compare the movement with. */
export interface MovementContext {
  today: string;
  decimals?: number;
  /** The product's existing batches (for unknown-batch and expiry checks). */
  batches?: readonly Pick<BatchStock, 'code' | 'received' | 'expiry'>[];
  /** Available at the source (on hand − reserved), for the stock check. */
  availableAtSource?: number;
  allowNegative?: boolean;
  /** The owner's override for issuing an expired batch (logged by the caller). */
  overrideExpired?: boolean;
}

const SIGNED: ReadonlySet<MovementKind> = new Set(['adjustment', 'count-correction']);
const NEEDS_FROM: ReadonlySet<MovementKind> = new Set(['issue', 'write-off', 'transfer']);
const NEEDS_TO: ReadonlySet<MovementKind> = new Set(['receipt', 'return', 'transfer']);

function checkQuantity(m: MovementInput, decimals: number, out: StockProblem[]): void {
  const q = m.quantity;
  const unit = decimals === 0 ? 'whole units' : `steps of 1/${scaleOf(decimals)} unit`;
  if (typeof q !== 'number' || !Number.isFinite(q)) {
    out.push(problem('quantity', 'not-a-number', 'must be a number'));
  } else if (!Number.isInteger(q)) {
    out.push(problem('quantity', 'fractional-quantity', `must be counted in ${unit}`));
  } else if (q === 0) {
    out.push(problem('quantity', 'zero-quantity', 'must not be zero'));
  } else if (q < 0 && !SIGNED.has(m.kind)) {
    out.push(problem('quantity', 'negative-quantity', `must be positive for a ${m.kind}`));
  } else if (!Number.isSafeInteger(q)) {
    out.push(problem('quantity', 'not-a-number', 'is too large'));
  }
}

function checkDate(text: string | null | undefined, field: string, out: StockProblem[]): boolean {
  if (text == null) return true;
  try {
    dayNumber(text);
    return true;
  } catch {
    out.push(problem(field, 'invalid-date', 'must be a calendar date YYYY-MM-DD'));
    return false;
  }
}

function checkPlaces(m: MovementInput, out: StockProblem[]): void {
  if (NEEDS_FROM.has(m.kind) && !m.fromLocation) {
    out.push(problem('fromLocation', 'missing', `a ${m.kind} needs the location it leaves`));
  }
  if (NEEDS_TO.has(m.kind) && !m.toLocation) {
    out.push(problem('toLocation', 'missing', `a ${m.kind} needs the location it goes to`));
  }
  if (m.kind === 'transfer' && m.fromLocation && m.fromLocation === m.toLocation) {
    out.push(problem('toLocation', 'same-location', 'a transfer must go to another location'));
  }
}

function checkBatch(m: MovementInput, ctx: MovementContext, out: StockProblem[]): void {
  const nb = m.newBatch;
  if (nb) {
    const ok = checkDate(nb.received, 'newBatch.received', out);
    if (
      checkDate(nb.expiry, 'newBatch.expiry', out) &&
      ok &&
      nb.expiry &&
      nb.expiry < nb.received
    ) {
      out.push(
        problem(
          'newBatch.expiry',
          'expiry-before-receipt',
          'the expiry date is before the date received',
        ),
      );
    }
    return;
  }
  if (!m.batchCode || !ctx.batches) return;
  const batch = ctx.batches.find((b) => b.code === m.batchCode);
  if (!batch) {
    out.push(problem('batchCode', 'unknown-batch', `no batch "${m.batchCode}" of this product`));
  } else if (
    (m.kind === 'issue' || m.kind === 'transfer') &&
    isExpired(batch, ctx.today) &&
    !ctx.overrideExpired
  ) {
    out.push(
      problem(
        'batchCode',
        'expired-batch',
        `batch ${batch.code} expired on ${batch.expiry}; only the owner can override`,
      ),
    );
  }
}

/** Every problem with `m`; `[]` when it may be booked. */
export function validateMovement(m: MovementInput, ctx: MovementContext): StockProblem[] {
  const out: StockProblem[] = [];
  checkQuantity(m, ctx.decimals ?? 0, out);
  if (m.kind === 'receipt' && m.unitCost === undefined) {
    out.push(problem('unitCost', 'missing', 'goods in needs the actual unit cost'));
  }
  if (
    m.unitCost !== undefined &&
    !(Number.isSafeInteger(m.unitCost) && (m.unitCost as number) >= 0)
  ) {
    out.push(
      problem('unitCost', 'invalid-money', 'must be a whole number of minor units, not negative'),
    );
  }
  if (m.kind === 'write-off' && !m.writeOffReason) {
    out.push(problem('writeOffReason', 'missing', 'say why: damaged, expired or lost'));
  }
  checkPlaces(m, out);
  checkBatch(m, ctx, out);
  const q = m.quantity;
  const outgoing = NEEDS_FROM.has(m.kind) || (SIGNED.has(m.kind) && typeof q === 'number' && q < 0);
  if (
    outgoing &&
    typeof q === 'number' &&
    ctx.availableAtSource !== undefined &&
    !ctx.allowNegative
  ) {
    if (Math.abs(q) > ctx.availableAtSource) {
      out.push(
        problem('quantity', 'insufficient-stock', `only ${ctx.availableAtSource} available`),
      );
    }
  }
  return out;
}
