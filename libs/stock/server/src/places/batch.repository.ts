/**
 * Batches of a product: code (unique per product), received and expiry dates. A batch without
 * an expiry date takes one from the product's shelf life when it has one.
 */
import { sql } from 'kysely';
import type { TenantScope, Tx } from '@latchwork/shared-db';
import { conflictField, invalidField } from '../stock-errors';
import { isUniqueViolation } from '../catalogue/product-rules';
import type { BatchBody } from './places.schemas';
import { existsInFirm } from '../stock-tx';
import { PACK_COLUMNS, packText } from '../ledger/ledger.repository';

/** Creates a batch; 400 for an unknown product or supplier, 409 for a code already used. */
export async function createBatch(
  tx: Tx,
  scope: TenantScope,
  body: BatchBody,
  at = '',
): Promise<string> {
  const product = await tx
    .selectFrom('product')
    .select(['id', 'shelfLifeDays'])
    .where('tenantId', '=', scope.tenantId)
    .where('id', '=', body.productId)
    .executeTakeFirst();
  if (!product) invalidField(`${at}productId`, 'no such product');
  if (body.supplierId && !(await existsInFirm(tx, scope, 'supplier', body.supplierId)))
    invalidField(`${at}supplierId`, 'no such supplier');
  const expiresOn =
    body.expiresOn === undefined && product.shelfLifeDays
      ? sql<string>`(${body.receivedOn}::date + ${product.shelfLifeDays}::int)`
      : (body.expiresOn ?? null);
  try {
    const row = await tx
      .insertInto('stockBatch')
      .values({
        tenantId: scope.tenantId,
        productId: body.productId,
        code: body.code,
        receivedOn: body.receivedOn,
        expiresOn: expiresOn as string | null,
        supplierId: body.supplierId,
      })
      .returning('id')
      .executeTakeFirstOrThrow();
    return row.id;
  } catch (err) {
    if (isUniqueViolation(err, 'stock_batch_tenant_id_product_id_code_key'))
      conflictField(`${at}code`, 'duplicate-batch', `Batch ${body.code} of this product exists.`);
    throw err;
  }
}

/** Batches with their product and on-hand quantity, first expiry first. */
export function batchList(tx: Tx, scope: TenantScope) {
  return tx
    .selectFrom('stockBatch as b')
    .innerJoin('product as p', (j) =>
      j.onRef('p.id', '=', 'b.productId').on('p.tenantId', '=', scope.tenantId),
    )
    .select([
      'b.id',
      'b.productId',
      'b.code',
      'b.receivedOn',
      'b.expiresOn',
      'b.supplierId',
      'p.sku',
      'p.name as productName',
      'p.kind',
      ...PACK_COLUMNS,
      (eb) =>
        eb
          .selectFrom('stockBalance as sb')
          .select(sql<string>`coalesce(sum(sb.quantity), 0)`.as('q'))
          .where('sb.tenantId', '=', scope.tenantId)
          .whereRef('sb.batchId', '=', 'b.id')
          .as('onHand'),
    ])
    .where('b.tenantId', '=', scope.tenantId)
    .orderBy(sql`b.expires_on nulls last`)
    .orderBy('b.receivedOn')
    .orderBy('b.code');
}

type BatchRow = Awaited<ReturnType<ReturnType<typeof batchList>['execute']>>[number];

/** A batch as the API returns it: on hand as a number and in packs ("3 boxes + 5 tiles"). */
export function batchView(b: BatchRow) {
  const { packSize: _s, unitOne: _a, unitOther: _b, packOne: _c, packOther: _d, ...rest } = b;
  const onHand = Number(b.onHand);
  return { ...rest, onHand, onHandPacks: packText(b, onHand) };
}
