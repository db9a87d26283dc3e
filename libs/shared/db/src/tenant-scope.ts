import { sql, type Kysely, type Transaction } from 'kysely';
import type { Database } from './database';

/** The tenant a unit of work acts for. Repository functions take it as their first argument. */
export interface TenantScope {
  readonly tenantId: string;
}

export type Tx = Transaction<Database>;

/**
 * Runs `work` in a transaction whose row-level-security context is the given tenant.
 * `set_config(..., true)` is transaction-local, so a pooled connection never carries one
 * tenant's context into another request.
 */
export async function withTenant<T>(
  db: Kysely<Database>,
  scope: TenantScope,
  work: (tx: Tx) => Promise<T>,
): Promise<T> {
  return db.transaction().execute(async (tx) => {
    await sql`select set_config('app.tenant_id', ${scope.tenantId}, true)`.execute(tx);
    return work(tx);
  });
}
