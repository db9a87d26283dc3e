import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { withTenant } from '@latchwork/shared-db';
import { createTestApi } from './api-harness';
import { demoIds, sessionFor, type TestSession } from './sessions';
import { makeStockJob, productBody, stockAs, stockTestName } from './walker/stock';

const { app, deps } = createTestApi();
afterAll(() => deps.close());

let stores: TestSession;
let owner: TestSession;
let firm = '';
let jobId = '';
let shelf = '';
let tileId = '';
let tileBatch = '';

const post = (path: string, body: object, as = stores) =>
  request(app).post(`/api/v1${path}`).set(stockAs(as)).send(body);
const problemPaths = (res: request.Response) =>
  res.body.error.details.problems.map((p: { path: string }) => p.path);

beforeAll(async () => {
  const ids = await demoIds(deps.db);
  firm = ids.tenant('kestrel-floorworks').id;
  stores = await sessionFor(deps.db, ids.user('stores@kestrel-floorworks.test'), firm);
  owner = await sessionFor(deps.db, ids.user('owner@kestrel-floorworks.test'), firm);
  jobId = await makeStockJob(deps.db, firm);
  shelf = (await post('/stock/locations', { name: stockTestName('Bad'), kind: 'warehouse' })).body
    .id;
  tileId = (await post('/stock/products', productBody('tile'))).body.id;
  const receipt = await post('/stock/movements', {
    kind: 'receipt',
    productId: tileId,
    newBatch: { code: stockTestName('T'), receivedOn: '2026-10-01' },
    toLocationId: shelf,
    quantity: 48,
    unitCostMinor: 250,
  }).expect(201);
  tileBatch = receipt.body.batchId;
});

const issueTiles = (quantity: unknown, extra: object = {}) =>
  post('/stock/movements', {
    kind: 'issue',
    productId: tileId,
    batchId: tileBatch,
    fromLocationId: shelf,
    quantity,
    jobId,
    ...extra,
  });

describe('bad input is refused, naming the field', () => {
  it('a negative tile quantity: 400 on quantity', async () => {
    const res = await issueTiles(-3).expect(400);
    expect(problemPaths(res)).toContain('quantity');
    expect(res.body.error.message).toMatch(/must be positive/);
  });

  it('a fractional tile quantity: 400 on quantity, counted in whole units', async () => {
    const res = await issueTiles(2.5).expect(400);
    expect(problemPaths(res)).toEqual(['quantity']);
    expect(res.body.error.message).toMatch(/whole units/);
  });

  it('an unknown batch: 400 on batchId', async () => {
    const res = await issueTiles(1, { batchId: '00000000-0000-4000-8000-000000000000' }).expect(
      400,
    );
    expect(problemPaths(res)).toEqual(['batchId']);
  });

  it('expiry before receipt: 400 on expiresOn, for a batch and for goods in with a new batch', async () => {
    const batch = await post('/stock/batches', {
      productId: tileId,
      code: stockTestName('E'),
      receivedOn: '2026-11-10',
      expiresOn: '2026-11-09',
    }).expect(400);
    expect(problemPaths(batch)).toEqual(['expiresOn']);
    const goodsIn = await post('/stock/movements', {
      kind: 'receipt',
      productId: tileId,
      newBatch: { code: stockTestName('E'), receivedOn: '2026-11-10', expiresOn: '2026-01-01' },
      toLocationId: shelf,
      quantity: 24,
      unitCostMinor: 250,
    }).expect(400);
    expect(problemPaths(goodsIn)).toEqual(['newBatch.expiresOn']);
  });

  it('a transfer to the same location: 400 on toLocationId', async () => {
    const res = await post('/stock/movements', {
      kind: 'transfer',
      productId: tileId,
      batchId: tileBatch,
      fromLocationId: shelf,
      toLocationId: shelf,
      quantity: 24,
    }).expect(400);
    expect(problemPaths(res)).toContain('toLocationId');
  });

  it('a fractional reservation: 400 on quantity', async () => {
    const res = await post('/stock/reservations', { jobId, productId: tileId, quantity: 0.5 });
    expect(res.status).toBe(400);
    expect(problemPaths(res)).toEqual(['quantity']);
  });
});

describe('expired adhesive', () => {
  it('is refused (409 on batchId) unless the owner overrides with a reason, which is audit-logged', async () => {
    const kit = (await post('/stock/products', productBody('adhesive'))).body.id;
    const receipt = await post('/stock/movements', {
      kind: 'receipt',
      productId: kit,
      newBatch: { code: stockTestName('OLD'), receivedOn: '2025-01-10', expiresOn: '2025-07-10' },
      toLocationId: shelf,
      quantity: 4,
      unitCostMinor: 4000,
    }).expect(201);
    const issue = (as: TestSession, extra: object = {}) =>
      post(
        '/stock/movements',
        {
          kind: 'issue',
          productId: kit,
          batchId: receipt.body.batchId,
          fromLocationId: shelf,
          quantity: 1,
          jobId,
          ...extra,
        },
        as,
      );
    const refused = await issue(stores, { overrideExpiredReason: 'site is waiting' }).expect(409);
    expect(problemPaths(refused)).toEqual(['batchId']);
    expect(refused.body.error.message).toMatch(
      /expired on 2025-07-10; only the owner can override/,
    );
    await issue(owner).expect(409);
    const reason = `tested on a board first ${stockTestName('r')}`;
    const allowed = await issue(owner, { overrideExpiredReason: reason }).expect(201);
    expect(allowed.body.overrideReason).toBe(reason);
    const logged = await withTenant(deps.db, { tenantId: firm }, (tx) =>
      tx
        .selectFrom('auditLog')
        .select(['action', 'detail'])
        .where('tenantId', '=', firm)
        .where('action', '=', 'stock-expired-issued')
        .orderBy('createdAt', 'desc')
        .limit(5)
        .execute(),
    );
    expect(logged.map((l) => (l.detail as { reason: string }).reason)).toContain(reason);
  });
});
