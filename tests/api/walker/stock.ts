import { sql, type Kysely } from 'kysely';
import { withTenant, type Database } from '@latchwork/shared-db';
import type { WalkerFixture } from './fixture';

const unique = () => `${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`;

/**
 * A customer and a job in the firm, written straight to the tables (the stock tests must not
 * depend on the jobs API's form); the number comes from the firm's counter like any job's.
 */
export async function makeStockJob(db: Kysely<Database>, tenantId: string): Promise<string> {
  return withTenant(db, { tenantId }, async (tx) => {
    const customer = await tx
      .insertInto('customer')
      .values({ tenantId, kind: 'business', name: `Stock test customer ${unique()}` })
      .returning('id')
      .executeTakeFirstOrThrow();
    const { rows } = await sql<{ n: number }>`
      insert into job_counter (tenant_id, last_number) values (${tenantId}, 1)
      on conflict (tenant_id) do update set last_number = job_counter.last_number + 1
      returning last_number as n`.execute(tx);
    const job = await tx
      .insertInto('job')
      .values({
        tenantId,
        number: rows[0].n,
        reference: `J-${rows[0].n}`,
        title: `Stock test job ${unique()}`,
        customerId: customer.id,
      })
      .returning('id')
      .executeTakeFirstOrThrow();
    return job.id;
  });
}

/** Headers of a signed-in session for supertest. */
export const stockAs = (s: { cookie: string; csrfToken: string }) => ({
  Cookie: s.cookie,
  'X-XSRF-TOKEN': s.csrfToken,
});

/** A valid product body of `kind` with a unique SKU (tiles come in boxes of 24). */
export function productBody(kind = 'tile', extra: Record<string, unknown> = {}) {
  const tile = kind === 'tile';
  return {
    sku: stockTestName(kind.toUpperCase()),
    name: `Test ${kind} ${unique()}`,
    kind,
    attributes: tile ? { colour: 'Graphite', thicknessMm: 7, pitchMm: 500 } : {},
    unitOne: tile ? 'tile' : 'unit',
    unitOther: tile ? 'tiles' : 'units',
    packOne: 'box',
    packOther: 'boxes',
    packSize: tile ? 24 : 1,
    costMinor: 250,
    priceMinor: 420,
    ...extra,
  };
}

/** Unique names for objects the stock tests create. */
export const stockTestName = (prefix: string) => `${prefix}-${unique()}`;

// Filled as the routes land.
export const stockWalk: WalkerFixture = {
  prepare: async () => ({}),
  bodies: {},
};
