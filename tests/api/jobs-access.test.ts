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
let other: Awaited<ReturnType<typeof newFirm>>;
const s = {} as Record<'owner' | 'installer' | 'stores' | 'bookkeeper' | 'otherOwner', TestSession>;
const jobs: string[] = [];

beforeAll(async () => {
  firm = await newFirm(deps.db);
  other = await newFirm(deps.db);
  for (const role of ['owner', 'installer', 'stores', 'bookkeeper'] as const)
    s[role] = await sessionFor(deps.db, firm.users[role], firm.tenantId);
  s.otherOwner = await sessionFor(deps.db, other.users.owner, other.tenantId);
  const { customerId } = await newCustomer(deps.db, firm.tenantId);
  for (const title of ['Garage A', 'Garage B', 'Garage C']) {
    const res = await request(app)
      .post('/api/v1/jobs')
      .set(as(s.owner))
      .send({ title, customerId, valueEstimateMinor: 10_000 })
      .expect(201);
    jobs.push(res.body.id);
  }
});

const get = (who: TestSession, path: string) => request(app).get(`/api/v1${path}`).set(as(who));
const total = async (who: TestSession, path: string) => (await get(who, path).expect(200)).body;

describe('who sees which jobs', () => {
  it('shows an installer no job until they are on its crew, then exactly that job', async () => {
    expect((await total(s.installer, '/jobs')).total).toBe(0);
    expect((await total(s.installer, '/jobs/board')).all.count).toBe(0);
    await get(s.installer, `/jobs/${jobs[1]}`).expect(404);
    await get(s.installer, `/jobs/${jobs[1]}/timeline`).expect(404);

    await withTenant(deps.db, { tenantId: firm.tenantId }, (tx) =>
      tx
        .insertInto('jobCrew')
        .values({ tenantId: firm.tenantId, jobId: jobs[1] ?? '', userId: firm.users.installer })
        .execute(),
    );
    const list = await total(s.installer, '/jobs');
    expect(list.total).toBe(1);
    expect(list.items.map((j: { id: string }) => j.id)).toEqual([jobs[1]]);
    expect((await total(s.installer, '/jobs/board')).all).toMatchObject({
      count: 1,
      valueMinor: 10_000,
    });
    await get(s.installer, `/jobs/${jobs[1]}`).expect(200);
    await get(s.installer, `/jobs/${jobs[1]}/stage-history`).expect(200);
    await get(s.installer, `/jobs/${jobs[0]}`).expect(404);
    const csv = (await get(s.installer, '/jobs/export.csv').expect(200)).text;
    expect(csv.trim().split('\r\n')).toHaveLength(2);
  });

  it('lets stores and the bookkeeper read every job but change none', async () => {
    for (const who of [s.stores, s.bookkeeper]) {
      expect((await total(who, '/jobs')).total).toBe(3);
      await get(who, `/jobs/${jobs[0]}`).expect(200);
      await request(app)
        .post(`/api/v1/jobs/${jobs[0]}/moves`)
        .set(as(who))
        .send({ to: 'survey_booked' })
        .expect(403);
      await request(app)
        .post(`/api/v1/jobs/${jobs[0]}/notes`)
        .set(as(who))
        .send({ body: 'hello' })
        .expect(403);
      await request(app).patch(`/api/v1/jobs/${jobs[0]}`).set(as(who)).send({}).expect(403);
    }
  });

  it('answers 404 to another firm for every one of this firm’s jobs, and lists none of them', async () => {
    for (const path of ['', '/timeline', '/stage-history'])
      await get(s.otherOwner, `/jobs/${jobs[0]}${path}`).expect(404);
    await request(app)
      .post(`/api/v1/jobs/${jobs[0]}/moves`)
      .set(as(s.otherOwner))
      .send({ to: 'survey_booked' })
      .expect(404);
    expect((await total(s.otherOwner, '/jobs')).total).toBe(0);
    const header = await get(s.owner, `/jobs/${jobs[0]}`).expect(200);
    expect(header.body.stage).toBe('enquiry');
  });
});
