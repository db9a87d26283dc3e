import { z } from 'zod';
import { withTenant } from '@latchwork/shared-db';
import { actorOf, endpoint, scopeOf } from '@latchwork/shared-server-kit';
import type { StockDeps } from '../stock-deps';
import { runReorder } from './reorder-run';

const suggestionQuery = z.object({
  /** Every product, not only those at or below their reorder point. */
  all: z.enum(['true', 'false']).default('false'),
});

/** Reorder suggestions and the "run reorder now" button. */
export function reorderEndpoints(deps: StockDeps) {
  return [
    endpoint({
      method: 'get',
      path: '/stock/reorder/suggestions',
      summary: 'What the reorder run would order now, with the figures and reasons',
      tags: ['stock'],
      permission: 'stock:read',
      query: suggestionQuery,
      handle: ({ query, req }) =>
        withTenant(deps.db, scopeOf(req), async (tx) => {
          const result = await runReorder(tx, scopeOf(req), null, { dryRun: true });
          const shown =
            query.all === 'true' ? result.suggestions : result.suggestions.filter((s) => s.order);
          return { ...result, suggestions: shown };
        }),
    }),
    endpoint({
      method: 'post',
      path: '/stock/reorder/run',
      summary: 'Run the reorder now: draft purchase orders per supplier for what is low',
      tags: ['stock'],
      permission: 'stock:write',
      handle: ({ req }) =>
        withTenant(deps.db, scopeOf(req), async (tx) => {
          const result = await runReorder(tx, scopeOf(req), actorOf(req).userId);
          return { ...result, suggestions: result.suggestions.filter((s) => s.order) };
        }),
    }),
  ];
}
