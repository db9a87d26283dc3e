/**
 * Stock benchmark (issue 6 §12). Prints figures and ratios to the targets; it is not a timed test.
 *
 *   eval "$(node tests/support/test-env.mjs)"
 *   npx tsx --tsconfig tsconfig.base.json tests/bench/stock-bench.ts [--movements 1000000]
 *   npx tsx --tsconfig tsconfig.base.json tests/bench/stock-bench.ts --delete-leftovers
 *
 * A generated firm: 1,000 products (half of them tiles in 2 batches each), 20 locations, 50
 * jobs and 1,000,000 ledger movements over the last year — 20,000 opening receipts, then
 * issues to jobs (70 %), transfers (20 %) and returns (10 %) — bulk inserted with
 * generate_series as the table owner, with the balance summary and cost state built from the
 * movements; checkLedger then proves the three agree. Timed as the app role, each call in its
 * own firm transaction as the API runs it: one product's balance, the full stock value report,
 * the reorder run (suggestions, then once for real). The firm is deleted at the end.
 */
import os from 'node:os';
import { sql, type Kysely } from 'kysely';
import { createDb, withTenant, type Database } from '@latchwork/shared-db';
import { checkLedger, runReorder } from '@latchwork/stock-server';
import { listBalances } from '../../libs/stock/server/src/ledger/ledger.repository';
import { stockValueReport } from '../../libs/stock/server/src/reports/valuation';

const arg = (name: string, fallback: number) => {
  const i = process.argv.indexOf(name);
  return i > 0 ? Number(process.argv[i + 1]) : fallback;
};
const MOVEMENTS = arg('--movements', 1_000_000);

const env = (name: string) => {
  const v = process.env[name];
  if (!v) throw new Error(`${name} is not set: eval "$(node tests/support/test-env.mjs)" first`);
  return v;
};

async function timed<T>(work: () => Promise<T>, runs: number, warm = 2) {
  for (let k = 0; k < warm; k++) await work();
  const t: number[] = [];
  let last: T | undefined;
  for (let k = 0; k < runs; k++) {
    const t0 = performance.now();
    last = await work();
    t.push(performance.now() - t0);
  }
  t.sort((a, b) => a - b);
  const p95 = t[Math.min(t.length - 1, Math.ceil(t.length * 0.95) - 1)];
  return { median: t[t.length >> 1], p95, last: last as T };
}

function report(label: string, r: { median: number; p95: number }, targetMs: number) {
  const ratio = r.median / targetMs;
  console.log(
    `${label.padEnd(34)} median ${r.median.toFixed(1).padStart(8)} ms  p95 ${r.p95
      .toFixed(1)
      .padStart(8)} ms  target ${String(targetMs).padStart(6)} ms  ratio ${ratio.toFixed(3)}  ${
      ratio <= 1 ? 'ok' : 'OVER'
    }`,
  );
}

/** Runs `statement` in the firm's transaction as the table owner. */
const asOwner = (db: Kysely<Database>, tenantId: string, statement: ReturnType<typeof sql>) =>
  withTenant(db, { tenantId }, (tx) => statement.execute(tx));

/** The generated firm: catalogue, places, jobs, then the ledger and its summaries. */
async function seedLedger(db: Kysely<Database>, movements: number) {
  const slug = `bench-${Date.now().toString(36)}`;
  const { id: tenantId } = await db
    .insertInto('tenant')
    .values({ slug, name: `Bench Flooring ${slug}` })
    .returning('id')
    .executeTakeFirstOrThrow();
  const run = (statement: ReturnType<typeof sql>) => asOwner(db, tenantId, statement);
  await run(sql`insert into supplier (tenant_id, name, lead_time_days, order_cost_minor, email)
    select ${tenantId}, 'Bench supplier ' || g, 3 + g, 2500, 'orders-' || g || '@bench-supply.test'
    from generate_series(1, 5) g`);
  await run(sql`insert into stock_location (tenant_id, name, kind)
    select ${tenantId}, 'Bench place ' || lpad(g::text, 2, '0'),
      case when g <= 2 then 'warehouse' else 'van' end
    from generate_series(1, 20) g`);
  await run(sql`insert into product (tenant_id, sku, name, kind, pack_size, cost_minor,
      preferred_supplier_id, unit_one, unit_other, pack_one, pack_other)
    select ${tenantId}, 'B-' || lpad(g::text, 4, '0'), 'Bench product ' || g,
      case when g <= 500 then 'tile' else 'adhesive' end, case when g <= 500 then 24 else 1 end,
      100 + g, (select array_agg(id order by name) from supplier where tenant_id = ${tenantId})[1 + g % 5],
      case when g <= 500 then 'tile' else 'kit' end, case when g <= 500 then 'tiles' else 'kits' end,
      case when g <= 500 then 'box' else 'kit' end, case when g <= 500 then 'boxes' else 'kits' end
    from generate_series(1, 1000) g`);
  await run(sql`insert into stock_batch (tenant_id, product_id, code, received_on)
    select ${tenantId}, p.id, 'L' || b, current_date - 400
    from product p cross join generate_series(1, 2) b
    where p.tenant_id = ${tenantId} and p.kind = 'tile'`);
  await run(sql`insert into customer (tenant_id, kind, name)
    values (${tenantId}, 'business', 'Bench customer')`);
  await run(sql`insert into job (tenant_id, number, reference, title, customer_id)
    select ${tenantId}, g, 'BJ-' || g, 'Bench job ' || g,
      (select id from customer where tenant_id = ${tenantId})
    from generate_series(1, 50) g`);
  await withTenant(db, { tenantId }, async (tx) => {
    await sql`
    create temporary table bench_slot on commit drop as
    select p.n, l.n as l, p.id as product_id, l.id as location_id, p.cost_minor,
      (select b.id from stock_batch b where b.tenant_id = ${tenantId} and b.product_id = p.id
        and b.code = 'L' || (1 + l.n % 2)) as batch_id
    from (select id, cost_minor, row_number() over (order by sku) as n from product
          where tenant_id = ${tenantId}) p
    cross join (select id, row_number() over (order by name) as n from stock_location
          where tenant_id = ${tenantId}) l`.execute(tx);
    await sql`create index on bench_slot (n, l)`.execute(tx);
    // 1,000 of each product at each place, a year ago.
    await sql`insert into stock_movement (tenant_id, kind, product_id, batch_id, to_location_id, quantity,
      unit_cost_minor, value_minor, at)
    select ${tenantId}, 'receipt', product_id, batch_id, location_id, 1000, cost_minor,
      1000 * cost_minor, now() - interval '366 days'
    from bench_slot order by n, l`.execute(tx);
    // Then issues, transfers and returns spread evenly over the year, small enough that no
    // balance can go below zero (at most ~45 outflows of ≤ 5 from each 1,000).
    await sql`with jobs as (select array_agg(id order by number) as ids from job where tenant_id = ${tenantId}),
    g as (select g, 1 + (g * 7919) % 1000 as n, 1 + (g * 104729) % 20 as l, g % 10 as k,
            1 + g % 5 as q
          from generate_series(1::bigint, ${movements - 20000}) g)
    insert into stock_movement (tenant_id, kind, product_id, batch_id, from_location_id,
      to_location_id, quantity, unit_cost_minor, value_minor, job_id, at)
    select ${tenantId},
      case when g.k < 7 then 'issue' when g.k < 9 then 'transfer' else 'return' end,
      s.product_id, s.batch_id,
      case when g.k < 9 then s.location_id end,
      case when g.k = 9 then s.location_id
           when g.k >= 7 then (select location_id from bench_slot x where x.n = g.n
             and x.l = 1 + g.l % 20) end,
      g.q, s.cost_minor,
      case when g.k < 7 then -g.q * s.cost_minor when g.k = 9 then g.q * s.cost_minor else 0 end,
      case when g.k < 7 or g.k = 9 then (select ids from jobs)[1 + g.g % 50] end,
      now() - interval '365 days' + (g.g::float8 / ${movements - 20000}) * interval '365 days'
    from g join bench_slot s on s.n = g.n and s.l = g.l
    order by g.g`.execute(tx);
  });
  // Jobs have reserved 30,000 of each of the first 100 products: the reorder run has work.
  await run(sql`insert into reservation (tenant_id, job_id, product_id, quantity)
    select ${tenantId}, (select id from job where tenant_id = ${tenantId} and number = 1), id, 30000
    from product where tenant_id = ${tenantId} and sku <= 'B-0100'`);
  await run(sql`insert into stock_balance (tenant_id, product_id, batch_id, location_id, quantity)
    select ${tenantId}, product_id, batch_id, location_id, sum(q)
    from (select product_id, batch_id, to_location_id as location_id, quantity as q
            from stock_movement where tenant_id = ${tenantId} and to_location_id is not null
          union all
          select product_id, batch_id, from_location_id, -quantity
            from stock_movement where tenant_id = ${tenantId} and from_location_id is not null) m
    group by product_id, batch_id, location_id`);
  await run(sql`insert into product_cost_state (tenant_id, product_id, quantity, value_minor,
      last_unit_cost_minor)
    select ${tenantId}, product_id,
      sum(case when from_location_id is null then quantity
               when to_location_id is null then -quantity else 0 end),
      sum(value_minor - settlement_minor), max(unit_cost_minor)
    from stock_movement where tenant_id = ${tenantId} group by product_id`);
  // Planner statistics, as autovacuum would have them for a table that grew over a year.
  await sql`analyze stock_movement, stock_balance, product_cost_state, product, stock_batch`.execute(
    db,
  );
  const counts = await asOwner(
    db,
    tenantId,
    sql`select (select count(*) from stock_balance where tenant_id = ${tenantId})::int as balances`,
  );
  const products = await withTenant(db, { tenantId }, (tx) =>
    tx.selectFrom('product').select('id').where('tenantId', '=', tenantId).orderBy('sku').execute(),
  );
  return {
    tenantId,
    products: products.length,
    productIds: products.map((p) => p.id),
    locations: 20,
    balances: (counts.rows[0] as { balances: number }).balances,
  };
}

/**
 * Removes the generated firm: every table with a tenant_id (other features' too, such as rows
 * their triggers wrote), each in its own transaction — a later table's foreign-key checks then
 * skip rows an earlier one removed instead of wading through a million dead index entries — in
 * passes until nothing refers to the firm any more.
 */
async function deleteFirm(db: Kysely<Database>, tenantId: string) {
  const { rows } = await sql<{ tableName: string }>`
    select c.table_name from information_schema.columns c
    join information_schema.tables t on t.table_schema = c.table_schema
      and t.table_name = c.table_name and t.table_type = 'BASE TABLE'
    where c.table_schema = 'public' and c.column_name = 'tenant_id'`.execute(db);
  // Children first where we know them; anything else finds its place in a later pass.
  const first = ['goods_receipt_line', 'stock_count_line', 'purchase_order_line', 'reservation'];
  let left = [
    ...first,
    'stock_balance',
    'product_cost_state',
    'stock_movement',
    ...rows.map((r) => r.tableName),
  ].filter((t, i, all) => all.indexOf(t) === i && rows.some((r) => r.tableName === t));
  for (let pass = 0; pass < 6 && left.length > 0; pass++) {
    const blocked: string[] = [];
    for (const table of left)
      await withTenant(db, { tenantId }, (tx) =>
        sql`delete from ${sql.table(table)} where tenant_id = ${tenantId}`.execute(tx),
      ).catch((err: { code?: string }) => {
        if (err.code !== '23503') throw err;
        blocked.push(table);
      });
    left = blocked;
  }
  await db.deleteFrom('tenant').where('id', '=', tenantId).execute();
}

async function main() {
  const owner: Kysely<Database> = createDb({ connectionString: env('DATABASE_OWNER_URL'), max: 2 });
  const app: Kysely<Database> = createDb({ connectionString: env('DATABASE_URL'), max: 2 });
  let tenantId = '';
  try {
    const t0 = performance.now();
    const seeded = await seedLedger(owner, MOVEMENTS);
    tenantId = seeded.tenantId;
    const scope = { tenantId };
    console.log(
      `load average ${os
        .loadavg()
        .map((x) => x.toFixed(1))
        .join(' ')} on ${os.cpus().length} cores`,
    );
    console.log(
      `seeded ${MOVEMENTS.toLocaleString('en')} movements, ${seeded.products} products, ${seeded.locations} locations, ${seeded.balances.toLocaleString('en')} balances in ${((performance.now() - t0) / 1000).toFixed(1)} s`,
    );
    const c0 = performance.now();
    const check = await withTenant(app, scope, (tx) => checkLedger(tx, scope));
    console.log(
      `checkLedger: ${check.balances.length} balance and ${check.costs.length} cost differences in ${((performance.now() - c0) / 1000).toFixed(2)} s`,
    );
    if (check.balances.length + check.costs.length > 0)
      throw new Error('the seeded ledger is inconsistent');

    const inFirm = <T>(work: Parameters<typeof withTenant<T>>[2]) => withTenant(app, scope, work);
    let k = 0;
    const one = await timed(
      () =>
        inFirm((tx) =>
          listBalances(tx, scope, {
            productId: seeded.productIds[k++ % seeded.productIds.length],
            includeZero: 'false',
          }),
        ),
      50,
    );
    report("one product's balance (by place)", one, 5);
    const value = await timed(() => inFirm((tx) => stockValueReport(tx, scope)), 15);
    report('full stock value report', value, 200);
    const all = await timed(
      () => inFirm((tx) => listBalances(tx, scope, { includeZero: 'false' })),
      5,
    );
    console.log(
      `  (every balance with names and packs, ${all.last.length} rows: median ${all.median.toFixed(0)} ms, for information)`,
    );
    // The database's own share, without the round trips and the Node side of a busy machine.
    const explain = async (statement: ReturnType<typeof sql>) => {
      const plan = await withTenant(app, scope, (tx) =>
        sql`explain (analyze, format json) ${statement}`.execute(tx),
      );
      return (plan.rows[0] as { 'QUERY PLAN': { 'Execution Time': number }[] })['QUERY PLAN'][0][
        'Execution Time'
      ];
    };
    const pid = seeded.productIds[17];
    const balanceDb = await explain(sql`select sb.quantity, p.sku, l.name, b.code
      from stock_balance sb join product p on p.tenant_id = sb.tenant_id and p.id = sb.product_id
      join stock_location l on l.tenant_id = sb.tenant_id and l.id = sb.location_id
      left join stock_batch b on b.tenant_id = sb.tenant_id and b.id = sb.batch_id
      where sb.tenant_id = ${tenantId} and sb.product_id = ${pid} and sb.quantity <> 0`);
    const reportDb = await explain(sql`select sb.location_id, l.name, l.kind, p.kind, sb.quantity,
        c.quantity, c.value_minor
      from stock_balance sb
      join product p on p.tenant_id = ${tenantId} and p.id = sb.product_id
      join stock_location l on l.tenant_id = ${tenantId} and l.id = sb.location_id
      join product_cost_state c on c.tenant_id = ${tenantId} and c.product_id = sb.product_id
      where sb.tenant_id = ${tenantId} and sb.quantity > 0`);
    console.log(
      `  database execution (EXPLAIN ANALYZE): one balance ${balanceDb.toFixed(2)} ms, value report rows ${reportDb.toFixed(1)} ms`,
    );
    const suggest = await timed(
      () => inFirm((tx) => runReorder(tx, scope, null, { dryRun: true })),
      5,
      1,
    );
    report('reorder suggestions (no orders)', suggest, 10_000);
    const r0 = performance.now();
    const run = await inFirm((tx) => runReorder(tx, scope, null));
    const runMs = performance.now() - r0;
    report('reorder run, drafting orders', { median: runMs, p95: runMs }, 10_000);
    console.log(
      `  (${run.suggestions.filter((s) => s.order).length} products to order, ${run.created.length} draft orders, ${run.created.reduce((s, c) => s + c.lines, 0)} lines)`,
    );
  } finally {
    if (tenantId) await deleteFirm(owner, tenantId);
    await owner.destroy();
    await app.destroy();
  }
}

/** `--delete-leftovers`: removes firms an interrupted run of this benchmark left behind. */
async function deleteLeftovers() {
  const owner: Kysely<Database> = createDb({ connectionString: env('DATABASE_OWNER_URL'), max: 2 });
  const firms = await owner.selectFrom('tenant').select(['id', 'slug', 'name']).execute();
  for (const f of firms.filter(
    (t) => /^bench-[a-z0-9]+$/.test(t.slug) && t.name === `Bench Flooring ${t.slug}`,
  )) {
    await deleteFirm(owner, f.id);
    console.log(`deleted ${f.slug}`);
  }
  await owner.destroy();
}

void (process.argv.includes('--delete-leftovers') ? deleteLeftovers() : main()).catch((err) => {
  console.error(err);
  process.exitCode = 1;
});
