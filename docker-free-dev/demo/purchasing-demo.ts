import {
  createPurchaseOrder,
  markSent,
  postCount,
  receiveGoods,
  runReorder,
  saveEntries,
  saveReasons,
  startCount,
  submitCount,
} from '@latchwork/stock-server';
import type { DemoStep } from './demo-context';

/**
 * Purchase orders, goods in and counts on top of the stock demo (run after it): an order that
 * has arrived in two batches, one sent and waiting, the reorder run's drafts, a posted count of
 * a van with one difference and a count still in progress. No e-mail is sent: orders are only
 * marked sent.
 */
export const purchasingDemo: DemoStep = async (firm) => {
  const { tx, tenantId } = firm;
  const scope = { tenantId };
  const ownerId =
    [...firm.members.entries()].find(([email]) => email.startsWith('owner@'))?.[1] ?? '';
  const actor = { userId: ownerId, role: 'owner' as const };
  const places = await tx
    .selectFrom('stockLocation')
    .select(['id', 'name', 'kind'])
    .where('tenantId', '=', tenantId)
    .orderBy('name')
    .execute();
  const warehouse = places.find((p) => p.kind === 'warehouse');
  const stocked = await tx
    .selectFrom('stockBalance')
    .select('locationId')
    .where('tenantId', '=', tenantId)
    .where('quantity', '>', '0')
    .groupBy('locationId')
    .execute();
  const van = places.find((p) => p.kind === 'van' && stocked.some((s) => s.locationId === p.id));
  const products = await tx
    .selectFrom('product')
    .innerJoin('supplier', 'supplier.id', 'product.preferredSupplierId')
    .select(['product.id', 'product.packSize', 'product.costMinor', 'product.kind'])
    .select(['supplier.id as supplierId', 'supplier.email', 'supplier.name as supplierName'])
    .where('product.tenantId', '=', tenantId)
    .where('product.kind', 'in', ['tile', 'adhesive', 'skirting', 'ramp'])
    .orderBy('product.sku')
    .execute();
  if (!warehouse || products.length === 0) return 'no catalogue or warehouse: nothing added';

  const bySupplier = new Map<string, typeof products>();
  for (const p of products)
    bySupplier.set(p.supplierId, [...(bySupplier.get(p.supplierId) ?? []), p]);
  const groups = [...bySupplier.values()];
  const order = async (lines: typeof products, packs: number) => {
    const first = lines[0];
    const id = await createPurchaseOrder(tx, scope, ownerId, {
      supplierId: first.supplierId,
      deliveryLocationId: warehouse.id,
      expectedOn: null,
      notes: 'Deliver to the yard gate, weekdays 7:30 to 16:00.',
      source: 'manual',
      lines: lines.slice(0, 3).map((p) => ({
        productId: p.id,
        quantity: packs * Number(p.packSize),
        unitCostMinor: Number(p.costMinor),
      })),
    });
    await markSent(
      tx,
      scope,
      ownerId,
      id,
      first.email ?? `orders@${first.supplierId.slice(0, 8)}.test`,
    );
    return id;
  };

  let summary = '';
  // Arrived: the first line in two batches, the rest in one, one box damaged.
  const arrived = await order(groups[0], 4);
  const lines = await tx
    .selectFrom('purchaseOrderLine')
    .select(['id', 'quantity'])
    .where('tenantId', '=', tenantId)
    .where('purchaseOrderId', '=', arrived)
    .orderBy('position')
    .execute();
  const stamp = firm.today.toISOString().slice(2, 10).replaceAll('-', '');
  await receiveGoods(tx, scope, actor, arrived, {
    note: 'Delivery note 40417',
    lines: lines.flatMap((l, i) => {
      const q = Number(l.quantity);
      return i === 0
        ? [
            {
              purchaseOrderLineId: l.id,
              packs: 0,
              units: q / 2,
              damaged: 0,
              batchCode: `PO${stamp}-A`,
            },
            {
              purchaseOrderLineId: l.id,
              packs: 0,
              units: q / 2,
              damaged: 0,
              batchCode: `PO${stamp}-B`,
            },
          ]
        : [
            {
              purchaseOrderLineId: l.id,
              packs: 0,
              units: q,
              damaged: 0,
              batchCode: `PO${stamp}-${i}`,
            },
          ];
    }),
  });
  summary += '1 order received in batches';
  if (groups.length > 1 && firm.slug === 'kestrel-floorworks') {
    await order(groups[1], 2);
    summary += ', 1 sent';
  }
  const reorder = await runReorder(tx, scope, null);
  summary += `, ${reorder.created.length} reorder drafts`;

  // A count of the van: everything as booked but one product two short.
  if (van) {
    const countId = await startCount(tx, scope, actor, {
      locationId: van.id,
      productIds: [],
      note: 'Monthly van check',
    });
    const countLines = await tx
      .selectFrom('stockCountLine')
      .select(['id', 'expectedAtStart'])
      .where('tenantId', '=', tenantId)
      .where('countId', '=', countId)
      .orderBy('position')
      .execute();
    await saveEntries(tx, scope, actor, countId, {
      lines: countLines.map((l, i) => ({
        lineId: l.id,
        packs: 0,
        units: Math.max(Number(l.expectedAtStart) - (i === 0 ? 2 : 0), 0),
      })),
    });
    await submitCount(tx, scope, actor, countId);
    if (countLines.length > 0)
      await saveReasons(tx, scope, countId, {
        lines: [{ lineId: countLines[0].id, reason: 'unrecorded_issue', note: 'Used on a repair' }],
      });
    await postCount(tx, scope, actor, countId);
    summary += ', 1 count posted';
    await startCount(tx, scope, actor, {
      locationId: warehouse.id,
      productIds: [],
      note: 'Year-end count',
    });
    summary += ', 1 count in progress';
  }
  return summary;
};
