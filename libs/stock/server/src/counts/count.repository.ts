/** Reading counts: the header, the lines with product and batch names, the list. */
import { sql } from 'kysely';
import type { StockCountStatus, TenantScope, Tx } from '@latchwork/shared-db';
import { NotFoundError } from '@latchwork/shared-server-kit';
import type { z } from 'zod';
import { loadProducts, packsOf, type ProductFacts } from '../purchasing/product-facts';
import type { countQuery } from './count.schemas';

/** A count's header as the services use it. */
export interface CountHeader {
  id: string;
  locationId: string;
  locationName: string;
  status: StockCountStatus;
  scope: 'all' | 'chosen';
  note: string;
  startedAt: Date;
  startedBy: string | null;
  submittedAt: Date | null;
  approvedBy: string | null;
  approvedAt: Date | null;
  postedAt: Date | null;
  netValueMinor: number | null;
  grossValueMinor: number | null;
}

/** The count, 404 when it is not the firm's; `lock` holds its row until the transaction ends. */
export async function findCount(
  tx: Tx,
  scope: TenantScope,
  countId: string,
  lock = false,
): Promise<CountHeader> {
  let q = tx
    .selectFrom('stockCount as c')
    .innerJoin('stockLocation as l', (j) =>
      j.onRef('l.id', '=', 'c.locationId').on('l.tenantId', '=', scope.tenantId),
    )
    .select(['c.id', 'c.locationId', 'l.name as locationName', 'c.status', 'c.scope', 'c.note'])
    .select(['c.startedAt', 'c.startedBy', 'c.submittedAt', 'c.approvedBy', 'c.approvedAt'])
    .select(['c.postedAt', 'c.netValueMinor', 'c.grossValueMinor'])
    .where('c.tenantId', '=', scope.tenantId)
    .where('c.id', '=', countId);
  if (lock) q = q.forUpdate('c');
  const row = await q.executeTakeFirst();
  if (!row) throw new NotFoundError('That stock count');
  const num = (v: string | null) => (v === null ? null : Number(v));
  return {
    ...row,
    netValueMinor: num(row.netValueMinor),
    grossValueMinor: num(row.grossValueMinor),
  };
}

/** A line of a count with what the sheet shows about its product and batch. */
export interface CountLine {
  id: string;
  position: number;
  productId: string;
  batchId: string | null;
  batchCode: string | null;
  expiresOn: string | null;
  expectedAtStart: number;
  counted: number | null;
  countedAt: Date | null;
  reason: string | null;
  reasonNote: string;
  expected: number | null;
  variance: number | null;
  unitCostMinor: number | null;
  varianceValueMinor: number | null;
  movementId: string | null;
  product: ProductFacts;
}

/** Every line of the count in sheet order, with its product's facts. */
export async function countLines(
  tx: Tx,
  scope: TenantScope,
  countId: string,
): Promise<CountLine[]> {
  const rows = await tx
    .selectFrom('stockCountLine as cl')
    .leftJoin('stockBatch as b', (j) =>
      j.onRef('b.id', '=', 'cl.batchId').on('b.tenantId', '=', scope.tenantId),
    )
    .selectAll('cl')
    .select(['b.code as batchCode', 'b.expiresOn'])
    .where('cl.tenantId', '=', scope.tenantId)
    .where('cl.countId', '=', countId)
    .orderBy('cl.position')
    .execute();
  const products = await loadProducts(
    tx,
    scope,
    rows.map((r) => r.productId),
  );
  const num = (v: string | null) => (v === null ? null : Number(v));
  return rows.map((r) => ({
    id: r.id,
    position: r.position,
    productId: r.productId,
    batchId: r.batchId,
    batchCode: r.batchCode,
    expiresOn: r.expiresOn,
    expectedAtStart: Number(r.expectedAtStart),
    counted: num(r.counted),
    countedAt: r.countedAt,
    reason: r.reason,
    reasonNote: r.reasonNote,
    expected: num(r.expected),
    variance: num(r.variance),
    unitCostMinor: num(r.unitCostMinor),
    varianceValueMinor: num(r.varianceValueMinor),
    movementId: r.movementId,
    product: products.get(r.productId) as ProductFacts,
  }));
}

/** A line as the blind sheet shows it: what to count and what was entered, no expected figure. */
export function sheetLine(l: CountLine) {
  const p = l.product;
  const counted = l.counted;
  return {
    id: l.id,
    position: l.position,
    productId: l.productId,
    sku: p.sku,
    productName: p.name,
    batchId: l.batchId,
    batchCode: l.batchCode,
    expiresOn: l.expiresOn,
    packSize: p.packSize,
    decimals: p.decimals,
    units: {
      unitOne: p.unitOne,
      unitOther: p.unitOther,
      packOne: p.packOne,
      packOther: p.packOther,
    },
    counted,
    countedPacks: counted === null ? null : packsOf(p, counted),
    countedAt: l.countedAt,
  };
}

/** Counts, newest first, with their location and how far the counting has got. */
export async function listCounts(tx: Tx, scope: TenantScope, f: z.output<typeof countQuery>) {
  let q = tx
    .selectFrom('stockCount as c')
    .innerJoin('stockLocation as l', (j) =>
      j.onRef('l.id', '=', 'c.locationId').on('l.tenantId', '=', scope.tenantId),
    )
    .select(['c.id', 'c.locationId', 'l.name as locationName', 'c.status', 'c.scope', 'c.note'])
    .select(['c.startedAt', 'c.submittedAt', 'c.approvedAt', 'c.postedAt'])
    .select(['c.netValueMinor', 'c.grossValueMinor'])
    .select((eb) => [
      eb
        .selectFrom('stockCountLine as cl')
        .select(sql<string>`count(*)`.as('n'))
        .whereRef('cl.countId', '=', 'c.id')
        .where('cl.tenantId', '=', scope.tenantId)
        .as('lineCount'),
      eb
        .selectFrom('stockCountLine as cl')
        .select(sql<string>`count(*)`.as('n'))
        .whereRef('cl.countId', '=', 'c.id')
        .where('cl.tenantId', '=', scope.tenantId)
        .where('cl.counted', 'is not', null)
        .as('countedCount'),
    ])
    .where('c.tenantId', '=', scope.tenantId);
  if (f.status) q = q.where('c.status', '=', f.status);
  if (f.locationId) q = q.where('c.locationId', '=', f.locationId);
  const rows = await q.orderBy('c.startedAt', 'desc').limit(f.limit).execute();
  const num = (v: string | null) => (v === null ? null : Number(v));
  return rows.map((r) => ({
    ...r,
    netValueMinor: num(r.netValueMinor),
    grossValueMinor: num(r.grossValueMinor),
    lineCount: Number(r.lineCount),
    countedCount: Number(r.countedCount),
  }));
}
