/**
 * An issue drawn from a reservation counts against it, in the posting's transaction: the
 * reservation's issued quantity grows and it is fulfilled once everything promised has left.
 * Reversing such an issue gives the quantity back to the reservation.
 */
import type { TenantScope, Tx } from '@latchwork/shared-db';
import { conflictField, invalidField } from '../stock-errors';
import type { MovementRequest } from './movement-request';

/** Applies every reservation the movements draw on (rows locked by id order). */
export async function applyReservations(
  tx: Tx,
  scope: TenantScope,
  movements: readonly MovementRequest[],
  at: (i: number) => string,
): Promise<void> {
  const drawn = movements
    .map((m, i) => ({ m, i }))
    .filter(({ m }) => m.reservationId)
    .sort((a, b) => ((a.m.reservationId ?? '') < (b.m.reservationId ?? '') ? -1 : 1));
  for (const { m, i } of drawn) {
    const r = await tx
      .selectFrom('reservation')
      .select(['id', 'jobId', 'productId', 'batchId', 'quantity', 'issuedQuantity', 'status'])
      .where('tenantId', '=', scope.tenantId)
      .where('id', '=', m.reservationId ?? '')
      .forUpdate()
      .executeTakeFirst();
    const path = `${at(i)}reservationId`;
    if (!r) invalidField(path, 'no such reservation');
    if (m.kind !== 'issue') invalidField(path, 'only an issue draws on a reservation');
    if (r.jobId !== m.jobId || r.productId !== m.productId)
      invalidField(path, 'the reservation is for another job or product');
    if (r.batchId && r.batchId !== m.batchId)
      conflictField(`${at(i)}batchId`, 'other-batch', 'the reservation holds another batch');
    const reversal = !!m.reversesMovementId;
    if (!reversal && r.status !== 'active')
      conflictField(path, 'reservation-closed', `the reservation is ${r.status}`);
    const issued = Math.max(0, Number(r.issuedQuantity) + (reversal ? -m.quantity : m.quantity));
    const status =
      r.status === 'released' ? 'released' : issued >= Number(r.quantity) ? 'fulfilled' : 'active';
    await tx
      .updateTable('reservation')
      .set({ issuedQuantity: issued, status, updatedAt: new Date() })
      .where('tenantId', '=', scope.tenantId)
      .where('id', '=', r.id)
      .execute();
  }
}
