import type { TenantScope, Tx, Role } from '@latchwork/shared-db';

export function listMembers(tx: Tx, scope: TenantScope) {
  return tx
    .selectFrom('membership as m')
    .innerJoin('appUser as u', 'u.id', 'm.userId')
    .select(['m.userId', 'u.email', 'u.name', 'm.role', 'm.createdAt as invitedAt', 'm.joinedAt'])
    .where('m.tenantId', '=', scope.tenantId)
    .orderBy('u.name')
    .execute();
}

export function findMember(tx: Tx, scope: TenantScope, userId: string) {
  return tx
    .selectFrom('membership as m')
    .innerJoin('appUser as u', 'u.id', 'm.userId')
    .select(['m.userId', 'u.email', 'u.name', 'm.role', 'm.createdAt as invitedAt', 'm.joinedAt'])
    .where('m.tenantId', '=', scope.tenantId)
    .where('m.userId', '=', userId)
    .executeTakeFirst();
}

/**
 * Locks the firm's owner rows and counts them. Concurrent demotions queue on the lock and
 * re-read the rows, so two owners cannot demote each other into a firm with none.
 */
export async function lockOwners(tx: Tx, scope: TenantScope): Promise<string[]> {
  const rows = await tx
    .selectFrom('membership')
    .select('userId')
    .where('tenantId', '=', scope.tenantId)
    .where('role', '=', 'owner')
    .forUpdate()
    .execute();
  return rows.map((r) => r.userId);
}

/** The person's account, made on first invitation; an e-mail is one person across firms. */
export async function ensureUser(tx: Tx, email: string, name: string): Promise<string> {
  await tx
    .insertInto('appUser')
    .values({ email, name })
    .onConflict((oc) => oc.column('email').doNothing())
    .execute();
  const row = await tx
    .selectFrom('appUser')
    .select('id')
    .where('email', '=', email)
    .executeTakeFirstOrThrow();
  return row.id;
}

export async function addMembership(
  tx: Tx,
  scope: TenantScope,
  userId: string,
  role: Role,
  invitedBy: string,
) {
  await tx
    .insertInto('membership')
    .values({ tenantId: scope.tenantId, userId, role, invitedBy, joinedAt: null })
    .execute();
}

export async function setRole(tx: Tx, scope: TenantScope, userId: string, role: Role) {
  await tx
    .updateTable('membership')
    .set({ role })
    .where('tenantId', '=', scope.tenantId)
    .where('userId', '=', userId)
    .execute();
}

export async function deleteMembership(tx: Tx, scope: TenantScope, userId: string) {
  await tx
    .deleteFrom('membership')
    .where('tenantId', '=', scope.tenantId)
    .where('userId', '=', userId)
    .execute();
}
