/**
 * Products with their stock figures: on hand and value from the weighted-average cost state
 * (kept with every posting), reserved from active reservations, available = on hand −
 * reserved. Every query filters by the firm first.
 */
import { sql } from 'kysely';
import type { TenantScope, Tx } from '@latchwork/shared-db';
import { averageUnitCost } from '@latchwork/stock-domain';
import type { ProductBody } from './catalogue.schemas';

const num = (v: string | number | null | undefined) => (v == null ? null : Number(v));

function baseQuery(tx: Tx, scope: TenantScope) {
  return tx
    .selectFrom('product as p')
    .leftJoin('productCostState as c', (j) =>
      j.onRef('c.productId', '=', 'p.id').on('c.tenantId', '=', scope.tenantId),
    )
    .leftJoin('supplier as s', (j) =>
      j.onRef('s.id', '=', 'p.preferredSupplierId').on('s.tenantId', '=', scope.tenantId),
    )
    .selectAll('p')
    .select([
      'c.quantity as onHand',
      'c.valueMinor as valueMinor',
      's.name as preferredSupplierName',
      (eb) =>
        eb
          .selectFrom('reservation as r')
          .select(sql<string>`coalesce(sum(r.quantity - r.issued_quantity), 0)`.as('q'))
          .where('r.tenantId', '=', scope.tenantId)
          .whereRef('r.productId', '=', 'p.id')
          .where('r.status', '=', 'active')
          .as('reserved'),
    ])
    .where('p.tenantId', '=', scope.tenantId);
}

type Row = Awaited<ReturnType<ReturnType<typeof baseQuery>['executeTakeFirstOrThrow']>>;

/** A product as the API returns it: bigints as numbers, with its stock figures. */
export function productView(row: Row) {
  const { tenantId: _t, ...p } = row;
  const onHand = num(p.onHand) ?? 0;
  const value = num(p.valueMinor) ?? 0;
  const reserved = num(p.reserved) ?? 0;
  return {
    ...p,
    packSize: Number(p.packSize),
    costMinor: Number(p.costMinor),
    priceMinor: Number(p.priceMinor),
    minOrderQuantity: num(p.minOrderQuantity),
    onHand,
    valueMinor: value,
    reserved,
    available: onHand - reserved,
    averageUnitCostMinor: averageUnitCost(
      { quantity: onHand, value, lastUnitCost: null },
      p.decimals,
    ),
  };
}
export type ProductView = ReturnType<typeof productView>;

export interface ProductFilter {
  q?: string;
  kind?: ProductBody['kind'];
  active: 'true' | 'false' | 'all';
  limit: number;
  offset: number;
}

/** One page of the catalogue, by kind then name, with the total that matched. */
export async function listProducts(tx: Tx, scope: TenantScope, f: ProductFilter) {
  let query = baseQuery(tx, scope);
  if (f.kind) query = query.where('p.kind', '=', f.kind);
  if (f.active !== 'all') query = query.where('p.active', '=', f.active === 'true');
  if (f.q) {
    const like = `%${f.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
    query = query.where((eb) => eb.or([eb('p.sku', 'ilike', like), eb('p.name', 'ilike', like)]));
  }
  const rows = await query
    .select(sql<string>`count(*) over ()`.as('total'))
    .orderBy('p.kind')
    .orderBy(sql`lower(p.name)`)
    .limit(f.limit)
    .offset(f.offset)
    .execute();
  return {
    items: rows.map(({ total: _n, ...r }) => productView(r)),
    total: rows.length > 0 ? Number(rows[0].total) : 0,
  };
}

export async function findProduct(tx: Tx, scope: TenantScope, productId: string) {
  const row = await baseQuery(tx, scope).where('p.id', '=', productId).executeTakeFirst();
  return row ? productView(row) : undefined;
}

/** The columns a body writes (jsonb as JSON text). */
export function productColumns(body: ProductBody) {
  return {
    ...body,
    attributes: JSON.stringify(body.attributes),
    kitComponents: JSON.stringify(body.kitComponents),
  };
}

export async function insertProduct(tx: Tx, scope: TenantScope, body: ProductBody) {
  const row = await tx
    .insertInto('product')
    .values({ tenantId: scope.tenantId, ...productColumns(body) })
    .returning('id')
    .executeTakeFirstOrThrow();
  return row.id;
}

export async function updateProduct(
  tx: Tx,
  scope: TenantScope,
  productId: string,
  body: ProductBody,
) {
  const r = await tx
    .updateTable('product')
    .set({ ...productColumns(body), updatedAt: new Date() })
    .where('tenantId', '=', scope.tenantId)
    .where('id', '=', productId)
    .executeTakeFirst();
  return Number(r.numUpdatedRows) > 0;
}
