import { recordAudit, type TenantScope, type Tx } from '@latchwork/shared-db';
import { actorOf, endpoint } from '@latchwork/shared-server-kit';
import type { Request } from 'express';
import type { StockDeps } from '../stock-deps';
import { inFirm } from '../stock-tx';
import { invalidField } from '../stock-errors';
import { createBatch } from '../places/batch.repository';
import { checkLedger } from './check-ledger';
import { listBalances, listMovements, PACK_COLUMNS, packText } from './ledger.repository';
import {
  balanceQuery,
  movementBody,
  movementIdParams,
  movementQuery,
  reverseBody,
  settingsBody,
  type MovementBody,
} from './movement.schemas';
import { postMovements } from './post-movements';
import { reverseMovement } from './reverse-movement';

const actor = (req: Request) => ({ userId: actorOf(req).userId, role: actorOf(req).role });

/** A movement body as the posting service takes it, creating its new batch first. */
async function requestOf(tx: Tx, scope: TenantScope, body: MovementBody) {
  const { newBatch, ...m } = body;
  if (!newBatch) return m;
  if (body.kind !== 'receipt') invalidField('newBatch', 'only goods in creates a batch');
  if (body.batchId) invalidField('newBatch', 'give batchId or newBatch, not both');
  const batchId = await createBatch(
    tx,
    scope,
    { ...newBatch, productId: body.productId },
    'newBatch.',
  );
  return { ...m, batchId };
}

/** The ledger: book, reverse and read movements; balances; the ledger check; settings. */
export function movementEndpoints(deps: StockDeps) {
  return [
    endpoint({
      method: 'post',
      path: '/stock/movements',
      summary:
        'Book a movement: receipt, transfer, issue to a job, return from a job, adjustment, count correction or write-off',
      tags: ['stock'],
      permission: 'stock:write',
      status: 201,
      body: movementBody,
      handle: ({ body, req }) =>
        inFirm(deps.db, req, async (tx, scope) => {
          const m = await requestOf(tx, scope, body);
          const [row] = await postMovements(tx, scope, actor(req), [m], { at: () => '' });
          // With its packs, so the page can say what was booked: "Booked: 2 boxes + 4 tiles".
          const pack = await tx
            .selectFrom('product as p')
            .select(PACK_COLUMNS)
            .where('p.tenantId', '=', scope.tenantId)
            .where('p.id', '=', row.productId)
            .executeTakeFirstOrThrow();
          return { ...row, packs: packText(pack, row.quantity) };
        }),
    }),
    endpoint({
      method: 'post',
      path: '/stock/movements/:movementId/reverse',
      summary: 'Undo a movement by booking its reverse (nothing is edited or deleted)',
      tags: ['stock'],
      permission: 'stock:write',
      status: 201,
      params: movementIdParams,
      body: reverseBody,
      handle: ({ params, body, req }) =>
        inFirm(deps.db, req, (tx, scope) =>
          reverseMovement(tx, scope, actor(req), params.movementId, body.note),
        ),
    }),
    endpoint({
      method: 'get',
      path: '/stock/movements',
      summary:
        'The ledger, newest first; by product (with the running quantity), place, batch or job',
      tags: ['stock'],
      permission: 'stock:read',
      query: movementQuery,
      handle: ({ query, req }) =>
        inFirm(deps.db, req, (tx, scope) => listMovements(tx, scope, query)),
    }),
    endpoint({
      method: 'get',
      path: '/stock/balances',
      summary: 'Stock on hand by product × batch × location, with packs',
      tags: ['stock'],
      permission: 'stock:read',
      query: balanceQuery,
      handle: ({ query, req }) =>
        inFirm(deps.db, req, (tx, scope) => listBalances(tx, scope, query)),
    }),
    endpoint({
      method: 'get',
      path: '/stock/ledger-check',
      summary: 'Recompute balances and stock value from the ledger; lists any difference',
      tags: ['stock'],
      permission: 'stock:read',
      handle: ({ req }) => inFirm(deps.db, req, (tx, scope) => checkLedger(tx, scope)),
    }),
    endpoint({
      method: 'get',
      path: '/stock/settings',
      summary: 'The firm’s stock settings',
      tags: ['stock'],
      permission: 'stock:read',
      handle: ({ req }) => inFirm(deps.db, req, (tx, scope) => stockSettings(tx, scope)),
    }),
    endpoint({
      method: 'put',
      path: '/stock/settings',
      summary: 'Change the stock settings (owner): negative stock, expiry warning, reorder',
      tags: ['stock'],
      permission: 'settings:write',
      body: settingsBody,
      handle: ({ body, req }) =>
        inFirm(deps.db, req, async (tx, scope) => {
          const before = await stockSettings(tx, scope);
          await tx
            .insertInto('stockSetting')
            .values({ tenantId: scope.tenantId, ...body })
            .onConflict((oc) =>
              oc.column('tenantId').doUpdateSet({ ...body, updatedAt: new Date() }),
            )
            .execute();
          await recordAudit(tx, scope, {
            userId: actorOf(req).userId,
            action: 'settings-changed',
            subject: 'stock settings',
            detail: { before, after: body },
            ipAddress: req.ip ?? null,
          });
          return stockSettings(tx, scope);
        }),
    }),
  ];
}

/** The firm's stock settings, defaults when never saved. */
export async function stockSettings(tx: Tx, scope: TenantScope) {
  const row = await tx
    .selectFrom('stockSetting')
    .select([
      'allowNegativeStock',
      'expiryWarningDays',
      'defaultServiceLevelBp',
      'holdingCostRateBp',
    ])
    .where('tenantId', '=', scope.tenantId)
    .executeTakeFirst();
  return (
    row ?? {
      allowNegativeStock: false,
      expiryWarningDays: 30,
      defaultServiceLevelBp: 9500,
      holdingCostRateBp: 2500,
    }
  );
}
