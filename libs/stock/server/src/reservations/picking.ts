/**
 * Picking lists and issuing from a reservation: for each reservation still open, where to take
 * its stock from — first expiry first out (the domain's `fefoPickingList`), expired batches
 * skipped and named — and the issue movements that draw it down.
 */
import type { TenantScope, Tx } from '@latchwork/shared-db';
import { dbToday } from '../stock-tx';
import { NotFoundError } from '@latchwork/shared-server-kit';
import { fefoPickingList } from '@latchwork/stock-domain';
import { conflictField, invalidField } from '../stock-errors';
import { PACK_COLUMNS, packText, type PackFacts } from '../ledger/ledger.repository';
import { postMovements } from '../ledger/post-movements';
import type { PostingActor } from '../ledger/movement-request';
import { pickSources } from './batch-stock';

/** Reservations with their job, product, batch and place names. */
export function reservationRows(tx: Tx, scope: TenantScope) {
  const t = scope.tenantId;
  return tx
    .selectFrom('reservation as r')
    .innerJoin('product as p', (j) => j.onRef('p.id', '=', 'r.productId').on('p.tenantId', '=', t))
    .innerJoin('job as j', (j) => j.onRef('j.id', '=', 'r.jobId').on('j.tenantId', '=', t))
    .leftJoin('stockBatch as b', (j) => j.onRef('b.id', '=', 'r.batchId').on('b.tenantId', '=', t))
    .leftJoin('stockLocation as l', (j) =>
      j.onRef('l.id', '=', 'r.locationId').on('l.tenantId', '=', t),
    )
    .select([
      'r.id',
      'r.jobId',
      'r.productId',
      'r.batchId',
      'r.locationId',
      'r.quantity',
      'r.issuedQuantity',
      'r.status',
      'r.note',
      'r.createdAt',
      'j.reference as jobReference',
      'j.title as jobTitle',
      'p.sku',
      'p.name as productName',
      'p.kind',
      ...PACK_COLUMNS,
      'b.code as batchCode',
      'b.expiresOn',
      'l.name as locationName',
    ])
    .where('r.tenantId', '=', t);
}

type Row = Awaited<ReturnType<ReturnType<typeof reservationRows>['execute']>>[number];

/** A reservation as the API returns it. */
export function reservationView(r: Row) {
  const { packSize: _s, unitOne: _a, unitOther: _b, packOne: _c, packOther: _d, ...rest } = r;
  const quantity = Number(r.quantity);
  const issued = Number(r.issuedQuantity);
  const remaining = r.status === 'active' ? Math.max(0, quantity - issued) : 0;
  return { ...rest, quantity, issuedQuantity: issued, remaining, packs: packText(r, remaining) };
}

/** Where to pick `quantity` of a reservation's product from, FEFO. */
async function pickFor(
  tx: Tx,
  scope: TenantScope,
  r: { productId: string; batchId: string | null; locationId: string | null },
  pack: PackFacts,
  quantity: number,
  day: string,
) {
  const sources = await pickSources(tx, scope, r.productId, r.batchId, r.locationId);
  const list = fefoPickingList(sources, quantity, { today: day });
  const byKey = new Map(sources.map((s) => [`${s.code}|${s.location}`, s]));
  return {
    ...list,
    lines: list.lines.map((l) => {
      const s = byKey.get(`${l.code}|${l.location}`);
      return {
        ...l,
        batchId: s?.batchId ?? null,
        locationId: s?.locationId ?? '',
        locationName: s?.locationName ?? '',
        packs: packText(pack, l.quantity),
      };
    }),
  };
}

/** The job's picking list: per open reservation, the batches and places to take it from. */
export async function jobPickingList(tx: Tx, scope: TenantScope, jobId: string) {
  const job = await tx
    .selectFrom('job')
    .select(['id', 'reference', 'title'])
    .where('tenantId', '=', scope.tenantId)
    .where('id', '=', jobId)
    .executeTakeFirst();
  if (!job) throw new NotFoundError('That job');
  const rows = await reservationRows(tx, scope)
    .where('r.jobId', '=', jobId)
    .where('r.status', '=', 'active')
    .orderBy('p.kind')
    .orderBy('p.name')
    .execute();
  const day = await dbToday(tx);
  const items = [];
  for (const row of rows) {
    const r = reservationView(row);
    items.push({ reservation: r, ...(await pickFor(tx, scope, r, row, r.remaining, day)) });
  }
  return { job, today: day, items };
}

/** Issues (part of) a reservation to its job, FEFO; 409 when the places named cannot cover it. */
export async function issueReserved(
  tx: Tx,
  scope: TenantScope,
  actor: PostingActor,
  reservationId: string,
  body: { quantity?: number; fromLocationId?: string | null; note: string },
) {
  const row = await reservationRows(tx, scope).where('r.id', '=', reservationId).executeTakeFirst();
  if (!row) throw new NotFoundError('That reservation');
  const r = reservationView(row);
  if (r.status !== 'active')
    conflictField('reservationId', 'reservation-closed', `The reservation is ${r.status}.`);
  const quantity = body.quantity ?? r.remaining;
  if (!Number.isSafeInteger(quantity) || quantity <= 0)
    invalidField(
      'quantity',
      'must be a whole number of stock units above 0',
      'fractional-quantity',
    );
  const from = { ...r, locationId: body.fromLocationId ?? r.locationId };
  const pick = await pickFor(tx, scope, from, row, quantity, await dbToday(tx));
  if (pick.short > 0)
    conflictField(
      'quantity',
      'insufficient-stock',
      `Only ${quantity - pick.short} of ${quantity} can be picked${pick.skippedExpired.length ? ` (expired batches skipped: ${pick.skippedExpired.join(', ')})` : ''}.`,
      { pick },
    );
  return postMovements(
    tx,
    scope,
    actor,
    pick.lines.map((l) => ({
      kind: 'issue' as const,
      productId: r.productId,
      batchId: l.batchId,
      fromLocationId: l.locationId,
      quantity: l.quantity,
      jobId: r.jobId,
      reservationId: r.id,
      note: body.note,
    })),
  );
}
