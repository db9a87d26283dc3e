import { sql, type Kysely } from 'kysely';

/**
 * Movements by batch. A batch's own history (the ledger filtered by batch) and the foreign-key
 * check when a batch row goes both look movements up by (tenant, batch); without this index
 * each is a scan of the firm's whole ledger — measured on the 1,000,000-movement benchmark,
 * where removing the generated firm's 1,000 batches took minutes. Partial: most movements of
 * products without batches carry none.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`create index stock_movement_batch_idx on stock_movement (tenant_id, batch_id)
    where batch_id is not null`.execute(db);
}
