import { actorOf, endpoint, NotFoundError } from '@latchwork/shared-server-kit';
import type { StockDeps } from '../stock-deps';
import { inFirm } from '../stock-tx';
import { conflictField } from '../stock-errors';
import {
  issueReservedBody,
  jobIdParams,
  reservationIdParams,
  reservationQuery,
  reserveBody,
} from './reservation.schemas';
import { offerFor, reserve } from './reserve';
import { issueReserved, jobPickingList, reservationRows, reservationView } from './picking';

/** Reservations per job: offer, reserve, list, release, pick and issue. */
export function reservationEndpoints(deps: StockDeps) {
  return [
    endpoint({
      method: 'post',
      path: '/stock/reservations/offer',
      summary:
        'Which batches a reservation would take, with a warning when not one batch (nothing saved)',
      tags: ['stock'],
      permission: 'stock:read',
      body: reserveBody,
      handle: ({ body, req }) => inFirm(deps.db, req, (tx, scope) => offerFor(tx, scope, body)),
    }),
    endpoint({
      method: 'post',
      path: '/stock/reservations',
      summary: 'Reserve stock for a job, one batch per product where one covers it',
      tags: ['stock'],
      permission: 'stock:write',
      status: 201,
      body: reserveBody,
      handle: ({ body, req }) =>
        inFirm(deps.db, req, async (tx, scope) => {
          const made = await reserve(tx, scope, actorOf(req).userId, body);
          const rows = await reservationRows(tx, scope)
            .where('r.id', 'in', made.reservationIds)
            .execute();
          return { reservations: rows.map(reservationView), offer: made.offer };
        }),
    }),
    endpoint({
      method: 'get',
      path: '/stock/reservations',
      summary: 'Reservations by job, product or status',
      tags: ['stock'],
      permission: 'stock:read',
      query: reservationQuery,
      handle: ({ query, req }) =>
        inFirm(deps.db, req, async (tx, scope) => {
          let q = reservationRows(tx, scope);
          if (query.jobId) q = q.where('r.jobId', '=', query.jobId);
          if (query.productId) q = q.where('r.productId', '=', query.productId);
          if (query.status !== 'all') q = q.where('r.status', '=', query.status);
          return (await q.orderBy('r.createdAt', 'desc').limit(1000).execute()).map(
            reservationView,
          );
        }),
    }),
    endpoint({
      method: 'post',
      path: '/stock/reservations/:reservationId/release',
      summary: 'Release what is left of a reservation back to available stock',
      tags: ['stock'],
      permission: 'stock:write',
      params: reservationIdParams,
      body: issueReservedBody.pick({ note: true }),
      handle: ({ params, req }) =>
        inFirm(deps.db, req, async (tx, scope) => {
          const row = await reservationRows(tx, scope)
            .where('r.id', '=', params.reservationId)
            .forUpdate('r')
            .executeTakeFirst();
          if (!row) throw new NotFoundError('That reservation');
          if (row.status !== 'active')
            conflictField(
              'reservationId',
              'reservation-closed',
              `The reservation is already ${row.status}.`,
            );
          await tx
            .updateTable('reservation')
            .set({ status: 'released', updatedAt: new Date() })
            .where('tenantId', '=', scope.tenantId)
            .where('id', '=', params.reservationId)
            .execute();
          return reservationView({ ...row, status: 'released' });
        }),
    }),
    endpoint({
      method: 'post',
      path: '/stock/reservations/:reservationId/issue',
      summary: 'Issue a reservation (or part of it) to its job, first expiry first out',
      tags: ['stock'],
      permission: 'stock:write',
      status: 201,
      params: reservationIdParams,
      body: issueReservedBody,
      handle: ({ params, body, req }) =>
        inFirm(deps.db, req, (tx, scope) =>
          issueReserved(
            tx,
            scope,
            { userId: actorOf(req).userId, role: actorOf(req).role },
            params.reservationId,
            body,
          ),
        ),
    }),
    endpoint({
      method: 'get',
      path: '/stock/jobs/:jobId/picking-list',
      summary: 'What to pick for a job: batches and places per open reservation, FEFO',
      tags: ['stock'],
      permission: 'stock:read',
      params: jobIdParams,
      handle: ({ params, req }) =>
        inFirm(deps.db, req, (tx, scope) => jobPickingList(tx, scope, params.jobId)),
    }),
  ];
}
