import type { Request } from 'express';
import type { TenantScope } from '@latchwork/shared-db';
import { UnauthenticatedError } from './errors';
import type { Permission, Role } from '@latchwork/shared-access';

/** Who is calling, in which firm, with which role: loaded afresh for every request. */
export interface Actor {
  userId: string;
  email: string;
  name: string;
  tenantId: string;
  role: Role;
  permissions: Permission[];
}

declare module 'express-serve-static-core' {
  interface Request {
    actor?: Actor;
  }
}

export function actorOf(req: Request): Actor {
  if (!req.actor) throw new UnauthenticatedError();
  return req.actor;
}

/** The tenant scope of a signed-in request: the firm the person is working in now. */
export function scopeOf(req: Request): TenantScope {
  return { tenantId: actorOf(req).tenantId };
}
