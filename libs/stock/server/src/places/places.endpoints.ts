import { sql } from 'kysely';
import { type TenantScope, type Tx } from '@latchwork/shared-db';
import { ConflictError, endpoint, NotFoundError } from '@latchwork/shared-server-kit';
import type { StockDeps } from '../stock-deps';
import { existsInFirm, inFirm } from '../stock-tx';
import { conflictField, invalidField } from '../stock-errors';
import { isUniqueViolation } from '../catalogue/product-rules';
import { batchList, batchView, createBatch } from './batch.repository';
import {
  batchBody,
  batchIdParams,
  batchQuery,
  locationBody,
  locationIdParams,
  type LocationBody,
} from './places.schemas';

async function checkLocation(tx: Tx, scope: TenantScope, body: LocationBody) {
  if (body.kind !== 'site' && (body.jobId || body.siteId))
    invalidField(body.jobId ? 'jobId' : 'siteId', 'only a site location belongs to a job or site');
  for (const [table, id, path] of [
    ['job', body.jobId, 'jobId'],
    ['site', body.siteId, 'siteId'],
  ] as const) {
    if (id && !(await existsInFirm(tx, scope, table, id))) invalidField(path, `no such ${table}`);
  }
}

function locationsQuery(tx: Tx, scope: TenantScope) {
  return tx
    .selectFrom('stockLocation as l')
    .selectAll('l')
    .select((eb) =>
      eb
        .selectFrom('stockBalance as b')
        .select(sql<string>`count(*) filter (where b.quantity <> 0)`.as('n'))
        .where('b.tenantId', '=', scope.tenantId)
        .whereRef('b.locationId', '=', 'l.id')
        .as('lines'),
    )
    .where('l.tenantId', '=', scope.tenantId);
}

async function findLocation(tx: Tx, scope: TenantScope, locationId: string) {
  const row = await locationsQuery(tx, scope).where('l.id', '=', locationId).executeTakeFirst();
  if (!row) throw new NotFoundError('That location');
  const { tenantId: _t, ...l } = row;
  return { ...l, lines: Number(l.lines) };
}

const duplicate = (err: unknown, name: string): never => {
  if (isUniqueViolation(err, 'stock_location_name_idx'))
    conflictField('name', 'duplicate-name', `A location called ${name} already exists.`);
  throw err;
};

/** Warehouses, vans and job sites; product batches with their dates. */
export function placesEndpoints(deps: StockDeps) {
  return [
    endpoint({
      method: 'get',
      path: '/stock/locations',
      summary: 'Stock locations (warehouses, vans, sites) with how many stock lines each holds',
      tags: ['stock'],
      permission: 'stock:read',
      handle: ({ req }) =>
        inFirm(deps.db, req, async (tx, scope) =>
          (await locationsQuery(tx, scope).orderBy('l.kind').orderBy('l.name').execute()).map(
            ({ tenantId: _t, ...l }) => ({ ...l, lines: Number(l.lines) }),
          ),
        ),
    }),
    endpoint({
      method: 'post',
      path: '/stock/locations',
      summary: 'Add a warehouse, van or site location',
      tags: ['stock'],
      permission: 'stock:write',
      status: 201,
      body: locationBody,
      handle: ({ body, req }) =>
        inFirm(deps.db, req, async (tx, scope) => {
          await checkLocation(tx, scope, body);
          const row = await tx
            .insertInto('stockLocation')
            .values({ tenantId: scope.tenantId, ...body })
            .returning('id')
            .executeTakeFirstOrThrow()
            .catch((e) => duplicate(e, body.name));
          return findLocation(tx, scope, row.id);
        }),
    }),
    endpoint({
      method: 'get',
      path: '/stock/locations/:locationId',
      summary: 'One location',
      tags: ['stock'],
      permission: 'stock:read',
      params: locationIdParams,
      handle: ({ params, req }) =>
        inFirm(deps.db, req, (tx, scope) => findLocation(tx, scope, params.locationId)),
    }),
    endpoint({
      method: 'put',
      path: '/stock/locations/:locationId',
      summary: 'Rename, re-link or deactivate a location',
      tags: ['stock'],
      permission: 'stock:write',
      params: locationIdParams,
      body: locationBody,
      handle: ({ params, body, req }) =>
        inFirm(deps.db, req, async (tx, scope) => {
          const before = await findLocation(tx, scope, params.locationId);
          if (before.kind !== body.kind && before.lines > 0)
            conflictField('kind', 'location-in-use', 'the location holds stock: move it first');
          await checkLocation(tx, scope, body);
          await tx
            .updateTable('stockLocation')
            .set(body)
            .where('tenantId', '=', scope.tenantId)
            .where('id', '=', params.locationId)
            .execute()
            .catch((e) => duplicate(e, body.name));
          return findLocation(tx, scope, params.locationId);
        }),
    }),
    endpoint({
      method: 'delete',
      path: '/stock/locations/:locationId',
      summary: 'Remove a location stock never moved through (otherwise deactivate it)',
      tags: ['stock'],
      permission: 'stock:write',
      params: locationIdParams,
      status: 204,
      async handle({ params, req, res }) {
        await inFirm(deps.db, req, async (tx, scope) => {
          const found = await findLocation(tx, scope, params.locationId);
          try {
            await tx
              .deleteFrom('stockLocation')
              .where('tenantId', '=', scope.tenantId)
              .where('id', '=', params.locationId)
              .execute();
          } catch (err) {
            if ((err as { code?: string }).code !== '23503') throw err;
            throw new ConflictError(
              `Stock has moved through ${found.name}: deactivate it instead.`,
            );
          }
        });
        res.status(204).end();
      },
    }),
    endpoint({
      method: 'get',
      path: '/stock/batches',
      summary: 'Batches, first expiry first; by product, or expiring within some days',
      tags: ['stock'],
      permission: 'stock:read',
      query: batchQuery,
      handle: ({ query, req }) =>
        inFirm(deps.db, req, async (tx, scope) => {
          let q = batchList(tx, scope);
          if (query.productId) q = q.where('b.productId', '=', query.productId);
          if (query.expiringWithinDays !== undefined)
            q = q.where(
              'b.expiresOn',
              '<=',
              sql<string>`current_date + ${query.expiringWithinDays}::int`,
            );
          return (await q.limit(1000).execute()).map(batchView);
        }),
    }),
    endpoint({
      method: 'post',
      path: '/stock/batches',
      summary: 'Record a batch: code, received date, expiry (from the shelf life if left out)',
      tags: ['stock'],
      permission: 'stock:write',
      status: 201,
      body: batchBody,
      handle: ({ body, req }) =>
        inFirm(deps.db, req, async (tx, scope) => {
          const id = await createBatch(tx, scope, body);
          return batchView(
            await batchList(tx, scope).where('b.id', '=', id).executeTakeFirstOrThrow(),
          );
        }),
    }),
    endpoint({
      method: 'get',
      path: '/stock/batches/:batchId',
      summary: 'One batch with its on-hand quantity',
      tags: ['stock'],
      permission: 'stock:read',
      params: batchIdParams,
      handle: ({ params, req }) =>
        inFirm(deps.db, req, async (tx, scope) => {
          const b = await batchList(tx, scope)
            .where('b.id', '=', params.batchId)
            .executeTakeFirst();
          if (!b) throw new NotFoundError('That batch');
          return batchView(b);
        }),
    }),
  ];
}
