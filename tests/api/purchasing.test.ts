import { inflateSync } from 'node:zlib';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApi } from './api-harness';
import { demoIds, sessionFor } from './sessions';
import { stockAs } from './walker/stock';
import { newPlace, newSupplier, newTile, purchasingFirm } from './walker/purchasing';

const { app, deps } = createTestApi();
afterAll(() => deps.close());

let f: Awaited<ReturnType<typeof purchasingFirm>>;
let supplier: { id: string; email: string; name: string };
let tile = '';
let kit = '';
let place = '';

beforeAll(async () => {
  f = await purchasingFirm(deps.db, app);
  await f.inFirm(async (tx) => {
    supplier = await newSupplier(tx, f.tenantId);
    tile = (await newTile(tx, f.tenantId, { supplierId: supplier.id })).id;
    kit = (await newTile(tx, f.tenantId, { packSize: 1, costMinor: 4000 })).id;
    place = (await newPlace(tx, f.tenantId)).id;
  });
});

/**
 * The text a PDF shows, read back without our renderer: every content stream inflated
 * (FlateDecode, node:zlib) and the hex strings of its TJ arrays decoded as WinAnsi bytes.
 */
function pdfText(pdf: Buffer): string {
  const raw = pdf.toString('latin1');
  const out: string[] = [];
  for (const m of raw.matchAll(/stream\r?\n([\s\S]*?)\r?\nendstream/g)) {
    let content: string;
    try {
      content = inflateSync(Buffer.from(m[1], 'latin1')).toString('latin1');
    } catch {
      continue;
    }
    for (const tj of content.matchAll(/\[(.*?)\]\s*TJ/g))
      out.push(
        [...tj[1].matchAll(/<([0-9a-f]*)>/gi)]
          .map((h) => Buffer.from(h[1], 'hex').toString('latin1'))
          .join(''),
      );
  }
  return out.join('\n');
}

const orderBody = (extra: object = {}) => ({
  supplierId: supplier.id,
  deliveryLocationId: place,
  notes: 'Deliver to the side gate',
  lines: [
    { productId: tile, packs: 2, units: 6 },
    { productId: kit, units: 5, unitCostMinor: 4150 },
  ],
  ...extra,
});

describe('purchase orders', () => {
  it('numbers drafts gapless from the firm prefix, even after a refused one', async () => {
    const stores = f.as('stores');
    const first = (await stores.post('/stock/purchase-orders', orderBody()).expect(201)).body;
    expect(first.reference).toBe(`PO-${first.number}`);
    const bad = await stores
      .post('/stock/purchase-orders', orderBody({ supplierId: crypto.randomUUID() }))
      .expect(400);
    expect(bad.body.error.details.problems[0].path).toBe('supplierId');
    const second = (await stores.post('/stock/purchase-orders', orderBody()).expect(201)).body;
    expect(second.number).toBe(first.number + 1);
    expect(second).toMatchObject({ status: 'draft', source: 'manual' });
    // 2 boxes + 6 tiles = 54 tiles at 1.50 = 81.00; 5 kits at 41.50 = 207.50; tax 20 %.
    expect(second.lines.map((l: { quantity: number }) => l.quantity)).toEqual([54, 5]);
    expect(second.lines[0].quantityPacks).toBe('2 boxes + 6 tiles');
    expect(second.totals).toEqual({ netMinor: 28850, taxMinor: 5770, grossMinor: 34620 });
  });

  it('edits a draft keeping its lines, sends it once, and then refuses edits', async () => {
    const stores = f.as('stores');
    const draft = (await stores.post('/stock/purchase-orders', orderBody()).expect(201)).body;
    const edited = (
      await stores
        .put(
          `/stock/purchase-orders/${draft.id}`,
          orderBody({ lines: [{ productId: tile, packs: 4 }] }),
        )
        .expect(200)
    ).body;
    expect(edited.lines).toHaveLength(1);
    expect(edited.lines[0]).toMatchObject({ id: draft.lines[0].id, quantity: 96 });

    const sent = (await stores.post(`/stock/purchase-orders/${draft.id}/send`, {}).expect(200))
      .body;
    expect(sent).toMatchObject({ status: 'sent', sentTo: supplier.email });
    const log = await f.inFirm((tx) =>
      tx
        .selectFrom('emailLog')
        .select(['template', 'toAddress', 'subject'])
        .where('id', '=', sent.emailLogId)
        .executeTakeFirstOrThrow(),
    );
    expect(log).toEqual({
      template: 'purchaseOrder',
      toAddress: supplier.email,
      subject: `Purchase order ${draft.reference} from Job Test Flooring ${f.slug}`,
    });
    const job = await deps.mailQueue.getJob(sent.emailLogId);
    expect(job?.data.attachments?.[0]).toMatchObject({
      filename: `${draft.reference}.pdf`,
      contentType: 'application/pdf',
    });
    expect(
      Buffer.from(job?.data.attachments?.[0].contentBase64 ?? '', 'base64')
        .subarray(0, 5)
        .toString(),
    ).toBe('%PDF-');

    await stores.post(`/stock/purchase-orders/${draft.id}/send`, {}).expect(409);
    await stores.put(`/stock/purchase-orders/${draft.id}`, orderBody()).expect(409);
    await stores
      .post(`/stock/purchase-orders/${draft.id}/cancel`, { reason: 'Supplier out of stock' })
      .expect(200);
    await stores.post(`/stock/purchase-orders/${draft.id}/cancel`, { reason: 'again' }).expect(409);
    await stores
      .post(`/stock/purchase-orders/${draft.id}/receipts`, {
        lines: [{ purchaseOrderLineId: draft.lines[0].id, packs: 1 }],
      })
      .expect(409);
  });

  it('sends nothing without a delivery place or an address', async () => {
    const stores = f.as('stores');
    const noPlace = (
      await stores.post('/stock/purchase-orders', orderBody({ deliveryLocationId: null }))
    ).body;
    const res = await stores.post(`/stock/purchase-orders/${noPlace.id}/send`, {}).expect(409);
    expect(res.body.error.details.problems[0].path).toBe('deliveryLocationId');
    const silent = await f.inFirm(async (tx) => {
      const s = await newSupplier(tx, f.tenantId);
      await tx.updateTable('supplier').set({ email: null }).where('id', '=', s.id).execute();
      return s.id;
    });
    const draft = (await stores.post('/stock/purchase-orders', orderBody({ supplierId: silent })))
      .body;
    const noAddress = await stores.post(`/stock/purchase-orders/${draft.id}/send`, {}).expect(409);
    expect(noAddress.body.error.details.problems[0].path).toBe('to');
    expect((await stores.get(`/stock/purchase-orders/${draft.id}`)).body.status).toBe('draft');
  });

  it('downloads the PDF with the firm, supplier, lines, totals and delivery place', async () => {
    const stores = f.as('stores');
    const draft = (await stores.post('/stock/purchase-orders', orderBody()).expect(201)).body;
    const res = await stores
      .get(`/stock/purchase-orders/${draft.id}/pdf`)
      .buffer(true)
      .parse((r, done) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => done(null, Buffer.concat(chunks)));
      })
      .expect(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    const text = pdfText(res.body as Buffer);
    for (const shown of [
      `Purchase order ${draft.reference}`,
      supplier.name,
      'Unit 9, Fenmoor Park',
      'Garage tile 7 mm, slate grey',
      '2 boxes + 6 tiles',
      '207.50',
      'Total: 346.20 GBP',
      'Deliver to the side gate',
    ])
      expect(text.replace(/\s+/g, ' ')).toContain(shown);
  });

  it('lets stores and the owner write, the estimator read, others nothing; firm B gets 404', async () => {
    const draft = (await f.as('owner').post('/stock/purchase-orders', orderBody()).expect(201))
      .body;
    await f.as('estimator').post('/stock/purchase-orders', orderBody()).expect(403);
    await f.as('estimator').get(`/stock/purchase-orders/${draft.id}`).expect(200);
    await f.as('bookkeeper').get('/stock/purchase-orders').expect(403);
    await f.as('installer').get(`/stock/purchase-orders/${draft.id}/pdf`).expect(403);
    const open = (await f.as('stores').get('/stock/purchase-orders?status=open')).body;
    expect(open.map((o: { id: string }) => o.id)).toContain(draft.id);

    const ids = await demoIds(deps.db);
    const ownerB = stockAs(
      await sessionFor(
        deps.db,
        ids.user('owner@pennick-flooring.test'),
        ids.tenant('pennick-flooring').id,
      ),
    );
    await request(app).get(`/api/v1/stock/purchase-orders/${draft.id}`).set(ownerB).expect(404);
    await request(app).get(`/api/v1/stock/purchase-orders/${draft.id}/pdf`).set(ownerB).expect(404);
    await request(app)
      .post(`/api/v1/stock/purchase-orders/${draft.id}/send`)
      .set(ownerB)
      .send({})
      .expect(404);
    const list = (await request(app).get('/api/v1/stock/purchase-orders').set(ownerB)).body;
    expect(list.map((o: { id: string }) => o.id)).not.toContain(draft.id);
  });
});
