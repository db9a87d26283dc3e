import type { Kysely } from 'kysely';
import { withTenant, type Database, type Role } from '@latchwork/shared-db';
import scenario from './demo-scenario.json';
import { seededRandom, type DemoStep } from './demo-context';
import { customersDemo } from './customers-demo';
import { jobsDemo } from './jobs-demo';
import { surveyDemo } from './survey-demo';
import { stockDemo } from './stock-demo';
import { purchasingDemo } from './purchasing-demo';

/** Each feature's demo data, in order: later steps read what earlier ones wrote. */
const FEATURE_STEPS: DemoStep[] = [customersDemo, jobsDemo, surveyDemo, stockDemo, purchasingDemo];

/**
 * Loads the demo scenario into an empty database: firms and people, then each feature's demo
 * data per firm, each firm in one transaction inside its tenant scope.
 */
export async function seedDemo(db: Kysely<Database>): Promise<string> {
  const tenantIds = new Map<string, string>();
  const userIds = new Map<string, string>();
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
    userIds.set(person.email, user.id);
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
  const added: string[] = [];
  for (const [index, [slug, tenantId]] of [...tenantIds].entries()) {
    const members = new Map(
      scenario.people
        .filter((p) => p.memberships.some((m) => m.tenant === slug))
        .map((p) => [p.email, userIds.get(p.email) ?? ''] as const),
    );
    await withTenant(db, { tenantId }, async (tx) => {
      const firm = {
        tx,
        tenantId,
        slug,
        members,
        random: seededRandom(index + 1),
        today: new Date(),
      };
      for (const step of FEATURE_STEPS) {
        const said = await step(firm);
        if (said) added.push(`${slug}: ${said}`);
      }
    });
  }
  return [`${scenario.tenants.length} firms, ${scenario.people.length} people`, ...added].join(
    '; ',
  );
}
