/**
 * The one way stock changes: `postMovements` appends ledger rows and, in the same
 * transaction, moves the balance summary and the weighted-average cost state. Rows are locked
 * in a fixed order (cost state by product id, then balances by product, batch, location), so
 * two people issuing the last boxes at once queue behind each other and the second one sees
 * what the first left: it cannot take stock that is no longer there.
 */
import { recordAudit, type TenantScope, type Tx } from '@latchwork/shared-db';
import {
  applyAverageCost,
  formatPacks,
  mulDivRound,
  scaleOf,
  StockInputError,
  type AverageCostState,
  type ValuationMovement,
} from '@latchwork/stock-domain';
import { conflictField, throwProblems } from '../stock-errors';
import { dbToday } from '../stock-tx';
import {
  checkShapes,
  loadContext,
  type MovementRequest,
  type PostingActor,
  type PostingContext,
  type ProductFacts,
} from './movement-request';
import { lockBalances, lockCostStates, writeBalances, writeCostStates, keyOf } from './locks';
import { applyReservations } from './reservation-draw';

/** Options of postMovements. */
export interface PostOptions {
  /** Field path prefix of movement i in errors; default `movements.i.`. */
  at?: (i: number) => string;
  /** "Today" for expiry checks, YYYY-MM-DD; default the database's current date. */
  today?: string;
}

/** A booked ledger row as the API returns it (bigints as numbers). */
export interface PostedMovement {
  id: string;
  seq: number;
  kind: MovementRequest['kind'];
  productId: string;
  batchId: string | null;
  fromLocationId: string | null;
  toLocationId: string | null;
  quantity: number;
  unitCostMinor: number;
  valueMinor: number;
  settlementMinor: number;
  jobId: string | null;
  reservationId: string | null;
  writeOffReason: string | null;
  reversesMovementId: string | null;
  overrideReason: string | null;
  note: string;
  userId: string | null;
  at: Date;
}

const packs = (p: ProductFacts, q: number) =>
  formatPacks(
    q,
    p.packSize,
    {
      unit: { one: p.unitOne, other: p.unitOther },
      pack: { one: p.packOne, other: p.packOther },
    },
    p.decimals,
  );

/** The movement as weighted-average valuation sees it: in, out, or moved within the firm. */
function valuationOf(m: MovementRequest): ValuationMovement {
  const value = m.exactValueMinor === undefined ? {} : { value: Math.abs(m.exactValueMinor) };
  if (m.fromLocationId && m.toLocationId) return { kind: 'transfer', quantity: m.quantity };
  if (m.toLocationId) {
    if (m.kind === 'receipt' && m.unitCostMinor !== undefined && !m.reversesMovementId)
      return { kind: 'receipt', quantity: m.quantity, unitCost: m.unitCostMinor };
    return { kind: 'return', quantity: m.quantity, unitCost: m.unitCostMinor, ...value };
  }
  return { kind: 'adjustment', quantity: -m.quantity, ...value };
}

/** Refuses an outflow that would take a balance below zero (unless the firm allows it). */
function checkAvailable(
  m: MovementRequest,
  ctx: PostingContext,
  onHand: number,
  path: string,
): void {
  if (!m.fromLocationId || m.quantity <= onHand) return;
  const product = ctx.products.get(m.productId) as ProductFacts;
  const batch = m.batchId ? ctx.batches.get(m.batchId) : undefined;
  const location = ctx.locations.get(m.fromLocationId);
  const where = `${product.name} (${product.sku})${batch ? `, batch ${batch.code}` : ''}`;
  conflictField(
    `${path}quantity`,
    'insufficient-stock',
    `Not enough ${where} at ${location?.name}: ${packs(product, Math.max(onHand, 0))} available, ${packs(product, m.quantity)} asked for.`,
    {
      productId: m.productId,
      batchId: m.batchId ?? null,
      locationId: m.fromLocationId,
      available: Math.max(onHand, 0),
      requested: m.quantity,
    },
  );
}

/**
 * Books `movements` in order inside the caller's transaction and returns the ledger rows.
 * Throws ValidationError (400) for malformed input and ConflictError (409) for not enough
 * stock, an expired batch without the owner's override, or a reservation that does not fit —
 * each naming the field. The caller's transaction must be the firm's (`withTenant`).
 */
export async function postMovements(
  tx: Tx,
  scope: TenantScope,
  actor: PostingActor,
  movements: readonly MovementRequest[],
  options: PostOptions = {},
): Promise<PostedMovement[]> {
  const at = options.at ?? ((i: number) => `movements.${i}.`);
  const today = options.today ?? (await dbToday(tx));
  const ctx = await loadContext(tx, scope, movements, at);
  checkShapes(movements, ctx, actor, today, at);

  const setting = await tx
    .selectFrom('stockSetting')
    .select('allowNegativeStock')
    .where('tenantId', '=', scope.tenantId)
    .executeTakeFirst();
  const allowNegative = setting?.allowNegativeStock ?? false;
  const costs = await lockCostStates(tx, scope, movements);
  const balances = await lockBalances(tx, scope, movements);

  const rows: PostedMovement[] = [];
  for (const [i, m] of movements.entries()) {
    const product = ctx.products.get(m.productId) as ProductFacts;
    const fromKey = m.fromLocationId ? keyOf(m.productId, m.batchId, m.fromLocationId) : null;
    if (fromKey && !allowNegative) checkAvailable(m, ctx, balances.get(fromKey) ?? 0, at(i));
    let booked: ReturnType<typeof applyAverageCost>;
    try {
      booked = applyAverageCost(costs.get(m.productId) as AverageCostState, valuationOf(m), {
        decimals: product.decimals,
        allowNegative,
      });
    } catch (err) {
      if (!(err instanceof StockInputError)) throw err;
      // The domain names `movements[0].…`; the request's own path is what the page marks.
      throwProblems(
        err.problems.map((p) => ({ ...p, field: p.field.replace(/^movements\[\d+\]\./, '') })),
        at(i),
      );
      throw err;
    }
    costs.set(m.productId, booked.state);
    if (fromKey) balances.set(fromKey, (balances.get(fromKey) ?? 0) - m.quantity);
    if (m.toLocationId) {
      const toKey = keyOf(m.productId, m.batchId, m.toLocationId);
      balances.set(toKey, (balances.get(toKey) ?? 0) + m.quantity);
    }
    const value = booked.line.value;
    const unitCost =
      m.toLocationId && !m.fromLocationId && m.unitCostMinor !== undefined
        ? m.unitCostMinor
        : mulDivRound(Math.abs(value), scaleOf(product.decimals), m.quantity);
    const batch = m.batchId ? ctx.batches.get(m.batchId) : undefined;
    const expired = !!batch?.expiresOn && batch.expiresOn < today && !!fromKey;
    const override =
      expired && actor.role === 'owner' ? (m.overrideExpiredReason?.trim() ?? null) : null;
    rows.push(
      await insertMovement(tx, scope, actor, m, {
        unitCost,
        value,
        settlement: booked.line.settlement,
        override: override || null,
      }),
    );
  }
  await applyReservations(tx, scope, movements, at);
  await writeBalances(tx, scope, balances);
  await writeCostStates(tx, scope, costs);
  await auditOverrides(tx, scope, actor, rows, ctx);
  return rows;
}

async function insertMovement(
  tx: Tx,
  scope: TenantScope,
  actor: PostingActor,
  m: MovementRequest,
  booked: { unitCost: number; value: number; settlement: number; override: string | null },
): Promise<PostedMovement> {
  const row = await tx
    .insertInto('stockMovement')
    .values({
      tenantId: scope.tenantId,
      kind: m.kind,
      productId: m.productId,
      batchId: m.batchId ?? null,
      fromLocationId: m.fromLocationId ?? null,
      toLocationId: m.toLocationId ?? null,
      quantity: m.quantity,
      unitCostMinor: booked.unitCost,
      valueMinor: booked.value,
      settlementMinor: booked.settlement,
      jobId: m.jobId ?? null,
      reservationId: m.reservationId ?? null,
      writeOffReason: m.writeOffReason ?? null,
      reversesMovementId: m.reversesMovementId ?? null,
      overrideReason: booked.override,
      note: m.note ?? '',
      userId: actor.userId,
      ...(m.at && { at: m.at }),
    })
    .returningAll()
    .executeTakeFirstOrThrow();
  return movementView(row);
}

/** A ledger row with its bigints as numbers (quantities and money are safe integers). */
export function movementView(
  row: {
    [K in keyof PostedMovement]: K extends
      | 'seq'
      | 'quantity'
      | 'unitCostMinor'
      | 'valueMinor'
      | 'settlementMinor'
      ? string
      : PostedMovement[K];
  } & { tenantId?: string },
): PostedMovement {
  const { tenantId: _tenant, ...rest } = row;
  return {
    ...rest,
    seq: Number(row.seq),
    quantity: Number(row.quantity),
    unitCostMinor: Number(row.unitCostMinor),
    valueMinor: Number(row.valueMinor),
    settlementMinor: Number(row.settlementMinor),
  };
}

/** The owner's override of an expired batch goes to the firm's audit log, with the reason. */
async function auditOverrides(
  tx: Tx,
  scope: TenantScope,
  actor: PostingActor,
  rows: readonly PostedMovement[],
  ctx: PostingContext,
): Promise<void> {
  for (const row of rows.filter((r) => r.overrideReason)) {
    const batch = row.batchId ? ctx.batches.get(row.batchId) : undefined;
    await recordAudit(tx, scope, {
      userId: actor.userId,
      action: 'stock-expired-issued',
      subject: `${ctx.products.get(row.productId)?.sku} batch ${batch?.code}`,
      detail: {
        movementId: row.id,
        batchId: row.batchId,
        expiresOn: batch?.expiresOn ?? null,
        quantity: row.quantity,
        reason: row.overrideReason,
      },
    });
  }
}
