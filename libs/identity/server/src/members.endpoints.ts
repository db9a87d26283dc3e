import { z } from 'zod';
import {
  withTenant,
  type Role,
  type TenantScope,
  type Tx,
  recordAudit,
} from '@latchwork/shared-db';
import {
  ConflictError,
  endpoint,
  NotFoundError,
  actorOf,
  scopeOf,
} from '@latchwork/shared-server-kit';
import { enqueueMail } from '@latchwork/shared-queues';
import { ROLES } from '@latchwork/shared-access';
import type { IdentityDeps } from './identity-deps';
import {
  addMembership,
  deleteMembership,
  ensureUser,
  findMember,
  listMembers,
  lockOwners,
  setRole,
} from './members.repository';

/** How long an invitation link works (common practice for such links: a few days). */
export const INVITATION_TTL_SECONDS = 72 * 3600;

const member = z.object({
  userId: z.string(),
  email: z.string(),
  name: z.string(),
  role: z.enum(ROLES),
  invitedAt: z.date(),
  joinedAt: z.date().nullable(),
});
const userIdParams = z.object({ userId: z.uuid() });

/**
 * The member about to change role (`newRole`) or leave (`null`), refusing when that would
 * leave the firm without an owner. Owner rows are locked first, so two owners demoting each
 * other at the same moment cannot both succeed.
 */
async function memberKeepingAnOwner(
  tx: Tx,
  scope: TenantScope,
  userId: string,
  newRole: Role | null,
) {
  const owners = await lockOwners(tx, scope);
  const found = await findMember(tx, scope, userId);
  if (!found) throw new NotFoundError('That member');
  if (found.role === 'owner' && newRole !== 'owner' && owners.length <= 1) {
    throw new ConflictError('A firm needs at least one owner: make someone else an owner first.');
  }
  return found;
}

export function memberEndpoints(deps: IdentityDeps) {
  async function sendInvitation(scope: TenantScope, person: { email: string; name: string }) {
    const tenant = await deps.db
      .selectFrom('tenant')
      .select('name')
      .where('id', '=', scope.tenantId)
      .executeTakeFirstOrThrow();
    const ticket = await deps.idpAdmin.createPasswordTicket({
      email: person.email,
      name: person.name,
      returnTo: `${deps.appUrl}/api/v1/auth/login`,
      expiresInSeconds: INVITATION_TTL_SECONDS,
    });
    const expires = new Date(ticket.expiresAt).toUTCString();
    // Someone who already has a password (a member of another firm) just signs in.
    const url = ticket.accountExists ? `${deps.appUrl}/api/v1/auth/login` : ticket.url;
    await enqueueMail(deps.db, deps.mailQueue, scope, {
      to: person.email,
      template: ticket.accountExists ? 'invitationExisting' : 'invitation',
      params: { firm: tenant.name, url, expires },
    });
  }

  return [
    endpoint({
      method: 'get',
      path: '/members',
      summary: 'The people of the firm and their roles',
      tags: ['members'],
      permission: 'members:read',
      response: z.array(member),
      handle: ({ req }) => withTenant(deps.db, scopeOf(req), (tx) => listMembers(tx, scopeOf(req))),
    }),
    endpoint({
      method: 'post',
      path: '/members/invitations',
      summary: 'Invite a person by e-mail with a role',
      tags: ['members'],
      permission: 'members:write',
      status: 201,
      body: z.object({
        email: z.email().max(320).toLowerCase(),
        name: z.string().trim().min(1).max(200),
        role: z.enum(ROLES),
      }),
      response: member,
      async handle({ body, req }) {
        const scope = scopeOf(req);
        const actor = actorOf(req);
        const created = await withTenant(deps.db, scope, async (tx) => {
          const userId = await ensureUser(tx, body.email, body.name);
          if (await findMember(tx, scope, userId))
            throw new ConflictError(`${body.email} is already a member of this firm.`);
          await addMembership(tx, scope, userId, body.role, actor.userId);
          await recordAudit(tx, scope, {
            userId: actor.userId,
            action: 'member-invited',
            subject: body.email,
            detail: { role: body.role },
            ipAddress: req.ip,
          });
          return findMember(tx, scope, userId);
        });
        await sendInvitation(scope, body);
        return created;
      },
    }),
    endpoint({
      method: 'post',
      path: '/members/:userId/invitation',
      summary: 'Send a new invitation link to a person who has not joined yet',
      tags: ['members'],
      permission: 'members:write',
      params: userIdParams,
      status: 202,
      async handle({ params, req }) {
        const scope = scopeOf(req);
        const found = await withTenant(deps.db, scope, (tx) =>
          findMember(tx, scope, params.userId),
        );
        if (!found) throw new NotFoundError('That member');
        if (found.joinedAt) throw new ConflictError(`${found.email} has already joined.`);
        await sendInvitation(scope, found);
        return { sent: true };
      },
    }),
    endpoint({
      method: 'patch',
      path: '/members/:userId',
      summary: 'Change a member’s role (the last owner cannot be demoted)',
      tags: ['members'],
      permission: 'members:write',
      params: userIdParams,
      body: z.object({ role: z.enum(ROLES) }),
      response: member,
      async handle({ params, body, req }) {
        const scope = scopeOf(req);
        return withTenant(deps.db, scope, async (tx) => {
          const found = await memberKeepingAnOwner(tx, scope, params.userId, body.role);
          await setRole(tx, scope, params.userId, body.role);
          await recordAudit(tx, scope, {
            userId: actorOf(req).userId,
            action: 'member-role-changed',
            subject: found.email,
            detail: { from: found.role, to: body.role },
            ipAddress: req.ip,
          });
          return findMember(tx, scope, params.userId);
        });
      },
    }),
    endpoint({
      method: 'delete',
      path: '/members/:userId',
      summary: 'Remove a member from the firm (the last owner cannot be removed)',
      tags: ['members'],
      permission: 'members:write',
      params: userIdParams,
      status: 204,
      async handle({ params, req, res }) {
        const scope = scopeOf(req);
        await withTenant(deps.db, scope, async (tx) => {
          const found = await memberKeepingAnOwner(tx, scope, params.userId, null);
          await deleteMembership(tx, scope, params.userId);
          await recordAudit(tx, scope, {
            userId: actorOf(req).userId,
            action: 'member-removed',
            subject: found.email,
            detail: { role: found.role },
            ipAddress: req.ip,
          });
        });
        res.status(204).end();
      },
    }),
  ];
}
