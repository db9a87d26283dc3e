import { sql, type Kysely } from 'kysely';

/**
 * Foundation tables. `tenant` and `app_user` are global; every other table carries
 * tenant_id, has indexes that start with it, and is guarded by row-level security that the
 * API's role (latchwork_app: not superuser, not owner) cannot bypass.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`create extension if not exists citext`.execute(db);

  await sql`
    create table tenant (
      id uuid primary key default gen_random_uuid(),
      slug text not null unique check (slug ~ '^[a-z0-9-]{2,40}$'),
      name text not null check (length(name) between 1 and 200),
      address_lines text[] not null default '{}',
      currency char(3) not null default 'GBP' check (currency ~ '^[A-Z]{3}$'),
      units text not null default 'metric' check (units in ('metric', 'imperial')),
      default_tax_rate_bp integer not null default 2000 check (default_tax_rate_bp between 0 and 10000),
      payment_terms_days integer not null default 30 check (payment_terms_days between 0 and 365),
      number_prefixes jsonb not null default
        '{"job":"J-","quote":"Q-","invoice":"INV-","creditNote":"CN-","purchaseOrder":"PO-"}',
      created_at timestamptz not null default now()
    )`.execute(db);

  await sql`
    create table app_user (
      id uuid primary key default gen_random_uuid(),
      email citext not null unique,
      name text not null,
      created_at timestamptz not null default now()
    )`.execute(db);

  await sql`
    create table membership (
      tenant_id uuid not null references tenant (id),
      user_id uuid not null references app_user (id),
      role text not null check (role in ('owner', 'estimator', 'stores', 'bookkeeper', 'installer')),
      created_at timestamptz not null default now(),
      primary key (tenant_id, user_id)
    )`.execute(db);
  await sql`create index membership_user_idx on membership (tenant_id, user_id, role)`.execute(db);

  await sql`
    create table audit_log (
      id uuid primary key default gen_random_uuid(),
      tenant_id uuid not null references tenant (id),
      user_id uuid references app_user (id),
      action text not null,
      subject text,
      detail jsonb not null default '{}',
      ip_address text,
      created_at timestamptz not null default now()
    )`.execute(db);
  await sql`create index audit_log_tenant_time_idx on audit_log (tenant_id, created_at desc)`.execute(
    db,
  );

  await sql`
    create table file (
      id uuid primary key default gen_random_uuid(),
      tenant_id uuid not null references tenant (id),
      object_key text not null,
      file_name text not null,
      content_type text not null,
      size_bytes bigint not null check (size_bytes >= 0),
      uploaded_by uuid references app_user (id),
      created_at timestamptz not null default now(),
      unique (tenant_id, id),
      unique (tenant_id, object_key)
    )`.execute(db);

  await sql`
    create table email_log (
      id uuid primary key default gen_random_uuid(),
      tenant_id uuid not null references tenant (id),
      to_address text not null,
      subject text not null,
      template text not null,
      status text not null default 'queued' check (status in ('queued', 'sent', 'failed')),
      message_id text,
      error text,
      attempts integer not null default 0,
      created_at timestamptz not null default now(),
      sent_at timestamptz,
      unique (tenant_id, id)
    )`.execute(db);
  await sql`create index email_log_tenant_time_idx on email_log (tenant_id, created_at desc)`.execute(
    db,
  );

  for (const table of ['membership', 'audit_log', 'file', 'email_log']) {
    await sql`alter table ${sql.table(table)} enable row level security`.execute(db);
    await sql`alter table ${sql.table(table)} force row level security`.execute(db);
    // Pooled connections report '' rather than NULL once the setting has been used.
    await sql`
      create policy tenant_isolation on ${sql.table(table)}
      using (tenant_id = nullif(current_setting('app.tenant_id', true), '')::uuid)
      with check (tenant_id = nullif(current_setting('app.tenant_id', true), '')::uuid)`.execute(
      db,
    );
  }

  await sql`grant select, insert, update on tenant, app_user to latchwork_app`.execute(db);
  await sql`grant select, insert, update, delete on membership, file to latchwork_app`.execute(db);
  await sql`grant select, insert, update on email_log to latchwork_app`.execute(db);
  // The audit log is append-only for the application.
  await sql`grant select, insert on audit_log to latchwork_app`.execute(db);
}
