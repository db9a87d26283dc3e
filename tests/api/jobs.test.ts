import request from 'supertest';
import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { withTenant } from '@latchwork/shared-db';
import { createTestApi } from './api-harness';
import { sessionFor, type TestSession } from './sessions';
import { newCustomer, newFirm } from './walker/jobs';

const { app, deps } = createTestApi();
afterAll(() => deps.close());

const as = (s: TestSession) => ({ Cookie: s.cookie, 'X-XSRF-TOKEN': s.csrfToken });
let firm: Awaited<ReturnType<typeof newFirm>>;
let owner: TestSession;
let estimator: TestSession;
let links: { customerId: string; siteId: string };

beforeAll(async () => {
  // A firm of its own: every job number it hands out is this file's to count.
  firm = await newFirm(deps.db, 'KT/');
  owner = await sessionFor(deps.db, firm.users.owner, firm.tenantId);
  estimator = await sessionFor(deps.db, firm.users.estimator, firm.tenantId);
  links = await newCustomer(deps.db, firm.tenantId);
});

const create = (s: TestSession, body: object) =>
  request(app)
    .post('/api/v1/jobs')
    .set(as(s))
    .send({ title: 'Garage floor', customerId: links.customerId, ...body });

describe('job references', () => {
  it('gives 20 parallel creations the numbers 1..20: no duplicate, no gap', async () => {
    const results = await Promise.all(
      Array.from({ length: 20 }, (_, i) => create(estimator, { title: `Parallel bay ${i}` })),
    );
    for (const r of results) expect(r.status, JSON.stringify(r.body)).toBe(201);
    const refs = results.map((r) => r.body.reference as string).sort();
    // Expected list built by hand from the prefix and 5-digit padding (the references rule).
    expect(refs).toEqual(
      Array.from({ length: 20 }, (_, i) => `KT/${String(i + 1).padStart(5, '0')}`),
    );
  });

  it('leaves no gap when a creation holding the counter rolls back', async () => {
    // Another transaction takes the next number and holds the counter's lock while five
    // creations queue behind it; it then rolls back, so its number must be handed out again.
    let release!: () => void;
    const held = new Promise<void>((r) => (release = r));
    let taken = 0;
    const blocker = withTenant(deps.db, { tenantId: firm.tenantId }, async (tx) => {
      const row = await tx
        .updateTable('jobCounter')
        .set({ lastNumber: sql`last_number + 1` })
        .where('tenantId', '=', firm.tenantId)
        .returning('lastNumber')
        .executeTakeFirstOrThrow();
      taken = row.lastNumber;
      await held;
      throw new Error('roll back');
    }).catch((e: Error) => e.message);
    await new Promise((r) => setTimeout(r, 100));
    const queued = Array.from({ length: 5 }, (_, i) => create(owner, { title: `Queued ${i}` }));
    await new Promise((r) => setTimeout(r, 300));
    release();
    expect(await blocker).toBe('roll back');
    const numbers = (await Promise.all(queued)).map((r) => Number(r.body.reference.slice(3)));
    expect(taken).toBe(21);
    expect(numbers.sort((a, b) => a - b)).toEqual([21, 22, 23, 24, 25]);
  });
});

describe('POST /api/v1/jobs', () => {
  it('opens the job at Enquiry with its history line and timeline event', async () => {
    const res = await create(estimator, {
      siteId: links.siteId,
      valueEstimateMinor: 482_500,
      source: 'Website form',
      ownerUserId: firm.users.estimator,
      enquiryOn: '2026-03-02',
      surveyAt: '2026-03-09T09:30:00Z',
      quoteDueOn: '2026-03-16',
      installStartOn: '2026-04-06',
      installEndOn: '2026-04-08',
    }).expect(201);
    expect(res.body).toMatchObject({
      stage: 'enquiry',
      valueEstimateMinor: 482_500,
      source: 'Website form',
      owner: { id: firm.users.estimator, name: 'Ezra Tolland' },
      site: { id: links.siteId, postcode: 'BT1 4QQ' },
      enquiryOn: '2026-03-02',
      quoteDueOn: '2026-03-16',
      installEndOn: '2026-04-08',
      // From the transition grid's Enquiry row (libs/jobs/domain/README.md).
      nextStages: ['survey_booked', 'surveyed', 'quoted', 'lost', 'on_hold', 'cancelled'],
    });
    expect(new Date(res.body.surveyAt).toISOString()).toBe('2026-03-09T09:30:00.000Z');
    const history = await request(app)
      .get(`/api/v1/jobs/${res.body.id}/stage-history`)
      .set(as(owner))
      .expect(200);
    expect(history.body).toMatchObject([
      { from: null, to: 'enquiry', movedBy: { id: firm.users.estimator } },
    ]);
    const timeline = await request(app)
      .get(`/api/v1/jobs/${res.body.id}/timeline`)
      .set(as(owner))
      .expect(200);
    expect(timeline.body.items.map((e: { kind: string }) => e.kind)).toEqual(['created']);
  });

  it('refuses a site of another customer, an owner from outside and a float value', async () => {
    const other = await newCustomer(deps.db, firm.tenantId);
    const site = await create(owner, { siteId: other.siteId }).expect(400);
    expect(site.body.error.details.problems).toEqual([
      { path: 'siteId', message: expect.stringContaining('not one of this customer') },
    ]);
    const stranger = await create(owner, { ownerUserId: '00000000-0000-4000-8000-000000000000' });
    expect(stranger.status).toBe(400);
    expect(stranger.body.error.details.problems[0].path).toBe('ownerUserId');
    const float = await create(owner, { valueEstimateMinor: 1234.5 }).expect(400);
    expect(float.body.error.details.problems[0].path).toBe('valueEstimateMinor');
    const backwards = await create(owner, {
      installStartOn: '2026-05-02',
      installEndOn: '2026-05-01',
    }).expect(400);
    expect(backwards.body.error.details.problems[0].path).toBe('installEndOn');
  });
});

describe('PATCH /api/v1/jobs/:jobId', () => {
  it('changes what is given, records what changed, and drops the site with a new customer', async () => {
    const job = (await create(owner, { siteId: links.siteId }).expect(201)).body;
    const other = await newCustomer(deps.db, firm.tenantId);
    const res = await request(app)
      .patch(`/api/v1/jobs/${job.id}`)
      .set(as(owner))
      .send({ customerId: other.customerId, valueEstimateMinor: 99_000, title: 'Gym floor' })
      .expect(200);
    expect(res.body).toMatchObject({
      title: 'Gym floor',
      customer: { id: other.customerId },
      site: null,
      valueEstimateMinor: 99_000,
      stage: 'enquiry',
    });
    const timeline = await request(app)
      .get(`/api/v1/jobs/${job.id}/timeline`)
      .set(as(owner))
      .expect(200);
    expect(timeline.body.items[0]).toMatchObject({ kind: 'updated' });
    expect(timeline.body.items[0].detail.changed.sort()).toEqual(
      ['customerId', 'siteId', 'title', 'valueEstimateMinor'].sort(),
    );
    // Sending the same values again changes nothing and adds no line.
    await request(app)
      .patch(`/api/v1/jobs/${job.id}`)
      .set(as(owner))
      .send({ title: 'Gym floor', surveyAt: null })
      .expect(200);
    const again = await request(app).get(`/api/v1/jobs/${job.id}/timeline`).set(as(owner));
    expect(again.body.items).toHaveLength(timeline.body.items.length);
  });

  it('answers 404 for an unknown job', async () => {
    await request(app)
      .patch('/api/v1/jobs/00000000-0000-4000-8000-000000000000')
      .set(as(owner))
      .send({ title: 'x' })
      .expect(404);
  });
});
