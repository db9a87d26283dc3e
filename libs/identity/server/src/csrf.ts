import { randomBytes, timingSafeEqual } from 'node:crypto';
import type { Request, RequestHandler, Response } from 'express';
import { AppError } from '@latchwork/shared-server-kit';

/** Cookie and header names Angular's HttpClient uses for its built-in XSRF protection. */
export const CSRF_COOKIE = 'XSRF-TOKEN';
export const CSRF_HEADER = 'x-xsrf-token';

/** Gives the session a token and exposes it in a script-readable cookie (double submit). */
export function issueCsrfToken(req: Request, res: Response): string {
  req.session.csrfToken ??= randomBytes(32).toString('base64url');
  res.cookie(CSRF_COOKIE, req.session.csrfToken, {
    sameSite: 'lax',
    secure: req.secure,
    httpOnly: false,
    path: '/',
  });
  return req.session.csrfToken;
}

const SAFE = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * A state-changing request of a signed-in session must carry the session's token in a
 * header, which another site's form or script cannot set. SameSite=Lax is the first wall.
 */
export const csrfProtection: RequestHandler = (req, _res, next) => {
  if (SAFE.has(req.method) || !req.session?.userId) return next();
  const expected = req.session.csrfToken ?? '';
  const given = req.get(CSRF_HEADER) ?? '';
  const ok =
    expected.length > 0 &&
    given.length === expected.length &&
    timingSafeEqual(Buffer.from(given), Buffer.from(expected));
  if (!ok)
    return next(
      new AppError(
        'forbidden',
        'The request did not carry this session’s security token. Reload the page and try again.',
      ),
    );
  next();
};
