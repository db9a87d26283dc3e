import type { TenantScope, Tx } from '@latchwork/shared-db';
import type { ContactInput, CustomerInput, CustomerPatch } from './customer.schemas';

/** bigint money read as text; inputs are capped at 2^53 − 1, so the number is exact. */
export const minorOrNull = (v: string | null): number | null => (v === null ? null : Number(v));

/** The columns a person or an import edits. */
export const customerFields = [
  'kind',
  'name',
  'externalRef',
  'email',
  'phone',
  'billingAddressLines',
  'postcode',
  'paymentTermsDays',
  'creditLimitMinor',
  'notes',
] as const;
const customerColumns = ['id', ...customerFields, 'createdAt', 'updatedAt'] as const;

export async function findCustomer(tx: Tx, scope: TenantScope, customerId: string) {
  const row = await tx
    .selectFrom('customer')
    .select(customerColumns)
    .where('tenantId', '=', scope.tenantId)
    .where('id', '=', customerId)
    .executeTakeFirst();
  return row && { ...row, creditLimitMinor: minorOrNull(row.creditLimitMinor) };
}

export function listContacts(tx: Tx, scope: TenantScope, customerId: string) {
  return tx
    .selectFrom('customerContact')
    .select(['id', 'name', 'role', 'email', 'phone'])
    .where('tenantId', '=', scope.tenantId)
    .where('customerId', '=', customerId)
    .orderBy('position')
    .execute();
}

/** The customer's jobs, newest move first, for the customer page's Jobs tab. */
export async function listJobSummaries(tx: Tx, scope: TenantScope, customerId: string) {
  const rows = await tx
    .selectFrom('job')
    .select(['id', 'reference', 'title', 'stage', 'valueEstimateMinor', 'stageChangedAt'])
    .where('tenantId', '=', scope.tenantId)
    .where('customerId', '=', customerId)
    .orderBy('stageChangedAt', 'desc')
    .limit(500)
    .execute();
  return rows.map((r) => ({ ...r, valueEstimateMinor: minorOrNull(r.valueEstimateMinor) }));
}

/** How many jobs point at the customer or at one of its sites (what blocks a delete). */
export async function countJobs(
  tx: Tx,
  scope: TenantScope,
  by: { customerId: string } | { siteId: string },
): Promise<number> {
  const [column, value] =
    'customerId' in by
      ? (['customerId', by.customerId] as const)
      : (['siteId', by.siteId] as const);
  const row = await tx
    .selectFrom('job')
    .select((eb) => eb.fn.countAll<string>().as('n'))
    .where('tenantId', '=', scope.tenantId)
    .where(column, '=', value)
    .executeTakeFirstOrThrow();
  return Number(row.n);
}

export async function insertCustomer(
  tx: Tx,
  scope: TenantScope,
  input: CustomerInput,
  createdBy: string,
): Promise<string> {
  const { contacts, ...fields } = input;
  const row = await tx
    .insertInto('customer')
    .values({ ...fields, tenantId: scope.tenantId, createdBy })
    .returning('id')
    .executeTakeFirstOrThrow();
  await replaceContacts(tx, scope, row.id, contacts ?? []);
  return row.id;
}

/** Sets the fields the patch names; contacts, when given, become exactly the list sent. */
export async function updateCustomer(
  tx: Tx,
  scope: TenantScope,
  customerId: string,
  patch: CustomerPatch,
): Promise<void> {
  const { contacts, ...fields } = patch;
  await tx
    .updateTable('customer')
    .set({ ...fields, updatedAt: new Date() })
    .where('tenantId', '=', scope.tenantId)
    .where('id', '=', customerId)
    .execute();
  if (contacts) await replaceContacts(tx, scope, customerId, contacts);
}

/**
 * Makes the customer's contacts the given list, in its order. A contact sent with its id is
 * updated in place (its id stays valid for whatever refers to it); the others are added;
 * contacts on file but not sent are removed.
 */
async function replaceContacts(
  tx: Tx,
  scope: TenantScope,
  customerId: string,
  contacts: readonly ContactInput[],
): Promise<void> {
  const kept = contacts.flatMap((c) => (c.id ? [c.id] : []));
  let removal = tx
    .deleteFrom('customerContact')
    .where('tenantId', '=', scope.tenantId)
    .where('customerId', '=', customerId);
  if (kept.length) removal = removal.where('id', 'not in', kept);
  await removal.execute();
  for (const [position, c] of contacts.entries()) {
    const values = {
      name: c.name,
      role: c.role ?? '',
      email: c.email ?? null,
      phone: c.phone ?? null,
      position,
    };
    const updated = c.id
      ? await tx
          .updateTable('customerContact')
          .set(values)
          .where('tenantId', '=', scope.tenantId)
          .where('customerId', '=', customerId)
          .where('id', '=', c.id)
          .executeTakeFirst()
      : undefined;
    // An id that is not this customer's contact is treated as a new contact.
    if (!updated || updated.numUpdatedRows === 0n)
      await tx
        .insertInto('customerContact')
        .values({ ...values, tenantId: scope.tenantId, customerId })
        .execute();
  }
}

/** Removes a customer without jobs, its sites and (by cascade) its contacts. */
export async function deleteCustomer(tx: Tx, scope: TenantScope, customerId: string) {
  await tx
    .deleteFrom('site')
    .where('tenantId', '=', scope.tenantId)
    .where('customerId', '=', customerId)
    .execute();
  await tx
    .deleteFrom('customer')
    .where('tenantId', '=', scope.tenantId)
    .where('id', '=', customerId)
    .execute();
}
