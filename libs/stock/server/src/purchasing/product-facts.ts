/**
 * What counts, orders and goods in need to know about products: names, units and packs for
 * "3 boxes + 5 tiles", the catalogue cost, and the weighted-average cost the ledger keeps.
 * Quantities come in from the pages as whole packs plus loose steps.
 */
import { z } from 'zod';
import type { TenantScope, Tx } from '@latchwork/shared-db';
import { averageUnitCost, formatPacks } from '@latchwork/stock-domain';
import { invalidField } from '../stock-errors';

/** A product as counts and orders show and value it. */
export interface ProductFacts {
  id: string;
  sku: string;
  name: string;
  decimals: number;
  packSize: number;
  unitOne: string;
  unitOther: string;
  packOne: string;
  packOther: string;
  costMinor: number;
  taxRateBp: number;
  /** Weighted-average cost per whole unit; the catalogue cost when nothing is in stock. */
  averageCostMinor: number;
}

/** Whole packs plus loose steps, as the stores person counts and orders: "3 boxes + 5 tiles". */
export const packQuantity = {
  packs: z.number().int().min(0).max(1e9).default(0),
  units: z.number().int().min(0).max(1e12).default(0),
};

/** Steps of `packs` whole packs and `units` loose steps. */
export const stepsOf = (p: Pick<ProductFacts, 'packSize'>, q: { packs: number; units: number }) =>
  q.packs * p.packSize + q.units;

/** "3 boxes + 5 tiles" for `quantity` steps of product `p`. */
export function packsOf(
  p: Pick<
    ProductFacts,
    'packSize' | 'decimals' | 'unitOne' | 'unitOther' | 'packOne' | 'packOther'
  >,
  quantity: number,
): string {
  return formatPacks(
    quantity,
    p.packSize,
    { unit: { one: p.unitOne, other: p.unitOther }, pack: { one: p.packOne, other: p.packOther } },
    p.decimals,
  );
}

/** The named products of the firm, with their average cost, by id. */
export async function loadProducts(
  tx: Tx,
  scope: TenantScope,
  ids: readonly string[],
): Promise<Map<string, ProductFacts>> {
  const unique = [...new Set(ids)];
  if (unique.length === 0) return new Map();
  const rows = await tx
    .selectFrom('product as p')
    .leftJoin('productCostState as c', (j) =>
      j.onRef('c.productId', '=', 'p.id').on('c.tenantId', '=', scope.tenantId),
    )
    .select(['p.id', 'p.sku', 'p.name', 'p.decimals', 'p.packSize', 'p.unitOne', 'p.unitOther'])
    .select(['p.packOne', 'p.packOther', 'p.costMinor', 'p.taxRateBp'])
    .select(['c.quantity as stateQuantity', 'c.valueMinor as stateValue'])
    .where('p.tenantId', '=', scope.tenantId)
    .where('p.id', 'in', unique)
    .execute();
  return new Map(
    rows.map((r) => {
      const average = averageUnitCost(
        {
          quantity: Number(r.stateQuantity ?? 0),
          value: Number(r.stateValue ?? 0),
          lastUnitCost: null,
        },
        r.decimals,
      );
      const facts: ProductFacts = {
        id: r.id,
        sku: r.sku,
        name: r.name,
        decimals: r.decimals,
        packSize: Number(r.packSize),
        unitOne: r.unitOne,
        unitOther: r.unitOther,
        packOne: r.packOne,
        packOther: r.packOther,
        costMinor: Number(r.costMinor),
        taxRateBp: r.taxRateBp,
        averageCostMinor: average ?? Number(r.costMinor),
      };
      return [r.id, facts];
    }),
  );
}

/** The firm's row of `table` with this id (its name too); 400 naming `field` when there is none. */
export async function requireFirmRow(
  tx: Tx,
  scope: TenantScope,
  table: 'supplier' | 'stockLocation',
  id: string,
  field: string,
): Promise<{ id: string; name: string }> {
  const row = await tx
    .selectFrom(table)
    .select(['id', 'name'])
    .where('tenantId', '=', scope.tenantId)
    .where('id', '=', id)
    .executeTakeFirst();
  if (!row) invalidField(field, table === 'supplier' ? 'no such supplier' : 'no such location');
  return row;
}
