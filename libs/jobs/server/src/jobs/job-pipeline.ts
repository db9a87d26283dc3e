import { sql } from 'kysely';
import type { TenantScope, Tx } from '@latchwork/shared-db';
import {
  addMinor,
  OPEN_PIPELINE_STAGES,
  pipelineCsv,
  STAGE_LABELS,
  STAGES,
  type PipelineJob,
  type Stage,
} from '@latchwork/jobs-domain';
import type { JobViewer } from './job-events';
import {
  filteredJobs,
  listedJob,
  listedJobs,
  orderFor,
  toMinor,
  type ListedJob,
} from './job-query';
import type { BoardQuery, JobFilter, ListQuery } from './job.schemas';

/**
 * One page of the job table, sorted on the server, with the number of rows in all. The page's
 * ids are found first on the narrow job rows (joining a customer or owner only to sort by its
 * name), then only those rows are dressed: a deep page then sorts ids, not whole rows.
 */
export async function listJobs(tx: Tx, scope: TenantScope, viewer: JobViewer, query: ListQuery) {
  const total = await filteredJobs(tx, scope, viewer, query)
    .select((eb) => eb.fn.countAll<string>().as('n'))
    .executeTakeFirstOrThrow();
  const order = orderFor(query.sort, query.dir);
  const size = query.pageSize;
  const skip = (query.page - 1) * size;
  const base = filteredJobs(tx, scope, viewer, query).select('j.id');
  const page =
    query.sort === 'customer'
      ? base.innerJoin('customer as c', (join) =>
          join.onRef('c.id', '=', 'j.customerId').onRef('c.tenantId', '=', 'j.tenantId'),
        )
      : query.sort === 'owner'
        ? base.leftJoin('appUser as o', 'o.id', 'j.ownerUserId')
        : base;
  const ids = (await page.orderBy(order).limit(size).offset(skip).execute()).map((r) => r.id);
  if (!ids.length) return { items: [], total: Number(total.n) };
  const rows = await listedJobs(tx, scope, viewer, { dateField: query.dateField })
    .where('j.id', 'in', ids)
    .orderBy(order)
    .execute();
  return { items: rows.map(listedJob), total: Number(total.n) };
}

/** Cards of one column, newest move first: the order the board shows them in. */
async function columnCards(
  tx: Tx,
  scope: TenantScope,
  viewer: JobViewer,
  filter: JobFilter,
  stage: Stage,
  offset: number,
  limit: number,
): Promise<{ cards: ListedJob[]; more: boolean }> {
  const rows = await listedJobs(tx, scope, viewer, { ...filter, stage: [stage] })
    .orderBy('j.stageChangedAt', 'desc')
    .orderBy('j.number', 'desc')
    .offset(offset)
    .limit(limit + 1)
    .execute();
  return { cards: rows.slice(0, limit).map(listedJob), more: rows.length > limit };
}

/**
 * The first cards of several columns in one statement: for each stage, a lateral subquery
 * walks the board index from the newest move and stops at `limit` (one round trip instead of
 * one per column).
 */
async function firstCards(
  tx: Tx,
  scope: TenantScope,
  viewer: JobViewer,
  filter: BoardQuery,
  stages: readonly Stage[],
): Promise<Map<Stage, ListedJob[]>> {
  const byStage = new Map<Stage, ListedJob[]>();
  if (!stages.length) return byStage;
  const rows = await tx
    .selectFrom(
      sql<{ stage: string }>`(select unnest(${sql.val([...stages])}::text[]) as stage)`.as(
        'wanted',
      ),
    )
    .innerJoinLateral(
      () =>
        listedJobs(tx, scope, viewer, filter)
          .where(sql<boolean>`j.stage = wanted.stage`)
          .orderBy('j.stageChangedAt', 'desc')
          .orderBy('j.number', 'desc')
          .limit(filter.limit)
          .as('c'),
      (join) => join.onTrue(),
    )
    .selectAll('c')
    // Grouped by stage below; within a stage, the board's order.
    .orderBy(sql`c.stage_changed_at desc, c.number desc`)
    .execute();
  for (const row of rows) {
    const job = listedJob(row);
    byStage.set(job.stage, [...(byStage.get(job.stage) ?? []), job]);
  }
  return byStage;
}

interface Totals {
  count: number;
  valueMinor: number;
  unvalued: number;
}

/**
 * The board: every stage's count, value and first cards after the filters, and the open
 * pipeline's totals (see OPEN_PIPELINE_STAGES). With `column`, only that column's cards from
 * `offset` (to show more of a long column). Totals are summed by PostgreSQL, in integer minor
 * units, over every matching job, not just the cards shown.
 */
export async function board(tx: Tx, scope: TenantScope, viewer: JobViewer, query: BoardQuery) {
  if (query.column) {
    const column = await columnCards(
      tx,
      scope,
      viewer,
      query,
      query.column,
      query.offset,
      query.limit,
    );
    return { stage: query.column, ...column };
  }
  // Parallel workers cost more to start than they save on one firm's jobs: measured at
  // 100,000 jobs on a 2-core machine, ~120 ms with two workers, ~50 ms without.
  await sql`set local max_parallel_workers_per_gather = 0`.execute(tx);
  const sums = await filteredJobs(tx, scope, viewer, query)
    .select([
      'j.stage',
      (eb) => eb.fn.countAll<string>().as('count'),
      sql<string | null>`sum(j.value_estimate_minor)`.as('valueMinor'),
      sql<string>`count(*) filter (where j.value_estimate_minor is null)`.as('unvalued'),
    ])
    .groupBy('j.stage')
    .execute();
  const byStage = new Map(
    sums.map((s) => [
      s.stage as Stage,
      {
        count: Number(s.count),
        valueMinor: toMinor(s.valueMinor) ?? 0,
        unvalued: Number(s.unvalued),
      },
    ]),
  );
  const zero: Totals = { count: 0, valueMinor: 0, unvalued: 0 };
  const add = (a: Totals, b: Totals): Totals => ({
    count: a.count + b.count,
    valueMinor: addMinor(a.valueMinor, b.valueMinor),
    unvalued: a.unvalued + b.unvalued,
  });
  const stages = query.stage?.length ? STAGES.filter((s) => query.stage?.includes(s)) : STAGES;
  const cards = await firstCards(
    tx,
    scope,
    viewer,
    query,
    stages.filter((s) => byStage.has(s)),
  );
  const columns = stages.map((stage) => {
    const totals = byStage.get(stage) ?? zero;
    const shown = cards.get(stage) ?? [];
    return {
      stage,
      label: STAGE_LABELS[stage],
      ...totals,
      cards: shown,
      more: totals.count > shown.length,
    };
  });
  const all = [...byStage.values()].reduce(add, zero);
  const openPipeline = OPEN_PIPELINE_STAGES.map((s) => byStage.get(s) ?? zero).reduce(add, zero);
  return { columns, openPipeline, all };
}

/** Hard limit of one export, so a single request cannot hold the API for long. */
export const EXPORT_MAX_ROWS = 100_000;

/** The table's rows after the same filters and sort, as the CSV file a spreadsheet opens. */
export async function exportCsv(
  tx: Tx,
  scope: TenantScope,
  viewer: JobViewer,
  query: ListQuery,
): Promise<string> {
  const tenant = await tx
    .selectFrom('tenant')
    .select('currency')
    .where('id', '=', scope.tenantId)
    .executeTakeFirstOrThrow();
  const rows = await listedJobs(tx, scope, viewer, query)
    .orderBy(orderFor(query.sort, query.dir))
    .limit(EXPORT_MAX_ROWS)
    .execute();
  const jobs: PipelineJob[] = rows.map(listedJob).map((j) => ({
    id: j.id,
    reference: j.reference,
    title: j.title,
    stage: j.stage,
    valueMinor: j.valueEstimateMinor,
    ownerId: j.ownerUserId,
    ownerName: j.ownerName,
    customerId: j.customerId,
    customerName: j.customerName,
    enquiredOn: j.enquiryOn,
    stageChangedOn: j.stageChangedAt.toISOString().slice(0, 10),
    expectedStartOn: j.installStartOn,
  }));
  return pipelineCsv(jobs, minorDigits(tenant.currency));
}

/** The currency's minor-unit digits as ISO 4217 gives them (GBP 2, JPY 0, BHD 3), via ICU. */
export function minorDigits(currency: string): number {
  return (
    new Intl.NumberFormat('en', { style: 'currency', currency }).resolvedOptions()
      .maximumFractionDigits ?? 2
  );
}
