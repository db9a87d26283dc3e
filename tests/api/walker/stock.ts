import { sql, type Kysely } from 'kysely';
import { withTenant, type Database } from '@latchwork/shared-db';
import { postMovements } from '@latchwork/stock-server';
import type { WalkerFixture, WalkerSetup } from './fixture';

const unique = () => `${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`;

/**
 * A customer and a job in the firm, written straight to the tables (the stock tests must not
 * depend on the jobs API's form); the number comes from the firm's counter like any job's.
 */
export async function makeStockJob(db: Kysely<Database>, tenantId: string): Promise<string> {
  return withTenant(db, { tenantId }, async (tx) => {
    const customer = await tx
      .insertInto('customer')
      .values({ tenantId, kind: 'business', name: `Stock test customer ${unique()}` })
      .returning('id')
      .executeTakeFirstOrThrow();
    const { rows } = await sql<{ n: number }>`
      insert into job_counter (tenant_id, last_number) values (${tenantId}, 1)
      on conflict (tenant_id) do update set last_number = job_counter.last_number + 1
      returning last_number as n`.execute(tx);
    const job = await tx
      .insertInto('job')
      .values({
        tenantId,
        number: rows[0].n,
        reference: `J-${rows[0].n}`,
        title: `Stock test job ${unique()}`,
        customerId: customer.id,
      })
      .returning('id')
      .executeTakeFirstOrThrow();
    return job.id;
  });
}

/** Headers of a signed-in session for supertest. */
export const stockAs = (s: { cookie: string; csrfToken: string }) => ({
  Cookie: s.cookie,
  'X-XSRF-TOKEN': s.csrfToken,
});

/** A valid product body of `kind` with a unique SKU (tiles come in boxes of 24). */
export function productBody(kind = 'tile', extra: Record<string, unknown> = {}) {
  const tile = kind === 'tile';
  return {
    sku: stockTestName(kind.toUpperCase()),
    name: `Test ${kind} ${unique()}`,
    kind,
    attributes: tile ? { colour: 'Graphite', thicknessMm: 7, pitchMm: 500 } : {},
    unitOne: tile ? 'tile' : 'unit',
    unitOther: tile ? 'tiles' : 'units',
    packOne: 'box',
    packOther: 'boxes',
    packSize: tile ? 24 : 1,
    costMinor: 250,
    priceMinor: 420,
    ...extra,
  };
}

/** Unique names for objects the stock tests create. */
export const stockTestName = (prefix: string) => `${prefix}-${unique()}`;

/** Firm A's stock objects the walk aims at: product, supplier, location, batch, movement, reservation. */
async function prepareStock({ db, tenantA, ownerA }: WalkerSetup) {
  const stockJobId = await makeStockJob(db, tenantA);
  return withTenant(db, { tenantId: tenantA }, async (tx) => {
    const scope = { tenantId: tenantA };
    const supplierName = stockTestName('Walker supplier');
    const supplier = await tx
      .insertInto('supplier')
      .values({ tenantId: tenantA, name: supplierName, contacts: '[]' })
      .returning('id')
      .executeTakeFirstOrThrow();
    const body = productBody('tile');
    const product = await tx
      .insertInto('product')
      .values({
        tenantId: tenantA,
        ...body,
        attributes: JSON.stringify(body.attributes),
        kitComponents: '[]',
        kind: 'tile',
      })
      .returning('id')
      .executeTakeFirstOrThrow();
    const locationName = stockTestName('Walker shelf');
    const location = await tx
      .insertInto('stockLocation')
      .values({ tenantId: tenantA, name: locationName, kind: 'warehouse' })
      .returning('id')
      .executeTakeFirstOrThrow();
    const batch = await tx
      .insertInto('stockBatch')
      .values({
        tenantId: tenantA,
        productId: product.id,
        code: stockTestName('WB'),
        receivedOn: '2026-11-01',
      })
      .returning('id')
      .executeTakeFirstOrThrow();
    const actor = { userId: ownerA, role: 'owner' as const };
    const [movement] = await postMovements(tx, scope, actor, [
      {
        kind: 'receipt',
        productId: product.id,
        batchId: batch.id,
        toLocationId: location.id,
        quantity: 96,
        unitCostMinor: 250,
      },
    ]);
    const reservation = await tx
      .insertInto('reservation')
      .values({
        tenantId: tenantA,
        jobId: stockJobId,
        productId: product.id,
        batchId: batch.id,
        quantity: 24,
      })
      .returning('id')
      .executeTakeFirstOrThrow();
    return {
      productId: product.id,
      stockProductSku: body.sku,
      supplierId: supplier.id,
      stockSupplierName: supplierName,
      locationId: location.id,
      stockLocationName: locationName,
      batchId: batch.id,
      movementId: movement.id,
      reservationId: reservation.id,
      stockJobId,
    };
  });
}

type Params = Record<string, string>;

/** A one-product catalogue CSV with a fresh SKU. */
const walkerCsv = () =>
  `sku,name,kind,colour,pack_size,cost,price\r\n${stockTestName('WCSV')},Walker tile,tile,Amber,24,2.35,3.90\r\n`;

export const stockWalk: WalkerFixture = {
  prepare: prepareStock,
  bodies: {
    'POST /api/v1/stock/products': () => productBody('tile'),
    'PUT /api/v1/stock/products/:productId': (_f, p: Params) =>
      productBody('tile', { sku: p['stockProductSku'] }),
    'POST /api/v1/stock/products/import/preview': () => ({ csv: walkerCsv() }),
    'POST /api/v1/stock/products/import': () => ({ csv: walkerCsv() }),
    'POST /api/v1/stock/suppliers': () => ({ name: stockTestName('Walker supplier') }),
    'PUT /api/v1/stock/suppliers/:supplierId': (_f, p: Params) => ({
      name: p['stockSupplierName'],
      leadTimeDays: 5,
    }),
    'DELETE /api/v1/stock/suppliers/:supplierId': () => ({}),
    'POST /api/v1/stock/locations': () => ({ name: stockTestName('Walker van'), kind: 'van' }),
    'PUT /api/v1/stock/locations/:locationId': (_f, p: Params) => ({
      name: p['stockLocationName'],
      kind: 'warehouse',
    }),
    'DELETE /api/v1/stock/locations/:locationId': () => ({}),
    'POST /api/v1/stock/batches': (_f, p: Params) => ({
      productId: p['productId'],
      code: stockTestName('WB'),
      receivedOn: '2026-11-02',
    }),
    'POST /api/v1/stock/movements': (_f, p: Params) => ({
      kind: 'receipt',
      productId: p['productId'],
      batchId: p['batchId'],
      toLocationId: p['locationId'],
      quantity: 24,
      unitCostMinor: 250,
    }),
    'POST /api/v1/stock/movements/:movementId/reverse': () => ({ note: 'route walker' }),
    'PUT /api/v1/stock/settings': () => ({
      allowNegativeStock: false,
      expiryWarningDays: 30,
      defaultServiceLevelBp: 9500,
      holdingCostRateBp: 2500,
    }),
    'POST /api/v1/stock/reservations/offer': (_f, p: Params) => ({
      jobId: p['stockJobId'],
      productId: p['productId'],
      quantity: 1,
    }),
    'POST /api/v1/stock/reservations': (_f, p: Params) => ({
      jobId: p['stockJobId'],
      productId: p['productId'],
      quantity: 1,
      acceptSplit: true,
      acceptShort: true,
    }),
    'POST /api/v1/stock/reservations/:reservationId/release': () => ({}),
    'POST /api/v1/stock/reservations/:reservationId/issue': () => ({ quantity: 1 }),
  },
};
