import { sql } from 'kysely';
import { z } from 'zod';
import { withTenant, type TenantScope, type Tx } from '@latchwork/shared-db';
import { ConflictError, endpoint, NotFoundError, scopeOf } from '@latchwork/shared-server-kit';
import type { StockDeps } from '../stock-deps';
import { conflictField } from '../stock-errors';
import { supplierBody, supplierIdParams, type SupplierBody } from './catalogue.schemas';
import { isUniqueViolation } from './product-rules';

const columns = (body: SupplierBody) => ({ ...body, contacts: JSON.stringify(body.contacts) });

async function findSupplier(tx: Tx, scope: TenantScope, supplierId: string) {
  const row = await tx
    .selectFrom('supplier')
    .selectAll()
    .select((eb) =>
      eb
        .selectFrom('product')
        .select(sql<string>`count(*)`.as('n'))
        .where('tenantId', '=', scope.tenantId)
        .whereRef('preferredSupplierId', '=', 'supplier.id')
        .as('productCount'),
    )
    .where('tenantId', '=', scope.tenantId)
    .where('id', '=', supplierId)
    .executeTakeFirst();
  if (!row) throw new NotFoundError('That supplier');
  const { tenantId: _t, ...s } = row;
  return {
    ...s,
    orderCostMinor: s.orderCostMinor === null ? null : Number(s.orderCostMinor),
    productCount: Number(s.productCount),
  };
}

function duplicateName(err: unknown, body: SupplierBody): never {
  if (isUniqueViolation(err, 'supplier_name_idx'))
    conflictField('name', 'duplicate-name', `A supplier called ${body.name} already exists.`);
  throw err;
}

/** Suppliers with their contacts, lead time and cost per order. */
export function supplierEndpoints(deps: StockDeps) {
  return [
    endpoint({
      method: 'get',
      path: '/stock/suppliers',
      summary: 'The firm’s suppliers, by name',
      tags: ['stock'],
      permission: 'stock:read',
      query: z.object({ q: z.string().trim().max(100).optional() }),
      handle: ({ query, req }) =>
        withTenant(deps.db, scopeOf(req), async (tx) => {
          let q = tx
            .selectFrom('supplier')
            .select(['id', 'name', 'email', 'phone', 'leadTimeDays', 'active', 'contacts'])
            .where('tenantId', '=', scopeOf(req).tenantId);
          if (query.q) q = q.where('name', 'ilike', `%${query.q.replace(/[\\%_]/g, '\\$&')}%`);
          return q.orderBy(sql`lower(name)`).execute();
        }),
    }),
    endpoint({
      method: 'post',
      path: '/stock/suppliers',
      summary: 'Add a supplier',
      tags: ['stock'],
      permission: 'stock:write',
      status: 201,
      body: supplierBody,
      handle: ({ body, req }) =>
        withTenant(deps.db, scopeOf(req), async (tx) => {
          const row = await tx
            .insertInto('supplier')
            .values({ tenantId: scopeOf(req).tenantId, ...columns(body) })
            .returning('id')
            .executeTakeFirstOrThrow()
            .catch((e) => duplicateName(e, body));
          return findSupplier(tx, scopeOf(req), row.id);
        }),
    }),
    endpoint({
      method: 'get',
      path: '/stock/suppliers/:supplierId',
      summary: 'One supplier with its contacts and how many products it supplies',
      tags: ['stock'],
      permission: 'stock:read',
      params: supplierIdParams,
      handle: ({ params, req }) =>
        withTenant(deps.db, scopeOf(req), (tx) =>
          findSupplier(tx, scopeOf(req), params.supplierId),
        ),
    }),
    endpoint({
      method: 'put',
      path: '/stock/suppliers/:supplierId',
      summary: 'Replace a supplier’s details',
      tags: ['stock'],
      permission: 'stock:write',
      params: supplierIdParams,
      body: supplierBody,
      handle: ({ params, body, req }) =>
        withTenant(deps.db, scopeOf(req), async (tx) => {
          const scope = scopeOf(req);
          await findSupplier(tx, scope, params.supplierId);
          await tx
            .updateTable('supplier')
            .set({ ...columns(body), updatedAt: new Date() })
            .where('tenantId', '=', scope.tenantId)
            .where('id', '=', params.supplierId)
            .execute()
            .catch((e) => duplicateName(e, body));
          return findSupplier(tx, scope, params.supplierId);
        }),
    }),
    endpoint({
      method: 'delete',
      path: '/stock/suppliers/:supplierId',
      summary: 'Remove a supplier nothing refers to (otherwise deactivate it)',
      tags: ['stock'],
      permission: 'stock:write',
      params: supplierIdParams,
      status: 204,
      async handle({ params, req, res }) {
        await withTenant(deps.db, scopeOf(req), async (tx) => {
          const scope = scopeOf(req);
          const found = await findSupplier(tx, scope, params.supplierId);
          if (found.productCount > 0)
            throw new ConflictError(
              `${found.name} is the preferred supplier of ${found.productCount} products: deactivate it instead.`,
            );
          await tx
            .deleteFrom('supplier')
            .where('tenantId', '=', scope.tenantId)
            .where('id', '=', params.supplierId)
            .execute()
            .catch((e: { code?: string }) => {
              if (e.code === '23503')
                throw new ConflictError('Batches name this supplier: deactivate it instead.');
              throw e;
            });
        });
        res.status(204).end();
      },
    }),
  ];
}
