import { z } from 'zod';
import { withTenant, recordAudit } from '@latchwork/shared-db';
import { endpoint, actorOf, scopeOf } from '@latchwork/shared-server-kit';
import type { IdentityDeps } from './identity-deps';

const prefix = z
  .string()
  .trim()
  .max(12)
  .regex(/^[A-Za-z0-9\-/]*$/, 'letters, digits, "-" and "/" only');

export const tenantSettings = z.object({
  name: z.string().trim().min(1).max(200),
  addressLines: z.array(z.string().trim().max(200)).max(6),
  // ISO 4217 alphabetic code.
  currency: z.string().regex(/^[A-Z]{3}$/, 'a three-letter ISO 4217 code such as GBP or EUR'),
  units: z.enum(['metric', 'imperial']),
  /** Basis points: 2000 = 20 %. */
  defaultTaxRateBp: z.number().int().min(0).max(10000),
  paymentTermsDays: z.number().int().min(0).max(365),
  numberPrefixes: z.object({
    job: prefix,
    quote: prefix,
    invoice: prefix,
    creditNote: prefix,
    purchaseOrder: prefix,
  }),
});
type TenantSettings = z.infer<typeof tenantSettings>;

const COLUMNS = [
  'name',
  'addressLines',
  'currency',
  'units',
  'defaultTaxRateBp',
  'paymentTermsDays',
  'numberPrefixes',
] as const;

export function settingsEndpoints(deps: IdentityDeps) {
  const read = (tenantId: string) =>
    deps.db
      .selectFrom('tenant')
      .select(COLUMNS)
      .where('id', '=', tenantId)
      .executeTakeFirstOrThrow() as Promise<TenantSettings>;
  return [
    endpoint({
      method: 'get',
      path: '/settings',
      summary: 'The firm’s settings',
      tags: ['settings'],
      permission: 'settings:read',
      response: tenantSettings,
      handle: ({ req }) => read(scopeOf(req).tenantId),
    }),
    endpoint({
      method: 'put',
      path: '/settings',
      summary: 'Change the firm’s settings',
      tags: ['settings'],
      permission: 'settings:write',
      body: tenantSettings,
      response: tenantSettings,
      async handle({ body, req }) {
        const scope = scopeOf(req);
        const before = await read(scope.tenantId);
        const changed = COLUMNS.filter(
          (c) => JSON.stringify(before[c]) !== JSON.stringify(body[c]),
        );
        await withTenant(deps.db, scope, async (tx) => {
          await tx
            .updateTable('tenant')
            .set({
              ...body,
              numberPrefixes: JSON.stringify(body.numberPrefixes) as unknown as Record<
                string,
                string
              >,
            })
            .where('id', '=', scope.tenantId)
            .execute();
          if (changed.length) {
            const detail = Object.fromEntries(
              changed.map((c) => [c, { from: before[c], to: body[c] }]),
            );
            await recordAudit(tx, scope, {
              userId: actorOf(req).userId,
              action: 'settings-changed',
              subject: changed.join(', '),
              detail,
              ipAddress: req.ip,
            });
          }
        });
        return read(scope.tenantId);
      },
    }),
  ];
}
