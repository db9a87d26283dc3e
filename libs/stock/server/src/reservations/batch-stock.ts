/**
 * What a product has per batch for reserving and picking: on hand (at one location or all),
 * minus what active reservations still hold. Stock without a batch counts as one batch with
 * an empty code, so the domain's batch choice and FEFO picking work on every product.
 */
import { sql } from 'kysely';
import type { TenantScope, Tx } from '@latchwork/shared-db';
import type { BatchStock, PickSource } from '@latchwork/stock-domain';

/** A batch of the product with its id (null: stock held without a batch). */
export interface ProductBatchStock extends BatchStock {
  batchId: string | null;
}

/** Per batch: on hand (at `locationId` if given) and still reserved by active reservations. */
export async function batchStocks(
  tx: Tx,
  scope: TenantScope,
  productId: string,
  locationId: string | null,
): Promise<ProductBatchStock[]> {
  const t = scope.tenantId;
  const { rows } = await sql<{
    batchId: string | null;
    code: string | null;
    receivedOn: string | null;
    expiresOn: string | null;
    onHand: string;
    reserved: string;
  }>`
    with held as (
      select batch_id, sum(quantity) as on_hand from stock_balance
      where tenant_id = ${t} and product_id = ${productId}
        and (${locationId}::uuid is null or location_id = ${locationId}::uuid)
      group by batch_id
    ), promised as (
      select batch_id, sum(quantity - issued_quantity) as reserved from reservation
      where tenant_id = ${t} and product_id = ${productId} and status = 'active'
      group by batch_id
    )
    select h.batch_id, b.code, b.received_on, b.expires_on, h.on_hand::text as on_hand,
      coalesce(p.reserved, 0)::text as reserved
    from held h
    left join stock_batch b on b.tenant_id = ${t} and b.id = h.batch_id
    left join promised p on p.batch_id is not distinct from h.batch_id
    where h.on_hand > 0`.execute(tx);
  return rows.map((r) => ({
    batchId: r.batchId,
    code: r.code ?? '',
    received: r.receivedOn ?? '0000-01-01',
    expiry: r.expiresOn,
    onHand: Number(r.onHand),
    reserved: Number(r.reserved),
  }));
}

/** A place the picker may take a product from: one batch at one location. */
export interface SourceRow extends PickSource {
  batchId: string | null;
  locationId: string;
  locationName: string;
}

/** Positive balances of a product (optionally one batch / location), as FEFO pick sources. */
export async function pickSources(
  tx: Tx,
  scope: TenantScope,
  productId: string,
  batchId: string | null,
  locationId: string | null,
): Promise<SourceRow[]> {
  const t = scope.tenantId;
  let q = tx
    .selectFrom('stockBalance as sb')
    .innerJoin('stockLocation as l', (j) =>
      j.onRef('l.id', '=', 'sb.locationId').on('l.tenantId', '=', t),
    )
    .leftJoin('stockBatch as b', (j) => j.onRef('b.id', '=', 'sb.batchId').on('b.tenantId', '=', t))
    .select([
      'sb.batchId',
      'sb.locationId',
      'sb.quantity',
      'l.name',
      'l.kind',
      'b.code',
      'b.receivedOn',
      'b.expiresOn',
    ])
    .where('sb.tenantId', '=', t)
    .where('sb.productId', '=', productId)
    .where('sb.quantity', '>', '0');
  if (batchId) q = q.where('sb.batchId', '=', batchId);
  if (locationId) q = q.where('sb.locationId', '=', locationId);
  const rows = await q.execute();
  return rows.map((r) => ({
    batchId: r.batchId,
    locationId: r.locationId,
    locationName: r.name,
    code: r.code ?? '',
    quantity: Number(r.quantity),
    received: r.receivedOn ?? '0000-01-01',
    expiry: r.expiresOn,
    location: r.locationId,
  }));
}
