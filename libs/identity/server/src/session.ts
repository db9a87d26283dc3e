import session from 'express-session';
import connectPgSimple from 'connect-pg-simple';
import type { Pool } from 'pg';

declare module 'express-session' {
  interface SessionData {
    userId?: string;
    tenantId?: string;
    /** Kept for the identity provider's sign-out (id_token_hint). */
    idToken?: string;
    csrfToken?: string;
    returnTo?: string;
  }
}

export const SESSION_COOKIE = 'lw.sid';
/** Idle time after which a session ends; every request pushes it back (rolling). */
export const SESSION_IDLE_MS = 8 * 60 * 60 * 1000;

/**
 * Server-side sessions in PostgreSQL, so any API copy can serve any request. The cookie
 * is httpOnly, SameSite=Lax, and Secure whenever the request came over https (`auto`).
 */
export function sessionMiddleware(pool: Pool, secret: string) {
  const PgStore = connectPgSimple(session);
  return session({
    name: SESSION_COOKIE,
    secret,
    store: new PgStore({
      pool,
      tableName: 'app_session',
      createTableIfMissing: false,
      pruneSessionInterval: 15 * 60,
    }),
    resave: false,
    saveUninitialized: false,
    rolling: true,
    proxy: true,
    cookie: { httpOnly: true, sameSite: 'lax', secure: 'auto', maxAge: SESSION_IDLE_MS, path: '/' },
  });
}
