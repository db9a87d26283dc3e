import type { Kysely } from 'kysely';
import { withTenant, type Database, type Role } from '@latchwork/shared-db';
import scenario from './demo-scenario.json';

/**
 * Loads the demo scenario into an empty database. Later features add their own demo data
 * by extending this function with a step per domain, each inside the tenant's scope.
 */
export async function seedDemo(db: Kysely<Database>): Promise<string> {
  const tenantIds = new Map<string, string>();
  for (const t of scenario.tenants) {
    const row = await db.insertInto('tenant').values(t).returning('id').executeTakeFirstOrThrow();
    tenantIds.set(t.slug, row.id);
  }
  for (const person of scenario.people) {
    const user = await db
      .insertInto('appUser')
      .values({ email: person.email, name: person.name })
      .returning('id')
      .executeTakeFirstOrThrow();
    for (const m of person.memberships) {
      const tenantId = tenantIds.get(m.tenant);
      if (!tenantId) throw new Error(`unknown demo tenant ${m.tenant}`);
      await withTenant(db, { tenantId }, (tx) =>
        tx
          .insertInto('membership')
          .values({ tenantId, userId: user.id, role: m.role as Role })
          .execute(),
      );
    }
  }
  return `${scenario.tenants.length} firms, ${scenario.people.length} people`;
}
