import type { Kysely } from 'kysely';
import type { Database } from './database';
import { withTenant, type TenantScope, type Tx } from './tenant-scope';

export type AuditAction =
  | 'sign-in'
  | 'sign-in-failed'
  | 'sign-in-locked'
  | 'sign-out'
  | 'member-invited'
  | 'member-role-changed'
  | 'member-removed'
  | 'settings-changed'
  | 'customer-created'
  | 'customer-updated'
  | 'customer-deleted'
  | 'site-created'
  | 'site-updated'
  | 'site-deleted'
  | 'customers-imported'
  | 'file-uploaded'
  | 'file-deleted'
  | 'stock-expired-issued';

export interface AuditInput {
  userId: string | null;
  action: AuditAction;
  subject?: string;
  detail?: Record<string, unknown>;
  ipAddress?: string | null;
}

/** Appends to the firm's audit log inside the caller's transaction (the app role cannot edit it). */
export async function recordAudit(tx: Tx, scope: TenantScope, entry: AuditInput): Promise<void> {
  await tx
    .insertInto('auditLog')
    .values({
      tenantId: scope.tenantId,
      userId: entry.userId,
      action: entry.action,
      subject: entry.subject ?? null,
      detail: entry.detail ?? {},
      ipAddress: entry.ipAddress ?? null,
    })
    .execute();
}

/** The same event in each of several firms (a sign-in is seen by every firm the person works for). */
export async function recordAuditInTenants(
  db: Kysely<Database>,
  tenantIds: string[],
  entry: AuditInput,
): Promise<void> {
  for (const tenantId of tenantIds)
    await withTenant(db, { tenantId }, (tx) => recordAudit(tx, { tenantId }, entry));
}

export interface AuditFilter {
  action?: string;
  userId?: string;
  from?: Date;
  to?: Date;
  before?: Date;
  limit: number;
}

export function listAudit(tx: Tx, scope: TenantScope, filter: AuditFilter) {
  let query = tx
    .selectFrom('auditLog as a')
    .leftJoin('appUser as u', 'u.id', 'a.userId')
    .select([
      'a.id',
      'a.createdAt',
      'a.action',
      'a.subject',
      'a.detail',
      'a.ipAddress',
      'a.userId',
      'u.name as userName',
      'u.email as userEmail',
    ])
    .where('a.tenantId', '=', scope.tenantId);
  if (filter.action) query = query.where('a.action', '=', filter.action);
  if (filter.userId) query = query.where('a.userId', '=', filter.userId);
  if (filter.from) query = query.where('a.createdAt', '>=', filter.from);
  if (filter.to) query = query.where('a.createdAt', '<', filter.to);
  if (filter.before) query = query.where('a.createdAt', '<', filter.before);
  return query.orderBy('a.createdAt', 'desc').limit(filter.limit).execute();
}
