import { z } from 'zod';
import { endpoint } from '@latchwork/shared-server-kit';
import type { StockDeps } from '../stock-deps';
import { inFirm } from '../stock-tx';
import { stockSettings } from '../ledger/movement.endpoints';
import { jobIdParams } from '../reservations/reservation.schemas';
import { jobMaterials } from './job-materials';
import { expiringReport, stockValueReport } from './valuation';

/** Stock value, expiring batches and a job's materials. */
export function reportEndpoints(deps: StockDeps) {
  return [
    endpoint({
      method: 'get',
      path: '/stock/reports/value',
      summary: 'Stock value at weighted-average cost by location and product kind',
      tags: ['stock'],
      permission: 'stock:read',
      handle: ({ req }) => inFirm(deps.db, req, (tx, scope) => stockValueReport(tx, scope)),
    }),
    endpoint({
      method: 'get',
      path: '/stock/reports/expiring',
      summary: 'Batches in stock that have expired or expire soon, with their value',
      tags: ['stock'],
      permission: 'stock:read',
      query: z.object({ days: z.coerce.number().int().min(0).max(3650).optional() }),
      handle: ({ query, req }) =>
        inFirm(deps.db, req, async (tx, scope) => {
          const days = query.days ?? (await stockSettings(tx, scope)).expiryWarningDays;
          return { days, batches: await expiringReport(tx, scope, days) };
        }),
    }),
    endpoint({
      method: 'get',
      path: '/stock/jobs/:jobId/materials',
      summary:
        'A job’s materials: estimated from its takeoffs vs reserved, issued, returned, with cost',
      tags: ['stock'],
      permission: 'stock:read',
      params: jobIdParams,
      handle: ({ params, req }) =>
        inFirm(deps.db, req, (tx, scope) => jobMaterials(tx, scope, params.jobId)),
    }),
  ];
}
