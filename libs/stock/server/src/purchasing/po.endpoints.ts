import type { Request } from 'express';
import { withTenant, type TenantScope, type Tx } from '@latchwork/shared-db';
import { enqueueMail } from '@latchwork/shared-queues';
import { actorOf, endpoint, scopeOf } from '@latchwork/shared-server-kit';
import type { StockDeps } from '../stock-deps';
import {
  cancelBody,
  goodsInBody,
  purchaseOrderBody,
  purchaseOrderIdParams,
  purchaseOrderQuery,
  sendBody,
} from './po.schemas';
import { createPurchaseOrder, linesOfBody, replaceDraft } from './po.repository';
import { findOrderRow, listPurchaseOrders, purchaseOrderView } from './po-view';
import { cancelOrder, markSent, orderPdf, requireOrderStatus, setOrder } from './po-status';
import { receiveGoods } from './goods-in';

const actor = (req: Request) => ({ userId: actorOf(req).userId, role: actorOf(req).role });
const fileName = (reference: string) => `${reference.replace(/[^\w.-]+/g, '_')}.pdf`;

/** Purchase orders: create, edit a draft, send as PDF by e-mail, cancel, goods in. */
export function purchaseOrderEndpoints(deps: StockDeps) {
  const inFirm = <T>(req: Request, work: (tx: Tx, s: TenantScope) => Promise<T>) =>
    withTenant(deps.db, scopeOf(req), (tx) => work(tx, scopeOf(req)));
  const byId = { params: purchaseOrderIdParams, tags: ['stock'] };
  return [
    endpoint({
      method: 'get',
      path: '/stock/purchase-orders',
      summary: 'Purchase orders, newest first; by status (or all open ones) and supplier',
      tags: ['stock'],
      permission: 'stock:read',
      query: purchaseOrderQuery,
      handle: ({ query, req }) => inFirm(req, (tx, scope) => listPurchaseOrders(tx, scope, query)),
    }),
    endpoint({
      method: 'post',
      path: '/stock/purchase-orders',
      summary: 'Start a draft purchase order to a supplier',
      tags: ['stock'],
      permission: 'stock:write',
      status: 201,
      body: purchaseOrderBody,
      handle: ({ body, req }) =>
        inFirm(req, async (tx, scope) => {
          const lines = await linesOfBody(tx, scope, body);
          const id = await createPurchaseOrder(tx, scope, actorOf(req).userId, {
            ...body,
            source: 'manual',
            lines,
          });
          return purchaseOrderView(tx, scope, id);
        }),
    }),
    endpoint({
      ...byId,
      method: 'get',
      path: '/stock/purchase-orders/:purchaseOrderId',
      summary: 'One purchase order with its lines, totals and deliveries',
      permission: 'stock:read',
      handle: ({ params, req }) =>
        inFirm(req, (tx, scope) => purchaseOrderView(tx, scope, params.purchaseOrderId)),
    }),
    endpoint({
      ...byId,
      method: 'put',
      path: '/stock/purchase-orders/:purchaseOrderId',
      summary: 'Change a draft purchase order (header and lines)',
      permission: 'stock:write',
      body: purchaseOrderBody,
      handle: ({ params, body, req }) =>
        inFirm(req, async (tx, scope) => {
          const row = await findOrderRow(tx, scope, params.purchaseOrderId, true);
          requireOrderStatus(row.status, ['draft'], 'be changed');
          const lines = await linesOfBody(tx, scope, body);
          await replaceDraft(tx, scope, row.id, { ...body, lines });
          return purchaseOrderView(tx, scope, row.id);
        }),
    }),
    endpoint({
      ...byId,
      method: 'post',
      path: '/stock/purchase-orders/:purchaseOrderId/send',
      summary: 'Send a draft to the supplier: the order as a PDF attached to an e-mail',
      permission: 'stock:write',
      body: sendBody,
      async handle({ params, body, req }) {
        const scope = scopeOf(req);
        const sent = await inFirm(req, async (tx) => {
          const to = await markSent(
            tx,
            scope,
            actorOf(req).userId,
            params.purchaseOrderId,
            body.to,
          );
          return { to, ...(await orderPdf(tx, scope, params.purchaseOrderId)) };
        });
        const emailLogId = await enqueueMail(deps.db, deps.mailQueue, scope, {
          to: sent.to,
          template: 'purchaseOrder',
          params: {
            firm: sent.firm.name,
            reference: sent.order.reference,
            supplier: sent.order.supplier.name,
            message: body.message,
          },
          attachments: [
            {
              filename: fileName(sent.order.reference),
              contentType: 'application/pdf',
              contentBase64: sent.pdf.toString('base64'),
            },
          ],
        });
        return inFirm(req, async (tx) => {
          await setOrder(tx, scope, params.purchaseOrderId, { emailLogId });
          return purchaseOrderView(tx, scope, params.purchaseOrderId);
        });
      },
    }),
    endpoint({
      ...byId,
      method: 'post',
      path: '/stock/purchase-orders/:purchaseOrderId/receipts',
      summary: 'Goods in against the order: quantities, batches, expiry, damage, actual cost',
      permission: 'stock:write',
      status: 201,
      body: goodsInBody,
      handle: ({ params, body, req }) =>
        inFirm(req, async (tx, scope) => {
          await receiveGoods(tx, scope, actor(req), params.purchaseOrderId, body);
          return purchaseOrderView(tx, scope, params.purchaseOrderId);
        }),
    }),
    endpoint({
      ...byId,
      method: 'post',
      path: '/stock/purchase-orders/:purchaseOrderId/cancel',
      summary: 'Cancel a draft or sent purchase order, with the reason',
      permission: 'stock:write',
      body: cancelBody,
      handle: ({ params, body, req }) =>
        inFirm(req, async (tx, scope) => {
          await cancelOrder(tx, scope, actorOf(req).userId, params.purchaseOrderId, body.reason);
          return purchaseOrderView(tx, scope, params.purchaseOrderId);
        }),
    }),
    endpoint({
      ...byId,
      method: 'get',
      path: '/stock/purchase-orders/:purchaseOrderId/pdf',
      summary: 'The purchase order as a PDF',
      permission: 'stock:read',
      async handle({ params, req, res }) {
        const { order, pdf } = await inFirm(req, (tx, scope) =>
          orderPdf(tx, scope, params.purchaseOrderId),
        );
        res
          .status(200)
          .type('application/pdf')
          .setHeader('Content-Disposition', `inline; filename="${fileName(order.reference)}"`)
          .send(pdf);
      },
    }),
  ];
}
