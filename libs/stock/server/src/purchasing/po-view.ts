/** Reading purchase orders: one with its lines, totals and receipts; the list. */
import { sql } from 'kysely';
import type { PurchaseOrderStatus, TenantScope, Tx } from '@latchwork/shared-db';
import { NotFoundError } from '@latchwork/shared-server-kit';
import { extendCost, mulDivRound } from '@latchwork/stock-domain';
import type { z } from 'zod';
import { loadProducts, packsOf, type ProductFacts } from './product-facts';
import type { purchaseOrderQuery } from './po.schemas';

/** The header row, 404 when it is not the firm's; `lock` holds it for a status change. */
export async function findOrderRow(tx: Tx, scope: TenantScope, id: string, lock = false) {
  let q = tx
    .selectFrom('purchaseOrder')
    .selectAll()
    .where('tenantId', '=', scope.tenantId)
    .where('id', '=', id);
  if (lock) q = q.forUpdate();
  const row = await q.executeTakeFirst();
  if (!row) throw new NotFoundError('That purchase order');
  return row;
}

async function orderLines(tx: Tx, scope: TenantScope, purchaseOrderId: string) {
  const rows = await tx
    .selectFrom('purchaseOrderLine')
    .selectAll()
    .where('tenantId', '=', scope.tenantId)
    .where('purchaseOrderId', '=', purchaseOrderId)
    .orderBy('position')
    .execute();
  const products = await loadProducts(
    tx,
    scope,
    rows.map((r) => r.productId),
  );
  return rows.map((r) => {
    const p = products.get(r.productId) as ProductFacts;
    const quantity = Number(r.quantity);
    const received = Number(r.receivedQuantity);
    const unitCostMinor = Number(r.unitCostMinor);
    const lineTotalMinor = extendCost(quantity, unitCostMinor, p.decimals);
    return {
      id: r.id,
      position: r.position,
      productId: r.productId,
      sku: p.sku,
      productName: p.name,
      packSize: p.packSize,
      decimals: p.decimals,
      units: {
        unitOne: p.unitOne,
        unitOther: p.unitOther,
        packOne: p.packOne,
        packOther: p.packOther,
      },
      quantity,
      quantityPacks: packsOf(p, quantity),
      unitCostMinor,
      lineTotalMinor,
      taxRateBp: p.taxRateBp,
      taxMinor: mulDivRound(lineTotalMinor, p.taxRateBp, 10000),
      receivedQuantity: received,
      receivedPacks: packsOf(p, received),
      damagedQuantity: Number(r.damagedQuantity),
      damagedPacks: packsOf(p, Number(r.damagedQuantity)),
      outstanding: Math.max(quantity - received, 0),
      outstandingPacks: packsOf(p, Math.max(quantity - received, 0)),
      note: r.note,
    };
  });
}

/** The receipts booked against the order, newest first. */
async function receipts(tx: Tx, scope: TenantScope, purchaseOrderId: string) {
  const rows = await tx
    .selectFrom('goodsReceipt as g')
    .innerJoin('stockLocation as l', (j) =>
      j.onRef('l.id', '=', 'g.locationId').on('l.tenantId', '=', scope.tenantId),
    )
    .leftJoin('appUser as u', 'u.id', 'g.receivedBy')
    .select(['g.id', 'g.receivedOn', 'g.note', 'g.createdAt', 'l.name as locationName'])
    .select('u.name as receivedByName')
    .select((eb) =>
      eb
        .selectFrom('goodsReceiptLine as gl')
        .leftJoin('stockBatch as b', (j) =>
          j.onRef('b.id', '=', 'gl.batchId').on('b.tenantId', '=', scope.tenantId),
        )
        .select(
          sql<
            {
              purchaseOrderLineId: string;
              batchCode: string | null;
              expiresOn: string | null;
              quantity: number;
              damagedQuantity: number;
              unitCostMinor: number;
            }[]
          >`coalesce(json_agg(json_build_object('purchaseOrderLineId', gl.purchase_order_line_id,
            'batchCode', b.code, 'expiresOn', b.expires_on, 'quantity', gl.quantity,
            'damagedQuantity', gl.damaged_quantity, 'unitCostMinor', gl.unit_cost_minor)), '[]')`.as(
            'lines',
          ),
        )
        .whereRef('gl.goodsReceiptId', '=', 'g.id')
        .where('gl.tenantId', '=', scope.tenantId)
        .as('lines'),
    )
    .where('g.tenantId', '=', scope.tenantId)
    .where('g.purchaseOrderId', '=', purchaseOrderId)
    .orderBy('g.createdAt', 'desc')
    .execute();
  return rows;
}

/** One order with supplier, delivery place, lines, totals and receipts. */
export async function purchaseOrderView(tx: Tx, scope: TenantScope, id: string) {
  const o = await findOrderRow(tx, scope, id);
  const supplier = await tx
    .selectFrom('supplier')
    .select(['id', 'name', 'email', 'phone', 'accountRef', 'addressLines', 'leadTimeDays'])
    .where('tenantId', '=', scope.tenantId)
    .where('id', '=', o.supplierId)
    .executeTakeFirstOrThrow();
  const location = o.deliveryLocationId
    ? await tx
        .selectFrom('stockLocation as l')
        .leftJoin('site as s', (j) =>
          j.onRef('s.id', '=', 'l.siteId').on('s.tenantId', '=', scope.tenantId),
        )
        .select(['l.id', 'l.name', 'l.kind', 's.addressLines', 's.postcode'])
        .where('l.tenantId', '=', scope.tenantId)
        .where('l.id', '=', o.deliveryLocationId)
        .executeTakeFirst()
    : undefined;
  const lines = await orderLines(tx, scope, id);
  const byLine = new Map(lines.map((l) => [l.id, l]));
  // Each delivered batch in the packs of its line's product, as the page shows it.
  const packed = (lineId: string, quantity: number) => {
    const l = byLine.get(lineId);
    return l ? packsOf({ ...l.units, packSize: l.packSize, decimals: l.decimals }, quantity) : '';
  };
  const netMinor = lines.reduce((s, l) => s + l.lineTotalMinor, 0);
  const taxMinor = lines.reduce((s, l) => s + l.taxMinor, 0);
  const { tenantId: _t, ...header } = o;
  return {
    ...header,
    supplier,
    deliveryLocation: location ?? null,
    lines,
    totals: { netMinor, taxMinor, grossMinor: netMinor + taxMinor },
    receipts: (await receipts(tx, scope, id)).map((r) => ({
      ...r,
      lines: (r.lines ?? []).map((g) => ({
        ...g,
        packs: packed(g.purchaseOrderLineId, Number(g.quantity)),
        damagedPacks: packed(g.purchaseOrderLineId, Number(g.damagedQuantity)),
      })),
    })),
  };
}

export type PurchaseOrderView = Awaited<ReturnType<typeof purchaseOrderView>>;

/** The open statuses: ordered (or about to be) and not all in yet. */
export const OPEN_STATUSES: PurchaseOrderStatus[] = ['draft', 'sent', 'part_received'];

/** Orders, newest first, with supplier name, line count and net value. */
export async function listPurchaseOrders(
  tx: Tx,
  scope: TenantScope,
  f: z.output<typeof purchaseOrderQuery>,
) {
  const t = scope.tenantId;
  let q = tx
    .selectFrom('purchaseOrder as o')
    .innerJoin('supplier as s', (j) =>
      j.onRef('s.id', '=', 'o.supplierId').on('s.tenantId', '=', t),
    )
    .leftJoin('stockLocation as l', (j) =>
      j.onRef('l.id', '=', 'o.deliveryLocationId').on('l.tenantId', '=', t),
    )
    .select(['o.id', 'o.reference', 'o.number', 'o.status', 'o.source', 'o.expectedOn'])
    .select(['o.createdAt', 'o.sentAt', 's.id as supplierId', 's.name as supplierName'])
    .select('l.name as deliveryLocationName')
    .select((eb) =>
      eb
        .selectFrom('purchaseOrderLine as pl')
        .select(sql<string>`count(*)`.as('n'))
        .whereRef('pl.purchaseOrderId', '=', 'o.id')
        .where('pl.tenantId', '=', t)
        .as('lineCount'),
    )
    .where('o.tenantId', '=', t);
  if (f.status === 'open') q = q.where('o.status', 'in', OPEN_STATUSES);
  else if (f.status) q = q.where('o.status', '=', f.status);
  if (f.supplierId) q = q.where('o.supplierId', '=', f.supplierId);
  const rows = await q.orderBy('o.number', 'desc').limit(f.limit).execute();
  return rows.map((r) => ({ ...r, lineCount: Number(r.lineCount) }));
}
