import type { Kysely } from 'kysely';
import type { RequestHandler } from 'express';
import type { Database } from '@latchwork/shared-db';
import { ForbiddenError, UnauthenticatedError } from '@latchwork/shared-server-kit';
import { isPermission, roleHas } from '@latchwork/shared-access';
import { loadActor } from './identity.repository';

/**
 * Loads the actor of a signed-in session on every request, so a changed role or a removed
 * membership takes effect at once rather than at the next sign-in.
 */
export function actorMiddleware(db: Kysely<Database>): RequestHandler {
  return async (req, _res, next) => {
    const { userId, tenantId } = req.session ?? {};
    if (userId && tenantId) req.actor = await loadActor(db, userId, tenantId);
    next();
  };
}

/** The guard every declared endpoint passes through (see routerFor). */
export function guardEndpoint(req: Parameters<RequestHandler>[0], permission: string): void {
  if (permission === 'public') return;
  if (!req.actor)
    throw new UnauthenticatedError(
      req.session?.userId ? 'You are no longer a member of this firm. Sign in again.' : undefined,
    );
  if (permission === 'signed-in') return;
  if (!isPermission(permission))
    throw new Error(`Route declares unknown permission "${permission}"`);
  if (!roleHas(req.actor.role, permission)) throw new ForbiddenError();
}
