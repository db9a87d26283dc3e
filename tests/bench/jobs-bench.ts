/**
 * Pipeline benchmark (issue 5, "done when"): a generated firm of 100,000 jobs over 5,000
 * customers, then the API's board, table, search and job page timed over HTTP (supertest on
 * the real app, signed in as the firm's owner). Prints median and p95 per query and the ratio
 * to the 300 ms target; it is not a timed test. The firm is deleted afterwards.
 *
 *   eval "$(node tests/support/test-env.mjs)"
 *   npx tsx --tsconfig tsconfig.base.json tests/bench/jobs-bench.ts [--runs 25] [--keep]
 */
import request from 'supertest';
import { sql } from 'kysely';
import { quantileSorted } from 'simple-statistics';
import { createDb, type Database } from '@latchwork/shared-db';
import type { Kysely } from 'kysely';
import { createTestApi } from '../api/api-harness';
import { sessionFor } from '../api/sessions';

const TARGET_MS = 300;
const argValue = (name: string) => {
  const at = process.argv.indexOf(name);
  return at === -1 ? undefined : process.argv[at + 1];
};
const RUNS = Number(argValue('--runs') ?? 25);

const ownerDb = createDb({ connectionString: process.env['DATABASE_OWNER_URL'] ?? '', max: 2 });
const { app, deps } = createTestApi();

const JOBS = 100_000;
const CUSTOMERS = 5_000;
/** The job whose page and timeline are timed. */
const SAMPLE_NUMBER = 54_321;

interface BenchFirm {
  tenantId: string;
  slug: string;
  ownerId: string;
  estimatorId: string;
  userIds: string[];
  sampleJobId: string;
  sampleReference: string;
  sampleCustomer: string;
}

/** Runs `work` as the schema owner inside the firm's row-level-security context. */
function inFirm<T>(
  db: Kysely<Database>,
  tenantId: string,
  work: (tx: Kysely<Database>) => Promise<T>,
) {
  return db.transaction().execute(async (tx) => {
    await sql`select set_config('app.tenant_id', ${tenantId}, true)`.execute(tx);
    return work(tx);
  });
}

/**
 * The generated firm, written with generate_series in a few statements (about a minute):
 * customers with one site each, jobs spread over every stage, 18 months of enquiry dates,
 * owners, values (one in eleven without), two history lines and two timeline events per job.
 */
async function createBenchFirm(db: Kysely<Database>): Promise<BenchFirm> {
  const slug = `bench-jobs-${Date.now().toString(36)}`;
  const tenant = await db
    .insertInto('tenant')
    .values({ slug, name: `Bench Flooring ${slug}` })
    .returning('id')
    .executeTakeFirstOrThrow();
  const tenantId = tenant.id;
  const userIds: string[] = [];
  const people = [
    ['owner', 'Rhona Castel'],
    ['estimator', 'Tobin Ashgrove'],
    ['estimator', 'Mina Holloway'],
    ['stores', 'Pell Udall'],
  ] as const;
  for (const [role, name] of people) {
    const user = await db
      .insertInto('appUser')
      .values({ email: `${role}-${userIds.length}-${slug}@bench.test`, name })
      .returning('id')
      .executeTakeFirstOrThrow();
    userIds.push(user.id);
    await inFirm(db, tenantId, (tx) =>
      tx.insertInto('membership').values({ tenantId, userId: user.id, role }).execute(),
    );
  }
  const owners = sql.val([userIds[0], userIds[1], userIds[2], null]);
  await inFirm(db, tenantId, async (tx) => {
    await sql`insert into customer (tenant_id, kind, name, email, postcode)
      select ${tenantId}, case when g % 3 = 0 then 'homeowner' else 'business' end,
        (array['Harrow','Linden','Brack','Osler','Quarry','Tamsin','Vell','Wickam','Yarrow','Corran'])[1 + g % 10]
          || ' ' || (array['Motors','Fitness','Logistics','Joinery','Dental','Autos','Storage','Leisure','Print','Farms'])[1 + (g / 10) % 10]
          || ' ' || g,
        'c' || g || '@' || ${slug} || '.test', 'BX' || (10 + g % 90) || ' ' || (g % 9) || 'QT'
      from generate_series(1, ${CUSTOMERS}) g`.execute(tx);
    await sql`insert into site (tenant_id, customer_id, name, address_lines, postcode)
      select tenant_id, id, 'Main site', array['Unit ' || (1 + abs(hashtext(id::text)) % 40) || ' Fernlow Park'], postcode
      from customer where tenant_id = ${tenantId}`.execute(tx);
    await sql`with c as (
        select c.id, s.id as site_id, row_number() over (order by c.id) as rn
        from customer c join site s on s.customer_id = c.id and s.tenant_id = c.tenant_id
        where c.tenant_id = ${tenantId})
      insert into job (tenant_id, number, reference, title, customer_id, site_id,
        value_estimate_minor, source, owner_user_id, stage, stage_changed_at, enquiry_on,
        quote_due_on, install_start_on, created_at)
      select ${tenantId}, g, 'J-' || lpad(g::text, greatest(5, length(g::text)), '0'),
        (array['Garage floor','Workshop floor','Gym floor','Warehouse aisles','Showroom','Car wash bay','Loading dock','Kennels'])[1 + g % 8] || ' ' || g,
        c.id, c.site_id,
        case when g % 11 = 0 then null else 50000 + (g::bigint * 7919) % 2500000 end,
        (array['Website','Referral','Returning customer','Trade show'])[1 + g % 4],
        (${owners}::uuid[])[1 + g % 4],
        (array['enquiry','survey_booked','surveyed','quoted','won','lost','scheduled','installing','completed','invoiced','paid','on_hold','cancelled'])[1 + (g * 31) % 13],
        now() - ((g * 37) % 540) * interval '1 day' + (g % 1440) * interval '1 minute',
        current_date - (540 - (g * 17) % 540)::int,
        current_date - ((g * 13) % 500)::int + 14,
        case when g % 3 = 0 then current_date - ((g * 7) % 500)::int + 30 end,
        now() - ((g * 17) % 540 + 550) * interval '1 day'
      from generate_series(1, ${JOBS}) g join c on c.rn = 1 + g % ${CUSTOMERS}`.execute(tx);
    await sql`insert into job_counter (tenant_id, last_number) values (${tenantId}, ${JOBS})`.execute(
      tx,
    );
    await sql`insert into job_stage_move (tenant_id, job_id, from_stage, to_stage, moved_by, moved_at)
      select tenant_id, id, null, 'enquiry', owner_user_id, created_at from job where tenant_id = ${tenantId}
      union all
      select tenant_id, id, case when stage = 'on_hold' then 'quoted' else 'enquiry' end, stage,
        owner_user_id, stage_changed_at
      from job where tenant_id = ${tenantId} and stage <> 'enquiry'`.execute(tx);
    await sql`insert into job_event (tenant_id, job_id, kind, summary, actor_user_id, created_at)
      select tenant_id, job_id, case when from_stage is null then 'created' else 'stage-move' end,
        'Moved to ' || to_stage, moved_by, moved_at
      from job_stage_move where tenant_id = ${tenantId}`.execute(tx);
  });
  // As autovacuum leaves a table in steady use: statistics and the visibility map for index-only scans.
  await sql`vacuum analyze customer, customer_search, site, job, job_search, job_stage_move, job_event`.execute(
    db,
  );
  const sample = await inFirm(db, tenantId, (tx) =>
    sql<{ id: string; reference: string; name: string }>`
      select j.id, j.reference, c.name from job j join customer c on c.id = j.customer_id
      where j.tenant_id = ${tenantId} and j.number = ${SAMPLE_NUMBER}`.execute(tx),
  );
  const row = sample.rows[0];
  if (!row) throw new Error('sample job missing');
  return {
    tenantId,
    slug,
    ownerId: userIds[0] ?? '',
    estimatorId: userIds[1] ?? '',
    userIds,
    sampleJobId: row.id,
    sampleReference: row.reference,
    sampleCustomer: row.name,
  };
}

/** A firm generated by an earlier run with --keep, to time again without generating. */
async function findBenchFirm(db: Kysely<Database>, slug: string): Promise<BenchFirm> {
  const tenant = await db
    .selectFrom('tenant')
    .select('id')
    .where('slug', '=', slug)
    .executeTakeFirstOrThrow();
  const users = await inFirm(db, tenant.id, (tx) =>
    tx
      .selectFrom('membership')
      .innerJoin('appUser as u', 'u.id', 'userId')
      .select(['u.id', 'role'])
      .where('tenantId', '=', tenant.id)
      .orderBy('u.createdAt')
      .execute(),
  );
  const sample = await inFirm(db, tenant.id, (tx) =>
    sql<{ id: string; reference: string; name: string }>`
      select j.id, j.reference, c.name from job j join customer c on c.id = j.customer_id
      where j.tenant_id = ${tenant.id} and j.number = ${SAMPLE_NUMBER}`.execute(tx),
  );
  const row = sample.rows[0];
  if (!row) throw new Error('sample job missing');
  return {
    tenantId: tenant.id,
    slug,
    ownerId: users.find((u) => u.role === 'owner')?.id ?? '',
    estimatorId: users.find((u) => u.role === 'estimator')?.id ?? '',
    userIds: users.map((u) => u.id),
    sampleJobId: row.id,
    sampleReference: row.reference,
    sampleCustomer: row.name,
  };
}

/** Deletes everything of the generated firm, children first. */
async function dropBenchFirm(db: Kysely<Database>, firm: BenchFirm): Promise<void> {
  const tables = [
    'job_event',
    'job_note',
    'job_crew',
    'job_stage_move',
    'job',
    'job_counter',
    'site',
    'customer',
    'email_log',
    'audit_log',
    'membership',
  ];
  await inFirm(db, firm.tenantId, async (tx) => {
    for (const table of tables)
      await sql`delete from ${sql.table(table)} where tenant_id = ${firm.tenantId}`.execute(tx);
  });
  await db.deleteFrom('tenant').where('id', '=', firm.tenantId).execute();
  await db.deleteFrom('appUser').where('id', 'in', firm.userIds).execute();
}

async function time(run: () => Promise<unknown>): Promise<number[]> {
  for (let i = 0; i < 3; i++) await run(); // warm the caches and the plan
  const ms: number[] = [];
  for (let i = 0; i < RUNS; i++) {
    const start = process.hrtime.bigint();
    await run();
    ms.push(Number(process.hrtime.bigint() - start) / 1e6);
  }
  return ms.sort((a, b) => a - b);
}

async function main() {
  const started = Date.now();
  const reuse = argValue('--firm');
  const firm: BenchFirm = reuse
    ? await findBenchFirm(ownerDb, reuse)
    : await createBenchFirm(ownerDb);
  if (!reuse)
    console.log(
      `generated ${JOBS.toLocaleString('en')} jobs, ${CUSTOMERS.toLocaleString('en')} customers in ${((Date.now() - started) / 1000).toFixed(1)} s`,
    );
  try {
    const session = await sessionFor(deps.db, firm.ownerId, firm.tenantId);
    const headers = { Cookie: session.cookie };
    const get = (path: string) => async () => {
      const res = await request(app).get(`/api/v1${path}`).set(headers);
      if (res.status !== 200) throw new Error(`${path} → ${res.status} ${res.text.slice(0, 200)}`);
      return res;
    };
    const filtered = `owner=${firm.estimatorId}&dateField=enquiryOn&from=2026-01-01&to=2026-09-30&minValue=200000`;
    const cases: [string, () => Promise<unknown>][] = [
      ['board (13 columns × 30 cards)', get('/jobs/board')],
      ['board, filtered by owner, dates, value', get(`/jobs/board?${filtered}`)],
      ['board, one column, next 30 cards', get('/jobs/board?column=quoted&offset=30')],
      ['table page 1, default sort', get('/jobs')],
      ['table filtered + sorted by value', get(`/jobs?${filtered}&sort=value&dir=desc`)],
      ['table sorted by customer', get('/jobs?sort=customer&dir=asc')],
      ['search "warehouse"', get('/jobs?q=warehouse')],
      ['search a customer name', get(`/jobs?q=${encodeURIComponent(firm.sampleCustomer)}`)],
      ['search a reference', get(`/jobs?q=${firm.sampleReference}`)],
      ['deep page (page 3,000 of 25)', get('/jobs?page=3000')],
      ['job page header', get(`/jobs/${firm.sampleJobId}`)],
      ['job timeline', get(`/jobs/${firm.sampleJobId}/timeline`)],
      ['CSV export, one owner, one quarter', get(`/jobs/export.csv?${filtered}`)],
    ];
    console.log(`\n${RUNS} runs each after 3 warm-up runs; target ${TARGET_MS} ms to first data`);
    console.log(
      'query'.padEnd(42),
      'median'.padStart(9),
      'p95'.padStart(9),
      '  ratio (p95/target)',
    );
    for (const [name, run] of cases) {
      const ms = await time(run);
      const median = quantileSorted(ms, 0.5);
      const p95 = quantileSorted(ms, 0.95);
      console.log(
        name.padEnd(42),
        `${median.toFixed(1)} ms`.padStart(9),
        `${p95.toFixed(1)} ms`.padStart(9),
        `  ${(p95 / TARGET_MS).toFixed(2)}`,
      );
    }
    await deps.db.deleteFrom('appSession').where('sid', '=', session.sid).execute();
  } finally {
    if (process.argv.includes('--keep')) console.log(`kept firm ${firm.slug}`);
    else await dropBenchFirm(ownerDb, firm);
    await deps.close();
    await ownerDb.destroy();
  }
}

main()
  .catch((err) => {
    console.error(err);
    process.exitCode = 1;
  })
  // The app's queue and session pool keep handles open; this is a script, so leave.
  .finally(() => process.exit());
