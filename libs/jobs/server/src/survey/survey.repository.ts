import type { TenantScope, Tx } from '@latchwork/shared-db';
import { ConflictError, ValidationError } from '@latchwork/shared-server-kit';
import type { z } from 'zod';
import type { surveyDetails } from './survey.schemas';

export type SurveyDetails = z.output<typeof surveyDetails>;

const SURVEY_COLUMNS = [
  'id',
  'jobId',
  'substrate',
  'surveyedAt',
  'surveyorUserId',
  'notes',
  'updatedAt',
] as const;

/** The job's survey details, or null before anyone has saved them. */
export function findSurvey(tx: Tx, scope: TenantScope, jobId: string) {
  return tx
    .selectFrom('survey')
    .select(SURVEY_COLUMNS)
    .where('tenantId', '=', scope.tenantId)
    .where('jobId', '=', jobId)
    .executeTakeFirst();
}

/** Creates or replaces the survey details. The surveyor must be a member of this firm. */
export async function saveSurvey(tx: Tx, scope: TenantScope, jobId: string, d: SurveyDetails) {
  if (d.surveyorUserId) {
    const member = await tx
      .selectFrom('membership')
      .select('userId')
      .where('tenantId', '=', scope.tenantId)
      .where('userId', '=', d.surveyorUserId)
      .executeTakeFirst();
    if (!member) {
      const message = 'The surveyor must be a member of the firm.';
      throw new ValidationError(message, [{ path: 'surveyorUserId', message }]);
    }
  }
  const values = {
    substrate: d.substrate,
    surveyedAt: d.surveyedAt,
    surveyorUserId: d.surveyorUserId,
    notes: d.notes,
  };
  return tx
    .insertInto('survey')
    .values({ tenantId: scope.tenantId, jobId, ...values })
    .onConflict((oc) =>
      oc.columns(['tenantId', 'jobId']).doUpdateSet({ ...values, updatedAt: new Date() }),
    )
    .returning(SURVEY_COLUMNS)
    .executeTakeFirstOrThrow();
}

/** The job's areas in the order they were added. */
export function listAreas(tx: Tx, scope: TenantScope, jobId: string) {
  return tx
    .selectFrom('surveyArea')
    .select(['id', 'name', 'createdAt'])
    .where('tenantId', '=', scope.tenantId)
    .where('jobId', '=', jobId)
    .orderBy('createdAt')
    .orderBy('id')
    .execute();
}

/** PostgreSQL's unique_violation: the area name index. */
const isDuplicateName = (err: unknown) =>
  (err as { code?: string }).code === '23505' &&
  String((err as { constraint?: string }).constraint) === 'survey_area_name_idx';

const duplicate = (name: string) =>
  new ConflictError(`This job already has an area called "${name}".`);

export async function addArea(
  tx: Tx,
  scope: TenantScope,
  jobId: string,
  name: string,
  userId: string,
) {
  try {
    return await tx
      .insertInto('surveyArea')
      .values({ tenantId: scope.tenantId, jobId, name, createdBy: userId })
      .returning(['id', 'name', 'createdAt'])
      .executeTakeFirstOrThrow();
  } catch (err) {
    throw isDuplicateName(err) ? duplicate(name) : err;
  }
}

export async function renameArea(tx: Tx, scope: TenantScope, areaId: string, name: string) {
  try {
    return await tx
      .updateTable('surveyArea')
      .set({ name })
      .where('tenantId', '=', scope.tenantId)
      .where('id', '=', areaId)
      .returning(['id', 'name', 'createdAt'])
      .executeTakeFirstOrThrow();
  } catch (err) {
    throw isDuplicateName(err) ? duplicate(name) : err;
  }
}
