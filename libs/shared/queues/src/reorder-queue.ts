import { Queue, type ConnectionOptions } from 'bullmq';
import { z } from 'zod';

/**
 * The nightly reorder: a job scheduler per firm runs `run` for that firm at 02:30, and a
 * `sync` scheduler a quarter of an hour earlier adds schedulers for new firms and drops those
 * of firms that turned the nightly run off. The worker does the work (apps/worker).
 */
export const REORDER_QUEUE = 'reorder';
export const REORDER_NIGHTLY_PATTERN = '30 2 * * *';
export const REORDER_SYNC_PATTERN = '15 2 * * *';
export const REORDER_SYNC_SCHEDULER = 'reorder-sync';

export const reorderJobSchema = z.object({ tenantId: z.uuid().optional() });
export type ReorderJob = z.infer<typeof reorderJobSchema>;

/** The id of a firm's nightly scheduler. */
export const reorderSchedulerId = (tenantId: string) => `reorder:${tenantId}`;

/** `prefix` namespaces the Redis keys, as for the mail queue (tests use their own). */
export function createReorderQueue(
  connection: ConnectionOptions,
  prefix?: string,
): Queue<ReorderJob> {
  return new Queue<ReorderJob>(REORDER_QUEUE, {
    connection,
    prefix,
    defaultJobOptions: {
      attempts: 3,
      backoff: { type: 'exponential', delay: 60_000 },
      removeOnComplete: { age: 14 * 24 * 3600 },
      removeOnFail: { age: 30 * 24 * 3600 },
    },
  });
}

/** Keeps the daily sync scheduled and asks for a sync now (the worker's start calls it). */
export async function scheduleReorderSync(queue: Queue<ReorderJob>): Promise<void> {
  await queue.upsertJobScheduler(
    REORDER_SYNC_SCHEDULER,
    { pattern: REORDER_SYNC_PATTERN },
    { name: 'sync', data: {} },
  );
  await queue.add('sync', {});
}

/** Makes the firms' nightly schedulers exactly `tenantIds`: adds the missing, removes the rest. */
export async function syncReorderSchedulers(
  queue: Queue<ReorderJob>,
  tenantIds: readonly string[],
): Promise<{ added: number; removed: number }> {
  const wanted = new Set(tenantIds.map(reorderSchedulerId));
  const existing = (await queue.getJobSchedulers(0, -1))
    .map((s) => s.key)
    .filter((key) => key.startsWith('reorder:'));
  let removed = 0;
  for (const key of existing)
    if (!wanted.has(key)) removed += (await queue.removeJobScheduler(key)) ? 1 : 0;
  const have = new Set(existing);
  let added = 0;
  for (const tenantId of tenantIds) {
    const id = reorderSchedulerId(tenantId);
    if (have.has(id)) continue;
    await queue.upsertJobScheduler(
      id,
      { pattern: REORDER_NIGHTLY_PATTERN },
      { name: 'run', data: { tenantId } },
    );
    added++;
  }
  return { added, removed };
}
