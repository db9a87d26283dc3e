import { sql } from 'kysely';
import type { TenantScope, Tx } from '@latchwork/shared-db';
import { ValidationError } from '@latchwork/shared-server-kit';
import {
  DEFAULT_SLAB_LIMITS,
  READING_KINDS,
  resolveSlabLimits,
  type SlabLimits,
} from '@latchwork/jobs-domain';
import type { LimitOverrides } from './survey.schemas';

/** The firm's stored overrides of the slab limits ({} when it has none). */
export async function slabLimitOverrides(tx: Tx, scope: TenantScope): Promise<LimitOverrides> {
  // Read as text: the CamelCasePlugin would rename the snake_case kinds inside the JSON.
  const row = await tx
    .selectFrom('surveySettings')
    .select(sql<string>`slab_limits::text`.as('json'))
    .where('tenantId', '=', scope.tenantId)
    .executeTakeFirst();
  return row ? (JSON.parse(row.json) as LimitOverrides) : {};
}

/** The limits readings of this firm are judged by: the defaults with the firm's overrides. */
export async function firmSlabLimits(tx: Tx, scope: TenantScope): Promise<SlabLimits> {
  return resolveSlabLimits(await slabLimitOverrides(tx, scope));
}

/** What `GET /survey/limits` answers: defaults (with sources), overrides and the result. */
export function limitsView(overrides: LimitOverrides) {
  return { defaults: DEFAULT_SLAB_LIMITS, overrides, effective: resolveSlabLimits(overrides) };
}

/**
 * Replaces the firm's overrides. A bound cannot move (RH stays a maximum); a temperature
 * minimum above the plausible range or a negative limit for a true-zero quantity is refused.
 */
export async function saveSlabLimitOverrides(
  tx: Tx,
  scope: TenantScope,
  overrides: LimitOverrides,
  userId: string,
): Promise<void> {
  const problems = READING_KINDS.flatMap((kind) => {
    const value = overrides[kind]?.value;
    const temperature = kind === 'air_temperature' || kind === 'slab_temperature';
    if (value === undefined || (temperature ? value <= 40 : value > 0)) return [];
    const message = temperature
      ? 'A temperature limit above 40 °C cannot be met on site.'
      : 'The limit must be above zero.';
    return [{ path: `${kind}.value`, message }];
  });
  if (problems.length) throw new ValidationError(problems[0]?.message ?? '', problems);
  const json = JSON.stringify(overrides);
  await tx
    .insertInto('surveySettings')
    .values({ tenantId: scope.tenantId, slabLimits: json, updatedBy: userId })
    .onConflict((oc) =>
      oc
        .column('tenantId')
        .doUpdateSet({ slabLimits: json, updatedBy: userId, updatedAt: new Date() }),
    )
    .execute();
}
