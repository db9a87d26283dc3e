import { withTenant, type TenantScope, type Tx } from '@latchwork/shared-db';
import {
  ConflictError,
  endpoint,
  NotFoundError,
  scopeOf,
  type EndpointDef,
} from '@latchwork/shared-server-kit';
import type { JobsDeps } from '../jobs-deps';
import { countJobs } from './customer.repository';
import { customerIdParams, site, siteIdParams, siteInput, sitePatch } from './customer.schemas';

import { auditCustomerChange, isStillReferenced, requireCustomer } from './customer-rules';
import { deleteSite, findSite, insertSite, updateSite } from './site.repository';

async function requireSite(tx: Tx, scope: TenantScope, siteId: string) {
  const found = await findSite(tx, scope, siteId);
  if (!found) throw new NotFoundError('That site');
  return found;
}

/** How a site is named in the audit log and in messages: its name or first address line. */
const siteLabel = (s: { name: string; addressLines: string[] }) =>
  s.name || s.addressLines[0] || 'the site';

/** A customer's sites: where the floors are, with what the crew needs to know to get in. */
export function siteEndpoints(deps: JobsDeps): EndpointDef[] {
  return [
    endpoint({
      method: 'post',
      path: '/customers/:customerId/sites',
      summary: 'Add a site to a customer',
      tags: ['customers'],
      permission: 'customers:write',
      params: customerIdParams,
      body: siteInput,
      status: 201,
      response: site,
      handle: ({ params, body, req }) =>
        withTenant(deps.db, scopeOf(req), async (tx) => {
          const scope = scopeOf(req);
          const customer = await requireCustomer(tx, scope, params.customerId);
          const id = await insertSite(tx, scope, customer.id, body);
          const created = await requireSite(tx, scope, id);
          await auditCustomerChange(tx, scope, req, 'site-created', siteLabel(created), {
            id,
            customer: customer.name,
          });
          return created;
        }),
    }),
    endpoint({
      method: 'get',
      path: '/sites/:siteId',
      summary: 'A site with its access notes, parking, floor type and opening hours',
      tags: ['customers'],
      permission: 'customers:read',
      params: siteIdParams,
      response: site,
      handle: ({ params, req }) =>
        withTenant(deps.db, scopeOf(req), (tx) => requireSite(tx, scopeOf(req), params.siteId)),
    }),
    endpoint({
      method: 'patch',
      path: '/sites/:siteId',
      summary: 'Change a site',
      tags: ['customers'],
      permission: 'customers:write',
      params: siteIdParams,
      body: sitePatch,
      response: site,
      handle: ({ params, body, req }) =>
        withTenant(deps.db, scopeOf(req), async (tx) => {
          const scope = scopeOf(req);
          await requireSite(tx, scope, params.siteId);
          await updateSite(tx, scope, params.siteId, body);
          const updated = await requireSite(tx, scope, params.siteId);
          await auditCustomerChange(tx, scope, req, 'site-updated', siteLabel(updated), {
            id: updated.id,
            fields: Object.keys(body),
          });
          return updated;
        }),
    }),
    endpoint({
      method: 'delete',
      path: '/sites/:siteId',
      summary: 'Remove a site; refused (409) while jobs use it',
      tags: ['customers'],
      permission: 'customers:write',
      params: siteIdParams,
      status: 204,
      async handle({ params, req, res }) {
        await withTenant(deps.db, scopeOf(req), async (tx) => {
          const scope = scopeOf(req);
          const found = await requireSite(tx, scope, params.siteId);
          const jobs = await countJobs(tx, scope, { siteId: found.id });
          if (jobs > 0)
            throw new ConflictError(
              `${jobs} job${jobs === 1 ? ' uses' : 's use'} ${siteLabel(found)}: it stays on file.`,
              { jobs },
            );
          await deleteSite(tx, scope, found.id).catch((err: unknown) => {
            if (isStillReferenced(err))
              throw new ConflictError(`${siteLabel(found)} is still in use (files or surveys).`);
            throw err;
          });
          await auditCustomerChange(tx, scope, req, 'site-deleted', siteLabel(found), {
            id: found.id,
          });
        });
        res.status(204).end();
      },
    }),
  ];
}
