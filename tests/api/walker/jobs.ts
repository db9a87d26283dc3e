import type { Kysely } from 'kysely';
import { withTenant, type Database, type Role } from '@latchwork/shared-db';
import type { WalkerFixture } from './fixture';
import { createJob } from '../../../libs/jobs/server/src/jobs/job.repository';

const unique = () => `${Date.now().toString(36)}${Math.random().toString(36).slice(2, 8)}`;

/** A customer with one site in the firm, made straight in the database (unique names). */
export async function newCustomer(
  db: Kysely<Database>,
  tenantId: string,
  name = `Job Test Customer ${unique()}`,
): Promise<{ customerId: string; siteId: string }> {
  return withTenant(db, { tenantId }, async (tx) => {
    const customer = await tx
      .insertInto('customer')
      .values({ tenantId, kind: 'business', name })
      .returning('id')
      .executeTakeFirstOrThrow();
    const site = await tx
      .insertInto('site')
      .values({
        tenantId,
        customerId: customer.id,
        name: 'Unit 4',
        addressLines: [`${unique()} Brackmoor Trading Estate`],
        postcode: 'BT1 4QQ',
      })
      .returning('id')
      .executeTakeFirstOrThrow();
    return { customerId: customer.id, siteId: site.id };
  });
}

/** A firm of its own, one member per role, for tests that must count everything in a firm. */
export async function newFirm(db: Kysely<Database>, jobPrefix = 'JT-') {
  const slug = `job-test-${unique()}`;
  const tenant = await db
    .insertInto('tenant')
    .values({
      slug,
      name: `Job Test Flooring ${slug}`,
      numberPrefixes: JSON.stringify({
        job: jobPrefix,
        quote: 'Q-',
        invoice: 'INV-',
        creditNote: 'CN-',
        purchaseOrder: 'PO-',
      }) as never,
    })
    .returning('id')
    .executeTakeFirstOrThrow();
  const names: Record<Role, string> = {
    owner: 'Orla Brennick',
    estimator: 'Ezra Tolland',
    stores: 'Suki Marrow',
    bookkeeper: 'Bea Quillan',
    installer: 'Ivo Dunmere',
  };
  const users = {} as Record<Role, string>;
  for (const role of Object.keys(names) as Role[]) {
    const user = await db
      .insertInto('appUser')
      .values({ email: `${role}-${slug}@job-tests.test`, name: names[role] })
      .returning('id')
      .executeTakeFirstOrThrow();
    users[role] = user.id;
    await withTenant(db, { tenantId: tenant.id }, (tx) =>
      tx.insertInto('membership').values({ tenantId: tenant.id, userId: user.id, role }).execute(),
    );
  }
  return { tenantId: tenant.id, slug, users, names };
}

/** Firm A's job for the route walk, opened as the API opens one. */
export const jobsWalk: WalkerFixture = {
  async prepare({ db, tenantA, ownerA }) {
    const { customerId, siteId } = await newCustomer(db, tenantA, `Walker Jobs ${unique()}`);
    const scope = { tenantId: tenantA };
    const job = await withTenant(db, scope, (tx) =>
      createJob(tx, scope, ownerA, {
        title: 'Walker garage floor',
        customerId,
        siteId,
        source: 'walker',
      }),
    );
    return { jobId: job.id, walkerCustomerId: customerId, walkerSiteId: siteId };
  },
  bodies: {
    'POST /api/v1/jobs': (_firm, params) => ({
      title: 'Walker workshop floor',
      customerId: params['walkerCustomerId'],
      siteId: params['walkerSiteId'],
      valueEstimateMinor: 125_000,
    }),
    'PATCH /api/v1/jobs/:jobId': () => ({ source: 'walker' }),
    'POST /api/v1/jobs/:jobId/moves': () => ({ to: 'survey_booked' }),
    'POST /api/v1/jobs/:jobId/notes': () => ({ body: 'Walker checked the gate code.' }),
  },
};
