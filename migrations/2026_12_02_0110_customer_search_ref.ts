import { sql, type Kysely } from 'kysely';

/**
 * Customer search also finds the firm's own reference (an account number typed from an
 * invoice). The trigram index must cover the exact expression the list query filters on,
 * so it is rebuilt with `external_ref` in it and the narrower index is dropped (keeping both
 * would only slow every write).
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`create index customer_search_all_idx on customer using gin ((
    name || ' ' || coalesce(email::text, '') || ' ' || coalesce(postcode, '') || ' ' ||
    coalesce(external_ref, '')) gin_trgm_ops)`.execute(db);
  await sql`drop index customer_search_idx`.execute(db);
}
