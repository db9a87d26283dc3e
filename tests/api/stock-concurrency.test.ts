import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApi } from './api-harness';
import { demoIds, sessionFor, type TestSession } from './sessions';
import { makeStockJob, productBody, stockAs, stockTestName } from './walker/stock';

const { app, deps } = createTestApi();
afterAll(() => deps.close());

let stores: TestSession;
let jobId = '';

beforeAll(async () => {
  const ids = await demoIds(deps.db);
  const firm = ids.tenant('kestrel-floorworks').id;
  stores = await sessionFor(deps.db, ids.user('stores@kestrel-floorworks.test'), firm);
  jobId = await makeStockJob(deps.db, firm);
});

describe('concurrency without loss', () => {
  it('50 parallel issues of 1 box against 10 boxes: exactly 10 succeed, 40 get a clear 409', async () => {
    const post = (path: string, body: object) =>
      request(app).post(`/api/v1${path}`).set(stockAs(stores)).send(body);
    const product = await post('/stock/products', productBody('tile')).expect(201);
    const place = await post('/stock/locations', {
      name: stockTestName('Race shelf'),
      kind: 'warehouse',
    }).expect(201);
    const receipt = await post('/stock/movements', {
      kind: 'receipt',
      productId: product.body.id,
      newBatch: { code: stockTestName('RACE'), receivedOn: '2026-11-20' },
      toLocationId: place.body.id,
      quantity: 240, // 10 boxes of 24
      unitCostMinor: 250,
    }).expect(201);

    const results = await Promise.all(
      Array.from({ length: 50 }, () =>
        post('/stock/movements', {
          kind: 'issue',
          productId: product.body.id,
          batchId: receipt.body.batchId,
          fromLocationId: place.body.id,
          quantity: 24,
          jobId,
        }),
      ),
    );
    const statuses = results.map((r) => r.status);
    expect(statuses.filter((s) => s === 201)).toHaveLength(10);
    expect(statuses.filter((s) => s === 409)).toHaveLength(40);
    const refusal = results.find((r) => r.status === 409);
    expect(refusal?.body.error.message).toMatch(/Not enough .* 0 tiles available, 1 box asked for/);
    expect(refusal?.body.error.details.problems[0].path).toBe('quantity');

    const balances = await request(app)
      .get(`/api/v1/stock/balances?productId=${product.body.id}&includeZero=true`)
      .set(stockAs(stores))
      .expect(200);
    expect(balances.body.map((b: { quantity: number }) => b.quantity)).toEqual([0]);
    const ledger = await request(app)
      .get(`/api/v1/stock/movements?productId=${product.body.id}&limit=500`)
      .set(stockAs(stores))
      .expect(200);
    const sum = ledger.body.reduce(
      (s: number, m: { kind: string; quantity: number }) =>
        s + (m.kind === 'receipt' ? m.quantity : -m.quantity),
      0,
    );
    expect(ledger.body).toHaveLength(11);
    expect(sum).toBe(0);
    const check = await request(app)
      .get('/api/v1/stock/ledger-check')
      .set(stockAs(stores))
      .expect(200);
    expect(check.body).toEqual({ balances: [], costs: [] });
  });
});
