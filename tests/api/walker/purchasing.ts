import type { Express } from 'express';
import type { Kysely } from 'kysely';
import request from 'supertest';
import { withTenant, type Database, type Role, type Tx } from '@latchwork/shared-db';
import { createPurchaseOrder, postMovements, startCount } from '@latchwork/stock-server';
import type { WalkerFixture } from './fixture';
import { newFirm } from './jobs';
import { stockAs } from './stock';
import { sessionFor, type TestSession } from '../sessions';

const unique = () => `${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`;

/** Unique names for what the purchasing and count tests create. */
export const purchasingName = (prefix: string) => `${prefix}-${unique()}`;

/** A supplier with an order address under .test, made straight in the firm's tables. */
export async function newSupplier(tx: Tx, tenantId: string, leadTimeDays = 5) {
  const name = purchasingName('Harlow Tile Supply');
  const row = await tx
    .insertInto('supplier')
    .values({
      tenantId,
      name,
      email: `orders-${unique()}@harlow-tiles.test`,
      addressLines: ['Unit 9, Fenmoor Park', 'Ashcombe AC4 7LT'],
      contacts: '[]',
      leadTimeDays,
      orderCostMinor: 2500,
    })
    .returning(['id', 'email', 'name'])
    .executeTakeFirstOrThrow();
  return { ...row, email: row.email as string };
}

/** A tile in boxes of `packSize`, at `costMinor` a tile, from `supplierId`. */
export async function newTile(
  tx: Tx,
  tenantId: string,
  o: { supplierId?: string | null; packSize?: number; costMinor?: number } = {},
) {
  return tx
    .insertInto('product')
    .values({
      tenantId,
      sku: purchasingName('GT7'),
      name: 'Garage tile 7 mm, slate grey',
      kind: 'tile',
      attributes: '{}',
      kitComponents: '[]',
      unitOne: 'tile',
      unitOther: 'tiles',
      packOne: 'box',
      packOther: 'boxes',
      packSize: o.packSize ?? 24,
      costMinor: o.costMinor ?? 150,
      preferredSupplierId: o.supplierId ?? null,
    })
    .returning('id')
    .executeTakeFirstOrThrow();
}

/** A warehouse (or van) of the firm. */
export async function newPlace(tx: Tx, tenantId: string, kind: 'warehouse' | 'van' = 'warehouse') {
  return tx
    .insertInto('stockLocation')
    .values({ tenantId, name: purchasingName(kind === 'van' ? 'Van' : 'Store'), kind })
    .returning('id')
    .executeTakeFirstOrThrow();
}

/** Firm A's count (one line, 24 tiles booked) and a draft order, for the route walk. */
async function prepare(db: Kysely<Database>, tenantId: string, ownerId: string) {
  return withTenant(db, { tenantId }, async (tx) => {
    const supplier = await newSupplier(tx, tenantId);
    const product = await newTile(tx, tenantId, { supplierId: supplier.id });
    const place = await newPlace(tx, tenantId);
    const actor = { userId: ownerId, role: 'owner' as const };
    await postMovements(tx, { tenantId }, actor, [
      {
        kind: 'receipt',
        productId: product.id,
        toLocationId: place.id,
        quantity: 24,
        unitCostMinor: 150,
      },
    ]);
    const countId = await startCount(tx, { tenantId }, actor, {
      locationId: place.id,
      productIds: [product.id],
      note: 'route walker',
    });
    const line = await tx
      .selectFrom('stockCountLine')
      .select('id')
      .where('countId', '=', countId)
      .executeTakeFirstOrThrow();
    const purchaseOrderId = await createPurchaseOrder(tx, { tenantId }, ownerId, {
      supplierId: supplier.id,
      deliveryLocationId: place.id,
      expectedOn: null,
      notes: '',
      source: 'manual',
      lines: [{ productId: product.id, quantity: 48, unitCostMinor: 150 }],
    });
    const poLine = await tx
      .selectFrom('purchaseOrderLine')
      .select('id')
      .where('purchaseOrderId', '=', purchaseOrderId)
      .executeTakeFirstOrThrow();
    return {
      countId,
      countLineId: line.id,
      purchaseOrderId,
      purchaseOrderLineId: poLine.id,
      purchasingProductId: product.id,
      purchasingSupplierId: supplier.id,
      purchasingLocationId: place.id,
    };
  });
}

/** Counts, reorder and purchase orders in the route walk. */
export const purchasingWalk: WalkerFixture = {
  prepare: ({ db, tenantA, ownerA }) => prepare(db, tenantA, ownerA),
  bodies: {
    'PUT /api/v1/stock/control-settings': () => ({
      countApprovalGrossMinor: 10000,
      demandWindowDays: 90,
      nightlyReorder: true,
      defaultOrderCostMinor: 2500,
    }),
    'POST /api/v1/stock/counts': (_firm, p) => ({
      locationId: p['purchasingLocationId'],
      productIds: [p['purchasingProductId']],
    }),
    'PUT /api/v1/stock/counts/:countId/entries': (_firm, p) => ({
      lines: [{ lineId: p['countLineId'], packs: 1, units: 0 }],
    }),
    'POST /api/v1/stock/counts/:countId/submit': () => ({}),
    'PUT /api/v1/stock/counts/:countId/reasons': (_firm, p) => ({
      lines: [{ lineId: p['countLineId'], reason: 'miscount' }],
    }),
    'POST /api/v1/stock/counts/:countId/approve': () => ({}),
    'POST /api/v1/stock/counts/:countId/post': () => ({}),
    'POST /api/v1/stock/counts/:countId/cancel': () => ({}),
    'POST /api/v1/stock/reorder/run': () => ({}),
    'POST /api/v1/stock/purchase-orders': (_firm, p) => ({
      supplierId: p['purchasingSupplierId'],
      lines: [{ productId: p['purchasingProductId'], packs: 2 }],
    }),
    'PUT /api/v1/stock/purchase-orders/:purchaseOrderId': (_firm, p) => ({
      supplierId: p['purchasingSupplierId'],
      deliveryLocationId: p['purchasingLocationId'],
      lines: [{ productId: p['purchasingProductId'], packs: 2, unitCostMinor: 155 }],
    }),
    'POST /api/v1/stock/purchase-orders/:purchaseOrderId/send': () => ({}),
    'POST /api/v1/stock/purchase-orders/:purchaseOrderId/receipts': (_firm, p) => ({
      lines: [
        {
          purchaseOrderLineId: p['purchaseOrderLineId'],
          packs: 1,
          batchCode: `W-${Date.now().toString(36)}`,
        },
      ],
    }),
    'POST /api/v1/stock/purchase-orders/:purchaseOrderId/cancel': () => ({
      reason: 'route walker',
    }),
  },
};

/** A firm of its own with a signed-in session per role, and a client per role. */
export async function purchasingFirm(db: Kysely<Database>, app: Express) {
  const firm = await newFirm(db, 'PT-');
  const sessions = {} as Record<Role, TestSession>;
  for (const role of Object.keys(firm.users) as Role[])
    sessions[role] = await sessionFor(db, firm.users[role], firm.tenantId);
  const as = (role: Role) => {
    const headers = stockAs(sessions[role]);
    return {
      get: (path: string) => request(app).get(`/api/v1${path}`).set(headers),
      post: (path: string, body: object = {}) =>
        request(app).post(`/api/v1${path}`).set(headers).send(body),
      put: (path: string, body: object) =>
        request(app).put(`/api/v1${path}`).set(headers).send(body),
    };
  };
  const inFirm = <T>(work: (tx: Tx) => Promise<T>) =>
    withTenant(db, { tenantId: firm.tenantId }, work);
  const owner = { userId: firm.users.owner, role: 'owner' as const };
  return { ...firm, as, inFirm, owner };
}
