import { sql } from 'kysely';
import type { TenantScope, Tx } from '@latchwork/shared-db';
import { CLOSED_STAGES } from '@latchwork/jobs-domain';
import type { ListQuery } from './customer.schemas';

/** `50%_off` matched literally: LIKE wildcards in what people type are not wildcards. */
export function likePattern(q: string): string {
  return `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}

function filtered(tx: Tx, scope: TenantScope, q: string | undefined) {
  let query = tx.selectFrom('customer as c').where('c.tenantId', '=', scope.tenantId);
  // Name, e-mail, postcode and reference, through the trigram index of `customer_search`
  // (migration 2026_12_02_0111 says why the search cannot read `customer` directly).
  if (q) query = query.where(sql<boolean>`c.id in (select customer_search_ids(${likePattern(q)}))`);
  return query;
}

/**
 * One page of the firm's customers with their site and open-job counts. Sorting by name
 * follows the `lower(name)` index; every sort ends on id so pages never overlap.
 */
export async function listCustomers(tx: Tx, scope: TenantScope, query: ListQuery) {
  const sortColumn = {
    name: sql`lower(c.name)`,
    createdAt: sql`c.created_at`,
    postcode: sql`c.postcode`,
  }[query.sort];
  const direction = query.dir === 'desc' ? sql`desc` : sql`asc`;
  // Postcode may be empty: empty ones go last whichever way the list is sorted.
  const nulls = query.sort === 'postcode' ? sql`nulls last` : sql``;
  // One transaction is one connection: the two queries run one after the other anyway.
  const rows = await filtered(tx, scope, query.q)
    .select([
      'c.id',
      'c.kind',
      'c.name',
      'c.email',
      'c.phone',
      'c.postcode',
      'c.externalRef',
      (eb) =>
        eb
          .selectFrom('site as s')
          .select(sql<string>`count(*)`.as('n'))
          .where('s.tenantId', '=', scope.tenantId)
          .whereRef('s.customerId', '=', 'c.id')
          .as('siteCount'),
      (eb) =>
        eb
          .selectFrom('job as j')
          .select(sql<string>`count(*)`.as('n'))
          .where('j.tenantId', '=', scope.tenantId)
          .whereRef('j.customerId', '=', 'c.id')
          .where('j.stage', 'not in', [...CLOSED_STAGES])
          .as('openJobCount'),
    ])
    .orderBy(sql`${sortColumn} ${direction} ${nulls}`)
    .orderBy('c.id', query.dir)
    .limit(query.pageSize)
    .offset((query.page - 1) * query.pageSize)
    .execute();
  const count = await filtered(tx, scope, query.q)
    .select(sql<string>`count(*)`.as('total'))
    .executeTakeFirstOrThrow();
  return {
    items: rows.map((r) => ({
      ...r,
      siteCount: Number(r.siteCount ?? 0),
      openJobCount: Number(r.openJobCount ?? 0),
    })),
    total: Number(count.total),
  };
}

/** The customer's sites, short form, for pickers (the job form's site field). */
export function listSiteSummaries(tx: Tx, scope: TenantScope, customerId: string) {
  return tx
    .selectFrom('site')
    .select(['id', 'name', 'addressLines', 'postcode'])
    .where('tenantId', '=', scope.tenantId)
    .where('customerId', '=', customerId)
    .orderBy('name')
    .orderBy('createdAt')
    .execute();
}
