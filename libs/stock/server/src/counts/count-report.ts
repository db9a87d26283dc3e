/**
 * Variances over time, from posted counts: by product (with the net quantity, which only
 * adds up within one product), by location or by month of posting. Values are what posting
 * booked at the weighted-average cost of the day.
 */
import { sql } from 'kysely';
import type { TenantScope, Tx } from '@latchwork/shared-db';
import type { VarianceReportQuery } from './count.schemas';

/** One group of the report. */
export interface VarianceGroup {
  key: string;
  label: string;
  counts: number;
  lines: number;
  linesWithVariance: number;
  /** Net quantity in stock steps; only for the product grouping. */
  netQuantity: number | null;
  netValueMinor: number;
  grossValueMinor: number;
}

const GROUPS = {
  product: { key: sql`p.id::text`, label: sql`p.sku || ' ' || p.name` },
  location: { key: sql`l.id::text`, label: sql`l.name` },
  month: {
    key: sql`to_char(c.posted_at, 'YYYY-MM')`,
    label: sql`to_char(c.posted_at, 'YYYY-MM')`,
  },
} as const;

/** The report, biggest gross variance first (months in order). */
export async function varianceReport(
  tx: Tx,
  scope: TenantScope,
  f: VarianceReportQuery,
): Promise<VarianceGroup[]> {
  const t = scope.tenantId;
  const g = GROUPS[f.groupBy];
  const { rows } = await sql<{
    key: string;
    label: string;
    counts: string;
    lines: string;
    linesWithVariance: string;
    netQuantity: string;
    netValueMinor: string;
    grossValueMinor: string;
  }>`
    select ${g.key} as key, ${g.label} as label,
      count(distinct c.id) as counts, count(*) as lines,
      count(*) filter (where cl.variance <> 0) as lines_with_variance,
      sum(cl.variance)::text as net_quantity,
      sum(cl.variance_value_minor)::text as net_value_minor,
      sum(abs(cl.variance_value_minor))::text as gross_value_minor
    from stock_count_line cl
    join stock_count c on c.tenant_id = cl.tenant_id and c.id = cl.count_id
    join product p on p.tenant_id = cl.tenant_id and p.id = cl.product_id
    join stock_location l on l.tenant_id = c.tenant_id and l.id = c.location_id
    where cl.tenant_id = ${t} and c.status = 'posted'
      and (${f.from ?? null}::date is null or c.posted_at >= ${f.from ?? null}::date)
      and (${f.to ?? null}::date is null or c.posted_at < ${f.to ?? null}::date + 1)
      and (${f.locationId ?? null}::uuid is null or c.location_id = ${f.locationId ?? null}::uuid)
      and (${f.productId ?? null}::uuid is null or cl.product_id = ${f.productId ?? null}::uuid)
    group by 1, 2
    order by ${f.groupBy === 'month' ? sql`1` : sql`sum(abs(cl.variance_value_minor)) desc, 2`}`.execute(
    tx,
  );
  return rows.map((r) => ({
    key: r.key,
    label: r.label,
    counts: Number(r.counts),
    lines: Number(r.lines),
    linesWithVariance: Number(r.linesWithVariance),
    netQuantity: f.groupBy === 'product' ? Number(r.netQuantity) : null,
    netValueMinor: Number(r.netValueMinor),
    grossValueMinor: Number(r.grossValueMinor),
  }));
}
