import { recordAudit, type AuditAction, type TenantScope, type Tx } from '@latchwork/shared-db';
import type { Request } from 'express';
import { actorOf } from '@latchwork/shared-server-kit';

/** What the customer routes write to the firm's audit log. */
export type CustomerAuditAction =
  | 'customer-created'
  | 'customer-updated'
  | 'customer-deleted'
  | 'site-created'
  | 'site-updated'
  | 'site-deleted'
  | 'customers-imported';

/**
 * Records a customer or site change by the caller. The shared `AuditAction` union does not
 * list these actions yet (asked of the lead); the column is free text, so the cast is the
 * only gap and goes once the union names them.
 */
export function auditCustomerChange(
  tx: Tx,
  scope: TenantScope,
  req: Request,
  action: CustomerAuditAction,
  subject: string,
  detail: Record<string, unknown> = {},
): Promise<void> {
  return recordAudit(tx, scope, {
    userId: actorOf(req).userId,
    action: action as string as AuditAction,
    subject,
    detail,
    ipAddress: req.ip,
  });
}
