import request from 'supertest';
import Papa from 'papaparse';
import Decimal from 'decimal.js';
import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { withTenant } from '@latchwork/shared-db';
import { pipelineSummary, STAGES, type PipelineJob, type Stage } from '@latchwork/jobs-domain';
import { createTestApi } from './api-harness';
import { sessionFor, type TestSession } from './sessions';
import { newCustomer, newFirm } from './walker/jobs';

const { app, deps } = createTestApi();
afterAll(() => deps.close());

const as = (s: TestSession) => ({ Cookie: s.cookie, 'X-XSRF-TOKEN': s.csrfToken });
let firm: Awaited<ReturnType<typeof newFirm>>;
let owner: TestSession;
const customers: string[] = [];
const TITLES = ['Garage floor', 'Workshop', 'Gym', 'Warehouse aisles', 'Showroom'];

beforeAll(async () => {
  firm = await newFirm(deps.db);
  owner = await sessionFor(deps.db, firm.users.owner, firm.tenantId);
  customers.push((await newCustomer(deps.db, firm.tenantId, 'Harrowgate Motors')).customerId);
  customers.push((await newCustomer(deps.db, firm.tenantId, 'Lindqvist Fitness')).customerId);
  const owners = [firm.users.owner, firm.users.estimator, null];
  for (let i = 0; i < 36; i++) {
    await request(app)
      .post('/api/v1/jobs')
      .set(as(owner))
      .send({
        title: `${TITLES[i % 5]} ${i}`,
        customerId: customers[i % 2],
        ownerUserId: owners[i % 3],
        // Every seventh job has no figure yet; the rest odd pence so sums are not round.
        valueEstimateMinor: i % 7 === 3 ? null : 100_001 + i * 12_345,
        enquiryOn: `2026-0${1 + (i % 6)}-1${i % 10}`,
      })
      .expect(201);
  }
  // Spread the jobs over the stages straight in the table: the board reads the stage column.
  await withTenant(deps.db, { tenantId: firm.tenantId }, (tx) =>
    sql`update job set stage = (${sql.val([...STAGES])}::text[])[1 + (number * 7) % 13]
        where tenant_id = ${firm.tenantId}`.execute(tx),
  );
});

/** The firm's jobs as the domain's pipeline functions take them, straight from SQL. */
async function jobsFromSql(): Promise<PipelineJob[]> {
  const rows = await withTenant(deps.db, { tenantId: firm.tenantId }, (tx) =>
    tx.selectFrom('job').selectAll().where('tenantId', '=', firm.tenantId).execute(),
  );
  return rows.map((r) => ({
    id: r.id,
    reference: r.reference,
    title: r.title,
    stage: r.stage as Stage,
    valueMinor: r.valueEstimateMinor === null ? null : Number(r.valueEstimateMinor),
    ownerId: r.ownerUserId,
    customerId: r.customerId,
    enquiredOn: r.enquiryOn,
  }));
}

const get = (path: string) => request(app).get(`/api/v1${path}`).set(as(owner)).expect(200);

describe('GET /api/v1/jobs/board', () => {
  it('gives each column the count and value PostgreSQL sums for that stage', async () => {
    const truth = await withTenant(deps.db, { tenantId: firm.tenantId }, (tx) =>
      sql<{ stage: string; n: string; v: string | null }>`
        select stage, count(*) as n, sum(value_estimate_minor) as v from job
        where tenant_id = ${firm.tenantId} group by stage`.execute(tx),
    );
    const board = (await get('/jobs/board')).body;
    expect(board.columns.map((c: { stage: string }) => c.stage)).toEqual([...STAGES]);
    for (const column of board.columns) {
      const row = truth.rows.find((r) => r.stage === column.stage);
      expect([column.stage, column.count, column.valueMinor]).toEqual([
        column.stage,
        Number(row?.n ?? 0),
        Number(row?.v ?? 0),
      ]);
      expect(column.cards).toHaveLength(Math.min(column.count, 30));
    }
    expect(board.all.count).toBe(36);
  });

  it('filters as the domain’s pipelineSummary does (owner, customer, dates, value)', async () => {
    const filter = {
      ownerIds: [firm.users.estimator, null],
      customerIds: [customers[0] ?? ''],
      dateField: 'enquiredOn' as const,
      from: '2026-02-01',
      to: '2026-05-31',
      minValueMinor: 150_000,
      maxValueMinor: 450_000,
    };
    const expected = pipelineSummary(await jobsFromSql(), filter);
    const query =
      `owner=${firm.users.estimator},none&customer=${customers[0]}` +
      '&dateField=enquiryOn&from=2026-02-01&to=2026-05-31&minValue=150000&maxValue=450000';
    const board = (await get(`/jobs/board?${query}`)).body;
    expect(board.all.count).toBeGreaterThan(0);
    expect(board.all.count).toBeLessThan(36);
    expect(board.all).toEqual(expected.all);
    expect(board.openPipeline).toEqual(expected.openPipeline);
    for (const column of board.columns) {
      const want = expected.stages.find((s) => s.stage === column.stage);
      expect([column.count, column.valueMinor, column.unvalued]).toEqual([
        want?.count,
        want?.valueMinor,
        want?.unvalued,
      ]);
    }
  });

  it('pages one column: the next cards follow on with no repeat', async () => {
    const board = (await get('/jobs/board?limit=1')).body;
    const busiest = board.columns.reduce((a: { count: number }, b: { count: number }) =>
      b.count > a.count ? b : a,
    );
    expect(busiest.count).toBeGreaterThan(2);
    expect(busiest.more).toBe(true);
    const rest = (await get(`/jobs/board?column=${busiest.stage}&offset=1&limit=30`)).body;
    expect(rest.more).toBe(false);
    const ids = [busiest.cards[0].id, ...rest.cards.map((c: { id: string }) => c.id)];
    expect(new Set(ids).size).toBe(busiest.count);
  });
});

describe('GET /api/v1/jobs', () => {
  it('sorts by value on the server with unvalued jobs last, and pages', async () => {
    const all = await jobsFromSql();
    const page1 = (await get('/jobs?sort=value&dir=asc&pageSize=10')).body;
    const page4 = (await get('/jobs?sort=value&dir=asc&pageSize=10&page=4')).body;
    expect(page1.total).toBe(36);
    expect(page4.items).toHaveLength(6);
    const values = all
      .map((j) => j.valueMinor)
      .sort((a, b) => (a === null ? 1 : b === null ? -1 : a - b));
    expect(page1.items.map((j: { valueEstimateMinor: number }) => j.valueEstimateMinor)).toEqual(
      values.slice(0, 10),
    );
    expect(page4.items.at(-1).valueEstimateMinor).toBeNull();
  });

  it('searches titles and customer names', async () => {
    const gyms = (await get('/jobs?q=gym')).body;
    // Titles cycle through five words: jobs 2, 7, 12 … 32 are gyms.
    expect(gyms.total).toBe(7);
    expect(gyms.items.every((j: { title: string }) => j.title.startsWith('Gym'))).toBe(true);
    const byCustomer = (await get('/jobs?q=lindqvist&pageSize=100')).body;
    expect(byCustomer.total).toBe(18);
    expect(new Set(byCustomer.items.map((j: { customerId: string }) => j.customerId))).toEqual(
      new Set([customers[1]]),
    );
  });
});

describe('GET /api/v1/jobs/export.csv', () => {
  it('writes the filtered, sorted jobs as CSV that papaparse reads back', async () => {
    const res = await get(`/jobs/export.csv?customer=${customers[0]}&sort=reference&dir=asc`);
    expect(res.headers['content-type']).toContain('text/csv');
    expect(res.headers['content-disposition']).toMatch(
      /attachment; filename="?jobs-\d{4}-\d{2}-\d{2}\.csv/,
    );
    const parsed = Papa.parse<string[]>(res.text.replace(/^\uFEFF/, ''), { skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    const [header, ...rows] = parsed.data;
    expect(header?.slice(0, 5)).toEqual(['Reference', 'Title', 'Customer', 'Stage', 'Value']);
    const mine = (await jobsFromSql())
      .filter((j) => j.customerId === customers[0])
      .sort((a, b) => a.reference.localeCompare(b.reference));
    expect(rows.map((r) => r[0])).toEqual(mine.map((j) => j.reference));
    for (const [i, job] of mine.entries()) {
      expect(rows[i]?.[2]).toBe('Harrowgate Motors');
      // Minor units to pounds with decimal.js as the outside reference.
      const pounds = job.valueMinor === null ? '' : new Decimal(job.valueMinor).div(100).toFixed(2);
      expect(rows[i]?.[4]).toBe(pounds);
    }
  });
});
