import { sql, type Kysely } from 'kysely';

/**
 * Customers, their contacts and sites, and jobs with their stage history. Money is integer
 * minor units (bigint); job references are gapless per firm through `job_counter`, whose row
 * is locked by the increment until the creating transaction ends.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`create extension if not exists pg_trgm`.execute(db);

  await sql`
    create table customer (
      id uuid primary key default gen_random_uuid(),
      tenant_id uuid not null references tenant (id),
      kind text not null check (kind in ('business', 'homeowner')),
      name text not null check (length(name) between 1 and 200),
      external_ref text check (length(external_ref) between 1 and 60),
      email citext,
      phone text,
      billing_address_lines text[] not null default '{}',
      postcode text,
      payment_terms_days integer check (payment_terms_days between 0 and 365),
      credit_limit_minor bigint check (credit_limit_minor >= 0),
      notes text not null default '',
      created_by uuid references app_user (id),
      created_at timestamptz not null default now(),
      updated_at timestamptz not null default now(),
      unique (tenant_id, id)
    )`.execute(db);
  await sql`create unique index customer_ref_idx on customer (tenant_id, external_ref)
    where external_ref is not null`.execute(db);
  await sql`create index customer_email_idx on customer (tenant_id, email)`.execute(db);
  await sql`create index customer_name_idx on customer (tenant_id, lower(name))`.execute(db);
  await sql`create index customer_search_idx on customer
    using gin ((name || ' ' || coalesce(email::text, '') || ' ' || coalesce(postcode, '')) gin_trgm_ops)`.execute(
    db,
  );

  await sql`
    create table customer_contact (
      id uuid primary key default gen_random_uuid(),
      tenant_id uuid not null references tenant (id),
      customer_id uuid not null,
      name text not null check (length(name) between 1 and 200),
      role text not null default '',
      email citext,
      phone text,
      position integer not null default 0,
      created_at timestamptz not null default now(),
      foreign key (tenant_id, customer_id) references customer (tenant_id, id) on delete cascade
    )`.execute(db);
  await sql`create index customer_contact_idx on customer_contact (tenant_id, customer_id, position)`.execute(
    db,
  );

  await sql`
    create table site (
      id uuid primary key default gen_random_uuid(),
      tenant_id uuid not null references tenant (id),
      customer_id uuid not null,
      external_ref text check (length(external_ref) between 1 and 60),
      name text not null default '',
      address_lines text[] not null default '{}',
      postcode text,
      access_notes text not null default '',
      parking text not null default '',
      floor_type text not null default '',
      opening_hours text not null default '',
      created_at timestamptz not null default now(),
      updated_at timestamptz not null default now(),
      unique (tenant_id, id),
      foreign key (tenant_id, customer_id) references customer (tenant_id, id)
    )`.execute(db);
  await sql`create index site_customer_idx on site (tenant_id, customer_id)`.execute(db);
  await sql`create unique index site_ref_idx on site (tenant_id, external_ref)
    where external_ref is not null`.execute(db);

  await sql`
    create table job_counter (
      tenant_id uuid primary key references tenant (id),
      last_number integer not null check (last_number >= 0)
    )`.execute(db);

  await sql`
    create table job (
      id uuid primary key default gen_random_uuid(),
      tenant_id uuid not null references tenant (id),
      number integer not null check (number > 0),
      reference text not null,
      title text not null check (length(title) between 1 and 200),
      customer_id uuid not null,
      site_id uuid,
      value_estimate_minor bigint check (value_estimate_minor >= 0),
      source text not null default '',
      owner_user_id uuid references app_user (id),
      stage text not null default 'enquiry' check (stage in ('enquiry', 'survey_booked',
        'surveyed', 'quoted', 'won', 'lost', 'scheduled', 'installing', 'completed',
        'invoiced', 'paid', 'on_hold', 'cancelled')),
      stage_changed_at timestamptz not null default now(),
      lost_reason text,
      enquiry_on date not null default current_date,
      survey_at timestamptz,
      quote_due_on date,
      install_start_on date,
      install_end_on date,
      created_by uuid references app_user (id),
      created_at timestamptz not null default now(),
      updated_at timestamptz not null default now(),
      unique (tenant_id, id),
      unique (tenant_id, number),
      foreign key (tenant_id, customer_id) references customer (tenant_id, id),
      foreign key (tenant_id, site_id) references site (tenant_id, id)
    )`.execute(db);
  await sql`create index job_stage_idx on job (tenant_id, stage, stage_changed_at desc)`.execute(
    db,
  );
  await sql`create index job_customer_idx on job (tenant_id, customer_id)`.execute(db);
  await sql`create index job_owner_idx on job (tenant_id, owner_user_id)`.execute(db);
  await sql`create index job_enquiry_idx on job (tenant_id, enquiry_on desc)`.execute(db);
  await sql`create index job_search_idx on job using gin ((reference || ' ' || title) gin_trgm_ops)`.execute(
    db,
  );

  await sql`
    create table job_stage_move (
      id uuid primary key default gen_random_uuid(),
      tenant_id uuid not null references tenant (id),
      job_id uuid not null,
      from_stage text,
      to_stage text not null,
      reason text,
      rule text,
      moved_by uuid references app_user (id),
      moved_at timestamptz not null default now(),
      foreign key (tenant_id, job_id) references job (tenant_id, id)
    )`.execute(db);
  await sql`create index job_stage_move_idx on job_stage_move (tenant_id, job_id, moved_at)`.execute(
    db,
  );

  const tables = ['customer', 'customer_contact', 'site', 'job_counter', 'job', 'job_stage_move'];
  for (const table of tables) {
    await sql`alter table ${sql.table(table)} enable row level security`.execute(db);
    await sql`alter table ${sql.table(table)} force row level security`.execute(db);
    await sql`
      create policy tenant_isolation on ${sql.table(table)}
      using (tenant_id = nullif(current_setting('app.tenant_id', true), '')::uuid)
      with check (tenant_id = nullif(current_setting('app.tenant_id', true), '')::uuid)`.execute(
      db,
    );
  }
  await sql`grant select, insert, update, delete on customer, customer_contact, site
    to latchwork_app`.execute(db);
  await sql`grant select, insert, update on job, job_counter to latchwork_app`.execute(db);
  // Stage history is append-only: a move is undone by another move, with its reason.
  await sql`grant select, insert on job_stage_move to latchwork_app`.execute(db);
}
