import { sql, type Kysely } from 'kysely';

/**
 * The job's timeline (`job_event`, append-only: every feature that touches a job writes one
 * line here), notes with the members they mention, and `job_crew` — who is booked on a job.
 * An installer reads only the jobs they are on the crew of; the scheduling issue fills it.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    create table job_event (
      id uuid primary key default gen_random_uuid(),
      tenant_id uuid not null references tenant (id),
      job_id uuid not null,
      kind text not null check (length(kind) between 1 and 60),
      summary text not null check (length(summary) between 1 and 500),
      detail jsonb not null default '{}',
      actor_user_id uuid references app_user (id),
      created_at timestamptz not null default now(),
      foreign key (tenant_id, job_id) references job (tenant_id, id)
    )`.execute(db);
  // The timeline pages newest first; id breaks ties between events of one transaction.
  await sql`create index job_event_job_idx on job_event (tenant_id, job_id, created_at desc, id desc)`.execute(
    db,
  );

  await sql`
    create table job_note (
      id uuid primary key default gen_random_uuid(),
      tenant_id uuid not null references tenant (id),
      job_id uuid not null,
      author_user_id uuid references app_user (id),
      body text not null check (length(body) between 1 and 10000),
      mentions uuid[] not null default '{}',
      created_at timestamptz not null default now(),
      foreign key (tenant_id, job_id) references job (tenant_id, id)
    )`.execute(db);
  await sql`create index job_note_job_idx on job_note (tenant_id, job_id, created_at desc)`.execute(
    db,
  );

  await sql`
    create table job_crew (
      tenant_id uuid not null references tenant (id),
      job_id uuid not null,
      user_id uuid not null,
      created_at timestamptz not null default now(),
      primary key (tenant_id, job_id, user_id),
      foreign key (tenant_id, job_id) references job (tenant_id, id),
      foreign key (tenant_id, user_id) references membership (tenant_id, user_id) on delete cascade
    )`.execute(db);
  // An installer's job list starts from their crew rows.
  await sql`create index job_crew_user_idx on job_crew (tenant_id, user_id, job_id)`.execute(db);

  for (const table of ['job_event', 'job_note', 'job_crew']) {
    await sql`alter table ${sql.table(table)} enable row level security`.execute(db);
    await sql`alter table ${sql.table(table)} force row level security`.execute(db);
    await sql`
      create policy tenant_isolation on ${sql.table(table)}
      using (tenant_id = nullif(current_setting('app.tenant_id', true), '')::uuid)
      with check (tenant_id = nullif(current_setting('app.tenant_id', true), '')::uuid)`.execute(
      db,
    );
  }
  // The timeline and notes are a record: corrections are new lines, never edits.
  await sql`grant select, insert on job_event, job_note to latchwork_app`.execute(db);
  await sql`grant select, insert, delete on job_crew to latchwork_app`.execute(db);
}
