/**
 * Reading the ledger and the balance summary for the pages: movements with the names of
 * what they touch (and, for one product, the running quantity), balances by product × batch
 * × location with the quantity in packs ("3 boxes + 5 tiles").
 */
import { sql } from 'kysely';
import type { TenantScope, Tx } from '@latchwork/shared-db';
import { formatPacks } from '@latchwork/stock-domain';
import type { z } from 'zod';
import type { balanceQuery, movementQuery } from './movement.schemas';

/** What a product row says about its units and packs. */
export interface PackFacts {
  packSize: string | number;
  unitOne: string;
  unitOther: string;
  packOne: string;
  packOther: string;
  decimals: number;
}

/** The product columns packText reads, for a query that joins `product as p`. */
export const PACK_COLUMNS = [
  'p.packSize',
  'p.unitOne',
  'p.unitOther',
  'p.packOne',
  'p.packOther',
  'p.decimals',
] as const;

/** The pack text of a product row: "3 boxes + 5 tiles". */
export function packText(p: PackFacts, quantity: number): string {
  return formatPacks(
    quantity,
    Number(p.packSize),
    { unit: { one: p.unitOne, other: p.unitOther }, pack: { one: p.packOne, other: p.packOther } },
    p.decimals,
  );
}

/** Movements, newest first; with `runningQuantity` (the product's total after each) by product. */
export async function listMovements(tx: Tx, scope: TenantScope, f: z.output<typeof movementQuery>) {
  const t = scope.tenantId;
  let q = tx
    .selectFrom('stockMovement as m')
    .innerJoin('product as p', (j) => j.onRef('p.id', '=', 'm.productId').on('p.tenantId', '=', t))
    .leftJoin('stockBatch as b', (j) => j.onRef('b.id', '=', 'm.batchId').on('b.tenantId', '=', t))
    .leftJoin('stockLocation as lf', (j) =>
      j.onRef('lf.id', '=', 'm.fromLocationId').on('lf.tenantId', '=', t),
    )
    .leftJoin('stockLocation as lt', (j) =>
      j.onRef('lt.id', '=', 'm.toLocationId').on('lt.tenantId', '=', t),
    )
    .leftJoin('job as j', (j) => j.onRef('j.id', '=', 'm.jobId').on('j.tenantId', '=', t))
    .leftJoin('appUser as u', 'u.id', 'm.userId')
    .selectAll('m')
    .select([
      'p.sku',
      'p.name as productName',
      ...PACK_COLUMNS,
      'b.code as batchCode',
      'b.expiresOn as batchExpiresOn',
      'lf.name as fromLocationName',
      'lt.name as toLocationName',
      'j.reference as jobReference',
      'u.name as userName',
    ])
    .where('m.tenantId', '=', t);
  if (f.productId)
    q = q.where('m.productId', '=', f.productId).select(
      sql<string>`sum(case when m.to_location_id is not null and m.from_location_id is null
          then m.quantity when m.from_location_id is not null and m.to_location_id is null
          then -m.quantity else 0 end) over (order by m.seq)`.as('runningQuantity'),
    );
  if (f.batchId) q = q.where('m.batchId', '=', f.batchId);
  if (f.jobId) q = q.where('m.jobId', '=', f.jobId);
  if (f.kind) q = q.where('m.kind', '=', f.kind);
  if (f.locationId)
    q = q.where((eb) =>
      eb.or([
        eb('m.fromLocationId', '=', f.locationId ?? ''),
        eb('m.toLocationId', '=', f.locationId ?? ''),
      ]),
    );
  // The running total needs every earlier movement of the product: filter the page outside.
  const inner = q.as('x');
  let outer = tx.selectFrom(inner).selectAll();
  if (f.beforeSeq) outer = outer.where('x.seq', '<', String(f.beforeSeq));
  const rows = await outer.orderBy('x.seq', 'desc').limit(f.limit).execute();
  return rows.map((r) => {
    const row = r as typeof r & { runningQuantity?: string };
    const {
      tenantId: _t,
      packSize: _s,
      unitOne: _u1,
      unitOther: _u2,
      packOne: _p1,
      packOther: _p2,
      ...rest
    } = row;
    return {
      ...rest,
      seq: Number(r.seq),
      quantity: Number(r.quantity),
      unitCostMinor: Number(r.unitCostMinor),
      valueMinor: Number(r.valueMinor),
      settlementMinor: Number(r.settlementMinor),
      packs: packText(r, Number(r.quantity)),
      runningQuantity: row.runningQuantity === undefined ? null : Number(row.runningQuantity),
    };
  });
}

/** Balances by product × batch × location, with names, expiry and the pack text. */
export async function listBalances(tx: Tx, scope: TenantScope, f: z.output<typeof balanceQuery>) {
  const t = scope.tenantId;
  let q = tx
    .selectFrom('stockBalance as sb')
    .innerJoin('product as p', (j) => j.onRef('p.id', '=', 'sb.productId').on('p.tenantId', '=', t))
    .innerJoin('stockLocation as l', (j) =>
      j.onRef('l.id', '=', 'sb.locationId').on('l.tenantId', '=', t),
    )
    .leftJoin('stockBatch as b', (j) => j.onRef('b.id', '=', 'sb.batchId').on('b.tenantId', '=', t))
    .select([
      'sb.productId',
      'sb.batchId',
      'sb.locationId',
      'sb.quantity',
      'p.sku',
      'p.name as productName',
      'p.kind',
      ...PACK_COLUMNS,
      'b.code as batchCode',
      'b.receivedOn',
      'b.expiresOn',
      'l.name as locationName',
      'l.kind as locationKind',
    ])
    .where('sb.tenantId', '=', t);
  if (f.productId) q = q.where('sb.productId', '=', f.productId);
  if (f.locationId) q = q.where('sb.locationId', '=', f.locationId);
  if (f.kind) q = q.where('p.kind', '=', f.kind as never);
  if (f.includeZero === 'false') q = q.where('sb.quantity', '<>', '0');
  const rows = await q
    .orderBy('p.kind')
    .orderBy('p.name')
    .orderBy('l.name')
    .orderBy(sql`b.expires_on nulls last`)
    .orderBy('b.code')
    .limit(5000)
    .execute();
  return rows.map((r) => ({
    productId: r.productId,
    batchId: r.batchId,
    locationId: r.locationId,
    sku: r.sku,
    productName: r.productName,
    kind: r.kind,
    decimals: r.decimals,
    batchCode: r.batchCode,
    receivedOn: r.receivedOn,
    expiresOn: r.expiresOn,
    locationName: r.locationName,
    locationKind: r.locationKind,
    quantity: Number(r.quantity),
    packs: packText(r, Number(r.quantity)),
  }));
}
