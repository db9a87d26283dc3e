import { sql } from 'kysely';
import { mean, probit, sampleStandardDeviation } from 'simple-statistics';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createDb, withTenant } from '@latchwork/shared-db';
import { economicOrderQuantity } from '@latchwork/stock-domain';
import { postMovements } from '@latchwork/stock-server';
import { createTestApi } from './api-harness';
import { makeStockJob } from './walker/stock';
import { newPlace, newSupplier, newTile, purchasingFirm } from './walker/purchasing';

const { app, deps } = createTestApi();
// The table owner may rewrite a movement's time: how this test builds 73 days of history.
const owner = createDb({ connectionString: process.env['DATABASE_OWNER_URL'] ?? '', max: 2 });
afterAll(async () => {
  await owner.destroy();
  await deps.close();
});

let f: Awaited<ReturnType<typeof purchasingFirm>>;
const ids = { supplier: '', other: '', kit: '', boxed: '', plenty: '', orphan: '', ordered: '' };
let place = '';
/** Kit A's daily issues over the 73-day window, oldest first: 5 kits every third day. */
const history = Array.from({ length: 73 }, (_, i) => ((73 - i) % 3 === 0 && 73 - i <= 72 ? 5 : 0));

/** Books the issues of `history` for `productId`, each moved back to its day. */
async function issueHistory(productId: string, jobId: string) {
  for (const [i, q] of history.entries()) {
    if (q === 0) continue;
    const [m] = await f.inFirm((tx) =>
      postMovements(tx, { tenantId: f.tenantId }, f.owner, [
        { kind: 'issue', productId, fromLocationId: place, quantity: q, jobId },
      ]),
    );
    const daysAgo = 73 - i;
    await withTenant(owner, { tenantId: f.tenantId }, (tx) =>
      sql`update stock_movement set at = date_trunc('day', now()) - ${daysAgo} * interval '1 day'
        + interval '12 hours' where id = ${m.id}`.execute(tx),
    );
  }
}

beforeAll(async () => {
  f = await purchasingFirm(deps.db, app);
  await f
    .as('owner')
    .put('/stock/control-settings', {
      countApprovalGrossMinor: 10000,
      demandWindowDays: 73,
      nightlyReorder: true,
      defaultOrderCostMinor: 1000,
    })
    .expect(200);
  const jobId = await makeStockJob(deps.db, f.tenantId);
  await f.inFirm(async (tx) => {
    ids.supplier = (await newSupplier(tx, f.tenantId, 4)).id;
    ids.other = (await newSupplier(tx, f.tenantId, 4)).id;
    place = (await newPlace(tx, f.tenantId)).id;
    const tile = (supplierId: string | null, packSize: number, costMinor: number) =>
      newTile(tx, f.tenantId, { supplierId, packSize, costMinor }).then((p) => p.id);
    // 48.00 a kit at the default 25 % a year: 12.00 to hold one kit for a year.
    ids.kit = await tile(ids.supplier, 1, 4800);
    ids.boxed = await tile(ids.supplier, 24, 150);
    ids.plenty = await tile(ids.other, 24, 150);
    ids.orphan = await tile(null, 1, 500);
    ids.ordered = await tile(ids.supplier, 1, 500);
    const receive = (productId: string, quantity: number, cost: number) =>
      postMovements(tx, { tenantId: f.tenantId }, f.owner, [
        { kind: 'receipt', productId, toLocationId: place, quantity, unitCostMinor: cost },
      ]);
    await receive(ids.kit, 125, 4800);
    await receive(ids.boxed, 10, 150);
    await receive(ids.plenty, 500, 150);
    await receive(ids.orphan, 1, 500);
    // A job fitting in two days has reserved 40 tiles of the boxed product and 30 of "ordered".
    await tx
      .updateTable('job')
      .set({ installStartOn: sql`current_date + 2` })
      .where('id', '=', jobId)
      .execute();
    for (const [productId, quantity] of [
      [ids.boxed, 40],
      [ids.orphan, 30],
      [ids.ordered, 30],
    ] as const)
      await tx
        .insertInto('reservation')
        .values({ tenantId: f.tenantId, jobId, productId, quantity })
        .execute();
  });
  await issueHistory(ids.kit, jobId);
  await issueHistory(ids.plenty, jobId);
  // "ordered" is low too, but already on a sent order: the run must not order it again.
  const po = await f.as('stores').post('/stock/purchase-orders', {
    supplierId: ids.supplier,
    deliveryLocationId: place,
    lines: [{ productId: ids.ordered, units: 5 }],
  });
  await f.as('stores').post(`/stock/purchase-orders/${po.body.id}/send`, {}).expect(200);
});

type Suggestion = { productId: string; [k: string]: unknown };
const pick = (list: Suggestion[], id: string) => list.find((s) => s.productId === id);

describe('reorder', () => {
  it('EOQ: 600 kits a year, 25.00 an order, 12.00 to hold a kit a year → 50 (arithmetic)', () => {
    // √(2 × 600 × 2500 / 1200) = √2500 = 50.
    expect(economicOrderQuantity(600, 2500, 1200)).toBe(50);
  });

  it('suggests from the issue history and the reservations, checked against simple-statistics', async () => {
    const res = await f.as('estimator').get('/stock/reorder/suggestions').expect(200);
    const kit = pick(res.body.suggestions, ids.kit) as Record<string, number>;
    // The history as the test built it: 120 kits over 73 days = 600 a year.
    expect(mean(history) * 365).toBeCloseTo(600, 9);
    expect(kit['meanDaily']).toBeCloseTo(mean(history), 9);
    expect(kit['sdDaily']).toBeCloseTo(sampleStandardDeviation(history), 9);
    // z of the firm's 95 % service level against simple-statistics' probit, whose own
    // approximation is good to about 2e-3 (our Acklam quantile is exact to 1e-9).
    expect(Math.abs(kit['z'] - probit(0.95))).toBeLessThan(2e-3);
    const rop = mean(history) * 4 + probit(0.95) * sampleStandardDeviation(history) * Math.sqrt(4);
    expect(rop % 1).toBeGreaterThan(0.1); // not on a whole number: ceil is the same either way
    expect(kit['reorderPoint']).toBe(Math.ceil(rop));
    // Supplier's order cost 25.00, holding 48.00 × 25 % = 12.00: EOQ 50, packs of one.
    expect(kit['eoq']).toBeCloseTo(50, 9);
    expect(kit).toMatchObject({ order: true, quantity: 50, onHand: 5, blocked: null });

    // No history, but 40 reserved within the 4-day lead time: lift above 40 from 10 on hand
    // needs 31 tiles, rounded up to 2 boxes of 24.
    expect(pick(res.body.suggestions, ids.boxed)).toMatchObject({
      order: true,
      reorderPoint: 40,
      quantity: 48,
      packs: 2,
    });
    expect(pick(res.body.suggestions, ids.orphan)).toMatchObject({ blocked: 'no-supplier' });
    expect(pick(res.body.suggestions, ids.ordered)).toMatchObject({
      blocked: 'on-open-order',
      onOrder: 5,
    });
    expect(pick(res.body.suggestions, ids.plenty)).toBeUndefined();
    const all = await f.as('stores').get('/stock/reorder/suggestions?all=true').expect(200);
    expect(pick(all.body.suggestions, ids.plenty)).toMatchObject({ order: false });
  });

  it('makes one draft per supplier for what is low, and nothing twice', async () => {
    await f.as('estimator').post('/stock/reorder/run').expect(403);
    const run = (await f.as('stores').post('/stock/reorder/run').expect(200)).body;
    expect(run.created).toHaveLength(1);
    const po = (await f.as('stores').get(`/stock/purchase-orders/${run.created[0].id}`)).body;
    expect(po).toMatchObject({
      status: 'draft',
      source: 'reorder',
      supplierId: ids.supplier,
      deliveryLocationId: place,
    });
    const today = run.today as string;
    const inFour = new Date(Date.parse(`${today}T00:00:00Z`) + 4 * 86_400_000);
    expect(po.expectedOn).toBe(inFour.toISOString().slice(0, 10));
    expect(
      po.lines.map((l: { productId: string; quantity: number; unitCostMinor: number }) => [
        l.productId,
        l.quantity,
        l.unitCostMinor,
      ]),
    ).toEqual(
      expect.arrayContaining([
        [ids.kit, 50, 4800],
        [ids.boxed, 48, 150],
      ]),
    );
    expect(po.lines).toHaveLength(2);

    const again = (await f.as('owner').post('/stock/reorder/run').expect(200)).body;
    expect(again.created).toEqual([]);
    // The draft counts as on order: the kits' position is now 5 + 50, above the reorder point.
    const after = (await f.as('stores').get('/stock/reorder/suggestions?all=true')).body;
    expect(pick(after.suggestions, ids.kit)).toMatchObject({ order: false, onOrder: 50 });
    expect(pick(again.suggestions, ids.boxed)).toBeUndefined();
    const drafts = (await f.as('stores').get('/stock/purchase-orders?status=draft')).body;
    expect(drafts).toHaveLength(1);
  });
});
