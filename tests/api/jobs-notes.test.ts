import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { withTenant } from '@latchwork/shared-db';
import { createTestApi } from './api-harness';
import { sessionFor, type TestSession } from './sessions';
import { newCustomer, newFirm } from './walker/jobs';

const { app, deps } = createTestApi();
afterAll(() => deps.close());

const as = (s: TestSession) => ({ Cookie: s.cookie, 'X-XSRF-TOKEN': s.csrfToken });
let firm: Awaited<ReturnType<typeof newFirm>>;
let estimator: TestSession;
let jobId: string;

beforeAll(async () => {
  firm = await newFirm(deps.db);
  estimator = await sessionFor(deps.db, firm.users.estimator, firm.tenantId);
  const { customerId } = await newCustomer(deps.db, firm.tenantId);
  const job = await request(app)
    .post('/api/v1/jobs')
    .set(as(estimator))
    .send({ title: 'Gym floor, two halls', customerId })
    .expect(201);
  jobId = job.body.id;
});

const note = (body: string) =>
  request(app).post(`/api/v1/jobs/${jobId}/notes`).set(as(estimator)).send({ body });

const emailLog = () =>
  withTenant(deps.db, { tenantId: firm.tenantId }, (tx) =>
    tx.selectFrom('emailLog').selectAll().where('tenantId', '=', firm.tenantId).execute(),
  );

describe('POST /api/v1/jobs/:jobId/notes', () => {
  it('queues a mention e-mail to each member named, with a link to the job', async () => {
    const res = await note(
      '@orla brennick and @Ivo Dunmere: the slab in hall 2 is damp, see ivo@site.test',
    ).expect(201);
    expect(res.body.mentions.map((m: { name: string }) => m.name).sort()).toEqual([
      'Ivo Dunmere',
      'Orla Brennick',
    ]);
    const log = await emailLog();
    expect(log.map((l) => [l.toAddress, l.template]).sort()).toEqual([
      [`installer-${firm.slug}@job-tests.test`, 'mention'],
      [`owner-${firm.slug}@job-tests.test`, 'mention'],
    ]);
    expect(log[0]?.subject).toContain('Ezra Tolland mentioned you on JT-00001');
    // The queue holds the job under the log row's id (the worker's contract).
    for (const row of log) {
      const queued = await deps.mailQueue.getJob(row.id);
      expect(queued?.data).toMatchObject({
        to: row.toAddress,
        template: 'mention',
        params: { url: expect.stringMatching(new RegExp(`/jobs/${jobId}$`)) },
      });
    }
    const timeline = await request(app)
      .get(`/api/v1/jobs/${jobId}/timeline`)
      .set(as(estimator))
      .expect(200);
    const summaries = timeline.body.items.map((e: { summary: string }) => e.summary);
    expect(summaries).toContain('E-mailed Ivo Dunmere about the mention');
    expect(summaries).toContain('E-mailed Orla Brennick about the mention');
    const added = timeline.body.items.find((e: { kind: string }) => e.kind === 'note');
    expect(added.noteBody).toContain('the slab in hall 2 is damp');
  });

  it('e-mails nobody for an address, an unknown name or the author’s own name', async () => {
    const before = (await emailLog()).length;
    const res = await note('Copy to bea@quillan.test; @Nobody Here; note to self @Ezra Tolland');
    expect(res.status).toBe(201);
    expect(res.body.emailed).toEqual([]);
    expect(await emailLog()).toHaveLength(before);
  });

  it('refuses an empty note', async () => {
    const res = await note('   ').expect(400);
    expect(res.body.error.details.problems[0].path).toBe('body');
  });
});

describe('GET /api/v1/jobs/:jobId/timeline', () => {
  it('pages newest first with no event twice and none left out', async () => {
    for (let i = 0; i < 5; i++) await note(`Paging note ${i}`).expect(201);
    const seen: string[] = [];
    let before: string | null = null;
    let pages = 0;
    do {
      const res: request.Response = await request(app)
        .get(`/api/v1/jobs/${jobId}/timeline`)
        .query({ limit: 3, ...(before ? { before } : {}) })
        .set(as(estimator))
        .expect(200);
      seen.push(...res.body.items.map((e: { id: string }) => e.id));
      before = res.body.nextBefore;
      pages++;
    } while (before);
    const all = await withTenant(deps.db, { tenantId: firm.tenantId }, (tx) =>
      tx
        .selectFrom('jobEvent')
        .select(['id', 'createdAt'])
        .where('jobId', '=', jobId)
        .orderBy('createdAt', 'desc')
        .orderBy('id', 'desc')
        .execute(),
    );
    expect(seen).toEqual(all.map((e) => e.id));
    expect(pages).toBe(Math.ceil(all.length / 3));
  });
});
