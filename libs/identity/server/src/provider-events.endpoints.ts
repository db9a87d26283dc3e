import { createHmac, timingSafeEqual } from 'node:crypto';
import { z } from 'zod';
import { endpoint, UnauthenticatedError } from '@latchwork/shared-server-kit';
import { recordAuditInTenants } from '@latchwork/shared-db';
import { findUserByEmail, membershipsOfUser } from './identity.repository';
import type { IdentityDeps } from './identity-deps';

const providerEvent = z.object({
  type: z.enum(['sign-in-failed', 'sign-in-locked']),
  email: z.string().max(320),
  ipAddress: z.string().max(100).nullable(),
  at: z.iso.datetime(),
});

/** HMAC-SHA256 of the raw body with the shared secret, as `sha256=<hex>`. */
export function signProviderEvent(rawBody: Buffer | string, secret: string): string {
  return `sha256=${createHmac('sha256', secret).update(rawBody).digest('hex')}`;
}

/**
 * Failed sign-ins happen at the identity provider, which never tells the app through the
 * sign-in flow. The provider streams them here (signed), and each firm the person belongs
 * to sees them in its audit log. Unknown e-mails are dropped: they belong to no firm.
 */
export function providerEventEndpoints(deps: IdentityDeps & { providerEventSecret: string }) {
  return [
    endpoint({
      method: 'post',
      path: '/auth/provider-events',
      summary: 'Signed sign-in events streamed by the identity provider',
      tags: ['auth'],
      permission: 'public',
      body: providerEvent,
      status: 202,
      async handle({ body, req }) {
        const raw = (req as { rawBody?: Buffer }).rawBody ?? Buffer.alloc(0);
        const expected = Buffer.from(signProviderEvent(raw, deps.providerEventSecret));
        const given = Buffer.from(req.get('x-idp-signature') ?? '');
        if (given.length !== expected.length || !timingSafeEqual(given, expected))
          throw new UnauthenticatedError('Bad event signature.');
        const user = await findUserByEmail(deps.db, body.email.toLowerCase());
        if (!user) return { recorded: 0 };
        const tenants = (await membershipsOfUser(deps.db, user.id)).map((m) => m.tenantId);
        await recordAuditInTenants(deps.db, tenants, {
          userId: user.id,
          action: body.type,
          subject: user.email,
          ipAddress: body.ipAddress,
          detail: { at: body.at },
        });
        return { recorded: tenants.length };
      },
    }),
  ];
}
