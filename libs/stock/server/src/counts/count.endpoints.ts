import type { Request } from 'express';
import { withTenant, type TenantScope, type Tx } from '@latchwork/shared-db';
import { actorOf, endpoint, scopeOf } from '@latchwork/shared-server-kit';
import type { StockDeps } from '../stock-deps';
import { packsOf } from '../purchasing/product-facts';
import { countLines, findCount, listCounts, sheetLine } from './count.repository';
import {
  countEntriesBody,
  countIdParams,
  countQuery,
  countReasonsBody,
  startCountBody,
  varianceReportQuery,
} from './count.schemas';
import { startCount } from './count-start';
import { approveCount, postCount, reviewCount } from './count-posting';
import { varianceReport } from './count-report';
import { cancelCount, saveEntries, saveReasons, submitCount } from './count-workflow';

const actor = (req: Request) => ({ userId: actorOf(req).userId, role: actorOf(req).role });

/**
 * A count as the pages see it. While counting it is the blind sheet: no expected figures
 * anywhere. Submitted, it carries the live variance; posted, the variance as booked.
 */
export async function countView(tx: Tx, scope: TenantScope, countId: string) {
  const count = await findCount(tx, scope, countId);
  if (count.status === 'counting' || count.status === 'cancelled') {
    const lines = await countLines(tx, scope, countId);
    return { ...count, lines: lines.map(sheetLine), variance: null };
  }
  const { lines, evaluation } = await reviewCount(tx, scope, countId);
  const live = new Map(evaluation.lines.map((v) => [v.lineId, v]));
  const posted = count.status === 'posted';
  const shown = lines.map((l) => {
    const v = live.get(l.id);
    const figures = posted
      ? {
          expected: l.expected ?? 0,
          variance: l.variance ?? 0,
          unitCostMinor: l.unitCostMinor ?? 0,
          varianceValueMinor: l.varianceValueMinor ?? 0,
        }
      : {
          expected: v?.expected ?? 0,
          variance: v?.variance ?? 0,
          unitCostMinor: v?.unitCostMinor ?? 0,
          varianceValueMinor: v?.varianceValueMinor ?? 0,
        };
    return {
      ...sheetLine(l),
      expectedAtStart: l.expectedAtStart,
      movementsDuring: figures.expected - l.expectedAtStart,
      ...figures,
      expectedAtStartPacks: packsOf(l.product, l.expectedAtStart),
      movementsDuringPacks: packsOf(l.product, figures.expected - l.expectedAtStart),
      expectedPacks: packsOf(l.product, figures.expected),
      variancePacks: packsOf(l.product, figures.variance),
      reason: l.reason,
      reasonNote: l.reasonNote,
      movementId: l.movementId,
    };
  });
  const gross = posted ? (count.grossValueMinor ?? 0) : evaluation.grossValueMinor;
  return {
    ...count,
    lines: shown,
    variance: {
      netValueMinor: posted ? (count.netValueMinor ?? 0) : evaluation.netValueMinor,
      grossValueMinor: gross,
      thresholdMinor: evaluation.thresholdMinor,
      needsApproval: posted ? false : evaluation.needsApproval && !count.approvedBy,
    },
  };
}

/** Stock counts: start, blind entries, submit, reasons, approval, posting; the variance report. */
export function countEndpoints(deps: StockDeps) {
  const inFirm = <T>(req: Request, work: (tx: Tx, s: TenantScope) => Promise<T>) =>
    withTenant(deps.db, scopeOf(req), (tx) => work(tx, scopeOf(req)));
  const step = (
    path: string,
    summary: string,
    permission: string,
    work: (tx: Tx, s: TenantScope, req: Request, countId: string) => Promise<unknown>,
  ) =>
    endpoint({
      method: 'post',
      path: `/stock/counts/:countId/${path}`,
      summary,
      tags: ['stock'],
      permission,
      params: countIdParams,
      handle: ({ params, req }) =>
        inFirm(req, async (tx, scope) => {
          await work(tx, scope, req, params.countId);
          return countView(tx, scope, params.countId);
        }),
    });
  return [
    endpoint({
      method: 'get',
      path: '/stock/counts',
      summary: 'Stock counts, newest first, with how many lines are counted',
      tags: ['stock'],
      permission: 'stock:read',
      query: countQuery,
      handle: ({ query, req }) => inFirm(req, (tx, scope) => listCounts(tx, scope, query)),
    }),
    endpoint({
      method: 'post',
      path: '/stock/counts',
      summary: 'Start a count of a location (everything there, or chosen products)',
      tags: ['stock'],
      permission: 'stock:write',
      status: 201,
      body: startCountBody,
      handle: ({ body, req }) =>
        inFirm(req, async (tx, scope) =>
          countView(tx, scope, await startCount(tx, scope, actor(req), body)),
        ),
    }),
    endpoint({
      method: 'get',
      path: '/stock/counts/variance-report',
      summary: 'Count variances over time by product, location or month',
      tags: ['stock'],
      permission: 'stock:read',
      query: varianceReportQuery,
      handle: ({ query, req }) => inFirm(req, (tx, scope) => varianceReport(tx, scope, query)),
    }),
    endpoint({
      method: 'get',
      path: '/stock/counts/:countId',
      summary: 'A count: the blind sheet while counting, the variance once submitted',
      tags: ['stock'],
      permission: 'stock:read',
      params: countIdParams,
      handle: ({ params, req }) => inFirm(req, (tx, scope) => countView(tx, scope, params.countId)),
    }),
    endpoint({
      method: 'put',
      path: '/stock/counts/:countId/entries',
      summary: 'Enter what was found on lines of the sheet (packs + loose units)',
      tags: ['stock'],
      permission: 'stock:write',
      params: countIdParams,
      body: countEntriesBody,
      handle: ({ params, body, req }) =>
        inFirm(req, async (tx, scope) => {
          await saveEntries(tx, scope, actor(req), params.countId, body);
          return countView(tx, scope, params.countId);
        }),
    }),
    step('submit', 'Submit a fully counted count for review', 'stock:write', (tx, s, req, id) =>
      submitCount(tx, s, actor(req), id),
    ),
    endpoint({
      method: 'put',
      path: '/stock/counts/:countId/reasons',
      summary: 'Give the reasons for lines that differ',
      tags: ['stock'],
      permission: 'stock:write',
      params: countIdParams,
      body: countReasonsBody,
      handle: ({ params, body, req }) =>
        inFirm(req, async (tx, scope) => {
          await saveReasons(tx, scope, params.countId, body);
          return countView(tx, scope, params.countId);
        }),
    }),
    step(
      'approve',
      'Approve a count whose variance is over the firm’s threshold (owner)',
      'stock:approve',
      (tx, s, req, id) => approveCount(tx, s, actor(req), id),
    ),
    step(
      'post',
      'Post a submitted count: book a count correction for every line that differs',
      'stock:write',
      (tx, s, req, id) => postCount(tx, s, actor(req), id),
    ),
    step('cancel', 'Cancel a count that has not been posted', 'stock:write', (tx, s, _req, id) =>
      cancelCount(tx, s, id),
    ),
  ];
}
