import { z } from 'zod';
import { withTenant, type TenantScope, type Tx } from '@latchwork/shared-db';
import {
  actorOf,
  ConflictError,
  endpoint,
  NotFoundError,
  scopeOf,
  type EndpointDef,
} from '@latchwork/shared-server-kit';
import type { JobsDeps } from '../jobs-deps';
import { listCustomers, listSiteSummaries } from './customer-list.repository';
import {
  countJobs,
  deleteCustomer,
  findCustomer,
  insertCustomer,
  listContacts,
  listJobSummaries,
  updateCustomer,
} from './customer.repository';
import {
  customerDetail,
  customerIdParams,
  customerInput,
  customerList,
  customerPatch,
  listQuery,
  siteSummary,
} from './customer.schemas';

import {
  auditCustomerChange,
  checkCustomerKeysFree,
  firmCurrency,
  isStillReferenced,
  requireCustomer,
} from './customer-rules';

import { listSites } from './site.repository';
import { siteEndpoints } from './site.endpoints';
import { importEndpoints } from './import.endpoints';

/** Everything the customer page shows: the customer, contacts, sites, jobs and money slots. */
async function customerPage(tx: Tx, scope: TenantScope, customerId: string) {
  const customer = await findCustomer(tx, scope, customerId);
  if (!customer) throw new NotFoundError('That customer');
  return {
    ...customer,
    contacts: await listContacts(tx, scope, customerId),
    sites: await listSites(tx, scope, customerId),
    jobs: await listJobSummaries(tx, scope, customerId),
    balance: null,
    ...(await firmCurrency(tx, scope)),
  };
}

/** Customers, their contacts and sites, and the CSV import of both. */
export function customerEndpoints(deps: JobsDeps): EndpointDef[] {
  const tenant = <T>(req: Parameters<typeof scopeOf>[0], work: (tx: Tx, s: TenantScope) => T) =>
    withTenant(deps.db, scopeOf(req), async (tx) => work(tx, scopeOf(req)));
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
      handle: ({ query, req }) => tenant(req, (tx, scope) => listCustomers(tx, scope, query)),
    }),
    ...importEndpoints(deps),
    endpoint({
      method: 'post',
      path: '/customers',
      summary:
        'Add a customer with contacts (creditLimitMinor: integer minor units of the firm’s currency)',
      tags: ['customers'],
      permission: 'customers:write',
      body: customerInput,
      status: 201,
      response: customerDetail,
      handle: ({ body, req }) =>
        tenant(req, async (tx, scope) => {
          await checkCustomerKeysFree(tx, scope, body);
          const id = await insertCustomer(tx, scope, body, actorOf(req).userId);
          await auditCustomerChange(tx, scope, req, 'customer-created', body.name, { id });
          return customerPage(tx, scope, id);
        }),
    }),
    endpoint({
      method: 'get',
      path: '/customers/:customerId',
      summary: 'A customer with contacts, sites, a summary of its jobs and (later) its balance',
      tags: ['customers'],
      permission: 'customers:read',
      params: customerIdParams,
      response: customerDetail,
      handle: ({ params, req }) =>
        tenant(req, (tx, scope) => customerPage(tx, scope, params.customerId)),
    }),
    endpoint({
      method: 'patch',
      path: '/customers/:customerId',
      summary: 'Change a customer; contacts, when sent, become exactly the list sent',
      tags: ['customers'],
      permission: 'customers:write',
      params: customerIdParams,
      body: customerPatch,
      response: customerDetail,
      handle: ({ params, body, req }) =>
        tenant(req, async (tx, scope) => {
          const found = await requireCustomer(tx, scope, params.customerId);
          await checkCustomerKeysFree(tx, scope, body, found.id);
          await updateCustomer(tx, scope, found.id, body);
          await auditCustomerChange(tx, scope, req, 'customer-updated', found.name, {
            id: found.id,
            fields: Object.keys(body),
          });
          return customerPage(tx, scope, found.id);
        }),
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
        tenant(req, async (tx, scope) => {
          await requireCustomer(tx, scope, params.customerId);
          return listSiteSummaries(tx, scope, params.customerId);
        }),
    }),
    ...siteEndpoints(deps),
    endpoint({
      method: 'delete',
      path: '/customers/:customerId',
      summary: 'Remove a customer and its sites; refused (409) while it has jobs',
      tags: ['customers'],
      permission: 'customers:write',
      params: customerIdParams,
      status: 204,
      async handle({ params, req, res }) {
        await tenant(req, async (tx, scope) => {
          const found = await requireCustomer(tx, scope, params.customerId);
          const jobs = await countJobs(tx, scope, { customerId: found.id });
          if (jobs > 0)
            throw new ConflictError(
              `${found.name} has ${jobs} job${jobs === 1 ? '' : 's'}: a customer with jobs stays on file.`,
              { jobs },
            );
          await deleteCustomer(tx, scope, found.id).catch((err: unknown) => {
            if (isStillReferenced(err))
              throw new ConflictError(`${found.name} or one of its sites is still in use.`);
            throw err;
          });
          await auditCustomerChange(tx, scope, req, 'customer-deleted', found.name, {
            id: found.id,
          });
        });
        res.status(204).end();
      },
    }),
  ];
}
