import type { TenantScope, Tx } from '@latchwork/shared-db';
import { NotFoundError, ValidationError, type FieldProblem } from '@latchwork/shared-server-kit';

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
