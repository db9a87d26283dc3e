import type { TenantScope, Tx } from '@latchwork/shared-db';
import { ForbiddenError, NotFoundError, type Actor } from '@latchwork/shared-server-kit';
import { assertJobVisible } from '../jobs/job-events';

/** What a file can belong to (the file_link check constraint lists the same). */
export const OWNER_KINDS = ['job', 'site', 'customer'] as const;
export type FileOwnerKind = (typeof OWNER_KINDS)[number];

export interface FileOwner {
  kind: FileOwnerKind;
  id: string;
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
const LABEL: Record<FileOwnerKind, string> = {
  job: 'The job',
  site: 'The site',
  customer: 'The customer',
};

/**
 * Throws unless the actor may see the owner's files: a job must be visible to them (installers
 * see only jobs they are booked on); a site or customer needs `customers:read` (403 without
 * it) and must exist in the firm (404 otherwise, alike for another firm's id).
 */
export async function assertOwnerVisible(
  tx: Tx,
  scope: TenantScope,
  actor: Actor,
  owner: FileOwner,
): Promise<void> {
  if (owner.kind === 'job') return assertJobVisible(tx, scope, actor, owner.id);
  if (!actor.permissions.includes('customers:read')) throw new ForbiddenError();
  if (!UUID.test(owner.id)) throw new NotFoundError(LABEL[owner.kind]);
  const table = owner.kind === 'site' ? 'site' : 'customer';
  const row = await tx
    .selectFrom(table)
    .select('id')
    .where('tenantId', '=', scope.tenantId)
    .where('id', '=', owner.id)
    .executeTakeFirst();
  if (!row) throw new NotFoundError(LABEL[owner.kind]);
}

/** True when the actor may see the owner (see assertOwnerVisible), without throwing. */
export async function ownerVisible(
  tx: Tx,
  scope: TenantScope,
  actor: Actor,
  owner: FileOwner,
): Promise<boolean> {
  try {
    await assertOwnerVisible(tx, scope, actor, owner);
    return true;
  } catch (err) {
    if (err instanceof NotFoundError || err instanceof ForbiddenError) return false;
    throw err;
  }
}

/** The link row's columns for an owner: exactly one of job, site, customer is set. */
export function linkColumns(owner: FileOwner) {
  return {
    ownerKind: owner.kind,
    jobId: owner.kind === 'job' ? owner.id : null,
    siteId: owner.kind === 'site' ? owner.id : null,
    customerId: owner.kind === 'customer' ? owner.id : null,
  };
}

/** The owner a link row names. */
export function ownerOfLink(link: {
  ownerKind: FileOwnerKind;
  jobId: string | null;
  siteId: string | null;
  customerId: string | null;
}): FileOwner {
  const id = link.jobId ?? link.siteId ?? link.customerId ?? '';
  return { kind: link.ownerKind, id };
}
