/**
 * Purchase orders: created by hand or by the reorder run, numbered gapless per firm from the
 * firm's purchase-order prefix (the counter row stays locked until the creating transaction
 * ends, so a rolled-back order does not use a number up), edited only while draft.
 */
import { nextNumber, type TenantScope, type Tx } from '@latchwork/shared-db';
import { invalidField } from '../stock-errors';
import { loadProducts, requireFirmRow, stepsOf } from './product-facts';
import type { PurchaseOrderBody } from './po.schemas';

/** One line to order, in stock steps. */
export interface OrderLineInput {
  productId: string;
  quantity: number;
  unitCostMinor: number;
  note?: string;
}

/** A new order's header. */
export interface OrderInput {
  supplierId: string;
  deliveryLocationId: string | null;
  expectedOn: string | null;
  notes: string;
  source: 'manual' | 'reorder';
  lines: readonly OrderLineInput[];
}

/** The next number of the firm's orders and its reference, e.g. 7 and "PO-7". */
async function nextOrderNumber(
  tx: Tx,
  scope: TenantScope,
): Promise<{ n: number; reference: string }> {
  const tenant = await tx
    .selectFrom('tenant')
    .select('numberPrefixes')
    .where('id', '=', scope.tenantId)
    .executeTakeFirstOrThrow();
  const prefix = tenant.numberPrefixes['purchaseOrder'] ?? 'PO-';
  // Taken last: the counter row stays locked until the transaction ends.
  const n = await nextNumber(tx, scope, 'purchase_order_counter');
  return { n, reference: `${prefix}${n}` };
}

/** 400 naming the field when the supplier or location is not the firm's. */
async function checkPlaces(
  tx: Tx,
  scope: TenantScope,
  o: Pick<OrderInput, 'supplierId' | 'deliveryLocationId'>,
): Promise<void> {
  await requireFirmRow(tx, scope, 'supplier', o.supplierId, 'supplierId');
  if (o.deliveryLocationId)
    await requireFirmRow(tx, scope, 'stockLocation', o.deliveryLocationId, 'deliveryLocationId');
}

/** The body's lines in steps, at the catalogue cost unless given; 400 naming a bad line. */
export async function linesOfBody(
  tx: Tx,
  scope: TenantScope,
  body: PurchaseOrderBody,
): Promise<OrderLineInput[]> {
  const products = await loadProducts(
    tx,
    scope,
    body.lines.map((l) => l.productId),
  );
  const seen = new Set<string>();
  return body.lines.map((l, i) => {
    const p = products.get(l.productId);
    if (!p) invalidField(`lines.${i}.productId`, 'no such product');
    if (seen.has(l.productId))
      invalidField(`lines.${i}.productId`, 'already on this order: change that line instead');
    seen.add(l.productId);
    const quantity = stepsOf(p, l);
    if (quantity <= 0) invalidField(`lines.${i}.packs`, 'order at least one unit', 'zero-quantity');
    return {
      productId: l.productId,
      quantity,
      unitCostMinor: l.unitCostMinor ?? p.costMinor,
      note: l.note,
    };
  });
}

async function insertLines(
  tx: Tx,
  scope: TenantScope,
  purchaseOrderId: string,
  lines: readonly OrderLineInput[],
): Promise<void> {
  await tx
    .insertInto('purchaseOrderLine')
    .values(
      lines.map((l, position) => ({
        tenantId: scope.tenantId,
        purchaseOrderId,
        position,
        productId: l.productId,
        quantity: l.quantity,
        unitCostMinor: l.unitCostMinor,
        note: l.note ?? '',
      })),
    )
    .execute();
}

/** Creates a draft order with its lines; returns its id. */
export async function createPurchaseOrder(
  tx: Tx,
  scope: TenantScope,
  userId: string | null,
  o: OrderInput,
): Promise<string> {
  await checkPlaces(tx, scope, o);
  const { n, reference } = await nextOrderNumber(tx, scope);
  const row = await tx
    .insertInto('purchaseOrder')
    .values({
      tenantId: scope.tenantId,
      number: n,
      reference,
      supplierId: o.supplierId,
      source: o.source,
      deliveryLocationId: o.deliveryLocationId,
      expectedOn: o.expectedOn,
      notes: o.notes,
      createdBy: userId,
    })
    .returning('id')
    .executeTakeFirstOrThrow();
  await insertLines(tx, scope, row.id, o.lines);
  return row.id;
}

/**
 * Replaces a draft's header and lines (the caller has checked it is a draft). A product that
 * stays on the order keeps its line (and id); lines of products no longer named are removed.
 */
export async function replaceDraft(
  tx: Tx,
  scope: TenantScope,
  purchaseOrderId: string,
  o: Omit<OrderInput, 'source'>,
): Promise<void> {
  await checkPlaces(tx, scope, o);
  await tx
    .updateTable('purchaseOrder')
    .set({
      supplierId: o.supplierId,
      deliveryLocationId: o.deliveryLocationId,
      expectedOn: o.expectedOn,
      notes: o.notes,
      updatedAt: new Date(),
    })
    .where('tenantId', '=', scope.tenantId)
    .where('id', '=', purchaseOrderId)
    .execute();
  const kept = o.lines.map((l) => l.productId);
  await tx
    .deleteFrom('purchaseOrderLine')
    .where('tenantId', '=', scope.tenantId)
    .where('purchaseOrderId', '=', purchaseOrderId)
    .where('productId', 'not in', kept)
    .execute();
  for (const [position, l] of o.lines.entries())
    await tx
      .insertInto('purchaseOrderLine')
      .values({
        tenantId: scope.tenantId,
        purchaseOrderId,
        position,
        productId: l.productId,
        quantity: l.quantity,
        unitCostMinor: l.unitCostMinor,
        note: l.note ?? '',
      })
      .onConflict((oc) =>
        oc.columns(['tenantId', 'purchaseOrderId', 'productId']).doUpdateSet({
          position,
          quantity: l.quantity,
          unitCostMinor: l.unitCostMinor,
          note: l.note ?? '',
        }),
      )
      .execute();
}
