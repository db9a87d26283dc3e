/**
 * The stock value report. Cost is per product (weighted average: the exact value over the
 * quantity), so the value held at one location is that product's value × its share of the
 * quantity, rounded half-even once per row. The firm's total is the exact sum of the
 * products' values, not of the rounded rows.
 */
import { sql } from 'kysely';
import type { TenantScope, Tx } from '@latchwork/shared-db';
import { mulDivRound } from '@latchwork/stock-domain';

interface Cell {
  locationId: string;
  locationName: string;
  locationKind: string;
  kind: string;
  quantityLines: number;
  valueMinor: number;
}

/** Stock value by location × product kind, with totals per location, per kind and overall. */
export async function stockValueReport(tx: Tx, scope: TenantScope) {
  const t = scope.tenantId;
  const { rows } = await sql<{
    locationId: string;
    locationName: string;
    locationKind: string;
    kind: string;
    quantity: string;
    productQuantity: string;
    productValue: string;
  }>`
    select sb.location_id, l.name as location_name, l.kind as location_kind, p.kind,
      sb.quantity::text, c.quantity::text as product_quantity, c.value_minor::text as product_value
    from stock_balance sb
    join product p on p.tenant_id = ${t} and p.id = sb.product_id
    join stock_location l on l.tenant_id = ${t} and l.id = sb.location_id
    join product_cost_state c on c.tenant_id = ${t} and c.product_id = sb.product_id
    where sb.tenant_id = ${t} and sb.quantity > 0`.execute(tx);
  const cells = new Map<string, Cell>();
  for (const r of rows) {
    const total = Number(r.productQuantity);
    const value = total > 0 ? mulDivRound(Number(r.productValue), Number(r.quantity), total) : 0;
    const key = `${r.locationId}|${r.kind}`;
    const cell = cells.get(key) ?? {
      locationId: r.locationId,
      locationName: r.locationName,
      locationKind: r.locationKind,
      kind: r.kind,
      quantityLines: 0,
      valueMinor: 0,
    };
    cell.quantityLines += 1;
    cell.valueMinor += value;
    cells.set(key, cell);
  }
  const sum = (list: Cell[]) => list.reduce((s, c) => s + c.valueMinor, 0);
  const all = [...cells.values()].sort(
    (a, b) => a.locationName.localeCompare(b.locationName) || a.kind.localeCompare(b.kind),
  );
  const group = <K extends 'locationId' | 'kind'>(key: K) =>
    [...new Set(all.map((c) => c[key]))].map((id) => {
      const part = all.filter((c) => c[key] === id);
      return { ...part[0], valueMinor: sum(part), quantityLines: part.length };
    });
  const exact = await tx
    .selectFrom('productCostState')
    .select(sql<string>`coalesce(sum(value_minor), 0)::text`.as('v'))
    .where('tenantId', '=', t)
    .executeTakeFirstOrThrow();
  return {
    totalValueMinor: Number(exact.v),
    cells: all,
    byLocation: group('locationId').map(({ kind: _k, ...l }) => l),
    byKind: group('kind').map((k) => ({ kind: k.kind, valueMinor: k.valueMinor })),
  };
}

/** Batches with stock that expire within `days` (expired ones first), valued at average cost. */
export async function expiringReport(tx: Tx, scope: TenantScope, days: number) {
  const t = scope.tenantId;
  const { rows } = await sql<{
    batchId: string;
    code: string;
    expiresOn: string;
    receivedOn: string;
    productId: string;
    sku: string;
    productName: string;
    kind: string;
    locationId: string;
    locationName: string;
    quantity: string;
    productQuantity: string | null;
    productValue: string | null;
    daysLeft: number;
  }>`
    select b.id as batch_id, b.code, b.expires_on, b.received_on, p.id as product_id, p.sku,
      p.name as product_name, p.kind, l.id as location_id, l.name as location_name,
      sb.quantity::text, c.quantity::text as product_quantity,
      c.value_minor::text as product_value, (b.expires_on - current_date) as days_left
    from stock_batch b
    join stock_balance sb on sb.tenant_id = ${t} and sb.batch_id = b.id and sb.quantity > 0
    join product p on p.tenant_id = ${t} and p.id = b.product_id
    join stock_location l on l.tenant_id = ${t} and l.id = sb.location_id
    left join product_cost_state c on c.tenant_id = ${t} and c.product_id = p.id
    where b.tenant_id = ${t} and b.expires_on is not null
      and b.expires_on <= current_date + ${days}::int
    order by b.expires_on, p.name, l.name`.execute(tx);
  return rows.map(({ productQuantity, productValue, ...r }) => {
    const total = Number(productQuantity ?? 0);
    const quantity = Number(r.quantity);
    return {
      ...r,
      quantity,
      expired: r.daysLeft < 0,
      valueMinor: total > 0 ? mulDivRound(Number(productValue), quantity, total) : 0,
    };
  });
}
