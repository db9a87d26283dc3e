import { sql } from 'kysely';
import type { TenantScope, Tx } from '@latchwork/shared-db';
import { STAGES, type Stage } from '@latchwork/jobs-domain';
import { visibleJobs, type JobViewer } from './job-events';
import type { DateField, JobFilter, JobSort } from './job.schemas';

/** Integer minor units from a bigint/numeric column read as text; refuses what a float would blur. */
export function toMinor(text: string | number | bigint | null): number | null {
  if (text === null) return null;
  const value = Number(text);
  if (!Number.isSafeInteger(value)) throw new RangeError(`Money out of range: ${text}`);
  return value;
}

/** `like` pattern for text typed into a search box: its own % and _ match themselves. */
export function containsPattern(text: string): string {
  return `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}

const DATE_COLUMNS = {
  enquiryOn: { column: 'j.enquiryOn', instant: false },
  surveyAt: { column: 'j.surveyAt', instant: true },
  quoteDueOn: { column: 'j.quoteDueOn', instant: false },
  installStartOn: { column: 'j.installStartOn', instant: false },
  stageChangedAt: { column: 'j.stageChangedAt', instant: true },
} as const satisfies Record<DateField, { column: string; instant: boolean }>;

/**
 * The jobs the viewer may see (see visibleJobs) that pass the board's filters, as a query on
 * `job as j` for the caller to select from.
 */
export function filteredJobs(tx: Tx, scope: TenantScope, viewer: JobViewer, f: JobFilter) {
  let q = visibleJobs(tx, scope, viewer);
  if (f.owner?.length) {
    const ids = f.owner.filter((o): o is string => o !== 'none');
    const nobody = f.owner.includes('none');
    q = q.where((eb) =>
      eb.or([
        ...(ids.length ? [eb('j.ownerUserId', 'in', ids)] : []),
        ...(nobody ? [eb('j.ownerUserId', 'is', null)] : []),
      ]),
    );
  }
  if (f.customer?.length) q = q.where('j.customerId', 'in', f.customer);
  if (f.stage?.length) q = q.where('j.stage', 'in', f.stage);
  if (f.from || f.to) {
    const { column, instant } = DATE_COLUMNS[f.dateField];
    const ref = sql.ref(column);
    // Instants are filtered by the calendar day they fall on; the range is inclusive.
    if (f.from) q = q.where(sql<boolean>`${ref} >= ${f.from}::date`);
    if (f.to)
      q = q.where(
        instant ? sql<boolean>`${ref} < ${f.to}::date + 1` : sql<boolean>`${ref} <= ${f.to}::date`,
      );
  }
  if (f.minValue !== undefined) q = q.where('j.valueEstimateMinor', '>=', String(f.minValue));
  if (f.maxValue !== undefined) q = q.where('j.valueEstimateMinor', '<=', String(f.maxValue));
  if (f.q) {
    const pattern = containsPattern(f.q);
    // Through the search functions (see migrations 0111 and 0121): under row-level security
    // only they can use the trigram indexes. One id list, so the planner can look jobs up by id.
    q = q.where(
      sql<boolean>`j.id in (
        select job_search_ids(${pattern})
        union
        select cj.id from job cj
        where cj.tenant_id = ${scope.tenantId}
          and cj.customer_id in (select customer_search_ids(${pattern})))`,
    );
  }
  return q;
}

/** The job list's row: what a card, a table row and an export line show. */
export function listedJobs(tx: Tx, scope: TenantScope, viewer: JobViewer, f: JobFilter) {
  return filteredJobs(tx, scope, viewer, f)
    .innerJoin('customer as c', (join) =>
      join.onRef('c.id', '=', 'j.customerId').onRef('c.tenantId', '=', 'j.tenantId'),
    )
    .leftJoin('site as s', (join) =>
      join.onRef('s.id', '=', 'j.siteId').onRef('s.tenantId', '=', 'j.tenantId'),
    )
    .leftJoin('appUser as o', 'o.id', 'j.ownerUserId')
    .select((eb) => [
      'j.id',
      'j.number',
      'j.reference',
      'j.title',
      'j.stage',
      'j.valueEstimateMinor',
      'j.ownerUserId',
      'o.name as ownerName',
      'j.customerId',
      'c.name as customerName',
      'j.siteId',
      's.name as siteName',
      'j.enquiryOn',
      'j.stageChangedAt',
      'j.installStartOn',
      // Only a job on hold needs it: the board lets it go back only where it came from.
      eb
        .case()
        .when('j.stage', '=', 'on_hold')
        .then(
          eb
            .selectFrom('jobStageMove as m')
            .select('m.fromStage')
            .where('m.tenantId', '=', scope.tenantId)
            .whereRef('m.jobId', '=', 'j.id')
            .orderBy('m.movedAt', 'desc')
            .limit(1),
        )
        .end()
        .as('heldFrom'),
    ]);
}

type ListedRow = Awaited<ReturnType<ReturnType<typeof listedJobs>['execute']>>[number];

/** A listed row as the API returns it: money as integer minor units. */
export function listedJob(row: ListedRow) {
  return {
    id: row.id,
    reference: row.reference,
    title: row.title,
    stage: row.stage as Stage,
    valueEstimateMinor: toMinor(row.valueEstimateMinor),
    ownerUserId: row.ownerUserId,
    ownerName: row.ownerName,
    customerId: row.customerId,
    customerName: row.customerName,
    siteId: row.siteId,
    siteName: row.siteName,
    enquiryOn: row.enquiryOn,
    stageChangedAt: row.stageChangedAt,
    installStartOn: row.installStartOn,
    heldFrom: (row.heldFrom as Stage | null) ?? null,
  };
}
export type ListedJob = ReturnType<typeof listedJob>;

const SORT_EXPRESSIONS = {
  reference: sql`j.number`,
  title: sql`lower(j.title)`,
  customer: sql`lower(c.name)`,
  // Board order, not alphabetical: Enquiry first, Cancelled last.
  stage: sql`array_position(${sql.val([...STAGES])}::text[], j.stage)`,
  value: sql`j.value_estimate_minor`,
  owner: sql`lower(o.name)`,
  enquiryOn: sql`j.enquiry_on`,
  stageChangedAt: sql`j.stage_changed_at`,
  installStartOn: sql`j.install_start_on`,
} as const satisfies Record<JobSort, unknown>;

/**
 * `order by` for the table: the chosen column, empty values last either way, then the job
 * number so that paging is stable when many rows share a value.
 */
export function orderFor(sort: JobSort, dir: 'asc' | 'desc') {
  const direction = dir === 'asc' ? sql`asc` : sql`desc`;
  if (sort === 'reference') return sql`j.number ${direction}`;
  return sql`${SORT_EXPRESSIONS[sort]} ${direction} nulls last, j.number ${direction}`;
}
