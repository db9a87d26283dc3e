import { nextNumber, type TenantScope, type Tx } from '@latchwork/shared-db';
import { NotFoundError, ValidationError, type FieldProblem } from '@latchwork/shared-server-kit';
import { formatReference, heldFromOf, nextStages, type Stage } from '@latchwork/jobs-domain';
import { assertJobVisible, recordJobEvent, type JobViewer } from './job-events';
import { toMinor } from './job-query';
import type { CreateJobBody, UpdateJobBody } from './job.schemas';

/** The firm's members by id and name: owners to pick and people to @-mention. */
export function listTeam(tx: Tx, scope: TenantScope) {
  return tx
    .selectFrom('membership as m')
    .innerJoin('appUser as u', 'u.id', 'm.userId')
    .select(['u.id', 'u.name', 'u.email', 'm.role'])
    .where('m.tenantId', '=', scope.tenantId)
    .orderBy('u.name')
    .execute();
}

/** Checks that the customer, its site and the owner named exist in this firm. */
async function checkLinks(
  tx: Tx,
  scope: TenantScope,
  links: { customerId: string; siteId?: string | null; ownerUserId?: string | null },
): Promise<void> {
  const problems: FieldProblem[] = [];
  const customer = await tx
    .selectFrom('customer')
    .select('id')
    .where('tenantId', '=', scope.tenantId)
    .where('id', '=', links.customerId)
    .executeTakeFirst();
  if (!customer) problems.push({ path: 'customerId', message: 'no such customer in this firm' });
  if (links.siteId) {
    const site = await tx
      .selectFrom('site')
      .select('customerId')
      .where('tenantId', '=', scope.tenantId)
      .where('id', '=', links.siteId)
      .executeTakeFirst();
    if (site?.customerId !== links.customerId)
      problems.push({ path: 'siteId', message: 'the site is not one of this customer’s sites' });
  }
  if (links.ownerUserId) {
    const member = await tx
      .selectFrom('membership')
      .select('userId')
      .where('tenantId', '=', scope.tenantId)
      .where('userId', '=', links.ownerUserId)
      .executeTakeFirst();
    if (!member) problems.push({ path: 'ownerUserId', message: 'the owner must be a member' });
  }
  if (problems.length)
    throw new ValidationError(`${problems[0]?.path}: ${problems[0]?.message}`, problems);
}

/** Creates a job at Enquiry with its first history line and timeline event. */
export async function createJob(
  tx: Tx,
  scope: TenantScope,
  actorUserId: string,
  body: CreateJobBody,
): Promise<{ id: string; reference: string }> {
  await checkLinks(tx, scope, body);
  const tenant = await tx
    .selectFrom('tenant')
    .select('numberPrefixes')
    .where('id', '=', scope.tenantId)
    .executeTakeFirstOrThrow();
  // Taken last, so the counter's lock is held for as short a time as possible.
  const number = await nextNumber(tx, scope, 'job_counter');
  const reference = formatReference(tenant.numberPrefixes['job'] ?? '', number);
  const job = await tx
    .insertInto('job')
    .values({
      tenantId: scope.tenantId,
      number,
      reference,
      title: body.title,
      customerId: body.customerId,
      siteId: body.siteId ?? null,
      valueEstimateMinor: body.valueEstimateMinor ?? null,
      source: body.source,
      ownerUserId: body.ownerUserId ?? null,
      enquiryOn: body.enquiryOn,
      surveyAt: body.surveyAt ?? null,
      quoteDueOn: body.quoteDueOn ?? null,
      installStartOn: body.installStartOn ?? null,
      installEndOn: body.installEndOn ?? null,
      createdBy: actorUserId,
    })
    .returning('id')
    .executeTakeFirstOrThrow();
  await tx
    .insertInto('jobStageMove')
    .values({ tenantId: scope.tenantId, jobId: job.id, toStage: 'enquiry', movedBy: actorUserId })
    .execute();
  await recordJobEvent(tx, scope, {
    jobId: job.id,
    kind: 'created',
    summary: `Job ${reference} opened at Enquiry`,
    detail: { title: body.title },
    actorUserId,
  });
  return { id: job.id, reference };
}

/** A column's value as text for "did it change": instants by their time, money as digits. */
function comparable(value: unknown): string {
  if (value === null || value === undefined) return '';
  if (value instanceof Date) return String(value.getTime());
  if (typeof value === 'string' && /^\d{4}-\d{2}-\d{2}T/.test(value))
    return String(new Date(value).getTime());
  return String(value);
}

/** Changes the fields given; the timeline names what changed. Stage moves go through moveJob. */
export async function updateJob(
  tx: Tx,
  scope: TenantScope,
  viewer: JobViewer,
  jobId: string,
  body: UpdateJobBody,
): Promise<void> {
  await assertJobVisible(tx, scope, viewer, jobId);
  const before = await tx
    .selectFrom('job')
    .selectAll()
    .where('tenantId', '=', scope.tenantId)
    .where('id', '=', jobId)
    .forUpdate()
    .executeTakeFirstOrThrow();
  const customerId = body.customerId ?? before.customerId;
  // A new customer takes the job's site away unless a site of theirs comes with it.
  const newCustomer = body.customerId !== undefined && body.customerId !== before.customerId;
  const siteId = body.siteId !== undefined ? body.siteId : newCustomer ? null : before.siteId;
  await checkLinks(tx, scope, { customerId, siteId, ownerUserId: body.ownerUserId });
  const changes = { ...body, siteId };
  const changed = (Object.keys(changes) as (keyof typeof changes)[]).filter(
    (k) => comparable(before[k]) !== comparable(changes[k]),
  );
  if (!changed.length) return;
  await tx
    .updateTable('job')
    .set({ ...changes, updatedAt: new Date() })
    .where('tenantId', '=', scope.tenantId)
    .where('id', '=', jobId)
    .execute();
  await recordJobEvent(tx, scope, {
    jobId,
    kind: 'updated',
    summary: `Changed ${changed.join(', ')}`,
    detail: { changed },
    actorUserId: viewer.userId,
  });
}

/** The job page's header: the job, its customer, site and owner, and where it may go next. */
export async function jobHeader(tx: Tx, scope: TenantScope, viewer: JobViewer, jobId: string) {
  await assertJobVisible(tx, scope, viewer, jobId);
  const row = await tx
    .selectFrom('job as j')
    .innerJoin('customer as c', (join) =>
      join.onRef('c.id', '=', 'j.customerId').onRef('c.tenantId', '=', 'j.tenantId'),
    )
    .leftJoin('site as s', (join) =>
      join.onRef('s.id', '=', 'j.siteId').onRef('s.tenantId', '=', 'j.tenantId'),
    )
    .leftJoin('appUser as o', 'o.id', 'j.ownerUserId')
    .selectAll('j')
    .select([
      'c.name as customerName',
      's.name as siteName',
      's.addressLines as siteAddressLines',
      's.postcode as sitePostcode',
      'o.name as ownerName',
    ])
    .where('j.tenantId', '=', scope.tenantId)
    .where('j.id', '=', jobId)
    .executeTakeFirst();
  if (!row) throw new NotFoundError('The job');
  const history = await stageHistory(tx, scope, jobId);
  const heldFrom = heldFromOf(history) ?? null;
  const stage = row.stage as Stage;
  return {
    id: row.id,
    reference: row.reference,
    title: row.title,
    stage,
    heldFrom,
    nextStages: nextStages(stage, heldFrom),
    stageChangedAt: row.stageChangedAt,
    lostReason: row.lostReason,
    valueEstimateMinor: toMinor(row.valueEstimateMinor),
    source: row.source,
    customer: { id: row.customerId, name: row.customerName },
    site: row.siteId
      ? {
          id: row.siteId,
          name: row.siteName ?? '',
          addressLines: row.siteAddressLines ?? [],
          postcode: row.sitePostcode,
        }
      : null,
    owner: row.ownerUserId ? { id: row.ownerUserId, name: row.ownerName ?? '' } : null,
    enquiryOn: row.enquiryOn,
    surveyAt: row.surveyAt,
    quoteDueOn: row.quoteDueOn,
    installStartOn: row.installStartOn,
    installEndOn: row.installEndOn,
    createdAt: row.createdAt,
  };
}

/** The job's stage history, oldest first, with who moved it. */
export async function stageHistory(tx: Tx, scope: TenantScope, jobId: string) {
  const rows = await tx
    .selectFrom('jobStageMove as m')
    .leftJoin('appUser as u', 'u.id', 'm.movedBy')
    .select(['m.id', 'm.fromStage', 'm.toStage', 'm.reason', 'm.rule', 'm.movedAt', 'm.movedBy'])
    .select('u.name as movedByName')
    .where('m.tenantId', '=', scope.tenantId)
    .where('m.jobId', '=', jobId)
    .orderBy('m.movedAt')
    .execute();
  return rows.map((r) => ({
    id: r.id,
    from: r.fromStage as Stage | null,
    to: r.toStage as Stage,
    reason: r.reason,
    rule: r.rule,
    movedAt: r.movedAt,
    movedBy: r.movedBy ? { id: r.movedBy, name: r.movedByName ?? '' } : null,
  }));
}
