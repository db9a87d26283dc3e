import nodemailer from 'nodemailer';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { withTenant } from '@latchwork/shared-db';
import {
  createMailQueue,
  createRedisConnection,
  createReorderQueue,
  REORDER_NIGHTLY_PATTERN,
  reorderSchedulerId,
} from '@latchwork/shared-queues';
import { createLogger } from '@latchwork/shared-server-kit';
import { postMovements } from '@latchwork/stock-server';
import { createApp } from '../../apps/api/src/app';
import { createDepsFromEnv } from '../../apps/api/src/create-deps';
import { startWorkers, stopWorkers } from '../../apps/worker/src/start-worker';
import { newPlace, newSupplier, newTile, purchasingFirm } from '../api/walker/purchasing';
import { makeStockJob } from '../api/walker/stock';
import { stackEnv } from '../support/stack';

// Keys of our own: the stack's running worker must not take these tests' jobs.
const PREFIX = `test-reorder-${process.pid}`;
const deps = createDepsFromEnv();
deps.logger.level = 'silent';
const connection = createRedisConnection(stackEnv('REDIS_URL'));
// The API's sends go to our queue, so the worker started here is the one that mails them.
deps.mailQueue = createMailQueue(createRedisConnection(stackEnv('REDIS_URL')), PREFIX);
const app = createApp(deps);
const queue = createReorderQueue(createRedisConnection(stackEnv('REDIS_URL')), PREFIX);
const mailer = nodemailer.createTransport({
  host: stackEnv('SMTP_HOST'),
  port: Number(stackEnv('SMTP_PORT')),
  ignoreTLS: true,
});
let workers: ReturnType<typeof startWorkers>;
let f: Awaited<ReturnType<typeof purchasingFirm>>;
let quiet: Awaited<ReturnType<typeof purchasingFirm>>;

beforeAll(async () => {
  workers = startWorkers(
    connection,
    { db: deps.db, mailer, from: 'Latchwork <no-reply@latchwork.test>' },
    createLogger('reorder-test', 'silent'),
    { prefix: PREFIX },
  );
  f = await purchasingFirm(deps.db, app);
  quiet = await purchasingFirm(deps.db, app);
  await quiet
    .as('owner')
    .put('/stock/control-settings', {
      countApprovalGrossMinor: 10000,
      demandWindowDays: 90,
      nightlyReorder: false,
      defaultOrderCostMinor: 2500,
    })
    .expect(200);
});

afterAll(async () => {
  await stopWorkers(workers);
  await queue.obliterate({ force: true });
  await queue.close();
  await deps.mailQueue.obliterate({ force: true });
  await deps.close();
  connection.disconnect();
  mailer.close();
});

describe('the nightly reorder', () => {
  it('sync gives every firm with the nightly run a scheduler, and none to a firm without', async () => {
    const job = await queue.add('sync', {});
    await until(async () => ((await job.isCompleted()) ? true : undefined));
    const schedulers = await queue.getJobSchedulers(0, -1);
    const mine = schedulers.find((s) => s.key === reorderSchedulerId(f.tenantId));
    expect(mine).toMatchObject({ pattern: REORDER_NIGHTLY_PATTERN, name: 'run' });
    expect(schedulers.some((s) => s.key === reorderSchedulerId(quiet.tenantId))).toBe(false);
  });

  it('a run drafts the order; sent, the supplier gets the PDF through the mail fake', async () => {
    const supplier = await f.inFirm(async (tx) => {
      const s = await newSupplier(tx, f.tenantId, 3);
      const { id: productId } = await newTile(tx, f.tenantId, { supplierId: s.id });
      const { id: place } = await newPlace(tx, f.tenantId);
      await postMovements(tx, { tenantId: f.tenantId }, f.owner, [
        { kind: 'receipt', productId, toLocationId: place, quantity: 6, unitCostMinor: 150 },
      ]);
      return { ...s, productId };
    });
    // 60 tiles reserved for a job with no date yet: a reorder point of 60 against 6 on hand.
    const jobId = await makeStockJob(deps.db, f.tenantId);
    await withTenant(deps.db, { tenantId: f.tenantId }, (tx) =>
      tx
        .insertInto('reservation')
        .values({ tenantId: f.tenantId, jobId, productId: supplier.productId, quantity: 60 })
        .execute(),
    );
    const job = await queue.add('run', { tenantId: f.tenantId });
    const result = await until(async () =>
      (await job.isCompleted()) ? (await queue.getJob(job.id as string))?.returnvalue : undefined,
    );
    expect(result.created).toHaveLength(1);
    const orders = (await f.as('stores').get('/stock/purchase-orders?status=draft')).body;
    expect(orders).toHaveLength(1);
    const po = (await f.as('stores').get(`/stock/purchase-orders/${orders[0].id}`)).body;
    // Lift above 60 from 6: 55 tiles, rounded up to 3 boxes of 24.
    expect(po.lines).toMatchObject([{ productId: supplier.productId, quantity: 72 }]);

    const sent = await f
      .as('stores')
      .post(`/stock/purchase-orders/${po.id}/send`, { message: 'Ring on arrival.' })
      .expect(200);
    const [mail] = await until(async () => {
      const res = await request(stackEnv('MAIL_UI_URL')).get(
        `/api/messages?to=${encodeURIComponent(supplier.email)}`,
      );
      const list = Array.isArray(res.body) ? res.body : res.body.messages;
      return list.length > 0 ? list : undefined;
    });
    expect(mail.subject).toBe(`Purchase order ${po.reference} from Job Test Flooring ${f.slug}`);
    expect(mail.text).toContain('Ring on arrival.');
    expect(mail.attachments).toEqual([
      expect.objectContaining({
        filename: `${po.reference}.pdf`,
        contentType: 'application/pdf',
        size: expect.any(Number),
      }),
    ]);
    expect(mail.attachments[0].size).toBeGreaterThan(1000);
    // The worker recorded the send in the firm's e-mail log.
    const logged = await until(() =>
      withTenant(deps.db, { tenantId: f.tenantId }, (tx) =>
        tx
          .selectFrom('emailLog')
          .select(['status', 'template'])
          .where('id', '=', sent.body.emailLogId)
          .where('status', '=', 'sent')
          .executeTakeFirst(),
      ),
    );
    expect(logged.template).toBe('purchaseOrder');
  });
});

async function until<T>(probe: () => Promise<T | undefined>, timeoutMs = 20_000): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const value = await probe();
    if (value !== undefined) return value;
    if (Date.now() > deadline) throw new Error('timed out waiting');
    await new Promise((r) => setTimeout(r, 150));
  }
}
