/**
 * Reserving stock for a job. The domain's batch choice prefers one batch per product (tiles
 * of one production batch share a shade); when no single batch covers the job it offers the
 * best split and the reservation waits for the person to accept it, and the same when there
 * is not enough at all. Reservations of one product are serialised on its cost-state row, so
 * two jobs cannot both be promised the last boxes.
 */
import type { TenantScope, Tx } from '@latchwork/shared-db';
import { dbToday } from '../stock-tx';
import { chooseBatches, formatDecimal, type BatchChoice } from '@latchwork/stock-domain';
import { conflictField, invalidField } from '../stock-errors';
import { lockCostStates } from '../ledger/locks';
import { batchStocks } from './batch-stock';
import type { ReserveBody } from './reservation.schemas';

/** The choice with each pick's batch id, as the page shows it. */
export interface ReservationOffer extends Omit<BatchChoice, 'picks'> {
  picks: (BatchChoice['picks'][number] & { batchId: string | null })[];
  available: number;
}

/** Works out which batches would be reserved, without reserving (and without locks). */
export async function offerFor(
  tx: Tx,
  scope: TenantScope,
  body: ReserveBody,
): Promise<ReservationOffer> {
  const q = body.quantity;
  if (!Number.isSafeInteger(q) || q <= 0)
    invalidField(
      'quantity',
      'must be a whole number of stock units above 0',
      Number.isInteger(q) ? 'negative-quantity' : 'fractional-quantity',
    );
  const [job, product] = await Promise.all([
    tx
      .selectFrom('job')
      .select('id')
      .where('tenantId', '=', scope.tenantId)
      .where('id', '=', body.jobId)
      .executeTakeFirst(),
    tx
      .selectFrom('product')
      .select(['id', 'decimals'])
      .where('tenantId', '=', scope.tenantId)
      .where('id', '=', body.productId)
      .executeTakeFirst(),
  ]);
  if (!job) invalidField('jobId', 'no such job');
  if (!product) invalidField('productId', 'no such product');
  let stocks = await batchStocks(tx, scope, body.productId, body.locationId ?? null);
  if (body.batchId) {
    stocks = stocks.filter((s) => s.batchId === body.batchId);
    if (stocks.length === 0)
      invalidField('batchId', 'no stock of this batch here', 'unknown-batch');
  }
  const choice = chooseBatches(stocks, q, { today: await dbToday(tx) });
  const idOf = new Map(stocks.map((s) => [s.code, s.batchId]));
  return {
    ...choice,
    picks: choice.picks.map((p) => ({ ...p, batchId: idOf.get(p.code) ?? null })),
    available: stocks.reduce((sum, s) => sum + Math.max(0, s.onHand - s.reserved), 0),
  };
}

/** Reserves for the job (one row per batch); 409 with the offer when it needs consent. */
export async function reserve(tx: Tx, scope: TenantScope, userId: string, body: ReserveBody) {
  await lockCostStates(tx, scope, [{ productId: body.productId }]);
  const offer = await offerFor(tx, scope, body);
  const list = offer.picks.map((p) => `${p.quantity} from batch ${p.code || '(none)'}`).join(', ');
  if (offer.warning === 'short' && !body.acceptShort)
    conflictField(
      'quantity',
      'insufficient-stock',
      `Only ${offer.available} available, ${formatDecimal(body.quantity, 0)} asked for (${offer.shortBy} short). Reserve what there is (${list || 'nothing'}) with acceptShort, and order the rest.`,
      { offer },
    );
  if (offer.warning === 'mixed-batches' && !body.acceptSplit)
    conflictField(
      'quantity',
      'mixed-batches',
      `No single batch covers ${body.quantity}: shades may differ between batches. Best split: ${list}. Accept it with acceptSplit, and lay each batch in its own area.`,
      { offer },
    );
  if (offer.picks.length === 0)
    conflictField('quantity', 'insufficient-stock', 'Nothing available to reserve.', { offer });
  const rows = [];
  for (const pick of offer.picks)
    rows.push(
      await tx
        .insertInto('reservation')
        .values({
          tenantId: scope.tenantId,
          jobId: body.jobId,
          productId: body.productId,
          batchId: pick.batchId,
          locationId: body.locationId ?? null,
          quantity: pick.quantity,
          note: body.note,
          createdBy: userId,
        })
        .returning('id')
        .executeTakeFirstOrThrow(),
    );
  return { reservationIds: rows.map((r) => r.id), offer };
}
