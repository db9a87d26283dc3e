import type { TenantScope, Tx } from '@latchwork/shared-db';
import { ConflictError, NotFoundError } from '@latchwork/shared-server-kit';
import { checkMove, heldFromOf, STAGE_LABELS, type Stage } from '@latchwork/jobs-domain';
import { assertJobVisible, recordJobEvent, type JobViewer } from './job-events';

/** What a move asks for: the stage to go to and, where the stage table wants one, why. */
export interface MoveRequest {
  to: Stage;
  reason?: string | null;
  /** Set when a rule rather than a person moves the job (later issues: `quote-sent`…). */
  rule?: string;
}

/**
 * Moves a job to another stage when the stage table allows it, writing the history line and
 * the timeline event. The job row is locked first, so two people dragging the same card at
 * once are checked one after the other against the stage each move really starts from.
 * A refused move throws ConflictError (409) with the domain's sentence and refusal code.
 */
export async function moveJob(
  tx: Tx,
  scope: TenantScope,
  viewer: JobViewer,
  jobId: string,
  move: MoveRequest,
) {
  await assertJobVisible(tx, scope, viewer, jobId);
  const job = await tx
    .selectFrom('job')
    .select(['id', 'stage', 'reference'])
    .where('tenantId', '=', scope.tenantId)
    .where('id', '=', jobId)
    .forUpdate()
    .executeTakeFirst();
  if (!job) throw new NotFoundError('The job');
  const from = job.stage as Stage;
  const heldFrom = from === 'on_hold' ? await latestHeldFrom(tx, scope, jobId) : undefined;
  const check = checkMove(from, move.to, { reason: move.reason, heldFrom });
  if (!check.ok) throw new ConflictError(check.message, { refusal: check.code, from, to: move.to });

  const movedAt = new Date();
  await tx
    .updateTable('job')
    .set({
      stage: move.to,
      stageChangedAt: movedAt,
      updatedAt: movedAt,
      // The lost reason is the job's, for reports; reopening a lost job clears it.
      lostReason: move.to === 'lost' ? check.reason : null,
    })
    .where('tenantId', '=', scope.tenantId)
    .where('id', '=', jobId)
    .execute();
  await tx
    .insertInto('jobStageMove')
    .values({
      tenantId: scope.tenantId,
      jobId,
      fromStage: from,
      toStage: move.to,
      reason: check.reason,
      rule: move.rule ?? null,
      movedBy: move.rule ? null : viewer.userId,
      movedAt,
    })
    .execute();
  await recordJobEvent(tx, scope, {
    jobId,
    kind: 'stage-move',
    summary: moveSummary(from, move.to, check.reason),
    detail: { from, to: move.to, reason: check.reason, kind: check.kind, rule: move.rule ?? null },
    actorUserId: move.rule ? null : viewer.userId,
  });
  return { from, to: move.to, reason: check.reason, movedAt };
}

/** The timeline's sentence for a stage move. */
function moveSummary(from: Stage, to: Stage, reason: string | null): string {
  return `Moved from ${STAGE_LABELS[from]} to ${STAGE_LABELS[to]}${reason ? `: ${reason}` : ''}`;
}

/** The stage a job on hold was held from, read from the latest history lines. */
async function latestHeldFrom(
  tx: Tx,
  scope: TenantScope,
  jobId: string,
): Promise<Stage | undefined> {
  const last = await tx
    .selectFrom('jobStageMove')
    .select(['fromStage', 'toStage'])
    .where('tenantId', '=', scope.tenantId)
    .where('jobId', '=', jobId)
    .orderBy('movedAt', 'desc')
    .limit(1)
    .execute();
  return heldFromOf(
    last.map((m) => ({ from: m.fromStage as Stage | null, to: m.toStage as Stage })),
  );
}
