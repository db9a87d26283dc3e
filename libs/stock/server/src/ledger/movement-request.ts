/**
 * What a caller asks the ledger to book, and the checks that need no lock: every referenced
 * product, batch, location, job and reservation exists in the firm, the places fit the kind,
 * and the stock domain's `validateMovement` finds nothing wrong with the shape.
 */
import type {
  Role,
  StockMovementKind,
  TenantScope,
  Tx,
  WriteOffReason,
} from '@latchwork/shared-db';
import { validateMovement, type MovementKind, type StockProblem } from '@latchwork/stock-domain';
import { invalidField, throwProblems } from '../stock-errors';

/**
 * One movement to book. Quantities are positive integer steps of the product's stock unit;
 * direction is always from → to:
 * - receipt, return: `toLocationId` only (receipt needs `unitCostMinor`; a return may give
 *   the cost it left at, else it comes back at the average)
 * - issue, write_off: `fromLocationId` only (issue and return need `jobId`; write-off needs
 *   `writeOffReason`)
 * - transfer: both, different
 * - adjustment, count_correction: exactly one — `toLocationId` for found stock (optional
 *   `unitCostMinor`), `fromLocationId` for missing stock.
 */
export interface MovementRequest {
  kind: StockMovementKind;
  productId: string;
  batchId?: string | null;
  fromLocationId?: string | null;
  toLocationId?: string | null;
  quantity: number;
  unitCostMinor?: number;
  jobId?: string | null;
  /** An issue drawn from this reservation counts against it. */
  reservationId?: string | null;
  writeOffReason?: WriteOffReason | null;
  note?: string;
  /** The owner's reason for issuing an expired batch (ignored for anyone else). */
  overrideExpiredReason?: string | null;
  /**
   * When it happened, for bulk loads (demo data, benchmarks, imports) posted in time order;
   * the database's now() otherwise. The API never takes it from a request.
   */
  at?: Date;
  /** Set by `reverseMovement` only. */
  reversesMovementId?: string | null;
  /** Set by `reverseMovement` only: the exact value to book (undoes the original exactly). */
  exactValueMinor?: number;
}

/** Who books: the user recorded on the movement, and their role for owner-only overrides. */
export interface PostingActor {
  userId: string;
  role: Role;
}

/** The facts about the referenced rows that posting needs. */
export interface PostingContext {
  products: Map<string, ProductFacts>;
  batches: Map<string, BatchFacts>;
  locations: Map<string, { id: string; name: string }>;
}

export interface ProductFacts {
  id: string;
  sku: string;
  name: string;
  decimals: number;
  packSize: number;
  unitOne: string;
  unitOther: string;
  packOne: string;
  packOther: string;
}

export interface BatchFacts {
  id: string;
  productId: string;
  code: string;
  receivedOn: string;
  expiresOn: string | null;
}

const DOMAIN_KIND: Record<StockMovementKind, MovementKind> = {
  receipt: 'receipt',
  transfer: 'transfer',
  issue: 'issue',
  return: 'return',
  adjustment: 'adjustment',
  count_correction: 'count-correction',
  write_off: 'write-off',
};

const PLACES: Record<StockMovementKind, 'to' | 'from' | 'both' | 'one'> = {
  receipt: 'to',
  return: 'to',
  issue: 'from',
  write_off: 'from',
  transfer: 'both',
  adjustment: 'one',
  count_correction: 'one',
};

const ids = (values: (string | null | undefined)[]) => [
  ...new Set(values.filter((v): v is string => !!v)),
];

/** Loads every product, batch and location the movements name; 400 naming the first unknown. */
export async function loadContext(
  tx: Tx,
  scope: TenantScope,
  movements: readonly MovementRequest[],
  at: (i: number) => string,
): Promise<PostingContext> {
  const productIds = ids(movements.map((m) => m.productId));
  const batchIds = ids(movements.map((m) => m.batchId));
  const locationIds = ids(movements.flatMap((m) => [m.fromLocationId, m.toLocationId]));
  const jobIds = ids(movements.map((m) => m.jobId));
  const [products, batches, locations, jobs] = await Promise.all([
    productIds.length === 0
      ? []
      : tx
          .selectFrom('product')
          .select(['id', 'sku', 'name', 'decimals', 'packSize', 'unitOne', 'unitOther'])
          .select(['packOne', 'packOther'])
          .where('tenantId', '=', scope.tenantId)
          .where('id', 'in', productIds)
          .execute(),
    batchIds.length === 0
      ? []
      : tx
          .selectFrom('stockBatch')
          .select(['id', 'productId', 'code', 'receivedOn', 'expiresOn'])
          .where('tenantId', '=', scope.tenantId)
          .where('id', 'in', batchIds)
          .execute(),
    locationIds.length === 0
      ? []
      : tx
          .selectFrom('stockLocation')
          .select(['id', 'name'])
          .where('tenantId', '=', scope.tenantId)
          .where('id', 'in', locationIds)
          .execute(),
    jobIds.length === 0
      ? []
      : tx
          .selectFrom('job')
          .select('id')
          .where('tenantId', '=', scope.tenantId)
          .where('id', 'in', jobIds)
          .execute(),
  ]);
  const ctx: PostingContext = {
    products: new Map(products.map((p) => [p.id, { ...p, packSize: Number(p.packSize) }])),
    batches: new Map(batches.map((b) => [b.id, b])),
    locations: new Map(locations.map((l) => [l.id, l])),
  };
  const jobSet = new Set(jobs.map((j) => j.id));
  movements.forEach((m, i) => {
    if (!ctx.products.has(m.productId)) invalidField(`${at(i)}productId`, 'no such product');
    const batch = m.batchId ? ctx.batches.get(m.batchId) : null;
    if (m.batchId && (!batch || batch.productId !== m.productId))
      invalidField(`${at(i)}batchId`, 'no such batch of this product', 'unknown-batch');
    for (const key of ['fromLocationId', 'toLocationId'] as const) {
      const id = m[key];
      if (id && !ctx.locations.has(id)) invalidField(`${at(i)}${key}`, 'no such location');
    }
    if (m.jobId && !jobSet.has(m.jobId)) invalidField(`${at(i)}jobId`, 'no such job');
  });
  return ctx;
}

/** The places each kind needs, as problems naming the field. */
function placeProblems(m: MovementRequest): StockProblem[] {
  const rule = PLACES[m.kind];
  const from = !!m.fromLocationId;
  const to = !!m.toLocationId;
  const out: StockProblem[] = [];
  const say = (field: string, message: string): void => {
    out.push({ field, code: 'missing', kind: 'invalid', message });
  };
  if (rule === 'to' && from) say('fromLocationId', `a ${m.kind} only names where it goes to`);
  if (rule === 'from' && to) say('toLocationId', `a ${m.kind} only names where it leaves`);
  if (rule === 'one' && from === to)
    say(
      'toLocationId',
      'name one location: toLocationId for stock found, fromLocationId for stock missing',
    );
  if ((m.kind === 'issue' || m.kind === 'return') && !m.jobId)
    say('jobId', `a ${m.kind} names the job`);
  const outflowOrMove = rule === 'from' || rule === 'both' || (rule === 'one' && from);
  if (outflowOrMove && m.unitCostMinor !== undefined)
    say('unitCostMinor', 'stock leaves at the weighted average cost: leave the unit cost out');
  return out;
}

/**
 * Every problem with the shape of movement `m` (400s), plus the expired-batch refusal (409)
 * unless the owner overrides with a reason. Reversals mirror a booked movement: not checked.
 */
export function shapeProblems(
  m: MovementRequest,
  ctx: PostingContext,
  actor: PostingActor,
  today: string,
): StockProblem[] {
  if (m.reversesMovementId) return [];
  const product = ctx.products.get(m.productId);
  const batch = m.batchId ? ctx.batches.get(m.batchId) : undefined;
  const found = m.kind === 'adjustment' || m.kind === 'count_correction';
  const missing = found && !!m.fromLocationId && !m.toLocationId;
  const q = m.quantity;
  const problems = validateMovement(
    {
      kind: DOMAIN_KIND[m.kind],
      // Adjustments arrive positive with a direction; the domain counts them signed.
      quantity: missing && typeof q === 'number' ? -q : q,
      unitCost: m.unitCostMinor,
      batchCode: batch?.code ?? null,
      fromLocation: m.fromLocationId ?? null,
      toLocation: m.toLocationId ?? null,
      writeOffReason: m.writeOffReason ?? null,
    },
    {
      today,
      decimals: product?.decimals ?? 0,
      batches: batch
        ? [{ code: batch.code, received: batch.receivedOn, expiry: batch.expiresOn }]
        : [],
      overrideExpired: actor.role === 'owner' && !!m.overrideExpiredReason?.trim(),
    },
  );
  if (found && typeof q === 'number' && q < 0)
    problems.push({
      field: 'quantity',
      code: 'negative-quantity',
      kind: 'invalid',
      message:
        'must be positive: the direction is fromLocationId (missing) or toLocationId (found)',
    });
  const named = problems.map((p) => ({ ...p, field: API_FIELD[p.field] ?? p.field }));
  return [...named, ...placeProblems(m)];
}

/** The domain's field names as the API names them. */
const API_FIELD: Record<string, string> = {
  fromLocation: 'fromLocationId',
  toLocation: 'toLocationId',
  batchCode: 'batchId',
  unitCost: 'unitCostMinor',
};

/** Runs the lock-free checks of every movement; throws the first movement's 400/409. */
export function checkShapes(
  movements: readonly MovementRequest[],
  ctx: PostingContext,
  actor: PostingActor,
  today: string,
  at: (i: number) => string,
): void {
  movements.forEach((m, i) => throwProblems(shapeProblems(m, ctx, actor, today), at(i)));
}

export { DOMAIN_KIND };
