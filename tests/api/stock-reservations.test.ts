import request from 'supertest';
import { withTenant } from '@latchwork/shared-db';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApi } from './api-harness';
import { demoIds, sessionFor, type TestSession } from './sessions';
import { makeStockJob, productBody, stockAs, stockTestName } from './walker/stock';

const { app, deps } = createTestApi();
afterAll(() => deps.close());

let stores: TestSession;
let firm = '';
let shelf = '';

const post = (path: string, body: object) =>
  request(app).post(`/api/v1${path}`).set(stockAs(stores)).send(body);
const get = (path: string) => request(app).get(`/api/v1${path}`).set(stockAs(stores));

/** A product with batches of the given sizes (and expiry dates) on the shelf. */
async function stocked(kind: string, batches: { quantity: number; expiresOn?: string }[]) {
  const product = (await post('/stock/products', productBody(kind)).expect(201)).body;
  const ids: string[] = [];
  for (const b of batches) {
    const r = await post('/stock/movements', {
      kind: 'receipt',
      productId: product.id,
      newBatch: { code: stockTestName('L'), receivedOn: '2026-10-01', expiresOn: b.expiresOn },
      toLocationId: shelf,
      quantity: b.quantity,
      unitCostMinor: 300,
    }).expect(201);
    ids.push(r.body.batchId);
  }
  return { productId: product.id as string, batchIds: ids };
}

beforeAll(async () => {
  const ids = await demoIds(deps.db);
  firm = ids.tenant('kestrel-floorworks').id;
  stores = await sessionFor(deps.db, ids.user('stores@kestrel-floorworks.test'), firm);
  shelf = (await post('/stock/locations', { name: stockTestName('Res'), kind: 'warehouse' })).body
    .id;
});

describe('reservations', () => {
  it('prefer one batch per product; available = on hand − reserved; short is offered, not forced', async () => {
    const { productId, batchIds } = await stocked('tile', [{ quantity: 100 }, { quantity: 60 }]);
    const [job1, job2, job3] = [
      await makeStockJob(deps.db, firm),
      await makeStockJob(deps.db, firm),
      await makeStockJob(deps.db, firm),
    ];
    const first = await post('/stock/reservations', { jobId: job1, productId, quantity: 80 });
    expect(first.status).toBe(201);
    // Only the 100 covers 80 (common practice: one production batch per floor).
    expect(first.body.reservations.map((r: { batchId: string }) => r.batchId)).toEqual([
      batchIds[0],
    ]);
    // 50 more: 20 left of the first batch, 60 of the second → the second covers it alone.
    const second = await post('/stock/reservations', { jobId: job2, productId, quantity: 50 });
    expect(second.body.reservations[0]).toMatchObject({ batchId: batchIds[1], quantity: 50 });
    const product = await get(`/stock/products/${productId}`).expect(200);
    expect(product.body).toMatchObject({ onHand: 160, reserved: 130, available: 30 });

    const short = await post('/stock/reservations', { jobId: job3, productId, quantity: 40 });
    expect(short.status).toBe(409);
    expect(short.body.error.details.offer).toMatchObject({ warning: 'short', shortBy: 10 });
    const taken = await post('/stock/reservations', {
      jobId: job3,
      productId,
      quantity: 40,
      acceptShort: true,
    }).expect(201);
    expect(taken.body.reservations.map((r: { quantity: number }) => r.quantity).sort()).toEqual([
      10, 20,
    ]);
  });

  it('warns when no single batch covers the job and offers the best split', async () => {
    const { productId } = await stocked('tile', [{ quantity: 30 }, { quantity: 30 }]);
    const jobId = await makeStockJob(deps.db, firm);
    const offer = await post('/stock/reservations/offer', { jobId, productId, quantity: 50 });
    expect(offer.status).toBe(200);
    expect(offer.body.warning).toBe('mixed-batches');
    const refused = await post('/stock/reservations', { jobId, productId, quantity: 50 });
    expect(refused.status).toBe(409);
    expect(refused.body.error.message).toMatch(/No single batch covers 50.*Best split/);
    const split = await post('/stock/reservations', {
      jobId,
      productId,
      quantity: 50,
      acceptSplit: true,
    }).expect(201);
    expect(split.body.reservations).toHaveLength(2);
  });

  it('picks FEFO, issues from the reservation, takes returns, and costs the job', async () => {
    const { productId, batchIds } = await stocked('adhesive', [
      { quantity: 5, expiresOn: '2027-09-30' },
      { quantity: 5, expiresOn: '2027-03-31' },
    ]);
    const jobId = await makeStockJob(deps.db, firm);
    const made = await post('/stock/reservations', { jobId, productId, quantity: 3 }).expect(201);
    // Goods that expire: the batch expiring first, though both cover it (FEFO).
    expect(made.body.reservations[0].batchId).toBe(batchIds[1]);
    const picking = await get(`/stock/jobs/${jobId}/picking-list`).expect(200);
    expect(picking.body.items[0].lines).toEqual([
      expect.objectContaining({ batchId: batchIds[1], quantity: 3, locationId: shelf }),
    ]);
    const reservationId = made.body.reservations[0].id;
    await post(`/stock/reservations/${reservationId}/issue`, {}).expect(201);
    const after = await get(`/stock/reservations?jobId=${jobId}&status=all`).expect(200);
    expect(after.body[0]).toMatchObject({ status: 'fulfilled', issuedQuantity: 3, remaining: 0 });
    await post('/stock/movements', {
      kind: 'return',
      productId,
      batchId: batchIds[1],
      toLocationId: shelf,
      quantity: 1,
      jobId,
      note: 'one kit unopened',
    }).expect(201);
    const materials = await get(`/stock/jobs/${jobId}/materials`).expect(200);
    // 3 kits left at 3.00 each = 9.00; 1 came back at the average 3.00: 6.00 (arithmetic).
    expect(materials.body.products[0]).toMatchObject({
      issued: 3,
      returned: 1,
      used: 2,
      costMinor: 600,
    });
    // The line's figures in its product's units (one to a pack here), for the page.
    expect(materials.body.lines).toEqual([
      expect.objectContaining({
        kind: 'adhesive',
        packs: {
          estimated: null,
          reserved: '0 units',
          issued: '3 units',
          returned: '1 unit',
          used: '2 units',
        },
      }),
    ]);
    expect(materials.body.estimateSource).toBe('none');
  });

  it('estimates from the latest takeoff of each area and sets issues against it', async () => {
    const jobId = await makeStockJob(deps.db, firm);
    await withTenant(deps.db, { tenantId: firm }, async (tx) => {
      const area = await tx
        .insertInto('surveyArea')
        .values({ tenantId: firm, jobId, name: 'Garage' })
        .returning('id')
        .executeTakeFirstOrThrow();
      const summary = (kits: number, tiles: number) =>
        JSON.stringify({
          tiles: { byColour: [{ colour: 'Graphite', toOrder: tiles }] },
          materials: { adhesive: { kits } },
        });
      for (const [version, kits, tiles] of [
        [1, 9, 999],
        [2, 2, 48],
      ])
        await tx
          .insertInto('takeoffVersion')
          .values({
            tenantId: firm,
            areaId: area.id,
            version,
            input: '{}',
            rates: '{}',
            summary: summary(kits, tiles),
          })
          .execute();
    });
    const { productId } = await stocked('tile', [{ quantity: 96 }]);
    await post('/stock/movements', {
      kind: 'issue',
      productId,
      fromLocationId: shelf,
      batchId: (await get(`/stock/balances?productId=${productId}`)).body[0].batchId,
      quantity: 50,
      jobId,
    }).expect(201);
    const m = await get(`/stock/jobs/${jobId}/materials`).expect(200);
    expect(m.body.estimateSource).toBe('takeoff');
    // Only version 2 counts: 48 Graphite tiles and 2 kits estimated; 50 tiles issued.
    expect(m.body.lines).toEqual(
      expect.arrayContaining([
        expect.objectContaining({ kind: 'tile', colour: 'Graphite', estimated: 48, issued: 50 }),
        expect.objectContaining({ kind: 'adhesive', estimated: 2, issued: 0 }),
      ]),
    );
  });
});
