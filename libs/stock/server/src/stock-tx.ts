/**
 * Small shared pieces of the stock endpoints: the firm's transaction for a request, the
 * database's "today", and whether a row of the firm exists.
 */
import { sql } from 'kysely';
import type { Kysely } from 'kysely';
import type { Request } from 'express';
import { withTenant, type Database, type TenantScope, type Tx } from '@latchwork/shared-db';
import { scopeOf } from '@latchwork/shared-server-kit';

/** Runs `work` in the signed-in firm's transaction. */
export function inFirm<T>(
  db: Kysely<Database>,
  req: Request,
  work: (tx: Tx, scope: TenantScope) => Promise<T>,
): Promise<T> {
  const scope = scopeOf(req);
  return withTenant(db, scope, (tx) => work(tx, scope));
}

/** The database's current date, YYYY-MM-DD: one clock for expiry checks on every server. */
export async function dbToday(tx: Tx): Promise<string> {
  return (await sql<{ d: string }>`select current_date::text as d`.execute(tx)).rows[0].d;
}

type FirmTable = 'product' | 'supplier' | 'job' | 'site' | 'stockLocation';

/** Whether the firm has a row `id` in `table` (row-level security hides other firms' rows too). */
export async function existsInFirm(
  tx: Tx,
  scope: TenantScope,
  table: FirmTable,
  id: string,
): Promise<boolean> {
  const row = await tx
    .selectFrom(table)
    .select('id')
    .where('tenantId', '=', scope.tenantId)
    .where('id', '=', id)
    .executeTakeFirst();
  return !!row;
}
