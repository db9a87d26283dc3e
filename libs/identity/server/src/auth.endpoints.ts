import { z } from 'zod';
import type { Request } from 'express';
import { endpoint, actorOf } from '@latchwork/shared-server-kit';
import { issueCsrfToken } from './csrf';
import { recordAuditInTenants } from '@latchwork/shared-db';
import { findUserByEmail, markJoined, membershipsOfUser } from './identity.repository';
import type { IdentityDeps } from './identity-deps';
import { SESSION_COOKIE } from './session';

/** Only same-site paths: an open redirect would let a link send people to another site after sign-in. */
const safeReturnTo = z
  .string()
  .regex(/^\/(?!\/)[\w\-./?=&%#~]*$/, 'must be a path on this site')
  .max(500)
  .optional();

const regenerate = (req: Request) =>
  new Promise<void>((resolve, reject) =>
    req.session.regenerate((err) => (err ? reject(err) : resolve())),
  );
const destroy = (req: Request) =>
  new Promise<void>((resolve, reject) =>
    req.session.destroy((err) => (err ? reject(err) : resolve())),
  );

export function authEndpoints(deps: IdentityDeps) {
  const failed = (reason: string) => `/?signin=${encodeURIComponent(reason)}`;
  return [
    endpoint({
      method: 'get',
      path: '/auth/login',
      summary: 'Start signing in at the identity provider (browser redirect)',
      tags: ['auth'],
      permission: 'public',
      query: z.object({ returnTo: safeReturnTo }),
      async handle({ query, req, res }) {
        req.session.returnTo = query.returnTo;
        await deps.oidc.redirectToProvider(req, res);
      },
    }),
    endpoint({
      method: 'get',
      path: '/auth/callback',
      summary: 'The identity provider returns here; opens the session (browser redirect)',
      tags: ['auth'],
      permission: 'public',
      async handle({ req, res }) {
        const { identity, failure } = await deps.oidc.complete(req, res);
        if (!identity) return res.redirect(failed(failure ?? 'failed'));
        const user = await findUserByEmail(deps.db, identity.email);
        const memberships = user ? await membershipsOfUser(deps.db, user.id) : [];
        if (!user || memberships.length === 0) return res.redirect(failed('no-account'));
        const returnTo = req.session.returnTo;
        // A new session id at sign-in: a session id planted before sign-in is worth nothing.
        await regenerate(req);
        req.session.userId = user.id;
        req.session.tenantId = memberships[0]?.tenantId;
        req.session.idToken = identity.idToken;
        issueCsrfToken(req, res);
        const tenantIds = memberships.map((m) => m.tenantId);
        await markJoined(deps.db, user.id, tenantIds);
        await recordAuditInTenants(deps.db, tenantIds, {
          userId: user.id,
          action: 'sign-in',
          subject: user.email,
          ipAddress: req.ip,
        });
        res.redirect(returnTo ?? '/');
      },
    }),
    endpoint({
      method: 'post',
      path: '/auth/logout',
      summary: 'End the session; answers with the identity provider’s sign-out URL',
      tags: ['auth'],
      permission: 'signed-in',
      response: z.object({ signOutUrl: z.string().nullable() }),
      async handle({ req, res }) {
        const actor = actorOf(req);
        const memberships = await membershipsOfUser(deps.db, actor.userId);
        await recordAuditInTenants(
          deps.db,
          memberships.map((m) => m.tenantId),
          { userId: actor.userId, action: 'sign-out', subject: actor.email, ipAddress: req.ip },
        );
        const idToken = req.session.idToken;
        await destroy(req);
        res.clearCookie(SESSION_COOKIE, { path: '/' });
        const signOutUrl = await deps.oidc
          .signOutUrl(idToken, `${deps.appUrl}/`)
          .catch(() => undefined);
        return { signOutUrl: signOutUrl ?? null };
      },
    }),
  ];
}
