import { sql, type Kysely } from 'kysely';

/**
 * Sign-in and membership: server-side sessions (read by connect-pg-simple), who invited whom
 * and when they joined, and a second membership policy so that a signed-in person can list
 * their own firms before a firm is chosen (`app.user_id`, set per transaction).
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    create table app_session (
      sid varchar primary key,
      sess json not null,
      expire timestamp(6) not null
    )`.execute(db);
  await sql`create index app_session_expire_idx on app_session (expire)`.execute(db);
  await sql`grant select, insert, update, delete on app_session to latchwork_app`.execute(db);

  await sql`alter table membership add column invited_by uuid references app_user (id)`.execute(db);
  // Everyone already a member has joined: the default fills existing rows (DDL, so row-level
  // security does not hide them), then goes, so that new invitations start as not joined.
  await sql`alter table membership add column joined_at timestamptz default now()`.execute(db);
  await sql`alter table membership alter column joined_at drop default`.execute(db);
  await sql`create index membership_by_user_idx on membership (user_id)`.execute(db);

  await sql`
    create policy own_memberships on membership for select
    using (user_id = nullif(current_setting('app.user_id', true), '')::uuid)`.execute(db);
}
