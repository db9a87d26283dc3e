import nodemailer from 'nodemailer';
import { createDb } from '@latchwork/shared-db';
import { createRedisConnection } from '@latchwork/shared-queues';
import { createLogger } from '@latchwork/shared-server-kit';
import { startWorkers, stopWorkers } from './start-worker';

function required(name: string): string {
  const value = process.env[name];
  if (!value) throw new Error(`Environment variable ${name} is not set`);
  return value;
}

const logger = createLogger('worker');
const db = createDb({
  connectionString: required('DATABASE_URL'),
  applicationName: 'latchwork-worker',
  max: 5,
});
const connection = createRedisConnection(required('REDIS_URL'));
const mailer = nodemailer.createTransport({
  host: required('SMTP_HOST'),
  port: Number(required('SMTP_PORT')),
  secure: false,
  ignoreTLS: process.env['SMTP_TLS'] !== 'true',
});
const workers = startWorkers(
  connection,
  { db, mailer, from: process.env['MAIL_FROM'] ?? 'Latchwork <no-reply@latchwork.test>' },
  logger,
);
logger.info(`worker started: ${workers.map((w) => w.name).join(', ')}`);

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
