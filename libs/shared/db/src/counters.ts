import { sql } from 'kysely';
import type { TenantScope, Tx } from './tenant-scope';

/** Per-firm counter tables: one row per tenant holding the last number given out. */
export type CounterTable = 'job_counter' | 'purchase_order_counter';

/**
 * The firm's next number from a counter table (1 for the first). The upsert takes the
 * counter row's lock until the calling transaction ends, so concurrent callers queue and a
 * rolled-back one gives its number back: document numbers stay gapless.
 */
export async function nextNumber(tx: Tx, scope: TenantScope, table: CounterTable): Promise<number> {
  const { rows } = await sql<{ n: number }>`
    insert into ${sql.table(table)} (tenant_id, last_number) values (${scope.tenantId}, 1)
    on conflict (tenant_id) do update set last_number = ${sql.table(table)}.last_number + 1
    returning last_number as n`.execute(tx);
  return rows[0].n;
}
