import { sql, type Kysely } from 'kysely';

/**
 * An index behind the job → site foreign key. Without it, deleting or re-keying a site makes
 * PostgreSQL read the whole job table to check that no job still points at it (seen when the
 * 100,000-job benchmark removed its 5,000 sites: minutes instead of a second), and a site's
 * jobs could only be listed by reading every job of the firm.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`create index job_site_idx on job (tenant_id, site_id)`.execute(db);
}
