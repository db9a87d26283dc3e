import { sql, type Kysely } from 'kysely';

/**
 * Indexes the 100,000-job benchmark (tests/bench/jobs-bench.ts) showed were needed.
 *
 * 1. Job search. Under FORCE'd row-level security PostgreSQL lets only leakproof operators
 *    into an index condition, and ILIKE is not one, so the trigram index on `job` from
 *    2026_12_02_0100 was never used by the app: a search read every job of the firm. As for
 *    customers (2026_12_02_0111), the search text lives in `job_search`, kept by a trigger and
 *    read only through `job_search_ids(pattern)`, a SECURITY DEFINER function owned by the
 *    schema owner (for whom this table's RLS is not forced) that returns ids of the firm in
 *    `app.tenant_id` only. The app role has no grant on the table; the list query joins the ids
 *    back to `job` under its own RLS.
 * 2. The board: counts and values per stage by an index-only scan, and each column's newest
 *    cards in the index's order (stage, newest move first, job number as the tie-break).
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    create table job_search (
      tenant_id uuid not null,
      job_id uuid not null,
      search_text text not null,
      primary key (tenant_id, job_id),
      foreign key (tenant_id, job_id) references job (tenant_id, id) on delete cascade
    )`.execute(db);
  await sql`create index job_search_trgm_idx on job_search using gin (search_text gin_trgm_ops)`.execute(
    db,
  );
  // Enabled, not forced: the owner's functions below read it; nobody else has a grant.
  await sql`alter table job_search enable row level security`.execute(db);
  await sql`
    create policy tenant_isolation on job_search
    using (tenant_id = nullif(current_setting('app.tenant_id', true), '')::uuid)
    with check (tenant_id = nullif(current_setting('app.tenant_id', true), '')::uuid)`.execute(db);

  await sql`
    create function job_search_sync() returns trigger
    language plpgsql security definer set search_path = public, pg_temp as $$
    begin
      insert into job_search (tenant_id, job_id, search_text)
      values (new.tenant_id, new.id, new.reference || ' ' || new.title)
      on conflict (tenant_id, job_id) do update set search_text = excluded.search_text;
      return null;
    end $$`.execute(db);
  await sql`
    create trigger job_search_sync after insert or update of reference, title on job
    for each row execute function job_search_sync()`.execute(db);
  await sql`
    create function job_search_ids(pattern text) returns setof uuid
    language sql stable security definer set search_path = public, pg_temp as $$
      select job_id from job_search
      where tenant_id = nullif(current_setting('app.tenant_id', true), '')::uuid
        and search_text ilike pattern
    $$`.execute(db);
  await sql`revoke all on function job_search_ids(text) from public`.execute(db);
  await sql`revoke all on function job_search_sync() from public`.execute(db);
  await sql`grant execute on function job_search_ids(text) to latchwork_app`.execute(db);

  // Existing jobs, firm by firm (the owner, too, sees `job` only through RLS).
  await sql`
    do $$
    declare t uuid;
    begin
      for t in select id from tenant loop
        perform set_config('app.tenant_id', t::text, true);
        insert into job_search (tenant_id, job_id, search_text)
        select tenant_id, id, reference || ' ' || title from job;
      end loop;
      perform set_config('app.tenant_id', '', true);
    end $$`.execute(db);
  await sql`drop index job_search_idx`.execute(db);

  // Same leading columns as job_stage_idx, which it replaces.
  await sql`create index job_board_idx on job
    (tenant_id, stage, stage_changed_at desc, number desc) include (value_estimate_minor)`.execute(
    db,
  );
  await sql`drop index job_stage_idx`.execute(db);
}
