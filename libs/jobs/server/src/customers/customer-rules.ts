import type { Request } from 'express';
import { recordAudit, type AuditAction, type TenantScope, type Tx } from '@latchwork/shared-db';
import {
  actorOf,
  NotFoundError,
  ValidationError,
  type FieldProblem,
} from '@latchwork/shared-server-kit';

/**
 * Refuses an e-mail or reference that another customer of the firm already has. The CSV
 * import matches rows to customers by these two keys, so a second customer holding one of
 * them would make every later import of that row ambiguous.
 */
export async function checkCustomerKeysFree(
  tx: Tx,
  scope: TenantScope,
  keys: { email?: string | null; externalRef?: string | null },
  exceptId?: string,
): Promise<void> {
  const problems: FieldProblem[] = [];
  for (const field of ['email', 'externalRef'] as const) {
    const value = keys[field];
    if (!value) continue;
    let query = tx
      .selectFrom('customer')
      .select('name')
      .where('tenantId', '=', scope.tenantId)
      .where(field, '=', value);
    if (exceptId) query = query.where('id', '!=', exceptId);
    const other = await query.executeTakeFirst();
    if (other)
      problems.push({
        path: field,
        message: `${other.name} already has this ${field === 'email' ? 'e-mail' : 'reference'}`,
      });
  }
  if (problems.length)
    throw new ValidationError(`${problems[0].path}: ${problems[0].message}`, problems);
}

/** Throws 404 unless the customer is the firm's (another firm's id is simply not found). */
export async function requireCustomer(tx: Tx, scope: TenantScope, customerId: string) {
  const row = await tx
    .selectFrom('customer')
    .select(['id', 'name'])
    .where('tenantId', '=', scope.tenantId)
    .where('id', '=', customerId)
    .executeTakeFirst();
  if (!row) throw new NotFoundError('That customer');
  return row;
}

/** PostgreSQL's foreign-key violation: another table still refers to the row. */
export function isStillReferenced(err: unknown): boolean {
  return typeof err === 'object' && err !== null && (err as { code?: string }).code === '23503';
}

/** What the customer routes write to the firm's audit log. */
export type CustomerAuditAction = Extract<
  AuditAction,
  `customer-${string}` | `site-${string}` | 'customers-imported'
>;

/** Records a customer or site change by the caller. */
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
    action,
    subject,
    detail,
    ipAddress: req.ip,
  });
}

/**
 * Minor-unit digits of an ISO 4217 currency (GBP 2, JPY 0, BHD 3), from the runtime's
 * ICU data, which carries the ISO table; 2 for a code it does not know.
 */
export function minorDigitsOf(currency: string): number {
  try {
    return (
      new Intl.NumberFormat('en', { style: 'currency', currency }).resolvedOptions()
        .maximumFractionDigits ?? 2
    );
  } catch {
    return 2;
  }
}

/** The firm's currency and its minor digits, for money on the customer page and in imports. */
export async function firmCurrency(tx: Tx, scope: TenantScope) {
  const { currency } = await tx
    .selectFrom('tenant')
    .select('currency')
    .where('id', '=', scope.tenantId)
    .executeTakeFirstOrThrow();
  return { currency, minorDigits: minorDigitsOf(currency) };
}
