import { sql, type Kysely } from 'kysely';

/**
 * Site surveys (one per job), their areas and immutable takeoff versions, slab readings with
 * the verdict they got when recorded, a firm's own slab limits, and files linked to jobs,
 * sites and customers with their image thumbnails.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    create table survey (
      id uuid primary key default gen_random_uuid(),
      tenant_id uuid not null references tenant (id),
      job_id uuid not null,
      substrate text check (substrate in ('concrete', 'screed', 'asphalt', 'timber',
        'existing_floor')),
      surveyed_at timestamptz,
      surveyor_user_id uuid references app_user (id),
      notes text not null default '' check (length(notes) <= 10000),
      created_at timestamptz not null default now(),
      updated_at timestamptz not null default now(),
      unique (tenant_id, id),
      unique (tenant_id, job_id),
      foreign key (tenant_id, job_id) references job (tenant_id, id)
    )`.execute(db);

  await sql`
    create table survey_area (
      id uuid primary key default gen_random_uuid(),
      tenant_id uuid not null references tenant (id),
      job_id uuid not null,
      name text not null check (length(name) between 1 and 120),
      created_by uuid references app_user (id),
      created_at timestamptz not null default now(),
      unique (tenant_id, id),
      foreign key (tenant_id, job_id) references job (tenant_id, id)
    )`.execute(db);
  // Two areas of one job with one name would make "bay 2" ambiguous on the quote.
  await sql`create unique index survey_area_name_idx on survey_area (tenant_id, job_id, lower(name))`.execute(
    db,
  );

  // A saved takeoff never changes: editing an area saves version n + 1.
  await sql`
    create table takeoff_version (
      id uuid primary key default gen_random_uuid(),
      tenant_id uuid not null references tenant (id),
      area_id uuid not null,
      version integer not null check (version > 0),
      input jsonb not null,
      rates jsonb not null,
      summary jsonb not null,
      created_by uuid references app_user (id),
      created_at timestamptz not null default now(),
      unique (tenant_id, area_id, version),
      foreign key (tenant_id, area_id) references survey_area (tenant_id, id)
    )`.execute(db);

  await sql`
    create table slab_reading (
      id uuid primary key default gen_random_uuid(),
      tenant_id uuid not null references tenant (id),
      job_id uuid not null,
      kind text not null check (kind in ('relative_humidity', 'moisture_emission',
        'surface_regularity', 'air_temperature', 'slab_temperature')),
      method text not null check (length(method) between 1 and 40),
      value double precision not null,
      unit text check (unit in ('lb_per_1000ft2_24h', 'g_per_m2_24h')),
      location text not null default '' check (length(location) <= 200),
      taken_at timestamptz not null,
      status text not null check (status in ('pass', 'warn', 'fail')),
      message text not null,
      source text not null,
      recorded_by uuid references app_user (id),
      created_at timestamptz not null default now(),
      unique (tenant_id, id),
      foreign key (tenant_id, job_id) references job (tenant_id, id)
    )`.execute(db);
  await sql`create index slab_reading_job_idx on slab_reading (tenant_id, job_id, taken_at)`.execute(
    db,
  );

  await sql`
    create table survey_settings (
      tenant_id uuid primary key references tenant (id),
      slab_limits jsonb not null default '{}',
      updated_by uuid references app_user (id),
      updated_at timestamptz not null default now()
    )`.execute(db);

  // A file may belong to several records (a plan filed on the job and on the site).
  await sql`
    create table file_link (
      id uuid primary key default gen_random_uuid(),
      tenant_id uuid not null references tenant (id),
      file_id uuid not null,
      owner_kind text not null check (owner_kind in ('job', 'site', 'customer')),
      job_id uuid,
      site_id uuid,
      customer_id uuid,
      created_at timestamptz not null default now(),
      check ((owner_kind = 'job') = (job_id is not null)
        and (owner_kind = 'site') = (site_id is not null)
        and (owner_kind = 'customer') = (customer_id is not null)),
      foreign key (tenant_id, file_id) references file (tenant_id, id) on delete cascade,
      foreign key (tenant_id, job_id) references job (tenant_id, id),
      foreign key (tenant_id, site_id) references site (tenant_id, id),
      foreign key (tenant_id, customer_id) references customer (tenant_id, id)
    )`.execute(db);
  await sql`create index file_link_job_idx on file_link (tenant_id, job_id) where job_id is not null`.execute(
    db,
  );
  await sql`create index file_link_site_idx on file_link (tenant_id, site_id) where site_id is not null`.execute(
    db,
  );
  await sql`create index file_link_customer_idx on file_link (tenant_id, customer_id)
    where customer_id is not null`.execute(db);
  await sql`create index file_link_file_idx on file_link (tenant_id, file_id)`.execute(db);

  await sql`
    create table file_thumbnail (
      tenant_id uuid not null references tenant (id),
      file_id uuid not null,
      object_key text not null,
      content_type text not null,
      width integer not null check (width > 0),
      height integer not null check (height > 0),
      size_bytes bigint not null check (size_bytes >= 0),
      primary key (tenant_id, file_id),
      foreign key (tenant_id, file_id) references file (tenant_id, id) on delete cascade
    )`.execute(db);

  const tables = [
    'survey',
    'survey_area',
    'takeoff_version',
    'slab_reading',
    'survey_settings',
    'file_link',
    'file_thumbnail',
  ];
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
  await sql`grant select, insert, update on survey, survey_area, survey_settings
    to latchwork_app`.execute(db);
  await sql`grant select, insert, delete on slab_reading, file_link, file_thumbnail
    to latchwork_app`.execute(db);
  await sql`grant select, insert on takeoff_version to latchwork_app`.execute(db);
}
