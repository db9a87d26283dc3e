import type { TenantScope, Tx } from '@latchwork/shared-db';
import { GOVERNING_NOTE, surveyWarnings, type SurveyWarning } from '@latchwork/jobs-domain';
import { firmSlabLimits } from './slab-limits.repository';
import { asSlabReading, listReadings } from './slab-readings.repository';

export interface JobSurveyWarnings {
  warnings: SurveyWarning[];
  /** Shown with the warnings: we advise, the rules that apply decide. */
  caution: string;
}

/**
 * The failed-reading warnings of a job, judged by the firm's limits as they are now (the job
 * header, the survey and — in the quoting issue — the quote all show these). Does not check
 * visibility: callers have already asserted the job is visible to the actor.
 */
export async function surveyWarningsForJob(
  tx: Tx,
  scope: TenantScope,
  jobId: string,
): Promise<JobSurveyWarnings> {
  // One transaction is one connection: the queries run one after the other anyway.
  const readings = await listReadings(tx, scope, jobId);
  const limits = await firmSlabLimits(tx, scope);
  return {
    warnings: surveyWarnings(readings.map(asSlabReading), limits),
    caution: GOVERNING_NOTE,
  };
}
