import type { Job, Queue } from 'bullmq';
import type { Kysely } from 'kysely';
import { withTenant, type Database } from '@latchwork/shared-db';
import { reorderJobSchema, syncReorderSchedulers, type ReorderJob } from '@latchwork/shared-queues';
import { runReorder } from '@latchwork/stock-server';

export interface ReorderProcessorDeps {
  db: Kysely<Database>;
  queue: Queue<ReorderJob>;
}

/** Firms whose nightly reorder is on (the default until the owner turns it off). */
async function nightlyFirms(db: Kysely<Database>): Promise<string[]> {
  const tenants = await db.selectFrom('tenant').select('id').orderBy('id').execute();
  const on: string[] = [];
  for (const { id } of tenants) {
    const setting = await withTenant(db, { tenantId: id }, (tx) =>
      tx
        .selectFrom('stockControlSetting')
        .select('nightlyReorder')
        .where('tenantId', '=', id)
        .executeTakeFirst(),
    );
    if (setting?.nightlyReorder ?? true) on.push(id);
  }
  return on;
}

/**
 * `sync`: one nightly scheduler per firm with the run on. `run`: the firm's reorder run, which
 * drafts purchase orders for what is at or below its reorder point (it never duplicates a
 * line already on an open order, so a retry or a second run orders nothing twice).
 */
export function reorderProcessor(deps: ReorderProcessorDeps) {
  return async (job: Job<ReorderJob>) => {
    const data = reorderJobSchema.parse(job.data);
    if (job.name === 'sync') return syncReorderSchedulers(deps.queue, await nightlyFirms(deps.db));
    if (!data.tenantId) throw new Error('a reorder run names its firm');
    const scope = { tenantId: data.tenantId };
    return withTenant(deps.db, scope, async (tx) => {
      const setting = await tx
        .selectFrom('stockControlSetting')
        .select('nightlyReorder')
        .where('tenantId', '=', scope.tenantId)
        .executeTakeFirst();
      // Turned off since the last sync: the scheduler goes at the next sync; skip tonight.
      if (setting && !setting.nightlyReorder) return { skipped: true, created: [] };
      const result = await runReorder(tx, scope, null);
      return {
        skipped: false,
        created: result.created.map((c) => c.reference),
        suggested: result.suggestions.filter((s) => s.order).length,
      };
    });
  };
}
