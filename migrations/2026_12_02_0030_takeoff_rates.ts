import { sql, type Kysely } from 'kysely';

/** The firm's own takeoff rates: only those that differ from the engine's defaults. */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`alter table tenant add column takeoff_rates jsonb not null default '{}'`.execute(db);
}
