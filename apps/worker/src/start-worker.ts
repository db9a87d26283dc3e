import { Worker } from 'bullmq';
import type { Redis } from 'ioredis';
import type { Logger } from 'pino';
import {
  createReorderQueue,
  MAIL_QUEUE,
  REORDER_QUEUE,
  type MailJob,
  type ReorderJob,
} from '@latchwork/shared-queues';
import { mailProcessor, type MailProcessorDeps } from './mail.processor';
import { reorderProcessor } from './reorder.processor';

/** Starts one BullMQ worker per queue. Returned so tests and main.ts can close them. */
export function startWorkers(
  connection: Redis,
  deps: MailProcessorDeps,
  logger: Logger,
  options: { prefix?: string } = {},
): Worker[] {
  const mail = new Worker<MailJob>(MAIL_QUEUE, mailProcessor(deps), {
    connection,
    concurrency: 4,
    prefix: options.prefix,
  });
  // The sync job adds schedulers: the processor needs the queue itself, closed with the worker.
  const reorderQueue = createReorderQueue(connection, options.prefix);
  const reorder = new Worker<ReorderJob>(
    REORDER_QUEUE,
    reorderProcessor({ db: deps.db, queue: reorderQueue }),
    { connection, concurrency: 1, prefix: options.prefix },
  );
  reorder.on('closed', () => void reorderQueue.close());
  for (const worker of [mail, reorder]) {
    worker.on('completed', (job) => logger.info({ queue: worker.name, jobId: job.id }, 'job done'));
    worker.on('failed', (job, err) =>
      logger.warn(
        { queue: worker.name, jobId: job?.id, attempts: job?.attemptsMade, err: err.message },
        'job failed',
      ),
    );
    worker.on('error', (err) => logger.error({ err }, 'worker error'));
  }
  return [mail, reorder];
}

/**
 * Graceful stop: `close()` lets the job in hand finish; if it has not within the grace
 * period, force-close so its lock lapses and another worker copy picks the job up again.
 */
export async function stopWorkers(workers: Worker[], graceMs = 20_000): Promise<void> {
  let timer: NodeJS.Timeout | undefined;
  const forced = new Promise<'forced'>(
    (resolve) => (timer = setTimeout(() => resolve('forced'), graceMs)),
  );
  const outcome = await Promise.race([Promise.all(workers.map((w) => w.close())), forced]);
  clearTimeout(timer);
  if (outcome === 'forced') await Promise.all(workers.map((w) => w.close(true)));
}
