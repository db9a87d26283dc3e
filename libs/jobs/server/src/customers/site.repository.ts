import type { TenantScope, Tx } from '@latchwork/shared-db';
import type { SiteInput, SitePatch } from './customer.schemas';

/** Every column of a site that the API shows. */
export const siteColumns = [
  'id',
  'customerId',
  'externalRef',
  'name',
  'addressLines',
  'postcode',
  'accessNotes',
  'parking',
  'floorType',
  'openingHours',
] as const;

/** Every site of the customer, in full, for the customer page. */
export function listSites(tx: Tx, scope: TenantScope, customerId: string) {
  return tx
    .selectFrom('site')
    .select(siteColumns)
    .where('tenantId', '=', scope.tenantId)
    .where('customerId', '=', customerId)
    .orderBy('name')
    .orderBy('createdAt')
    .execute();
}

export function findSite(tx: Tx, scope: TenantScope, siteId: string) {
  return tx
    .selectFrom('site')
    .select(siteColumns)
    .where('tenantId', '=', scope.tenantId)
    .where('id', '=', siteId)
    .executeTakeFirst();
}

export async function insertSite(
  tx: Tx,
  scope: TenantScope,
  customerId: string,
  input: SiteInput,
): Promise<string> {
  const row = await tx
    .insertInto('site')
    .values({ ...input, tenantId: scope.tenantId, customerId })
    .returning('id')
    .executeTakeFirstOrThrow();
  return row.id;
}

export async function updateSite(tx: Tx, scope: TenantScope, siteId: string, patch: SitePatch) {
  await tx
    .updateTable('site')
    .set({ ...patch, updatedAt: new Date() })
    .where('tenantId', '=', scope.tenantId)
    .where('id', '=', siteId)
    .execute();
}

export async function deleteSite(tx: Tx, scope: TenantScope, siteId: string) {
  await tx
    .deleteFrom('site')
    .where('tenantId', '=', scope.tenantId)
    .where('id', '=', siteId)
    .execute();
}
