import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { checkLedger, postMovements } from '@latchwork/stock-server';
import { createTestApi } from './api-harness';
import {
  newPlace,
  newSupplier,
  newTile,
  purchasingFirm,
  purchasingName,
} from './walker/purchasing';

const { app, deps } = createTestApi();
afterAll(() => deps.close());

let f: Awaited<ReturnType<typeof purchasingFirm>>;
let supplierId = '';
let tile = '';
let kit = '';
let store = '';
let van = '';

beforeAll(async () => {
  f = await purchasingFirm(deps.db, app);
  await f.inFirm(async (tx) => {
    supplierId = (await newSupplier(tx, f.tenantId)).id;
    tile = (await newTile(tx, f.tenantId, { supplierId })).id;
    kit = (await newTile(tx, f.tenantId, { packSize: 1, costMinor: 4000 })).id;
    store = (await newPlace(tx, f.tenantId)).id;
    van = (await newPlace(tx, f.tenantId, 'van')).id;
    // 10 kits already on the shelf at 40.00 each.
    await postMovements(tx, { tenantId: f.tenantId }, f.owner, [
      { kind: 'receipt', productId: kit, toLocationId: store, quantity: 10, unitCostMinor: 4000 },
    ]);
  });
});

/** A sent order for 4 boxes of tiles at 1.50 and 12 kits at 40.00. */
async function sentOrder() {
  const stores = f.as('stores');
  const draft = (
    await stores
      .post('/stock/purchase-orders', {
        supplierId,
        deliveryLocationId: store,
        lines: [
          { productId: tile, packs: 4 },
          { productId: kit, units: 12 },
        ],
      })
      .expect(201)
  ).body;
  await stores.post(`/stock/purchase-orders/${draft.id}/send`, {}).expect(200);
  return { id: draft.id as string, tileLine: draft.lines[0].id, kitLine: draft.lines[1].id };
}

const balances = (productId: string) =>
  f.inFirm((tx) =>
    tx
      .selectFrom('stockBalance as sb')
      .leftJoin('stockBatch as b', 'b.id', 'sb.batchId')
      .select(['b.code', 'b.expiresOn', 'sb.locationId', 'sb.quantity'])
      .where('sb.productId', '=', productId)
      .where('sb.quantity', '<>', '0')
      .orderBy('b.code')
      .execute(),
  );

describe('goods in', () => {
  it('takes two batches, damage and the actual cost; part received, then received', async () => {
    const po = await sentOrder();
    const stores = f.as('stores');
    const [b1, b2, k1] = [purchasingName('SG'), purchasingName('SG'), purchasingName('K')];
    const first = (
      await stores
        .post(`/stock/purchase-orders/${po.id}/receipts`, {
          receivedOn: '2026-11-30',
          lines: [
            { purchaseOrderLineId: po.tileLine, packs: 1, units: 12, batchCode: b1 },
            { purchaseOrderLineId: po.tileLine, packs: 1, units: 12, batchCode: b2 },
            // 10 good kits and 1 broken, at what the supplier actually charged: 46.00.
            {
              purchaseOrderLineId: po.kitLine,
              units: 10,
              damaged: 1,
              batchCode: k1,
              expiresOn: '2027-05-31',
              unitCostMinor: 4600,
            },
          ],
        })
        .expect(201)
    ).body;
    expect(first.status).toBe('part_received');
    expect(first.lines[0]).toMatchObject({
      receivedQuantity: 72,
      receivedPacks: '3 boxes',
      outstanding: 24,
    });
    expect(first.lines[1]).toMatchObject({
      receivedQuantity: 10,
      receivedPacks: '10 tiles',
      damagedQuantity: 1,
      damagedPacks: '1 tile',
      outstanding: 2,
    });
    expect(first.receipts).toHaveLength(1);
    // Each batch of the delivery in its line's packs, as the order page lists it.
    expect(
      first.receipts[0].lines.map((g: { batchCode: string; packs: string }) => [
        g.batchCode,
        g.packs,
      ]),
    ).toEqual(
      expect.arrayContaining([
        [b1, '1 box + 12 tiles'],
        [b2, '1 box + 12 tiles'],
        [k1, '10 tiles'],
      ]),
    );
    // The codes are random, so which sorts first varies: compare in the codes' own order.
    const [first1, first2] = [b1, b2].sort((x, y) => x.localeCompare(y));
    const byCode = (await balances(tile)).sort((x, y) =>
      (x.code ?? '').localeCompare(y.code ?? ''),
    );
    expect(byCode).toEqual([
      { code: first1, expiresOn: null, locationId: store, quantity: '36' },
      { code: first2, expiresOn: null, locationId: store, quantity: '36' },
    ]);
    // The broken kit came in and went out as damaged: 10 new kits on top of the 10 there.
    const kits = await balances(kit);
    expect(kits).toContainEqual({
      code: k1,
      expiresOn: '2027-05-31',
      locationId: store,
      quantity: '10',
    });

    // Weighted average: 10 at 40.00 + 11 at 46.00 = 906.00 for 21; the broken one leaves at
    // 906.00 / 21 = 43.142… → 43.14, so 20 kits worth 862.86 remain (arithmetic, by the IAS 2
    // weighted-average rule). Had the order's 40.00 been booked, they would be worth 800.00.
    await f.inFirm(async (tx) => {
      const state = await tx
        .selectFrom('productCostState')
        .select(['quantity', 'valueMinor'])
        .where('productId', '=', kit)
        .executeTakeFirstOrThrow();
      expect(state).toEqual({ quantity: '20', valueMinor: '86286' });
      const writeOff = await tx
        .selectFrom('stockMovement')
        .select(['kind', 'writeOffReason', 'quantity', 'valueMinor'])
        .where('productId', '=', kit)
        .where('kind', '=', 'write_off')
        .executeTakeFirstOrThrow();
      expect(writeOff).toEqual({
        kind: 'write_off',
        writeOffReason: 'damaged',
        quantity: '1',
        valueMinor: '-4314',
      });
    });

    // The rest arrives in the van, into an existing batch.
    const rest = (
      await stores
        .post(`/stock/purchase-orders/${po.id}/receipts`, {
          locationId: van,
          lines: [
            { purchaseOrderLineId: po.tileLine, packs: 1, batchCode: b1 },
            { purchaseOrderLineId: po.kitLine, units: 2, batchCode: k1 },
          ],
        })
        .expect(201)
    ).body;
    expect(rest.status).toBe('received');
    expect(rest.receipts).toHaveLength(2);
    await stores
      .post(`/stock/purchase-orders/${po.id}/receipts`, {
        lines: [{ purchaseOrderLineId: po.kitLine, units: 1 }],
      })
      .expect(409);
    await stores.post(`/stock/purchase-orders/${po.id}/cancel`, { reason: 'late' }).expect(409);
    expect(await f.inFirm((tx) => checkLedger(tx, { tenantId: f.tenantId }))).toEqual({
      balances: [],
      costs: [],
    });
  });

  it('refuses an expiry before receipt, more than is still to come, and a draft', async () => {
    const po = await sentOrder();
    const stores = f.as('stores');
    const early = await stores
      .post(`/stock/purchase-orders/${po.id}/receipts`, {
        receivedOn: '2026-11-30',
        lines: [
          { purchaseOrderLineId: po.tileLine, packs: 1, batchCode: purchasingName('X') },
          {
            purchaseOrderLineId: po.kitLine,
            units: 1,
            batchCode: purchasingName('X'),
            expiresOn: '2026-11-29',
          },
        ],
      })
      .expect(400);
    expect(early.body.error.details.problems[0]).toMatchObject({
      path: 'lines.1.expiresOn',
      code: 'expiry-before-receipt',
    });
    const over = await stores
      .post(`/stock/purchase-orders/${po.id}/receipts`, {
        lines: [{ purchaseOrderLineId: po.kitLine, units: 13 }],
      })
      .expect(409);
    expect(over.body.error.details.problems[0].path).toBe('lines.0.packs');
    const other = await stores
      .post(`/stock/purchase-orders/${po.id}/receipts`, {
        lines: [{ purchaseOrderLineId: crypto.randomUUID(), units: 1 }],
      })
      .expect(400);
    expect(other.body.error.details.problems[0].path).toBe('lines.0.purchaseOrderLineId');
    // Nothing of the refused deliveries stuck.
    const after = (await stores.get(`/stock/purchase-orders/${po.id}`)).body;
    expect(after).toMatchObject({ status: 'sent', receipts: [] });

    const draft = (
      await stores.post('/stock/purchase-orders', {
        supplierId,
        deliveryLocationId: store,
        lines: [{ productId: tile, packs: 1 }],
      })
    ).body;
    await stores
      .post(`/stock/purchase-orders/${draft.id}/receipts`, {
        lines: [{ purchaseOrderLineId: draft.lines[0].id, packs: 1 }],
      })
      .expect(409);
    await f
      .as('estimator')
      .post(`/stock/purchase-orders/${po.id}/receipts`, {
        lines: [{ purchaseOrderLineId: po.kitLine, units: 1 }],
      })
      .expect(403);
  });
});
