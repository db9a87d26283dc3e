/**
 * The firm's count and reorder settings: the variance value above which the owner approves a
 * count, the demand window and order cost of the reorder run, whether it runs nightly, and
 * where its draft orders are delivered. Defaults apply until the owner saves them.
 */
import { z } from 'zod';
import { recordAudit, withTenant, type TenantScope, type Tx } from '@latchwork/shared-db';
import { actorOf, endpoint, scopeOf } from '@latchwork/shared-server-kit';
import type { StockDeps } from '../stock-deps';
import { requireFirmRow } from '../purchasing/product-facts';

/** The settings as the services use them (money in minor units). */
export interface ControlSettings {
  countApprovalGrossMinor: number;
  countApprovalLineMinor: number | null;
  demandWindowDays: number;
  nightlyReorder: boolean;
  defaultOrderCostMinor: number;
  deliveryLocationId: string | null;
}

/** 100.00 of variance in a count before the owner must look at it. */
export const DEFAULT_CONTROL: ControlSettings = {
  countApprovalGrossMinor: 10000,
  countApprovalLineMinor: null,
  demandWindowDays: 90,
  nightlyReorder: true,
  defaultOrderCostMinor: 2500,
  deliveryLocationId: null,
};

const money = z.number().int().min(0).max(1e13);

export const controlSettingsBody = z.object({
  countApprovalGrossMinor: money,
  countApprovalLineMinor: money.nullable().default(null),
  demandWindowDays: z.number().int().min(7).max(730),
  nightlyReorder: z.boolean(),
  defaultOrderCostMinor: money,
  deliveryLocationId: z.uuid().nullable().default(null),
});

/** The firm's settings, defaults when never saved. */
export async function controlSettings(tx: Tx, scope: TenantScope): Promise<ControlSettings> {
  const row = await tx
    .selectFrom('stockControlSetting')
    .selectAll()
    .where('tenantId', '=', scope.tenantId)
    .executeTakeFirst();
  if (!row) return { ...DEFAULT_CONTROL };
  return {
    countApprovalGrossMinor: Number(row.countApprovalGrossMinor),
    countApprovalLineMinor:
      row.countApprovalLineMinor === null ? null : Number(row.countApprovalLineMinor),
    demandWindowDays: row.demandWindowDays,
    nightlyReorder: row.nightlyReorder,
    defaultOrderCostMinor: Number(row.defaultOrderCostMinor),
    deliveryLocationId: row.deliveryLocationId,
  };
}

/** GET and PUT /stock/control-settings. */
export function controlSettingsEndpoints(deps: StockDeps) {
  return [
    endpoint({
      method: 'get',
      path: '/stock/control-settings',
      summary: 'Count approval threshold and reorder settings',
      tags: ['stock'],
      permission: 'stock:read',
      handle: ({ req }) =>
        withTenant(deps.db, scopeOf(req), (tx) => controlSettings(tx, scopeOf(req))),
    }),
    endpoint({
      method: 'put',
      path: '/stock/control-settings',
      summary: 'Change the count approval threshold and reorder settings (owner)',
      tags: ['stock'],
      permission: 'settings:write',
      body: controlSettingsBody,
      handle: ({ body, req }) =>
        withTenant(deps.db, scopeOf(req), async (tx) => {
          const scope = scopeOf(req);
          if (body.deliveryLocationId)
            await requireFirmRow(
              tx,
              scope,
              'stockLocation',
              body.deliveryLocationId,
              'deliveryLocationId',
            );
          const before = await controlSettings(tx, scope);
          await tx
            .insertInto('stockControlSetting')
            .values({ tenantId: scope.tenantId, ...body })
            .onConflict((oc) =>
              oc.column('tenantId').doUpdateSet({ ...body, updatedAt: new Date() }),
            )
            .execute();
          await recordAudit(tx, scope, {
            userId: actorOf(req).userId,
            action: 'settings-changed',
            subject: 'stock count and reorder settings',
            detail: { before, after: body },
            ipAddress: req.ip ?? null,
          });
          return controlSettings(tx, scope);
        }),
    }),
  ];
}
