/**
 * What the reorder run reads, in five set-wise queries however many products there are: the
 * products with their supplier terms and average cost, stock on hand (warehouses and vans —
 * stock already on a job's site is that job's), what is on open orders, what jobs starting
 * within the lead time have reserved, and the net issues per product and day of the window.
 */
import { sql } from 'kysely';
import type { TenantScope, Tx } from '@latchwork/shared-db';
import { averageUnitCost, type DemandEvent } from '@latchwork/stock-domain';

/** A product the run considers. */
export interface ReorderCandidate {
  id: string;
  sku: string;
  name: string;
  packSize: number;
  decimals: number;
  roundToPacks: boolean;
  minOrderQuantity: number | null;
  leadTimeDays: number;
  shelfLifeDays: number | null;
  serviceLevelBp: number | null;
  supplierId: string | null;
  supplierName: string | null;
  supplierOrderCostMinor: number | null;
  /** Catalogue cost, else the weighted average: what an order line is priced at. */
  unitCostMinor: number;
}

/** Where each product stands and what it has been used for. */
export interface ReorderFacts {
  candidates: ReorderCandidate[];
  onHand: Map<string, number>;
  onOrder: Map<string, number>;
  onOpenOrder: Set<string>;
  reserved: Map<string, number>;
  demand: Map<string, DemandEvent[]>;
}

const DEFAULT_LEAD_DAYS = 7;

const sums = (rows: { productId: string; q: string }[]) =>
  new Map(rows.map((r) => [r.productId, Number(r.q)]));

/** Loads everything for a run over the window `from`..`to` (ISO dates, inclusive). */
export async function loadReorderFacts(
  tx: Tx,
  scope: TenantScope,
  today: string,
  from: string,
  to: string,
): Promise<ReorderFacts> {
  const t = scope.tenantId;
  const products = await sql<{
    id: string;
    sku: string;
    name: string;
    packSize: string;
    decimals: number;
    roundToPacks: boolean;
    minOrderQuantity: string | null;
    leadTimeDays: number | null;
    shelfLifeDays: number | null;
    serviceLevelBp: number | null;
    supplierId: string | null;
    supplierName: string | null;
    supplierLead: number | null;
    supplierOrderCostMinor: string | null;
    costMinor: string;
    stockQuantity: string | null;
    stockValue: string | null;
  }>`
    select p.id, p.sku, p.name, p.pack_size, p.decimals, p.round_to_packs,
      p.min_order_quantity, p.lead_time_days, p.shelf_life_days, p.service_level_bp,
      s.id as supplier_id, s.name as supplier_name, s.lead_time_days as supplier_lead,
      s.order_cost_minor as supplier_order_cost_minor, p.cost_minor,
      c.quantity::text as stock_quantity, c.value_minor::text as stock_value
    from product p
    left join supplier s on s.tenant_id = p.tenant_id and s.id = p.preferred_supplier_id
      and s.active
    left join product_cost_state c on c.tenant_id = p.tenant_id and c.product_id = p.id
    where p.tenant_id = ${t} and p.active and p.kind not in ('labour', 'hire_tool')
    order by p.sku`.execute(tx);

  const onHand = await sql<{ productId: string; q: string }>`
    select b.product_id, sum(b.quantity)::text as q
    from stock_balance b join stock_location l on l.tenant_id = b.tenant_id and l.id = b.location_id
    where b.tenant_id = ${t} and l.kind <> 'site'
    group by b.product_id`.execute(tx);

  const ordered = await sql<{ productId: string; q: string }>`
    select pl.product_id, sum(greatest(pl.quantity - pl.received_quantity, 0))::text as q
    from purchase_order_line pl
    join purchase_order o on o.tenant_id = pl.tenant_id and o.id = pl.purchase_order_id
    where pl.tenant_id = ${t} and o.status in ('draft', 'sent', 'part_received')
    group by pl.product_id`.execute(tx);

  const reserved = await sql<{ productId: string; q: string }>`
    select r.product_id, sum(r.quantity - r.issued_quantity)::text as q
    from reservation r
    join job j on j.tenant_id = r.tenant_id and j.id = r.job_id
    left join product p on p.tenant_id = r.tenant_id and p.id = r.product_id
    left join supplier s on s.tenant_id = p.tenant_id and s.id = p.preferred_supplier_id
    where r.tenant_id = ${t} and r.status = 'active'
      and (j.install_start_on is null or j.install_start_on
        <= ${today}::date + coalesce(p.lead_time_days, s.lead_time_days, ${DEFAULT_LEAD_DAYS}))
    group by r.product_id`.execute(tx);

  // Issues out (+) and returns or reversals back (−) per product and calendar day (in the
  // database's time zone, the one current_date, and so `today`, is in).
  const demand = await sql<{ productId: string; day: string; q: string }>`
    select product_id, at::date::text as day,
      sum(case when to_location_id is null then quantity else -quantity end)::text as q
    from stock_movement
    where tenant_id = ${t} and kind in ('issue', 'return')
      and at >= ${from}::date and at < ${to}::date + 1
    group by 1, 2`.execute(tx);

  const events = new Map<string, DemandEvent[]>();
  for (const r of demand.rows) {
    const list = events.get(r.productId) ?? [];
    list.push({ date: r.day, quantity: Number(r.q) });
    events.set(r.productId, list);
  }
  const num = (v: string | null) => (v === null ? null : Number(v));
  return {
    candidates: products.rows.map((p) => ({
      id: p.id,
      sku: p.sku,
      name: p.name,
      packSize: Number(p.packSize),
      decimals: p.decimals,
      roundToPacks: p.roundToPacks,
      minOrderQuantity: num(p.minOrderQuantity),
      leadTimeDays: p.leadTimeDays ?? p.supplierLead ?? DEFAULT_LEAD_DAYS,
      shelfLifeDays: p.shelfLifeDays,
      serviceLevelBp: p.serviceLevelBp,
      supplierId: p.supplierId,
      supplierName: p.supplierName,
      supplierOrderCostMinor: num(p.supplierOrderCostMinor),
      unitCostMinor:
        Number(p.costMinor) > 0
          ? Number(p.costMinor)
          : (averageUnitCost(
              {
                quantity: Number(p.stockQuantity ?? 0),
                value: Number(p.stockValue ?? 0),
                lastUnitCost: null,
              },
              p.decimals,
            ) ?? 0),
    })),
    onHand: sums(onHand.rows),
    onOrder: sums(ordered.rows),
    onOpenOrder: new Set(ordered.rows.map((r) => r.productId)),
    reserved: sums(reserved.rows),
    demand: events,
  };
}
