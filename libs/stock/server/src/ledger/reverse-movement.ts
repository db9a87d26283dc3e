/**
 * A mistake in the ledger is never edited away: it is undone by a reversing movement of the
 * same kind with the places swapped, the same product, batch, job and reservation, booked at
 * exactly the value the original booked. A movement is reversed at most once, and a reversal
 * is not itself reversed (book the movement again instead).
 */
import type { TenantScope, Tx } from '@latchwork/shared-db';
import { ConflictError, NotFoundError } from '@latchwork/shared-server-kit';
import type { PostingActor } from './movement-request';
import { postMovements, type PostedMovement } from './post-movements';

/** Books the reversal of movement `movementId`; 404 if unknown, 409 if already reversed. */
export async function reverseMovement(
  tx: Tx,
  scope: TenantScope,
  actor: PostingActor,
  movementId: string,
  note: string,
): Promise<PostedMovement> {
  const original = await tx
    .selectFrom('stockMovement')
    .selectAll()
    .where('tenantId', '=', scope.tenantId)
    .where('id', '=', movementId)
    .executeTakeFirst();
  if (!original) throw new NotFoundError('That movement');
  if (original.reversesMovementId)
    throw new ConflictError('This movement is a reversal; book the movement again instead.');
  const already = await tx
    .selectFrom('stockMovement')
    .select('id')
    .where('tenantId', '=', scope.tenantId)
    .where('reversesMovementId', '=', movementId)
    .executeTakeFirst();
  if (already)
    throw new ConflictError('This movement has already been reversed.', {
      reversedBy: already.id,
    });
  const posting = postMovements(tx, scope, actor, [
    {
      kind: original.kind,
      productId: original.productId,
      batchId: original.batchId,
      fromLocationId: original.toLocationId,
      toLocationId: original.fromLocationId,
      quantity: Number(original.quantity),
      jobId: original.jobId,
      reservationId: original.reservationId,
      writeOffReason: original.writeOffReason,
      note: note || `reverses movement ${original.seq}`,
      reversesMovementId: original.id,
      exactValueMinor: Number(original.valueMinor),
    },
  ]);
  try {
    return (await posting)[0];
  } catch (err) {
    // Two reversals at once: the unique index lets one through; the other is told so.
    if ((err as { constraint?: string }).constraint === 'stock_movement_reverses_idx')
      throw new ConflictError('This movement has already been reversed.');
    throw err;
  }
}
