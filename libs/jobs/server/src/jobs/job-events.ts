import type { TenantScope, Tx } from '@latchwork/shared-db';
import { NotFoundError } from '@latchwork/shared-server-kit';
import type { Role } from '@latchwork/shared-access';

/** What happened to a job, as one line of its timeline. */
export interface JobEventInput {
  jobId: string;
  /** Short machine name: `created`, `stage-move`, `note`, `email-queued`, `file-uploaded`… */
  kind: string;
  /** The sentence the timeline shows, e.g. "Moved from Enquiry to Survey booked". */
  summary: string;
  /** Anything a later screen may want (ids, old and new values); a JSON object. */
  detail?: Record<string, unknown>;
  /** Null when a rule rather than a person caused it. */
  actorUserId: string | null;
}

/**
 * Appends one line to a job's timeline inside the caller's transaction. The timeline is the
 * single record of what happened to a job: stage moves, notes, files, survey readings, takeoff
 * versions, e-mails and later quotes and invoices all write here, so the job page reads one
 * table. Lines are never edited (the app role may only insert), a correction is a new line.
 */
export async function recordJobEvent(
  tx: Tx,
  scope: TenantScope,
  event: JobEventInput,
): Promise<{ id: string }> {
  return tx
    .insertInto('jobEvent')
    .values({
      tenantId: scope.tenantId,
      jobId: event.jobId,
      kind: event.kind,
      summary: event.summary.slice(0, 500),
      detail: event.detail ?? {},
      actorUserId: event.actorUserId,
    })
    .returning('id')
    .executeTakeFirstOrThrow();
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** The part of the signed-in actor that decides which jobs they may see. */
export interface JobViewer {
  userId: string;
  role: Role;
}

/**
 * The firm's jobs the viewer may see, as a query on `job as j`: all of them, but for an
 * installer only the jobs they are booked on (job_crew). Tenant first, as every query;
 * row-level security stands behind it.
 */
export function visibleJobs(tx: Tx, scope: TenantScope, viewer: JobViewer) {
  const jobs = tx.selectFrom('job as j').where('j.tenantId', '=', scope.tenantId);
  if (viewer.role !== 'installer') return jobs;
  return jobs.where((eb) =>
    eb.exists(
      eb
        .selectFrom('jobCrew as jc')
        .select('jc.jobId')
        .where('jc.tenantId', '=', scope.tenantId)
        .whereRef('jc.jobId', '=', 'j.id')
        .where('jc.userId', '=', viewer.userId),
    ),
  );
}

/**
 * Throws NotFoundError unless the job exists in this firm and the viewer may see it: an
 * installer sees only the jobs they are booked on (job_crew). Every job sub-resource (survey,
 * files, notes) calls this first, so all answer 404 alike for a job the caller may not see.
 */
export async function assertJobVisible(
  tx: Tx,
  scope: TenantScope,
  viewer: JobViewer,
  jobId: string,
): Promise<void> {
  // A malformed id names no job; answer as for any other unknown job, not with a SQL error.
  if (!UUID.test(jobId)) throw new NotFoundError('The job');
  const query = visibleJobs(tx, scope, viewer).select('j.id').where('j.id', '=', jobId);
  if (!(await query.executeTakeFirst())) throw new NotFoundError('The job');
}
