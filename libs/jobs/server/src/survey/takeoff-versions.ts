import type { TenantScope, Tx } from '@latchwork/shared-db';
import { NotFoundError, ValidationError } from '@latchwork/shared-server-kit';
import {
  computeTakeoff,
  resolveRates,
  TakeoffInputError,
  type TakeoffInput,
  type TakeoffRates,
  type TakeoffResult,
} from '@latchwork/takeoff';

/**
 * What a saved version keeps of the engine's result: everything but the drawing. The plan of
 * a 1,000 m² floor runs to megabytes and is exactly reproducible from the stored input and
 * rates, so the editor redraws it instead.
 */
export type TakeoffSummary = Omit<TakeoffResult, 'plan'>;

export function summaryOf(result: TakeoffResult): TakeoffSummary {
  const { plan: _plan, ...summary } = result;
  return summary;
}

/** The firm's own takeoff rates (the takeoff settings), or {} when it keeps the defaults. */
async function firmRateOverrides(tx: Tx, scope: TenantScope): Promise<Partial<TakeoffRates>> {
  const row = await tx
    .selectFrom('tenant')
    .select('takeoffRates')
    .where('id', '=', scope.tenantId)
    .executeTakeFirstOrThrow();
  return row.takeoffRates as Partial<TakeoffRates>;
}

/**
 * Computes with the firm's rates (the request's own rates win, as in the compute endpoint)
 * and returns the rates used in full, so the version stays reproducible after the firm
 * changes its settings. The engine's problems become a 400 naming field and point.
 */
export async function computeWithFirmRates(tx: Tx, scope: TenantScope, input: TakeoffInput) {
  const rates = resolveRates({ ...(await firmRateOverrides(tx, scope)), ...input.rates });
  try {
    return { rates, result: computeTakeoff({ ...input, rates }) };
  } catch (err) {
    if (!(err instanceof TakeoffInputError)) throw err;
    const problems = err.problems.map((p) => ({
      path: p.field,
      message: p.point ? `${p.message} (at ${p.point.join(', ')})` : p.message,
    }));
    throw new ValidationError(problems[0]?.message ?? 'The floor cannot be computed.', problems);
  }
}

/** Checks the area belongs to the job (in this firm) and returns it. */
export async function findArea(tx: Tx, scope: TenantScope, jobId: string, areaId: string) {
  const area = await tx
    .selectFrom('surveyArea')
    .select(['id', 'jobId', 'name', 'createdAt'])
    .where('tenantId', '=', scope.tenantId)
    .where('jobId', '=', jobId)
    .where('id', '=', areaId)
    .executeTakeFirst();
  if (!area) throw new NotFoundError('The area');
  return area;
}

/**
 * Saves the takeoff as the area's next version. The area row is locked first, so two people
 * saving at once get versions n + 1 and n + 2 rather than a unique-key error.
 */
export async function saveVersion(
  tx: Tx,
  scope: TenantScope,
  areaId: string,
  input: TakeoffInput,
  userId: string,
) {
  await tx
    .selectFrom('surveyArea')
    .select('id')
    .where('tenantId', '=', scope.tenantId)
    .where('id', '=', areaId)
    .forUpdate()
    .executeTakeFirstOrThrow();
  const { rates, result } = await computeWithFirmRates(tx, scope, input);
  const last = await tx
    .selectFrom('takeoffVersion')
    .select((eb) => eb.fn.max('version').as('version'))
    .where('tenantId', '=', scope.tenantId)
    .where('areaId', '=', areaId)
    .executeTakeFirst();
  const summary = summaryOf(result);
  const row = await tx
    .insertInto('takeoffVersion')
    .values({
      tenantId: scope.tenantId,
      areaId,
      version: (last?.version ?? 0) + 1,
      input: JSON.stringify(input),
      rates: JSON.stringify(rates),
      summary: JSON.stringify(summary),
      createdBy: userId,
    })
    .returning(['id', 'version', 'createdAt', 'createdBy'])
    .executeTakeFirstOrThrow();
  return { ...row, areaId, input, rates, summary };
}

const VERSION_COLUMNS = ['id', 'areaId', 'version', 'summary', 'createdBy', 'createdAt'] as const;

/** The area's versions, newest first, without their inputs. */
export function listVersions(tx: Tx, scope: TenantScope, areaId: string) {
  return tx
    .selectFrom('takeoffVersion')
    .select(VERSION_COLUMNS)
    .where('tenantId', '=', scope.tenantId)
    .where('areaId', '=', areaId)
    .orderBy('version', 'desc')
    .execute();
}

/** One version with the input it was computed from and the rates used. */
export async function getVersion(tx: Tx, scope: TenantScope, areaId: string, version: number) {
  const row = await tx
    .selectFrom('takeoffVersion')
    .select([...VERSION_COLUMNS, 'input', 'rates'])
    .where('tenantId', '=', scope.tenantId)
    .where('areaId', '=', areaId)
    .where('version', '=', version)
    .executeTakeFirst();
  if (!row) throw new NotFoundError('That takeoff version');
  return row;
}

/** The latest version of each of the job's areas (areas without one are left out). */
export function latestVersions(tx: Tx, scope: TenantScope, jobId: string) {
  return tx
    .selectFrom('takeoffVersion as v')
    .innerJoin('surveyArea as a', (j) =>
      j.onRef('a.tenantId', '=', 'v.tenantId').onRef('a.id', '=', 'v.areaId'),
    )
    .distinctOn('v.areaId')
    .select(['v.areaId', 'v.version', 'v.summary', 'v.createdAt', 'v.createdBy'])
    .where('v.tenantId', '=', scope.tenantId)
    .where('a.jobId', '=', jobId)
    .orderBy('v.areaId')
    .orderBy('v.version', 'desc')
    .execute();
}
