/**
 * The ledger is the source of truth; the balance summary and the cost state are kept beside
 * it for speed. `checkLedger` recomputes both from the movements alone and lists every place
 * where the summary disagrees — after a correct run of anything, the lists are empty.
 */
import { sql } from 'kysely';
import type { TenantScope, Tx } from '@latchwork/shared-db';

/** A balance whose summary differs from the sum of its movements. */
export interface BalanceDifference {
  productId: string;
  batchId: string | null;
  locationId: string;
  ledger: number;
  summary: number;
}

/** A product whose cost state differs from its movements (quantity, or exact value). */
export interface CostDifference {
  productId: string;
  ledgerQuantity: number;
  summaryQuantity: number;
  ledgerValue: number;
  summaryValue: number;
}

export interface LedgerCheck {
  balances: BalanceDifference[];
  costs: CostDifference[];
}

// FULL JOIN needs an equality it can hash: a missing batch is compared as the nil uuid.
const NIL = '00000000-0000-0000-0000-000000000000';

/** Recomputes balances and cost states from the ledger; returns the differences. */
export async function checkLedger(tx: Tx, scope: TenantScope): Promise<LedgerCheck> {
  const t = scope.tenantId;
  const balances = await sql<{
    productId: string;
    batchId: string | null;
    locationId: string;
    ledger: string;
    summary: string;
  }>`
    with moved as (
      select product_id, batch_id, to_location_id as location_id, quantity as q
        from stock_movement where tenant_id = ${t} and to_location_id is not null
      union all
      select product_id, batch_id, from_location_id, -quantity
        from stock_movement where tenant_id = ${t} and from_location_id is not null
    ), ledger as (
      select product_id, coalesce(batch_id, ${NIL}::uuid) as batch_key, location_id,
        sum(q) as q
      from moved group by 1, 2, 3
    ), summary as (
      select product_id, coalesce(batch_id, ${NIL}::uuid) as batch_key, location_id, quantity
      from stock_balance where tenant_id = ${t}
    )
    select coalesce(l.product_id, s.product_id) as product_id,
      nullif(coalesce(l.batch_key, s.batch_key), ${NIL}::uuid) as batch_id,
      coalesce(l.location_id, s.location_id) as location_id,
      coalesce(l.q, 0)::text as ledger, coalesce(s.quantity, 0)::text as summary
    from ledger l full join summary s
      on s.product_id = l.product_id and s.batch_key = l.batch_key
        and s.location_id = l.location_id
    where coalesce(l.q, 0) <> coalesce(s.quantity, 0)`.execute(tx);

  const costs = await sql<{
    productId: string;
    ledgerQuantity: string;
    summaryQuantity: string;
    ledgerValue: string;
    summaryValue: string;
  }>`
    with ledger as (
      select product_id,
        sum(case when to_location_id is not null and from_location_id is null then quantity
                 when from_location_id is not null and to_location_id is null then -quantity
                 else 0 end) as q,
        sum(value_minor - settlement_minor) as v
      from stock_movement where tenant_id = ${t} group by product_id
    ), summary as (
      select product_id, quantity, value_minor from product_cost_state where tenant_id = ${t}
    )
    select coalesce(l.product_id, s.product_id) as product_id,
      coalesce(l.q, 0)::text as ledger_quantity, coalesce(s.quantity, 0)::text as summary_quantity,
      coalesce(l.v, 0)::text as ledger_value, coalesce(s.value_minor, 0)::text as summary_value
    from ledger l full join summary s on s.product_id = l.product_id
    where coalesce(l.q, 0) <> coalesce(s.quantity, 0)
       or coalesce(l.v, 0) <> coalesce(s.value_minor, 0)`.execute(tx);

  return {
    balances: balances.rows.map((r) => ({
      ...r,
      ledger: Number(r.ledger),
      summary: Number(r.summary),
    })),
    costs: costs.rows.map((r) => ({
      productId: r.productId,
      ledgerQuantity: Number(r.ledgerQuantity),
      summaryQuantity: Number(r.summaryQuantity),
      ledgerValue: Number(r.ledgerValue),
      summaryValue: Number(r.summaryValue),
    })),
  };
}
