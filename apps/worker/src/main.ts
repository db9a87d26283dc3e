import { createDb } from '@latchwork/shared-db';
import {
  createMailerFromEnv,
  createRedisConnection,
  createReorderQueue,
  scheduleReorderSync,
} from '@latchwork/shared-queues';
import { createLogger, requiredEnv } from '@latchwork/shared-server-kit';
import { startWorkers, stopWorkers } from './start-worker';

const logger = createLogger('worker');
const db = createDb({
  connectionString: requiredEnv('DATABASE_URL'),
  applicationName: 'latchwork-worker',
  max: 5,
});
const connection = createRedisConnection(requiredEnv('REDIS_URL'));
const mailer = createMailerFromEnv();
const workers = startWorkers(
  connection,
  { db, mailer, from: process.env['MAIL_FROM'] ?? 'Latchwork <no-reply@latchwork.test>' },
  logger,
);
logger.info(`worker started: ${workers.map((w) => w.name).join(', ')}`);
// Nightly reorder: keep the daily sync scheduled and sync the firms' schedulers now.
const reorderQueue = createReorderQueue(connection);
void scheduleReorderSync(reorderQueue)
  .catch((err: Error) => logger.error({ err }, 'could not schedule the nightly reorder'))
  .finally(() => void reorderQueue.close());

async function shutdown(signal: string) {
  logger.info({ signal }, 'worker stopping; finishing the jobs in hand');
  await stopWorkers(workers);
  await db.destroy();
  connection.disconnect();
  mailer.close();
  process.exit(0);
}
process.once('SIGTERM', () => void shutdown('SIGTERM'));
process.once('SIGINT', () => void shutdown('SIGINT'));
