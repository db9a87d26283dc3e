import { z } from 'zod';
import type { Request, Response } from 'express';
import { endpoint, NotFoundError, actorOf } from '@latchwork/shared-server-kit';
import { issueCsrfToken } from './csrf';
import { loadActor, membershipsOfUser } from './identity.repository';
import type { IdentityDeps } from './identity-deps';

const meResponse = z.object({
  user: z.object({ id: z.string(), email: z.string(), name: z.string() }),
  memberships: z.array(
    z.object({ tenantId: z.string(), tenantName: z.string(), role: z.string() }),
  ),
  activeTenant: z.object({
    id: z.string(),
    name: z.string(),
    role: z.string(),
    currency: z.string(),
    units: z.string(),
  }),
  permissions: z.array(z.string()),
});

export function meEndpoints(deps: IdentityDeps) {
  async function me(req: Request, res: Response) {
    const actor = actorOf(req);
    issueCsrfToken(req, res);
    const memberships = await membershipsOfUser(deps.db, actor.userId);
    const tenant = await deps.db
      .selectFrom('tenant')
      .select(['id', 'name', 'currency', 'units'])
      .where('id', '=', actor.tenantId)
      .executeTakeFirstOrThrow();
    return {
      user: { id: actor.userId, email: actor.email, name: actor.name },
      memberships,
      activeTenant: { ...tenant, role: actor.role },
      permissions: actor.permissions,
    };
  }
  return [
    endpoint({
      method: 'get',
      path: '/me',
      summary: 'The signed-in person, their firms, the firm in use and what their role may do',
      tags: ['auth'],
      permission: 'signed-in',
      response: meResponse,
      handle: ({ req, res }) => me(req, res),
    }),
    endpoint({
      method: 'put',
      path: '/me/active-tenant',
      summary: 'Switch to another firm the person belongs to',
      tags: ['auth'],
      permission: 'signed-in',
      body: z.object({ tenantId: z.uuid() }),
      response: meResponse,
      async handle({ body, req, res }) {
        const actor = await loadActor(deps.db, actorOf(req).userId, body.tenantId);
        // Not a member: the same answer as a firm that does not exist.
        if (!actor) throw new NotFoundError('That firm');
        req.session.tenantId = body.tenantId;
        req.actor = actor;
        return me(req, res);
      },
    }),
  ];
}
