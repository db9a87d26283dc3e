/**
 * Starting a count: one line per product × batch at the location, each with the balance at
 * that moment (the snapshot). The counter never sees it; posting compares the count with the
 * balance as it stood when each line was counted (see count-variance.ts).
 */
import type { TenantScope, Tx } from '@latchwork/shared-db';
import type { PostingActor } from '../ledger';
import { conflictField, invalidField } from '../stock-errors';
import { requireFirmRow } from '../purchasing/product-facts';
import type { StartCountBody } from './count.schemas';

interface SnapshotLine {
  productId: string;
  batchId: string | null;
  quantity: number;
}

/** The balances at the location (all products, or the chosen ones), in sheet order. */
async function snapshot(
  tx: Tx,
  scope: TenantScope,
  locationId: string,
  productIds: readonly string[],
): Promise<SnapshotLine[]> {
  let q = tx
    .selectFrom('stockBalance as sb')
    .innerJoin('product as p', (j) =>
      j.onRef('p.id', '=', 'sb.productId').on('p.tenantId', '=', scope.tenantId),
    )
    .leftJoin('stockBatch as b', (j) =>
      j.onRef('b.id', '=', 'sb.batchId').on('b.tenantId', '=', scope.tenantId),
    )
    .select(['sb.productId', 'sb.batchId', 'sb.quantity'])
    .where('sb.tenantId', '=', scope.tenantId)
    .where('sb.locationId', '=', locationId);
  q =
    productIds.length > 0
      ? q.where('sb.productId', 'in', productIds)
      : q.where('sb.quantity', '<>', '0');
  const rows = await q
    .orderBy('p.kind')
    .orderBy('p.name')
    .orderBy('p.sku')
    .orderBy('b.code')
    .execute();
  const lines = rows.map((r) => ({ ...r, quantity: Number(r.quantity) }));
  // A chosen product with no balance here is still counted: the counter may find some.
  for (const productId of productIds)
    if (!lines.some((l) => l.productId === productId))
      lines.push({ productId, batchId: null, quantity: 0 });
  return lines;
}

/** Starts a count; 400 for an unknown location or product, 409 when there is nothing to count. */
export async function startCount(
  tx: Tx,
  scope: TenantScope,
  actor: PostingActor,
  body: StartCountBody,
): Promise<string> {
  const location = await requireFirmRow(tx, scope, 'stockLocation', body.locationId, 'locationId');
  const chosen = [...new Set(body.productIds)];
  if (chosen.length > 0) {
    const found = await tx
      .selectFrom('product')
      .select('id')
      .where('tenantId', '=', scope.tenantId)
      .where('id', 'in', chosen)
      .execute();
    const known = new Set(found.map((p) => p.id));
    const missing = body.productIds.findIndex((id) => !known.has(id));
    if (missing >= 0) invalidField(`productIds.${missing}`, 'no such product');
  }
  const lines = await snapshot(tx, scope, location.id, chosen);
  if (lines.length === 0)
    conflictField(
      'productIds',
      'nothing-to-count',
      `Nothing is booked at ${location.name}: choose the products to count.`,
    );
  const count = await tx
    .insertInto('stockCount')
    .values({
      tenantId: scope.tenantId,
      locationId: location.id,
      scope: chosen.length > 0 ? 'chosen' : 'all',
      note: body.note,
      startedBy: actor.userId,
    })
    .returning('id')
    .executeTakeFirstOrThrow();
  await tx
    .insertInto('stockCountLine')
    .values(
      lines.map((l, position) => ({
        tenantId: scope.tenantId,
        countId: count.id,
        position,
        productId: l.productId,
        batchId: l.batchId,
        expectedAtStart: l.quantity,
      })),
    )
    .execute();
  return count.id;
}
