/**
 * Pipeline totals for the board and the owner's numbers: count and value per stage and for
 * the open pipeline, after the board's filters. Money is integer minor units throughout.
 */
import { addMinor } from './money';
import { STAGES, STAGE_LABELS, isOpenPipeline, type Stage } from './stages';

/** What the pipeline needs to know about a job. Dates are ISO calendar dates (YYYY-MM-DD). */
export interface PipelineJob {
  readonly id: string;
  readonly reference: string;
  readonly title: string;
  readonly stage: Stage;
  /** Value estimate in minor units; null while nobody has put a figure on it. */
  readonly valueMinor: number | null;
  readonly ownerId: string | null;
  readonly ownerName?: string | null;
  readonly customerId: string;
  readonly customerName?: string;
  readonly enquiredOn: string;
  readonly stageChangedOn?: string | null;
  readonly expectedStartOn?: string | null;
}

export type PipelineDateField = 'enquiredOn' | 'stageChangedOn' | 'expectedStartOn';

/**
 * The board's filters; every one given must match. `ownerIds` may hold null for "nobody".
 * Dates and values are inclusive. A job without the date (or value) asked about is left out.
 */
export interface PipelineFilter {
  readonly ownerIds?: readonly (string | null)[];
  readonly customerIds?: readonly string[];
  readonly dateField?: PipelineDateField;
  readonly from?: string;
  readonly to?: string;
  readonly minValueMinor?: number;
  readonly maxValueMinor?: number;
}

/** Count and value of a set of jobs; `unvalued` counts jobs without a value estimate. */
export interface Totals {
  readonly count: number;
  readonly valueMinor: number;
  readonly unvalued: number;
}

export interface StageTotals extends Totals {
  readonly stage: Stage;
  readonly label: string;
}

export interface PipelineSummary {
  /** Every stage in board order, empty ones included (the board shows every column). */
  readonly stages: readonly StageTotals[];
  readonly openPipeline: Totals;
  readonly all: Totals;
}

/** True for a real calendar date written YYYY-MM-DD. */
export function isIsoDate(text: string): boolean {
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(text);
  if (!m) return false;
  const [y, mo, d] = [Number(m[1]), Number(m[2]), Number(m[3])];
  const date = new Date(Date.UTC(y, mo - 1, d));
  return date.getUTCFullYear() === y && date.getUTCMonth() === mo - 1 && date.getUTCDate() === d;
}

function checkFilter(f: PipelineFilter): void {
  for (const d of [f.from, f.to]) {
    if (d !== undefined && !isIsoDate(d)) throw new RangeError(`Not a date: "${d}".`);
  }
  for (const v of [f.minValueMinor, f.maxValueMinor]) {
    if (v !== undefined && !Number.isSafeInteger(v)) {
      throw new RangeError(`A value filter must be whole minor units (got ${v}).`);
    }
  }
}

/** True when the job passes every filter given. */
export function matchesFilter(job: PipelineJob, f: PipelineFilter): boolean {
  if (f.ownerIds && !f.ownerIds.includes(job.ownerId)) return false;
  if (f.customerIds && !f.customerIds.includes(job.customerId)) return false;
  if (f.from !== undefined || f.to !== undefined) {
    const date = job[f.dateField ?? 'enquiredOn'];
    // ISO dates compare correctly as text.
    if (!date) return false;
    if (f.from !== undefined && date < f.from) return false;
    if (f.to !== undefined && date > f.to) return false;
  }
  if (f.minValueMinor !== undefined || f.maxValueMinor !== undefined) {
    if (job.valueMinor === null) return false;
    if (f.minValueMinor !== undefined && job.valueMinor < f.minValueMinor) return false;
    if (f.maxValueMinor !== undefined && job.valueMinor > f.maxValueMinor) return false;
  }
  return true;
}

/** The jobs that pass the filter, in their given order. Throws RangeError on a bad filter. */
export function filterJobs(jobs: readonly PipelineJob[], f: PipelineFilter = {}): PipelineJob[] {
  checkFilter(f);
  return jobs.filter((j) => matchesFilter(j, f));
}

const add = (t: Totals, job: PipelineJob): Totals => ({
  count: t.count + 1,
  valueMinor: job.valueMinor === null ? t.valueMinor : addMinor(t.valueMinor, job.valueMinor),
  unvalued: t.unvalued + (job.valueMinor === null ? 1 : 0),
});

/**
 * Totals per stage, for the open pipeline (see `OPEN_PIPELINE_STAGES`) and for everything,
 * after the filter. Throws RangeError for a value that is not whole minor units.
 */
export function pipelineSummary(
  jobs: readonly PipelineJob[],
  filter: PipelineFilter = {},
): PipelineSummary {
  const zero: Totals = { count: 0, valueMinor: 0, unvalued: 0 };
  const perStage = new Map<Stage, Totals>(STAGES.map((s) => [s, zero]));
  let open = zero;
  let all = zero;
  for (const job of filterJobs(jobs, filter)) {
    if (job.valueMinor !== null && !Number.isSafeInteger(job.valueMinor)) {
      throw new RangeError(`Job ${job.reference}: value must be whole minor units.`);
    }
    perStage.set(job.stage, add(perStage.get(job.stage) ?? zero, job));
    if (isOpenPipeline(job.stage)) open = add(open, job);
    all = add(all, job);
  }
  return {
    stages: STAGES.map((stage) => ({
      stage,
      label: STAGE_LABELS[stage],
      ...(perStage.get(stage) ?? zero),
    })),
    openPipeline: open,
    all,
  };
}
