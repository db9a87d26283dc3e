/**
 * A count's life: counting (the blind sheet takes entries, line by line, as often as the
 * counter likes) → submitted (the entries are frozen and review sees the variance; reasons are
 * given) → posted (count corrections booked), or cancelled before posting.
 */
import type { Updateable } from 'kysely';
import type { Database, StockCountStatus, TenantScope, Tx } from '@latchwork/shared-db';
import { ConflictError } from '@latchwork/shared-server-kit';
import type { PostingActor } from '../ledger';
import { stepsOf } from '../purchasing/product-facts';
import { invalidField } from '../stock-errors';
import { countLines, findCount, type CountHeader } from './count.repository';
import type { CountEntriesBody, CountReasonsBody } from './count.schemas';

const STATUS_WORDS: Record<StockCountStatus, string> = {
  counting: 'still being counted',
  submitted: 'submitted for review',
  posted: 'posted',
  cancelled: 'cancelled',
};

/** 409 unless the count is in one of `allowed`. */
export function requireStatus(
  count: CountHeader,
  allowed: readonly StockCountStatus[],
  doing: string,
): void {
  if (!allowed.includes(count.status))
    throw new ConflictError(
      `This count is ${STATUS_WORDS[count.status]}: it cannot ${doing} now.`,
      { status: count.status },
    );
}

/** Sets columns of the count's header row. */
export async function setCount(
  tx: Tx,
  scope: TenantScope,
  countId: string,
  values: Updateable<Database['stockCount']>,
): Promise<void> {
  await tx
    .updateTable('stockCount')
    .set(values)
    .where('tenantId', '=', scope.tenantId)
    .where('id', '=', countId)
    .execute();
}

/** Index of each line id in the body, 400 naming the first that is not on this count. */
async function linesById(tx: Tx, scope: TenantScope, countId: string, ids: readonly string[]) {
  const lines = await countLines(tx, scope, countId);
  const byId = new Map(lines.map((l) => [l.id, l]));
  ids.forEach((id, i) => {
    if (!byId.has(id)) invalidField(`lines.${i}.lineId`, 'not a line of this count');
  });
  return byId;
}

/** Saves what the counter found (packs + loose units) on the given lines. */
export async function saveEntries(
  tx: Tx,
  scope: TenantScope,
  actor: PostingActor,
  countId: string,
  body: CountEntriesBody,
): Promise<void> {
  const count = await findCount(tx, scope, countId, true);
  requireStatus(count, ['counting'], 'take counts');
  const byId = await linesById(
    tx,
    scope,
    countId,
    body.lines.map((l) => l.lineId),
  );
  for (const entry of body.lines) {
    const line = byId.get(entry.lineId);
    if (!line) continue;
    await tx
      .updateTable('stockCountLine')
      .set({
        counted: stepsOf(line.product, entry),
        countedBy: actor.userId,
        countedAt: new Date(),
      })
      .where('tenantId', '=', scope.tenantId)
      .where('id', '=', entry.lineId)
      .execute();
  }
}

/** Freezes the entries for review; 400 naming the first line nobody counted. */
export async function submitCount(
  tx: Tx,
  scope: TenantScope,
  actor: PostingActor,
  countId: string,
): Promise<void> {
  const count = await findCount(tx, scope, countId, true);
  requireStatus(count, ['counting'], 'be submitted');
  const lines = await countLines(tx, scope, countId);
  const open = lines.find((l) => l.counted === null);
  if (open)
    invalidField(
      `lines.${open.position}.counted`,
      `${open.product.name}${open.batchCode ? ` batch ${open.batchCode}` : ''} has not been counted (enter 0 if there is none)`,
      'not-counted',
    );
  await setCount(tx, scope, countId, {
    status: 'submitted',
    submittedBy: actor.userId,
    submittedAt: new Date(),
  });
}

/** Records why lines differ (before posting). */
export async function saveReasons(
  tx: Tx,
  scope: TenantScope,
  countId: string,
  body: CountReasonsBody,
): Promise<void> {
  const count = await findCount(tx, scope, countId, true);
  requireStatus(count, ['counting', 'submitted'], 'take reasons');
  await linesById(
    tx,
    scope,
    countId,
    body.lines.map((l) => l.lineId),
  );
  for (const entry of body.lines)
    await tx
      .updateTable('stockCountLine')
      .set({ reason: entry.reason, reasonNote: entry.note })
      .where('tenantId', '=', scope.tenantId)
      .where('id', '=', entry.lineId)
      .execute();
}

/** Cancels a count that has not been posted; nothing is booked. */
export async function cancelCount(tx: Tx, scope: TenantScope, countId: string): Promise<void> {
  const count = await findCount(tx, scope, countId, true);
  requireStatus(count, ['counting', 'submitted'], 'be cancelled');
  await setCount(tx, scope, countId, { status: 'cancelled' });
}
