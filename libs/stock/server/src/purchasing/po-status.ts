/**
 * A purchase order's status: draft → sent → part received → received, or cancelled from
 * draft or sent. Sending renders the PDF and hands the e-mail, PDF attached, to the worker;
 * the mail is queued only after the order is committed as sent, so a failed send never
 * leaves a supplier holding an order the firm still shows as draft.
 */
import type { Updateable } from 'kysely';
import type { Database, PurchaseOrderStatus, TenantScope, Tx } from '@latchwork/shared-db';
import { ConflictError } from '@latchwork/shared-server-kit';
import { conflictField } from '../stock-errors';
import { findOrderRow, purchaseOrderView, type PurchaseOrderView } from './po-view';
import { purchaseOrderPdf, type Letterhead } from './po-pdf';

const WORDS: Record<PurchaseOrderStatus, string> = {
  draft: 'a draft',
  sent: 'sent',
  part_received: 'part received',
  received: 'received',
  cancelled: 'cancelled',
};

/** 409 unless the order is in one of `allowed`. */
export function requireOrderStatus(
  status: PurchaseOrderStatus,
  allowed: readonly PurchaseOrderStatus[],
  doing: string,
): void {
  if (!allowed.includes(status))
    throw new ConflictError(`This order is ${WORDS[status]}: it cannot ${doing}.`, { status });
}

/** Sets columns of the order's header row (and its updated time). */
export async function setOrder(
  tx: Tx,
  scope: TenantScope,
  id: string,
  values: Updateable<Database['purchaseOrder']>,
): Promise<void> {
  await tx
    .updateTable('purchaseOrder')
    .set({ ...values, updatedAt: new Date() })
    .where('tenantId', '=', scope.tenantId)
    .where('id', '=', id)
    .execute();
}

/** The firm's name, address and currency for the letterhead. */
export async function letterheadOf(tx: Tx, scope: TenantScope): Promise<Letterhead> {
  return tx
    .selectFrom('tenant')
    .select(['name', 'addressLines', 'currency'])
    .where('id', '=', scope.tenantId)
    .executeTakeFirstOrThrow();
}

/** The order's PDF, dated the day it was sent (today for a draft). */
export async function orderPdf(
  tx: Tx,
  scope: TenantScope,
  id: string,
): Promise<{ order: PurchaseOrderView; pdf: Buffer; firm: Letterhead }> {
  const order = await purchaseOrderView(tx, scope, id);
  const firm = await letterheadOf(tx, scope);
  const date = (order.sentAt ?? new Date()).toISOString().slice(0, 10);
  return { order, firm, pdf: await purchaseOrderPdf(order, firm, date) };
}

/** Marks a draft as sent to `to`; 409 without lines' delivery place or an address. */
export async function markSent(
  tx: Tx,
  scope: TenantScope,
  userId: string,
  id: string,
  to: string | undefined,
): Promise<string> {
  const row = await findOrderRow(tx, scope, id, true);
  requireOrderStatus(row.status, ['draft'], 'be sent again');
  if (!row.deliveryLocationId)
    conflictField('deliveryLocationId', 'no-delivery-place', 'Choose where the goods go first.');
  const supplier = await tx
    .selectFrom('supplier')
    .select(['name', 'email'])
    .where('tenantId', '=', scope.tenantId)
    .where('id', '=', row.supplierId)
    .executeTakeFirstOrThrow();
  const address = to ?? supplier.email;
  if (!address)
    conflictField('to', 'no-address', `${supplier.name} has no e-mail address: give one.`);
  await tx
    .updateTable('purchaseOrder')
    .set({
      status: 'sent',
      sentBy: userId,
      sentAt: new Date(),
      sentTo: address,
      updatedAt: new Date(),
    })
    .where('tenantId', '=', scope.tenantId)
    .where('id', '=', id)
    .execute();
  return address;
}

/** Cancels a draft or sent order, with the reason. */
export async function cancelOrder(
  tx: Tx,
  scope: TenantScope,
  userId: string,
  id: string,
  reason: string,
): Promise<void> {
  const row = await findOrderRow(tx, scope, id, true);
  requireOrderStatus(row.status, ['draft', 'sent'], 'be cancelled');
  await setOrder(tx, scope, id, {
    status: 'cancelled',
    cancelledBy: userId,
    cancelledAt: new Date(),
    cancelReason: reason,
  });
}
