import { Queue } from 'bullmq';
import nodemailer from 'nodemailer';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createDb, withTenant } from '@latchwork/shared-db';
import {
  createMailQueue,
  createRedisConnection,
  enqueueMail,
  type MailJob,
} from '@latchwork/shared-queues';
import { createLogger } from '@latchwork/shared-server-kit';
import { startWorkers, stopWorkers } from '../../apps/worker/src/start-worker';
import { messagesTo, stackEnv, waitForMessagesTo } from '../support/stack';

const db = createDb({ connectionString: stackEnv('DATABASE_URL'), max: 3 });
const connection = createRedisConnection(stackEnv('REDIS_URL'));
const mailer = nodemailer.createTransport({
  host: stackEnv('SMTP_HOST'),
  port: Number(stackEnv('SMTP_PORT')),
  ignoreTLS: true,
});
const logger = createLogger('worker-test', 'silent');
let queue: Queue<MailJob>;
// Keys of our own: the stack's running worker must not take these tests' jobs.
const PREFIX = `test-worker-${process.pid}`;
let tenantId: string;

async function until<T>(probe: () => Promise<T | undefined>, timeoutMs = 15_000): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const value = await probe();
    if (value !== undefined) return value;
    if (Date.now() > deadline) throw new Error('timed out waiting');
    await new Promise((r) => setTimeout(r, 100));
  }
}

const logRow = (id: string) =>
  withTenant(db, { tenantId }, (tx) =>
    tx
      .selectFrom('emailLog')
      .selectAll()
      .where('tenantId', '=', tenantId)
      .where('id', '=', id)
      .executeTakeFirstOrThrow(),
  );

beforeAll(async () => {
  queue = createMailQueue(createRedisConnection(stackEnv('REDIS_URL')), PREFIX);
  const tenant = await db
    .selectFrom('tenant')
    .select('id')
    .where('slug', '=', 'kestrel-floorworks')
    .executeTakeFirstOrThrow();
  tenantId = tenant.id;
});

afterAll(async () => {
  await queue.close();
  await db.destroy();
  connection.disconnect();
  mailer.close();
});

describe('the mail job', () => {
  it('renders, sends through SMTP to the mail fake, and records the e-mail as sent', async () => {
    const workers = startWorkers(
      connection,
      { db, mailer, from: 'Latchwork <no-reply@latchwork.test>' },
      logger,
      { prefix: PREFIX },
    );
    const to = `site-lead-${Date.now()}@wexbridge-motors.test`;
    const id = await enqueueMail(
      db,
      queue,
      { tenantId },
      {
        to,
        template: 'notice',
        params: {
          title: 'Survey booked',
          message: 'We will measure the garage on Tuesday at 9:00 <sharp>.',
        },
      },
    );
    const [message] = await waitForMessagesTo(to);
    expect(message?.subject).toBe('Survey booked');
    expect(message?.text).toContain('Tuesday at 9:00 <sharp>');
    const row = await until(async () => {
      const r = await logRow(id);
      return r.status === 'sent' ? r : undefined;
    });
    expect(row.messageId).toBeTruthy();
    expect(row.attempts).toBe(1);
    await stopWorkers(workers);
  });

  it('finishes the job in hand when asked to stop (graceful shutdown)', async () => {
    const slowMailer = {
      sendMail: async (m: object) => (
        await new Promise((r) => setTimeout(r, 800)),
        mailer.sendMail(m)
      ),
    } as typeof mailer;
    const workers = startWorkers(
      connection,
      { db, mailer: slowMailer, from: 'Latchwork <no-reply@latchwork.test>' },
      logger,
      { prefix: PREFIX },
    );
    const to = `graceful-${Date.now()}@wexbridge-motors.test`;
    const id = await enqueueMail(
      db,
      queue,
      { tenantId },
      {
        to,
        template: 'notice',
        params: { title: 'Tiles delivered', message: 'Leave the boxes in the room for 24 hours.' },
      },
    );
    await until(async () => ((await queue.getJob(id))?.processedOn ? true : undefined));
    await stopWorkers(workers);
    expect((await logRow(id)).status).toBe('sent');
    expect(await messagesTo(to)).toHaveLength(1);
  });

  it('retries a failing send with backoff and records the failure', async () => {
    const refusing = nodemailer.createTransport({
      host: '127.0.0.1',
      port: 9,
      connectionTimeout: 500,
    });
    const workers = startWorkers(
      connection,
      { db, mailer: refusing, from: 'x@latchwork.test' },
      logger,
      { prefix: PREFIX },
    );
    const id = await enqueueMail(
      db,
      queue,
      { tenantId },
      {
        to: 'nobody@wexbridge-motors.test',
        template: 'notice',
        params: { title: 'T', message: 'M' },
      },
    );
    const first = await until(async () => {
      const r = await logRow(id);
      return r.attempts >= 1 ? r : undefined;
    });
    expect(first.status).toBe('queued');
    expect(first.error).toMatch(/ECONNREFUSED|connect/i);
    const job = await queue.getJob(id);
    expect(job?.opts.attempts).toBeGreaterThan(1);
    expect(job?.opts.backoff).toMatchObject({ type: 'exponential' });
    await stopWorkers(workers);
    await job?.remove();
  });
});
