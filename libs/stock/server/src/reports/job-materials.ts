/**
 * A job's materials: estimated (from the latest takeoff version of each of its areas),
 * reserved, issued and returned, and the material cost — what left for the job at its
 * weighted-average cost less what came back. Reversals count against the movement they undo.
 */
import { sql } from 'kysely';
import type { TenantScope, Tx } from '@latchwork/shared-db';
import { NotFoundError } from '@latchwork/shared-server-kit';
import {
  estimateFromTakeoffs,
  materialKey,
  type TakeoffMaterialsSummary,
} from '@latchwork/stock-domain';
import { packText, type PackFacts } from '../ledger/ledger.repository';

type Figures = Record<'estimated' | 'reserved' | 'issued' | 'returned' | 'used', number | null>;

/**
 * A material line's figures in packs ("2 boxes + 10 tiles") when every product on the line
 * comes in the same pack; otherwise (or with nothing but an estimate) as plain numbers.
 */
function packedFigures(facts: PackFacts | null | undefined, f: Figures) {
  const text = (n: number | null) => (n === null ? null : facts ? packText(facts, n) : String(n));
  return {
    estimated: text(f.estimated),
    reserved: text(f.reserved),
    issued: text(f.issued),
    returned: text(f.returned),
    used: text(f.used),
  };
}

const samePack = (a: PackFacts, b: PackFacts) =>
  Number(a.packSize) === Number(b.packSize) &&
  a.decimals === b.decimals &&
  a.unitOne === b.unitOne &&
  a.unitOther === b.unitOther &&
  a.packOne === b.packOne &&
  a.packOther === b.packOther;

async function latestTakeoffs(tx: Tx, scope: TenantScope, jobId: string) {
  return tx
    .selectFrom('takeoffVersion as v')
    .innerJoin('surveyArea as a', (j) =>
      j.onRef('a.tenantId', '=', 'v.tenantId').onRef('a.id', '=', 'v.areaId'),
    )
    .distinctOn('v.areaId')
    .select(['v.areaId', 'v.summary'])
    .where('v.tenantId', '=', scope.tenantId)
    .where('a.jobId', '=', jobId)
    .orderBy('v.areaId')
    .orderBy('v.version', 'desc')
    .execute();
}

/** Per product and per material line (kind, tile colour): estimated vs reserved, issued, returned. */
export async function jobMaterials(tx: Tx, scope: TenantScope, jobId: string) {
  const t = scope.tenantId;
  const job = await tx
    .selectFrom('job')
    .select(['id', 'reference', 'title'])
    .where('tenantId', '=', t)
    .where('id', '=', jobId)
    .executeTakeFirst();
  if (!job) throw new NotFoundError('That job');
  const takeoffs = await latestTakeoffs(tx, scope, jobId);
  const estimate = estimateFromTakeoffs(takeoffs.map((v) => v.summary as TakeoffMaterialsSummary));
  const { rows } = await sql<{
    productId: string;
    sku: string;
    name: string;
    kind: string;
    colour: string | null;
    packSize: string;
    unitOne: string;
    unitOther: string;
    packOne: string;
    packOther: string;
    decimals: number;
    issued: string;
    returned: string;
    costMinor: string;
    reserved: string;
  }>`
    with moved as (
      select product_id,
        sum(case when kind = 'issue' then (case when from_location_id is not null
          then quantity else -quantity end) else 0 end) as issued,
        sum(case when kind = 'return' then (case when to_location_id is not null
          then quantity else -quantity end) else 0 end) as returned,
        -sum(value_minor) as cost
      from stock_movement
      where tenant_id = ${t} and job_id = ${jobId} and kind in ('issue', 'return')
      group by product_id
    ), held as (
      select product_id, sum(quantity - issued_quantity) as reserved from reservation
      where tenant_id = ${t} and job_id = ${jobId} and status = 'active' group by product_id
    )
    select p.id as product_id, p.sku, p.name, p.kind, p.attributes ->> 'colour' as colour,
      p.pack_size::text, p.unit_one, p.unit_other, p.pack_one, p.pack_other, p.decimals,
      coalesce(m.issued, 0)::text as issued, coalesce(m.returned, 0)::text as returned,
      coalesce(m.cost, 0)::text as cost_minor, coalesce(h.reserved, 0)::text as reserved
    from product p
    left join moved m on m.product_id = p.id
    left join held h on h.product_id = p.id
    where p.tenant_id = ${t} and (m.product_id is not null or h.product_id is not null)
    order by p.kind, p.name`.execute(tx);
  const products = rows.map((r) => {
    const issued = Number(r.issued);
    const returned = Number(r.returned);
    return {
      productId: r.productId,
      sku: r.sku,
      name: r.name,
      kind: r.kind,
      colour: r.colour,
      decimals: r.decimals,
      reserved: Number(r.reserved),
      issued,
      returned,
      used: issued - returned,
      usedPacks: packText(r, issued - returned),
      costMinor: Number(r.costMinor),
    };
  });
  const groups = new Map<
    string,
    {
      kind: string;
      colour: string | null;
      estimated: number | null;
      reserved: number;
      issued: number;
      returned: number;
      used: number;
    }
  >();
  for (const e of estimate)
    groups.set(materialKey(e.kind, e.colour), {
      kind: e.kind,
      colour: e.colour,
      estimated: e.quantity,
      reserved: 0,
      issued: 0,
      returned: 0,
      used: 0,
    });
  // The pack every product of a line shares; null once two differ.
  const packOf = new Map<string, PackFacts | null>();
  rows.forEach((r, i) => {
    const key = materialKey(products[i].kind, products[i].colour);
    const known = packOf.get(key);
    if (known === undefined) packOf.set(key, r);
    else if (known && !samePack(known, r)) packOf.set(key, null);
  });
  for (const p of products) {
    const key = materialKey(p.kind, p.colour);
    const g = groups.get(key) ?? {
      kind: p.kind,
      colour: p.kind === 'tile' ? p.colour : null,
      estimated: null,
      reserved: 0,
      issued: 0,
      returned: 0,
      used: 0,
    };
    g.reserved += p.reserved;
    g.issued += p.issued;
    g.returned += p.returned;
    g.used += p.used;
    groups.set(key, g);
  }
  return {
    job,
    estimateSource: takeoffs.length > 0 ? ('takeoff' as const) : ('none' as const),
    takeoffAreas: takeoffs.length,
    lines: [...groups].map(([key, g]) => ({ ...g, packs: packedFigures(packOf.get(key), g) })),
    products,
    totalCostMinor: products.reduce((s, p) => s + p.costMinor, 0),
  };
}
