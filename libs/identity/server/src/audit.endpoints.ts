import { z } from 'zod';
import { withTenant, listAudit } from '@latchwork/shared-db';
import { endpoint, scopeOf } from '@latchwork/shared-server-kit';
import type { IdentityDeps } from './identity-deps';

export function auditEndpoints(deps: IdentityDeps) {
  return [
    endpoint({
      method: 'get',
      path: '/audit',
      summary: 'The firm’s audit log, newest first, with filters',
      tags: ['audit'],
      permission: 'audit:read',
      query: z.object({
        action: z.string().max(40).optional(),
        userId: z.uuid().optional(),
        from: z.coerce.date().optional(),
        to: z.coerce.date().optional(),
        before: z.coerce.date().optional(),
        limit: z.coerce.number().int().min(1).max(200).default(50),
      }),
      handle: ({ query, req }) =>
        withTenant(deps.db, scopeOf(req), (tx) => listAudit(tx, scopeOf(req), query)),
    }),
  ];
}
