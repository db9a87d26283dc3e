import { withTenant } from '@latchwork/shared-db';
import type { WalkerFixture } from './fixture';

const unique = () => `${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 8)}`;

/** A small customers file with addresses nobody else uses, so each commit creates its row. */
const customerCsv = () =>
  `Name,Email,Type,Postcode\nWalker Import ${unique()},walk-${unique()}@walker.test,business,WX9 9WW\n`;

/**
 * The customer and site routes aim at one customer of firm A with one site. Deletes are
 * declared last among the routes, so the other routes still find them.
 */
export const customersWalk: WalkerFixture = {
  prepare: async ({ db, tenantA, ownerA }) =>
    withTenant(db, { tenantId: tenantA }, async (tx) => {
      const customer = await tx
        .insertInto('customer')
        .values({
          tenantId: tenantA,
          kind: 'business',
          name: `Walker Customer ${unique()}`,
          createdBy: ownerA,
        })
        .returning('id')
        .executeTakeFirstOrThrow();
      const site = await tx
        .insertInto('site')
        .values({ tenantId: tenantA, customerId: customer.id, addressLines: ['1 Walker Yard'] })
        .returning('id')
        .executeTakeFirstOrThrow();
      return { customerId: customer.id, siteId: site.id };
    }),
  bodies: {
    'POST /api/v1/customers': () => ({
      kind: 'homeowner',
      name: `Walker Homeowner ${unique()}`,
      contacts: [{ name: 'Ada Walker', role: 'Owner' }],
    }),
    'PATCH /api/v1/customers/:customerId': () => ({ notes: `Walked ${unique()}` }),
    'DELETE /api/v1/customers/:customerId': () => ({}),
    'POST /api/v1/customers/:customerId/sites': () => ({
      name: 'Walker annex',
      addressLines: [`${unique()} Walker Yard`],
    }),
    'PATCH /api/v1/sites/:siteId': () => ({ parking: 'Two bays by the gate' }),
    'DELETE /api/v1/sites/:siteId': () => ({}),
    'POST /api/v1/customers/import/preview': () => ({ kind: 'customers', csv: customerCsv() }),
    'POST /api/v1/customers/import/commit': () => ({ kind: 'customers', csv: customerCsv() }),
  },
};
