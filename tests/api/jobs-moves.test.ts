import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApi } from './api-harness';
import { sessionFor, type TestSession } from './sessions';
import { newCustomer, newFirm } from './walker/jobs';

const { app, deps } = createTestApi();
afterAll(() => deps.close());

const as = (s: TestSession) => ({ Cookie: s.cookie, 'X-XSRF-TOKEN': s.csrfToken });
let firm: Awaited<ReturnType<typeof newFirm>>;
let estimator: TestSession;
let customerId: string;

beforeAll(async () => {
  firm = await newFirm(deps.db);
  estimator = await sessionFor(deps.db, firm.users.estimator, firm.tenantId);
  customerId = (await newCustomer(deps.db, firm.tenantId)).customerId;
});

async function newJob(): Promise<string> {
  const res = await request(app)
    .post('/api/v1/jobs')
    .set(as(estimator))
    .send({ title: 'Workshop floor', customerId })
    .expect(201);
  return res.body.id;
}

const move = (jobId: string, to: string, reason?: string) =>
  request(app).post(`/api/v1/jobs/${jobId}/moves`).set(as(estimator)).send({ to, reason });

const history = async (jobId: string) =>
  (await request(app).get(`/api/v1/jobs/${jobId}/stage-history`).set(as(estimator)).expect(200))
    .body as { from: string | null; to: string; reason: string | null }[];

// Expected outcomes below are read off the transition grid in libs/jobs/domain/README.md.
describe('POST /api/v1/jobs/:jobId/moves', () => {
  it('walks a job forward through allowed moves, each with a history line and an event', async () => {
    const jobId = await newJob();
    for (const to of ['survey_booked', 'surveyed', 'quoted', 'won', 'scheduled'])
      expect((await move(jobId, to)).status).toBe(201);
    const res = await move(jobId, 'installing').expect(201);
    expect(res.body).toMatchObject({ stage: 'installing', nextStages: expect.any(Array) });
    expect((await history(jobId)).map((h) => [h.from, h.to])).toEqual([
      [null, 'enquiry'],
      ['enquiry', 'survey_booked'],
      ['survey_booked', 'surveyed'],
      ['surveyed', 'quoted'],
      ['quoted', 'won'],
      ['won', 'scheduled'],
      ['scheduled', 'installing'],
    ]);
    const timeline = await request(app)
      .get(`/api/v1/jobs/${jobId}/timeline`)
      .set(as(estimator))
      .expect(200);
    expect(timeline.body.items[0]).toMatchObject({
      kind: 'stage-move',
      summary: 'Moved from Booked in to Fitting',
      actorName: 'Ezra Tolland',
    });
  });

  it('refuses a move the table does not allow, with 409 and the domain’s sentence', async () => {
    const jobId = await newJob();
    const res = await move(jobId, 'paid').expect(409);
    expect(res.body.error.message).toContain("can't go from “Enquiry” to “Paid”");
    expect(res.body.error.details).toMatchObject({ refusal: 'not-allowed', from: 'enquiry' });
    const same = await move(jobId, 'enquiry').expect(409);
    expect(same.body.error.details.refusal).toBe('same-stage');
    expect(await history(jobId)).toHaveLength(1);
  });

  it('needs a reason to lose a job or to go backwards, and keeps it', async () => {
    const jobId = await newJob();
    await move(jobId, 'quoted').expect(201);
    const noReason = await move(jobId, 'lost', '   ').expect(409);
    expect(noReason.body.error.details.refusal).toBe('reason-required');
    const lost = await move(jobId, 'lost', 'Went with a cheaper coating').expect(201);
    expect(lost.body.lostReason).toBe('Went with a cheaper coating');
    expect((await move(jobId, 'enquiry')).status).toBe(409);
    const reopened = await move(jobId, 'quoted', 'Customer came back after a site visit');
    expect(reopened.status).toBe(201);
    expect(reopened.body.lostReason).toBeNull();
    expect((await move(jobId, 'surveyed')).body.error.details.refusal).toBe('reason-required');
    await move(jobId, 'surveyed', 'Floor area changed: measure again').expect(201);
    expect((await history(jobId)).slice(-3)).toMatchObject([
      { from: 'quoted', to: 'lost', reason: 'Went with a cheaper coating' },
      { from: 'lost', to: 'quoted', reason: 'Customer came back after a site visit' },
      { from: 'quoted', to: 'surveyed', reason: 'Floor area changed: measure again' },
    ]);
  });

  it('resumes a job on hold only to the stage it was held from', async () => {
    const jobId = await newJob();
    await move(jobId, 'survey_booked').expect(201);
    await move(jobId, 'on_hold', 'Customer abroad until June').expect(201);
    const header = await request(app).get(`/api/v1/jobs/${jobId}`).set(as(estimator)).expect(200);
    expect(header.body).toMatchObject({
      stage: 'on_hold',
      heldFrom: 'survey_booked',
      nextStages: ['survey_booked', 'cancelled'],
    });
    const elsewhere = await move(jobId, 'quoted').expect(409);
    expect(elsewhere.body.error.details.refusal).toBe('resume-elsewhere');
    await move(jobId, 'survey_booked').expect(201);
  });

  it('lets only one of four simultaneous identical moves through', async () => {
    // All start from Enquiry; the row lock makes the later ones see the first one's result.
    const jobId = await newJob();
    const tries = await Promise.all(Array.from({ length: 4 }, () => move(jobId, 'survey_booked')));
    expect(tries.map((t) => t.status).sort()).toEqual([201, 409, 409, 409]);
    expect((await history(jobId)).map((h) => h.to)).toEqual(['enquiry', 'survey_booked']);
  });

  it('checks the body: an unknown stage is a 400', async () => {
    const jobId = await newJob();
    const res = await move(jobId, 'finished').expect(400);
    expect(res.body.error.details.problems[0].path).toBe('to');
  });
});
