import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { checkLedger, postMovements } from '@latchwork/stock-server';
import { createTestApi } from './api-harness';
import { demoIds, sessionFor } from './sessions';
import { stockAs, makeStockJob } from './walker/stock';
import { newPlace, newTile, purchasingFirm } from './walker/purchasing';
import request from 'supertest';

const { app, deps } = createTestApi();
afterAll(() => deps.close());

let f: Awaited<ReturnType<typeof purchasingFirm>>;
let jobId = '';

beforeAll(async () => {
  f = await purchasingFirm(deps.db, app);
  jobId = await makeStockJob(deps.db, f.tenantId);
});

/** A tile at `cost` a tile with `quantity` booked in at a new warehouse. */
async function stocked(quantity: number, cost = 150) {
  return f.inFirm(async (tx) => {
    const { id: productId } = await newTile(tx, f.tenantId, { costMinor: cost });
    const { id: place } = await newPlace(tx, f.tenantId);
    await postMovements(tx, { tenantId: f.tenantId }, f.owner, [
      { kind: 'receipt', productId, toLocationId: place, quantity, unitCostMinor: cost },
    ]);
    return { productId, place };
  });
}

const issue = (productId: string, place: string, quantity: number) =>
  f.inFirm((tx) =>
    postMovements(tx, { tenantId: f.tenantId }, f.owner, [
      { kind: 'issue', productId, fromLocationId: place, quantity, jobId },
    ]),
  );

const lineOf = (count: { lines: { id: string; productId: string }[] }, productId: string) =>
  count.lines.find((l) => l.productId === productId)?.id as string;

describe('stock counts', () => {
  it('blind sheet; a movement during the count is not a variance; posting books nothing', async () => {
    const a = await stocked(100);
    const b = await f.inFirm(async (tx) => {
      const { id: productId } = await newTile(tx, f.tenantId);
      await postMovements(tx, { tenantId: f.tenantId }, f.owner, [
        { kind: 'receipt', productId, toLocationId: a.place, quantity: 50, unitCostMinor: 150 },
      ]);
      return productId;
    });
    const stores = f.as('stores');
    const started = await stores.post('/stock/counts', { locationId: a.place }).expect(201);
    expect(started.body.lines).toHaveLength(2);
    // Blind: nothing on the sheet says what the books expect.
    expect(JSON.stringify(started.body)).not.toMatch(/expected/i);
    expect(started.body.variance).toBeNull();
    const id = started.body.id;

    // 10 tiles of A go to a job before A is counted: the counter finds 90.
    await issue(a.productId, a.place, 10);
    await stores
      .put(`/stock/counts/${id}/entries`, {
        lines: [{ lineId: lineOf(started.body, a.productId), packs: 3, units: 18 }],
      })
      .expect(200);
    // B is counted (50), then 5 of B leave: the count saw them, posting must not miss them.
    await stores
      .put(`/stock/counts/${id}/entries`, {
        lines: [{ lineId: lineOf(started.body, b), packs: 2, units: 2 }],
      })
      .expect(200);
    await issue(b, a.place, 5);
    expect(JSON.stringify((await stores.get(`/stock/counts/${id}`)).body)).not.toMatch(/expected/);

    const submitted = await stores.post(`/stock/counts/${id}/submit`).expect(200);
    const lineA = submitted.body.lines.find(
      (l: { productId: string }) => l.productId === a.productId,
    );
    expect(lineA).toMatchObject({ expectedAtStart: 100, movementsDuring: -10, expected: 90 });
    // The same in packs for the review page (boxes of 24): 100 = 4 boxes + 4 tiles.
    expect(lineA).toMatchObject({
      expectedAtStartPacks: '4 boxes + 4 tiles',
      movementsDuringPacks: '-10 tiles',
      expectedPacks: '3 boxes + 18 tiles',
    });
    expect(lineA.variance).toBe(0);
    expect(submitted.body.lines.map((l: { variance: number }) => l.variance)).toEqual([0, 0]);
    await stores.put(`/stock/counts/${id}/entries`, { lines: [] }).expect(400);
    await stores
      .put(`/stock/counts/${id}/entries`, {
        lines: [{ lineId: lineOf(started.body, b), packs: 1, units: 0 }],
      })
      .expect(409);

    const posted = await stores.post(`/stock/counts/${id}/post`).expect(200);
    expect(posted.body.status).toBe('posted');
    expect(posted.body.lines.every((l: { movementId: string | null }) => !l.movementId)).toBe(true);
    expect(await f.inFirm((tx) => checkLedger(tx, { tenantId: f.tenantId }))).toEqual({
      balances: [],
      costs: [],
    });
  });

  it('refuses to submit with a line nobody counted, naming it', async () => {
    const a = await stocked(24);
    const stores = f.as('stores');
    const id = (await stores.post('/stock/counts', { locationId: a.place }).expect(201)).body.id;
    const res = await stores.post(`/stock/counts/${id}/submit`).expect(400);
    expect(res.body.error.details.problems[0].path).toBe('lines.0.counted');
    await stores.post(`/stock/counts/${id}/cancel`).expect(200);
    await stores.post(`/stock/counts/${id}/post`).expect(409);
  });

  it('over the threshold: reasons first, then the owner approves; corrections agree with the ledger', async () => {
    // 10 kits at 40.00 and 10 at 46.00: average 43.00 (issue 6's worked example, IAS 2.25).
    const a = await f.inFirm(async (tx) => {
      const { id: productId } = await newTile(tx, f.tenantId, { packSize: 1, costMinor: 4000 });
      const { id: place } = await newPlace(tx, f.tenantId);
      await postMovements(tx, { tenantId: f.tenantId }, f.owner, [
        { kind: 'receipt', productId, toLocationId: place, quantity: 10, unitCostMinor: 4000 },
        { kind: 'receipt', productId, toLocationId: place, quantity: 10, unitCostMinor: 4600 },
      ]);
      return { productId, place };
    });
    const stores = f.as('stores');
    const count = (
      await stores
        .post('/stock/counts', { locationId: a.place, productIds: [a.productId] })
        .expect(201)
    ).body;
    const lineId = count.lines[0].id;
    await stores
      .put(`/stock/counts/${count.id}/entries`, { lines: [{ lineId, packs: 0, units: 17 }] })
      .expect(200);
    const review = (await stores.post(`/stock/counts/${count.id}/submit`).expect(200)).body;
    // 3 missing at 43.00 = 129.00 (arithmetic), over the default 100.00.
    expect(review.lines[0]).toMatchObject({ variance: -3, unitCostMinor: 4300 });
    expect(review.lines[0].varianceValueMinor).toBe(-12900);
    expect(review.variance).toMatchObject({ grossValueMinor: 12900, needsApproval: true });

    const noReason = await stores.post(`/stock/counts/${count.id}/post`).expect(400);
    expect(noReason.body.error.details.problems[0].path).toBe('lines.0.reason');
    await stores
      .put(`/stock/counts/${count.id}/reasons`, { lines: [{ lineId, reason: 'damaged' }] })
      .expect(200);
    const refused = await stores.post(`/stock/counts/${count.id}/post`).expect(409);
    expect(refused.body.error.details.code).toBe('approval-required');
    await f.as('estimator').post(`/stock/counts/${count.id}/post`).expect(403);
    await f.as('estimator').post(`/stock/counts/${count.id}/approve`).expect(403);
    await stores.post(`/stock/counts/${count.id}/approve`).expect(403);
    await f.as('owner').post(`/stock/counts/${count.id}/approve`).expect(200);
    const posted = (await stores.post(`/stock/counts/${count.id}/post`).expect(200)).body;
    expect(posted.approvedBy).toBe(f.users.owner);
    expect(posted.variance).toMatchObject({ netValueMinor: -12900, grossValueMinor: 12900 });

    await f.inFirm(async (tx) => {
      const moved = await tx
        .selectFrom('stockMovement')
        .select(['kind', 'quantity', 'fromLocationId', 'valueMinor'])
        .where('id', '=', posted.lines[0].movementId)
        .executeTakeFirstOrThrow();
      expect(moved).toEqual({
        kind: 'count_correction',
        quantity: '3',
        fromLocationId: a.place,
        valueMinor: '-12900',
      });
      const balance = await tx
        .selectFrom('stockBalance')
        .select('quantity')
        .where('productId', '=', a.productId)
        .where('locationId', '=', a.place)
        .executeTakeFirstOrThrow();
      expect(balance.quantity).toBe('17');
      expect(await checkLedger(tx, { tenantId: f.tenantId })).toEqual({ balances: [], costs: [] });
    });
  });

  it('the owner may post over the threshold directly; stock found comes in at the average', async () => {
    const a = await stocked(48, 1000);
    const count = (await f.as('owner').post('/stock/counts', { locationId: a.place }).expect(201))
      .body;
    const lineId = count.lines[0].id;
    const owner = f.as('owner');
    await owner.put(`/stock/counts/${count.id}/entries`, { lines: [{ lineId, packs: 3 }] });
    await owner.post(`/stock/counts/${count.id}/submit`).expect(200);
    await owner.put(`/stock/counts/${count.id}/reasons`, {
      lines: [{ lineId, reason: 'unrecorded_receipt', note: 'a box left by the last delivery' }],
    });
    const posted = (await owner.post(`/stock/counts/${count.id}/post`).expect(200)).body;
    // 24 found at 10.00 = 240.00 over 100.00: the owner's posting is the approval.
    expect(posted.variance).toMatchObject({ netValueMinor: 24000, needsApproval: false });
    expect(posted.approvedBy).toBe(f.users.owner);
  });

  it('reports variances by product, location and month', async () => {
    const stores = f.as('stores');
    const byProduct = (await stores.get('/stock/counts/variance-report?groupBy=product')).body;
    const missing = byProduct.find((r: { netValueMinor: number }) => r.netValueMinor === -12900);
    expect(missing).toMatchObject({
      netQuantity: -3,
      grossValueMinor: 12900,
      linesWithVariance: 1,
    });
    const byMonth = (await stores.get('/stock/counts/variance-report?groupBy=month').expect(200))
      .body;
    const month = new Date().toISOString().slice(0, 7);
    // This firm's posted counts: −129.00 and +240.00, and the counts without variance.
    expect(byMonth).toEqual([
      expect.objectContaining({ key: month, netValueMinor: 11100, grossValueMinor: 36900 }),
    ]);
    const byPlace = (await stores.get('/stock/counts/variance-report?groupBy=location')).body;
    expect(byPlace.reduce((s: number, r: { counts: number }) => s + r.counts, 0)).toBe(3);
  });

  it('firm B sees none of it; the installer and bookkeeper cannot open counts', async () => {
    const a = await stocked(5);
    const id = (await f.as('stores').post('/stock/counts', { locationId: a.place })).body.id;
    const ids = await demoIds(deps.db);
    const ownerB = await sessionFor(
      deps.db,
      ids.user('owner@pennick-flooring.test'),
      ids.tenant('pennick-flooring').id,
    );
    await request(app).get(`/api/v1/stock/counts/${id}`).set(stockAs(ownerB)).expect(404);
    await request(app)
      .post(`/api/v1/stock/counts/${id}/submit`)
      .set(stockAs(ownerB))
      .send({})
      .expect(404);
    await f.as('installer').get(`/stock/counts/${id}`).expect(403);
    await f.as('bookkeeper').get('/stock/counts').expect(403);
    await f.as('estimator').post('/stock/counts', { locationId: a.place }).expect(403);
  });
});
