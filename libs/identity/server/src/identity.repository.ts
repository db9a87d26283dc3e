import { sql, type Kysely } from 'kysely';
import { withTenant, type Database } from '@latchwork/shared-db';
import { isRole, permissionsOf } from '@latchwork/shared-access';
import type { Actor } from '@latchwork/shared-server-kit';

export interface MembershipSummary {
  tenantId: string;
  tenantName: string;
  role: string;
}

export function findUserByEmail(db: Kysely<Database>, email: string) {
  return db.selectFrom('appUser').selectAll().where('email', '=', email).executeTakeFirst();
}

/**
 * The firms a person belongs to. Runs with `app.user_id` set, which the own-memberships
 * policy allows, since no firm has been chosen yet when this is asked (at sign-in).
 */
export async function membershipsOfUser(
  db: Kysely<Database>,
  userId: string,
): Promise<MembershipSummary[]> {
  return db.transaction().execute(async (tx) => {
    await sql`select set_config('app.user_id', ${userId}, true)`.execute(tx);
    return tx
      .selectFrom('membership as m')
      .innerJoin('tenant as t', 't.id', 'm.tenantId')
      .select(['m.tenantId', 't.name as tenantName', 'm.role'])
      .where('m.userId', '=', userId)
      .orderBy('t.name')
      .execute();
  });
}

/** Marks a person's pending invitations as joined: their first sign-in accepts them. */
export async function markJoined(
  db: Kysely<Database>,
  userId: string,
  tenantIds: string[],
): Promise<void> {
  for (const tenantId of tenantIds) {
    await withTenant(db, { tenantId }, (tx) =>
      tx
        .updateTable('membership')
        .set({ joinedAt: new Date() })
        .where('tenantId', '=', tenantId)
        .where('userId', '=', userId)
        .where('joinedAt', 'is', null)
        .execute(),
    );
  }
}

/** The actor for a session, or undefined when the membership no longer exists. */
export async function loadActor(
  db: Kysely<Database>,
  userId: string,
  tenantId: string,
): Promise<Actor | undefined> {
  const row = await withTenant(db, { tenantId }, (tx) =>
    tx
      .selectFrom('membership as m')
      .innerJoin('appUser as u', 'u.id', 'm.userId')
      .select(['u.id', 'u.email', 'u.name', 'm.role'])
      .where('m.tenantId', '=', tenantId)
      .where('m.userId', '=', userId)
      .executeTakeFirst(),
  );
  if (!row || !isRole(row.role)) return undefined;
  return {
    userId: row.id,
    email: row.email,
    name: row.name,
    tenantId,
    role: row.role,
    permissions: permissionsOf(row.role),
  };
}
