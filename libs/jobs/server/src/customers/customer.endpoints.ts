import { z } from 'zod';
import { withTenant } from '@latchwork/shared-db';
import { endpoint, NotFoundError, scopeOf, type EndpointDef } from '@latchwork/shared-server-kit';
import type { JobsDeps } from '../jobs-deps';
import { customerExists, listCustomers, listSiteSummaries } from './customer-list.repository';
import { customerIdParams, customerList, listQuery, siteSummary } from './customer.schemas';

/** Customers, their contacts and sites, and the CSV import of both. */
export function customerEndpoints(deps: JobsDeps): EndpointDef[] {
  return [
    endpoint({
      method: 'get',
      path: '/customers',
      summary:
        'Search, sort and page the firm’s customers (q looks in name, e-mail, postcode and reference)',
      tags: ['customers'],
      permission: 'customers:read',
      query: listQuery,
      response: customerList,
      handle: ({ query, req }) =>
        withTenant(deps.db, scopeOf(req), (tx) => listCustomers(tx, scopeOf(req), query)),
    }),
    endpoint({
      method: 'get',
      path: '/customers/:customerId/sites',
      summary: 'The customer’s sites, short form (for pickers)',
      tags: ['customers'],
      permission: 'customers:read',
      params: customerIdParams,
      response: z.array(siteSummary),
      handle: ({ params, req }) =>
        withTenant(deps.db, scopeOf(req), async (tx) => {
          if (!(await customerExists(tx, scopeOf(req), params.customerId)))
            throw new NotFoundError('That customer');
          return listSiteSummaries(tx, scopeOf(req), params.customerId);
        }),
    }),
  ];
}
