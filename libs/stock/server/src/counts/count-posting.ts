/**
 * Approving and posting a count. Posting recomputes the variance with the balances locked (as
 * any posting locks them), refuses lines that differ without a reason, and — when the gross
 * variance value is over the firm's threshold — wants the owner's approval first: given
 * beforehand (approve) or by the owner posting it. Each differing line becomes one
 * count-correction movement through postMovements, so the ledger and its summaries agree.
 */
import { roleHas } from '@latchwork/shared-access';
import type { TenantScope, Tx } from '@latchwork/shared-db';
import { ConflictError } from '@latchwork/shared-server-kit';
import { formatMoney } from '@latchwork/stock-domain';
import { postMovements, type MovementRequest, type PostingActor } from '../ledger';
import { invalidField } from '../stock-errors';
import { controlSettings } from '../reorder/control-settings';
import { countLines, findCount, type CountLine } from './count.repository';
import { evaluateCount, type CountEvaluation } from './count-variance';
import { requireStatus, setCount } from './count-workflow';

/** The count's variance as review shows it (no locks; posting computes it again). */
export async function reviewCount(tx: Tx, scope: TenantScope, countId: string) {
  const count = await findCount(tx, scope, countId);
  const lines = await countLines(tx, scope, countId);
  const evaluation = await evaluateCount(
    tx,
    scope,
    count,
    lines,
    await controlSettings(tx, scope),
    false,
  );
  return { count, lines, evaluation };
}

/** The owner approves a submitted count whose variance is over the threshold. */
export async function approveCount(
  tx: Tx,
  scope: TenantScope,
  actor: PostingActor,
  countId: string,
): Promise<void> {
  const count = await findCount(tx, scope, countId, true);
  requireStatus(count, ['submitted'], 'be approved');
  await setCount(tx, scope, countId, { approvedBy: actor.userId, approvedAt: new Date() });
}

function correctionOf(
  line: CountLine,
  v: CountEvaluation['lines'][number],
  locationId: string,
): MovementRequest {
  const note = `count ${line.reason ?? ''}${line.reasonNote ? `: ${line.reasonNote}` : ''}`.trim();
  return v.variance > 0
    ? {
        kind: 'count_correction',
        productId: line.productId,
        batchId: line.batchId,
        toLocationId: locationId,
        quantity: v.variance,
        // Found stock comes in at the cost its variance was valued at.
        unitCostMinor: v.unitCostMinor,
        note,
      }
    : {
        kind: 'count_correction',
        productId: line.productId,
        batchId: line.batchId,
        fromLocationId: locationId,
        quantity: -v.variance,
        note,
      };
}

/** Posts a submitted count; returns its evaluation as booked. */
export async function postCount(
  tx: Tx,
  scope: TenantScope,
  actor: PostingActor,
  countId: string,
): Promise<CountEvaluation> {
  const count = await findCount(tx, scope, countId, true);
  requireStatus(count, ['submitted'], 'be posted');
  const lines = await countLines(tx, scope, countId);
  const settings = await controlSettings(tx, scope);
  const evaluation = await evaluateCount(tx, scope, count, lines, settings, true);
  const byId = new Map(lines.map((l) => [l.id, l]));
  for (const v of evaluation.lines) {
    const line = byId.get(v.lineId) as CountLine;
    if (v.variance !== 0 && !line.reason)
      invalidField(
        `lines.${line.position}.reason`,
        `give a reason for the difference on ${line.product.name}`,
        'reason-required',
      );
  }
  const approver = roleHas(actor.role, 'stock:approve');
  if (evaluation.needsApproval && !count.approvedBy && !approver)
    throw new ConflictError(
      `The differences add up to ${formatMoney(evaluation.grossValueMinor)}, over the firm's limit of ${formatMoney(evaluation.thresholdMinor)}: the owner must approve this count first.`,
      {
        code: 'approval-required',
        grossValueMinor: evaluation.grossValueMinor,
        thresholdMinor: evaluation.thresholdMinor,
      },
    );
  const differing = evaluation.lines.filter((v) => v.variance !== 0);
  const booked =
    differing.length === 0
      ? []
      : await postMovements(
          tx,
          scope,
          actor,
          differing.map((v) => correctionOf(byId.get(v.lineId) as CountLine, v, count.locationId)),
          { at: (i) => `lines.${(byId.get(differing[i].lineId) as CountLine).position}.` },
        );
  const movementOf = new Map(differing.map((v, i) => [v.lineId, booked[i].id]));
  for (const v of evaluation.lines)
    await tx
      .updateTable('stockCountLine')
      .set({
        expected: v.expected,
        variance: v.variance,
        unitCostMinor: v.unitCostMinor,
        varianceValueMinor: v.varianceValueMinor,
        movementId: movementOf.get(v.lineId) ?? null,
      })
      .where('tenantId', '=', scope.tenantId)
      .where('id', '=', v.lineId)
      .execute();
  const now = new Date();
  await setCount(tx, scope, countId, {
    status: 'posted',
    postedBy: actor.userId,
    postedAt: now,
    netValueMinor: evaluation.netValueMinor,
    grossValueMinor: evaluation.grossValueMinor,
    ...(evaluation.needsApproval && !count.approvedBy
      ? { approvedBy: actor.userId, approvedAt: now }
      : {}),
  });
  return evaluation;
}
