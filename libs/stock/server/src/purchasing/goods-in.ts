/**
 * Goods in against a sent order. Each line names the order line, the good quantity (packs +
 * loose units), the batch (an existing code, or a new one with its expiry), the units that
 * arrived damaged and what the supplier actually charged. The ledger gets a `receipt` of
 * everything that arrived at the actual cost — which moves the weighted average — and a
 * `damaged` write-off of the broken units. Damaged units do not count as received: the order
 * line stays open for the supplier's replacement.
 */
import { sql } from 'kysely';
import type { TenantScope, Tx } from '@latchwork/shared-db';
import { postMovements, type MovementRequest, type PostingActor } from '../ledger';
import { conflictField, invalidField } from '../stock-errors';
import { loadProducts, packsOf, requireFirmRow, stepsOf, type ProductFacts } from './product-facts';
import type { GoodsInBody } from './po.schemas';
import { findOrderRow } from './po-view';
import { requireOrderStatus, setOrder } from './po-status';

type Line = GoodsInBody['lines'][number];

/** The batch of `line`: the existing one with its code, or a new one; null without a code. */
async function batchOf(
  tx: Tx,
  scope: TenantScope,
  line: Line,
  product: ProductFacts & { shelfLifeDays: number | null },
  receivedOn: string,
  supplierId: string,
  at: string,
): Promise<string | null> {
  if (!line.batchCode) {
    if (line.expiresOn) invalidField(`${at}batchCode`, 'an expiry date needs a batch code');
    return null;
  }
  const existing = await tx
    .selectFrom('stockBatch')
    .select(['id', 'expiresOn'])
    .where('tenantId', '=', scope.tenantId)
    .where('productId', '=', product.id)
    .where('code', '=', line.batchCode)
    .executeTakeFirst();
  if (existing) {
    if (line.expiresOn && line.expiresOn !== existing.expiresOn)
      invalidField(
        `${at}expiresOn`,
        `batch ${line.batchCode} is already booked with expiry ${existing.expiresOn ?? 'none'}`,
        'expiry-mismatch',
      );
    return existing.id;
  }
  if (line.expiresOn && line.expiresOn < receivedOn)
    invalidField(
      `${at}expiresOn`,
      `the expiry date ${line.expiresOn} is before the date received ${receivedOn}`,
      'expiry-before-receipt',
    );
  const expiresOn =
    line.expiresOn ??
    (product.shelfLifeDays
      ? sql<string>`(${receivedOn}::date + ${product.shelfLifeDays}::int)`
      : null);
  const row = await tx
    .insertInto('stockBatch')
    .values({
      tenantId: scope.tenantId,
      productId: product.id,
      code: line.batchCode,
      receivedOn,
      expiresOn: expiresOn as string | null,
      supplierId,
    })
    .returning('id')
    .executeTakeFirstOrThrow();
  return row.id;
}

/** Books a delivery against order `id`; returns the goods receipt's id. */
export async function receiveGoods(
  tx: Tx,
  scope: TenantScope,
  actor: PostingActor,
  id: string,
  body: GoodsInBody,
): Promise<string> {
  const order = await findOrderRow(tx, scope, id, true);
  requireOrderStatus(order.status, ['sent', 'part_received'], 'take deliveries');
  const locationId = body.locationId ?? order.deliveryLocationId;
  if (!locationId) invalidField('locationId', 'say where the goods were put');
  await requireFirmRow(tx, scope, 'stockLocation', locationId, 'locationId');
  const today = (await sql<{ d: string }>`select current_date::text as d`.execute(tx)).rows[0].d;
  const receivedOn = body.receivedOn ?? today;
  if (receivedOn > today) invalidField('receivedOn', 'goods cannot arrive in the future');

  const orderLines = await tx
    .selectFrom('purchaseOrderLine')
    .selectAll()
    .where('tenantId', '=', scope.tenantId)
    .where('purchaseOrderId', '=', id)
    .execute();
  const byId = new Map(orderLines.map((l) => [l.id, l]));
  const products = await loadProducts(
    tx,
    scope,
    orderLines.map((l) => l.productId),
  );
  const shelf = await tx
    .selectFrom('product')
    .select(['id', 'shelfLifeDays'])
    .where('tenantId', '=', scope.tenantId)
    .where(
      'id',
      'in',
      orderLines.map((l) => l.productId),
    )
    .execute();
  const shelfOf = new Map(shelf.map((s) => [s.id, s.shelfLifeDays]));

  const receipt = await tx
    .insertInto('goodsReceipt')
    .values({
      tenantId: scope.tenantId,
      purchaseOrderId: id,
      locationId,
      receivedOn,
      note: body.note,
      receivedBy: actor.userId,
    })
    .returning('id')
    .executeTakeFirstOrThrow();

  const receivedNow = new Map<string, number>();
  for (const [i, line] of body.lines.entries()) {
    const at = `lines.${i}.`;
    const ordered = byId.get(line.purchaseOrderLineId);
    if (!ordered) invalidField(`${at}purchaseOrderLineId`, 'not a line of this order');
    const product = products.get(ordered.productId) as ProductFacts;
    const good = stepsOf(product, line);
    if (good + line.damaged <= 0)
      invalidField(`${at}packs`, 'enter what arrived (good or damaged)', 'zero-quantity');
    const already = Number(ordered.receivedQuantity) + (receivedNow.get(ordered.id) ?? 0);
    const open = Number(ordered.quantity) - already;
    if (good > open)
      conflictField(
        `${at}packs`,
        'over-receipt',
        `Only ${packsOf(product, Math.max(open, 0))} of ${product.name} are still to come on this order.`,
        { outstanding: Math.max(open, 0), received: good },
      );
    receivedNow.set(ordered.id, (receivedNow.get(ordered.id) ?? 0) + good);
    const batchId = await batchOf(
      tx,
      scope,
      line,
      { ...product, shelfLifeDays: shelfOf.get(product.id) ?? null },
      receivedOn,
      order.supplierId,
      at,
    );
    const unitCostMinor = line.unitCostMinor ?? Number(ordered.unitCostMinor);
    const movements: MovementRequest[] = [
      {
        kind: 'receipt',
        productId: product.id,
        batchId,
        toLocationId: locationId,
        quantity: good + line.damaged,
        unitCostMinor,
        note: `goods in ${order.reference}`,
      },
    ];
    if (line.damaged > 0)
      movements.push({
        kind: 'write_off',
        productId: product.id,
        batchId,
        fromLocationId: locationId,
        quantity: line.damaged,
        writeOffReason: 'damaged',
        note: `arrived damaged, ${order.reference}`,
      });
    const [booked, writtenOff] = await postMovements(tx, scope, actor, movements, {
      at: () => at,
      today,
    });
    await tx
      .insertInto('goodsReceiptLine')
      .values({
        tenantId: scope.tenantId,
        goodsReceiptId: receipt.id,
        purchaseOrderLineId: ordered.id,
        productId: product.id,
        batchId,
        quantity: good,
        damagedQuantity: line.damaged,
        unitCostMinor,
        receiptMovementId: booked.id,
        writeOffMovementId: writtenOff?.id ?? null,
      })
      .execute();
    await tx
      .updateTable('purchaseOrderLine')
      .set({
        receivedQuantity: sql`received_quantity + ${good}`,
        damagedQuantity: sql`damaged_quantity + ${line.damaged}`,
      })
      .where('tenantId', '=', scope.tenantId)
      .where('id', '=', ordered.id)
      .execute();
  }
  const complete = orderLines.every(
    (l) => Number(l.receivedQuantity) + (receivedNow.get(l.id) ?? 0) >= Number(l.quantity),
  );
  await setOrder(tx, scope, id, { status: complete ? 'received' : 'part_received' });
  return receipt.id;
}
