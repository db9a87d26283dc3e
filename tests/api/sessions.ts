import { createHmac, randomBytes } from 'node:crypto';
import type { Kysely } from 'kysely';
import type { Database } from '@latchwork/shared-db';
import { stackEnv } from '../support/stack';

export interface TestSession {
  sid: string;
  /** The Cookie header value: the signed session cookie and the CSRF cookie. */
  cookie: string;
  csrfToken: string;
}

/**
 * A signed-in session written straight into the session store, as the sign-in callback
 * would leave it, so API tests can act as any member without the browser round trip (the
 * browser tests go through the real sign-in). The cookie is signed the way express-session
 * signs it: `s:<sid>.<base64 HMAC-SHA256 without padding>`.
 */
export async function sessionFor(
  db: Kysely<Database>,
  userId: string,
  tenantId: string,
): Promise<TestSession> {
  const sid = randomBytes(24).toString('base64url');
  const csrfToken = randomBytes(32).toString('base64url');
  const expire = new Date(Date.now() + 3600_000);
  const sess = {
    cookie: {
      originalMaxAge: 3600_000,
      expires: expire.toISOString(),
      httpOnly: true,
      path: '/',
      sameSite: 'lax',
    },
    userId,
    tenantId,
    csrfToken,
  };
  await db
    .insertInto('appSession')
    .values({ sid, sess: JSON.stringify(sess), expire })
    .execute();
  const signature = createHmac('sha256', stackEnv('SESSION_SECRET'))
    .update(sid)
    .digest('base64')
    .replace(/=+$/, '');
  return {
    sid,
    cookie: `lw.sid=${encodeURIComponent(`s:${sid}.${signature}`)}; XSRF-TOKEN=${csrfToken}`,
    csrfToken,
  };
}

/** Users of the demo firms by e-mail, with their ids and their firms' ids. */
export async function demoIds(db: Kysely<Database>) {
  const tenants = await db.selectFrom('tenant').select(['id', 'slug', 'name']).execute();
  const users = await db.selectFrom('appUser').select(['id', 'email']).execute();
  const tenant = (slug: string) => {
    const t = tenants.find((x) => x.slug === slug);
    if (!t) throw new Error(`no demo firm ${slug}`);
    return t;
  };
  const user = (email: string) => {
    const u = users.find((x) => x.email === email);
    if (!u) throw new Error(`no demo user ${email}`);
    return u.id;
  };
  return { tenant, user };
}
