import Papa from 'papaparse';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApi } from './api-harness';
import { demoIds, sessionFor, type TestSession } from './sessions';
import { productBody, stockAs, stockTestName } from './walker/stock';

const { app, deps } = createTestApi();
afterAll(() => deps.close());

let stores: TestSession;
let estimator: TestSession;
let bookkeeper: TestSession;
let ownerB: TestSession;

const post = (path: string, body: object, as = stores) =>
  request(app).post(`/api/v1${path}`).set(stockAs(as)).send(body);
const get = (path: string, as = stores) => request(app).get(`/api/v1${path}`).set(stockAs(as));

beforeAll(async () => {
  const ids = await demoIds(deps.db);
  const a = ids.tenant('kestrel-floorworks').id;
  stores = await sessionFor(deps.db, ids.user('stores@kestrel-floorworks.test'), a);
  estimator = await sessionFor(deps.db, ids.user('estimator@kestrel-floorworks.test'), a);
  bookkeeper = await sessionFor(deps.db, ids.user('books@kestrel-floorworks.test'), a);
  const b = ids.tenant('pennick-flooring').id;
  ownerB = await sessionFor(deps.db, ids.user('owner@pennick-flooring.test'), b);
});

describe('catalogue', () => {
  it('creates, finds by search and kind, replaces; refuses a duplicate SKU and a wrong attribute', async () => {
    const supplier = await post('/stock/suppliers', {
      name: stockTestName('Harrowgate Polymers'),
      email: 'orders@harrowgate-polymers.test',
      leadTimeDays: 9,
      contacts: [{ name: 'Ines Marlow', role: 'sales', email: 'ines@harrowgate-polymers.test' }],
    }).expect(201);
    const body = productBody('tile', { preferredSupplierId: supplier.body.id });
    const made = await post('/stock/products', body).expect(201);
    expect(made.body).toMatchObject({ sku: body.sku, packSize: 24, costMinor: 250, onHand: 0 });
    const found = await get(`/stock/products?q=${encodeURIComponent(body.sku)}&kind=tile`);
    expect(found.body.items.map((p: { id: string }) => p.id)).toEqual([made.body.id]);
    const none = await get(`/stock/products?q=${encodeURIComponent(body.sku)}&kind=adhesive`);
    expect(none.body.total).toBe(0);
    await post('/stock/products', body).expect(409);
    const wrong = await post('/stock/products', {
      ...productBody('skirting'),
      attributes: { pitchMm: 500 },
    }).expect(400);
    expect(wrong.body.error.details.problems[0].path).toBe('attributes.pitchMm');
    const replaced = await request(app)
      .put(`/api/v1/stock/products/${made.body.id}`)
      .set(stockAs(stores))
      .send({ ...body, name: 'Renamed tile', priceMinor: 455 })
      .expect(200);
    expect(replaced.body).toMatchObject({ name: 'Renamed tile', priceMinor: 455 });
    const s = await get(`/stock/suppliers/${supplier.body.id}`).expect(200);
    expect(s.body.productCount).toBe(1);
  });

  it('imports CSV in two steps: a preview with row/column/why, then all rows or none', async () => {
    const sku = stockTestName('CSV');
    const good = `sku,name,kind,colour,thickness_mm,pack_one,pack_other,pack_size,cost,price\r\n${sku},Imported tile,tile,Amber,7,box,boxes,24,2.35,3.90\r\n`;
    const bad = `${good}${sku}-2,Bad price,tile,Amber,7,box,boxes,24,2.345,3.90\r\n${sku}-3,Bad kind,floorboard,,,,,,1.00,2.00\r\n`;
    const preview = await post('/stock/products/import/preview', { csv: bad }).expect(200);
    expect(preview.body.summary).toEqual({ create: 1, update: 0, error: 2 });
    expect(preview.body.problems).toEqual([
      { row: 3, column: 'cost', message: expect.stringMatching(/more than 2 decimal places/) },
      { row: 4, column: 'kind', message: expect.any(String) },
    ]);
    // Nothing was written by the preview, and a file with problems imports nothing.
    expect((await get(`/stock/products?q=${sku}`)).body.total).toBe(0);
    await post('/stock/products/import', { csv: bad }).expect(400);
    expect((await get(`/stock/products?q=${sku}`)).body.total).toBe(0);
    const done = await post('/stock/products/import', { csv: good }).expect(200);
    expect(done.body.summary).toEqual({ create: 1, update: 0, error: 0 });
    const again = await post('/stock/products/import/preview', { csv: good }).expect(200);
    expect(again.body.summary).toEqual({ create: 0, update: 1, error: 0 });

    // The export reads back (papaparse as the reference parser) with money as decimal text.
    const csv = await get('/stock/products/export.csv').expect(200);
    expect(csv.headers['content-type']).toMatch(/text\/csv/);
    const rows = Papa.parse<Record<string, string>>(csv.text, { header: true }).data;
    expect(rows.find((r) => r['sku'] === sku)).toMatchObject({
      cost: '2.35',
      price: '3.90',
      colour: 'Amber',
      pack_size: '24',
    });
  });
});

describe('who may use the catalogue', () => {
  it('estimators read, only owner and stores write, bookkeepers are refused; firm B gets 404', async () => {
    const made = await post('/stock/products', productBody('primer')).expect(201);
    await get(`/stock/products/${made.body.id}`, estimator).expect(200);
    await post('/stock/products', productBody('primer'), estimator).expect(403);
    await get('/stock/products', bookkeeper).expect(403);
    await get(`/stock/products/${made.body.id}`, ownerB).expect(404);
    const list = await get(`/stock/products?q=${encodeURIComponent(made.body.sku)}`, ownerB);
    expect(list.body.total).toBe(0);
    await request(app)
      .put(`/api/v1/stock/products/${made.body.id}`)
      .set(stockAs(ownerB))
      .send(productBody('primer'))
      .expect(404);
  });
});
