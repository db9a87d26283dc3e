/**
 * The stages a job passes through, their labels and how they group for the board and the
 * pipeline totals. The moves between stages are in `stage-table.ts`.
 */

/** Every stage, in board order (the order of the columns). */
export const STAGES = [
  'enquiry',
  'survey_booked',
  'surveyed',
  'quoted',
  'won',
  'lost',
  'scheduled',
  'installing',
  'completed',
  'invoiced',
  'paid',
  'on_hold',
  'cancelled',
] as const;

/** A job's stage. Stored as this text in the database. */
export type Stage = (typeof STAGES)[number];

/**
 * Labels in plain trade words, as the board's columns and the job header show them. Our own
 * wording: "booked in" and "fitting" are what a contractor says on the phone.
 */
export const STAGE_LABELS: Readonly<Record<Stage, string>> = {
  enquiry: 'Enquiry',
  survey_booked: 'Survey booked',
  surveyed: 'Surveyed',
  quoted: 'Quote sent',
  won: 'Won',
  lost: 'Lost',
  scheduled: 'Booked in',
  installing: 'Fitting',
  completed: 'Fitted',
  invoiced: 'Invoiced',
  paid: 'Paid',
  on_hold: 'On hold',
  cancelled: 'Cancelled',
};

/**
 * How a stage counts:
 * - `open`: the firm still has work to do to win or deliver the job (the open pipeline);
 * - `awaiting-payment`: the work is done and the final invoice is out (the debtor reports
 *   count it, not the pipeline);
 * - `held`: paused, returns to the stage it was held from;
 * - `closed`: lost, cancelled or paid. Closed is not frozen: a lost job can be reopened and a
 *   reversed payment takes a paid job back to invoiced (see the table).
 */
export type StageGroup = 'open' | 'awaiting-payment' | 'held' | 'closed';

export const STAGE_GROUPS: Readonly<Record<Stage, StageGroup>> = {
  enquiry: 'open',
  survey_booked: 'open',
  surveyed: 'open',
  quoted: 'open',
  won: 'open',
  lost: 'closed',
  scheduled: 'open',
  installing: 'open',
  completed: 'open',
  invoiced: 'awaiting-payment',
  paid: 'closed',
  on_hold: 'held',
  cancelled: 'closed',
};

/**
 * The stages whose value counts in the open pipeline total: every `open` stage. On-hold jobs
 * are left out (their value is not expected soon); invoiced jobs are money owed, not pipeline.
 */
export const OPEN_PIPELINE_STAGES: readonly Stage[] = STAGES.filter(
  (s) => STAGE_GROUPS[s] === 'open',
);

/** The closed stages: lost, paid, cancelled. */
export const CLOSED_STAGES: readonly Stage[] = STAGES.filter((s) => STAGE_GROUPS[s] === 'closed');

/** True when `value` is one of the stage names (for input from the API or a CSV). */
export function isStage(value: unknown): value is Stage {
  return typeof value === 'string' && (STAGES as readonly string[]).includes(value);
}

/** The stage's label in plain trade words. */
export function stageLabel(stage: Stage): string {
  return STAGE_LABELS[stage];
}

/** True when the job's value counts in the open pipeline total. */
export function isOpenPipeline(stage: Stage): boolean {
  return STAGE_GROUPS[stage] === 'open';
}

/** True for lost, paid and cancelled. */
export function isClosed(stage: Stage): boolean {
  return STAGE_GROUPS[stage] === 'closed';
}
