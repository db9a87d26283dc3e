import { sql, type Kysely } from 'kysely';

/**
 * Customer search through a trigram index that the app can actually use. Under FORCE'd
 * row-level security PostgreSQL only lets leakproof operators into an index condition, and
 * ILIKE is not leakproof, so the index of 2026_12_02_0110 on `customer` was never used by the
 * app role: every search read all of the firm's customers. (Measured with 100,000 customers
 * in one firm: ~450 ms a search through RLS; ~1.5 ms with the index.)
 *
 * The search text now lives in `customer_search`, kept by a trigger, readable only through
 * `customer_search_ids(pattern)`: a SECURITY DEFINER function owned by the schema owner (for
 * whom this table's RLS is not forced) that returns ids of the firm in `app.tenant_id` only.
 * The app role has no grant on the table itself, and the list query joins the ids back to
 * `customer` under its own RLS, so a firm still sees nothing of another.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    create table customer_search (
      tenant_id uuid not null,
      customer_id uuid not null,
      search_text text not null,
      primary key (tenant_id, customer_id),
      foreign key (tenant_id, customer_id) references customer (tenant_id, id) on delete cascade
    )`.execute(db);
  await sql`create index customer_search_trgm_idx on customer_search
    using gin (search_text gin_trgm_ops)`.execute(db);
  // Enabled, not forced: the owner's functions below read it; nobody else has a grant.
  await sql`alter table customer_search enable row level security`.execute(db);
  await sql`
    create policy tenant_isolation on customer_search
    using (tenant_id = nullif(current_setting('app.tenant_id', true), '')::uuid)
    with check (tenant_id = nullif(current_setting('app.tenant_id', true), '')::uuid)`.execute(db);

  await sql`
    create function customer_search_sync() returns trigger
    language plpgsql security definer set search_path = public, pg_temp as $$
    begin
      insert into customer_search (tenant_id, customer_id, search_text)
      values (new.tenant_id, new.id, new.name || ' ' || coalesce(new.email::text, '') || ' ' ||
        coalesce(new.postcode, '') || ' ' || coalesce(new.external_ref, ''))
      on conflict (tenant_id, customer_id) do update set search_text = excluded.search_text;
      return null;
    end $$`.execute(db);
  await sql`
    create trigger customer_search_sync
    after insert or update of name, email, postcode, external_ref on customer
    for each row execute function customer_search_sync()`.execute(db);

  await sql`
    create function customer_search_ids(pattern text) returns setof uuid
    language sql stable security definer set search_path = public, pg_temp as $$
      select customer_id from customer_search
      where tenant_id = nullif(current_setting('app.tenant_id', true), '')::uuid
        and search_text ilike pattern
    $$`.execute(db);
  await sql`revoke all on function customer_search_ids(text) from public`.execute(db);
  await sql`revoke all on function customer_search_sync() from public`.execute(db);
  await sql`grant execute on function customer_search_ids(text) to latchwork_app`.execute(db);

  // Existing customers, firm by firm (the owner, too, sees `customer` only through RLS).
  await sql`
    do $$
    declare t uuid;
    begin
      for t in select id from tenant loop
        perform set_config('app.tenant_id', t::text, true);
        insert into customer_search (tenant_id, customer_id, search_text)
        select tenant_id, id, name || ' ' || coalesce(email::text, '') || ' ' ||
          coalesce(postcode, '') || ' ' || coalesce(external_ref, '')
        from customer;
      end loop;
      perform set_config('app.tenant_id', '', true);
    end $$`.execute(db);
  await sql`drop index customer_search_all_idx`.execute(db);
}
