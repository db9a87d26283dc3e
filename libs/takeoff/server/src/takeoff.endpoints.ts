import type { Kysely } from 'kysely';
import { z } from 'zod';
import { recordAudit, withTenant, type Database } from '@latchwork/shared-db';
import { actorOf, endpoint, scopeOf, ValidationError } from '@latchwork/shared-server-kit';
import {
  computeTakeoff,
  DEFAULT_RATES,
  resolveRates,
  TakeoffInputError,
  type TakeoffInput,
  type TakeoffRates,
} from '@latchwork/takeoff';
import { rateOverrides, takeoffInput } from './takeoff.schemas';

export interface TakeoffDeps {
  db: Kysely<Database>;
}

type RateOverrides = Partial<TakeoffRates>;

async function firmOverrides(db: Kysely<Database>, tenantId: string): Promise<RateOverrides> {
  const row = await db
    .selectFrom('tenant')
    .select('takeoffRates')
    .where('id', '=', tenantId)
    .executeTakeFirstOrThrow();
  return row.takeoffRates as RateOverrides;
}

const ratesView = (overrides: RateOverrides) => ({
  defaults: DEFAULT_RATES,
  overrides,
  effective: resolveRates(overrides),
});

/** The engine's problems in the API's error shape: field as path, with the point when known. */
function asValidationError(error: TakeoffInputError): ValidationError {
  const problems = error.problems.map((p) => ({
    path: p.field,
    message: p.message,
    ...(p.point && { point: p.point }),
  }));
  const first = error.problems[0];
  return new ValidationError(
    first ? `${first.field}: ${first.message}` : 'The floor cannot be computed.',
    problems,
  );
}

export function takeoffEndpoints(deps: TakeoffDeps) {
  return [
    endpoint({
      method: 'post',
      path: '/takeoffs/compute',
      summary: 'Compute a takeoff and layout from a measured floor (nothing is saved)',
      tags: ['takeoffs'],
      permission: 'takeoffs:read',
      body: takeoffInput,
      async handle({ body, req }) {
        // The firm's rates are the defaults; the request's own rates override them.
        const overrides = await firmOverrides(deps.db, scopeOf(req).tenantId);
        const input = { ...body, rates: { ...overrides, ...body.rates } } as TakeoffInput;
        try {
          return computeTakeoff(input);
        } catch (err) {
          if (err instanceof TakeoffInputError) throw asValidationError(err);
          throw err;
        }
      },
    }),
    endpoint({
      method: 'get',
      path: '/takeoffs/rates',
      summary: 'The takeoff rates: the defaults, the firm’s overrides and the result',
      tags: ['takeoffs'],
      permission: 'takeoffs:read',
      handle: async ({ req }) => ratesView(await firmOverrides(deps.db, scopeOf(req).tenantId)),
    }),
    endpoint({
      method: 'put',
      path: '/takeoffs/rates',
      summary: 'Set the firm’s own takeoff rates (only those that differ from the defaults)',
      tags: ['takeoffs'],
      permission: 'settings:write',
      body: rateOverrides,
      response: z.object({
        defaults: z.record(z.string(), z.unknown()),
        overrides: z.record(z.string(), z.unknown()),
        effective: z.record(z.string(), z.unknown()),
      }),
      async handle({ body, req }) {
        const scope = scopeOf(req);
        // Keep only real differences, so a later change of a default reaches this firm.
        const overrides = Object.fromEntries(
          Object.entries(body).filter(
            ([key, value]) =>
              value !== undefined && DEFAULT_RATES[key as keyof TakeoffRates] !== value,
          ),
        );
        await withTenant(deps.db, scope, async (tx) => {
          await tx
            .updateTable('tenant')
            .set({ takeoffRates: JSON.stringify(overrides) as unknown as RateOverrides })
            .where('id', '=', scope.tenantId)
            .execute();
          await recordAudit(tx, scope, {
            userId: actorOf(req).userId,
            action: 'settings-changed',
            subject: 'takeoff rates',
            detail: { overrides },
            ipAddress: req.ip,
          });
        });
        return ratesView(overrides);
      },
    }),
  ];
}
