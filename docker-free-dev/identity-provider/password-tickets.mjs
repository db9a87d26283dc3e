// @ts-check
// Password-set tickets: the app's admin call that makes a single-use, expiring link for an
// invited person (POST /admin/password-tickets, matching libs/identity/server idp-admin.ts),
// and the page at that link (GET/POST /set-password/:ticket).
import { createHash, randomBytes, timingSafeEqual } from 'node:crypto';
import express from 'express';
import { z } from 'zod';
import { looksLikeEmail, normaliseEmail } from './account-rules.mjs';
import { pageSecurity } from './page-security.mjs';
import { newPasswordProblem } from './password.mjs';
import { setPasswordPage, ticketGonePage } from './views-password.mjs';

/** Longest a link may live: a month (invitations use three days). */
const MAX_TICKET_SECONDS = 30 * 24 * 3600;
/** 32 random bytes in base64url are 43 characters. */
const TICKET_SHAPE = /^[A-Za-z0-9_-]{43}$/;

/** @param {string} text */
const sha256 = (text) => createHash('sha256').update(text).digest();

/** The stored form of a ticket: only its SHA-256 (hex) is kept. @param {string} ticket */
export const ticketHash = (ticket) => sha256(ticket).toString('hex');

/**
 * @param {string[]} allowedOrigins
 */
function ticketRequestSchema(allowedOrigins) {
  return z.object({
    email: z
      .string()
      .transform(normaliseEmail)
      .refine(looksLikeEmail, { message: 'must be an e-mail address' }),
    name: z.string().trim().max(200).default(''),
    returnTo: z
      .url({ protocol: /^https?$/ })
      .refine((url) => allowedOrigins.includes(new URL(url).origin), {
        message: 'must be on the origin of a registered redirect URI',
      }),
    expiresInSeconds: z.number().int().min(1).max(MAX_TICKET_SECONDS),
  });
}

/**
 * @param {import('express').Express} app
 * @param {{
 *   accounts: import('./accounts.mjs').AccountStore,
 *   issuer: string,
 *   adminToken?: string,
 *   allowedOrigins: string[],
 *   now: () => Date,
 * }} deps  without an adminToken the admin call always answers 401
 */
export function mountPasswordTickets(app, { accounts, issuer, adminToken, allowedOrigins, now }) {
  const expectedToken = adminToken ? sha256(`Bearer ${adminToken}`) : undefined;
  const schema = ticketRequestSchema(allowedOrigins);

  /**
   * @param {import('express').Request} req
   * @param {import('express').Response} res
   * @param {import('express').NextFunction} next
   * @returns {void}
   */
  const requireAdmin = (req, res, next) => {
    // Compare digests: equal lengths for timingSafeEqual whatever the header holds.
    const given = sha256(req.get('authorization') ?? '');
    if (expectedToken && timingSafeEqual(given, expectedToken)) {
      next();
      return;
    }
    res
      .status(401)
      .set('WWW-Authenticate', 'Bearer')
      .json({ error: { code: 'unauthenticated', message: 'A valid admin token is required.' } });
  };

  app.post(
    '/admin/password-tickets',
    requireAdmin,
    express.json({ limit: '8kb' }),
    async (req, res) => {
      const parsed = schema.safeParse(req.body);
      if (!parsed.success) {
        const problems = parsed.error.issues.map((i) => ({
          path: i.path.join('.'),
          message: i.message,
        }));
        const first = problems[0];
        res.status(400).json({
          error: {
            code: 'bad-request',
            message: `${first?.path || 'body'}: ${first?.message ?? 'invalid'}`,
            details: { problems },
          },
        });
        return;
      }
      const { email, name, returnTo, expiresInSeconds } = parsed.data;
      const ticket = randomBytes(32).toString('base64url');
      const expiresAt = new Date(now().getTime() + expiresInSeconds * 1000);
      await accounts.createPasswordTicket({
        tokenHash: ticketHash(ticket),
        email,
        name,
        returnTo,
        expiresAt,
      });
      const accountExists = Boolean(await accounts.findByEmail(email));
      res.status(201).json({
        url: `${issuer.replace(/\/+$/, '')}/set-password/${ticket}`,
        expiresAt: expiresAt.toISOString(),
        accountExists,
      });
    },
  );

  /**
   * The admin API answers in JSON even when its body cannot be read (bad JSON, too large).
   * @param {any} error
   * @param {import('express').Request} _req
   * @param {import('express').Response} res
   * @param {import('express').NextFunction} next
   * @returns {void}
   */
  const adminErrors = (error, _req, res, next) => {
    const status = Number(error?.status);
    if (!(status >= 400 && status < 500)) {
      next(error);
      return;
    }
    res.status(status).json({
      error: { code: 'bad-request', message: 'The body is not valid JSON of a sensible size.' },
    });
  };
  app.use('/admin', adminErrors);

  /** The live ticket of the request, or undefined (after answering 410). */
  async function liveTicket(
    /** @type {import('express').Request} */ req,
    /** @type {import('express').Response} */ res,
  ) {
    const ticket = String(req.params['ticket'] ?? '');
    const found = TICKET_SHAPE.test(ticket)
      ? await accounts.findPasswordTicket(ticketHash(ticket), now())
      : undefined;
    if (!found) res.status(410).send(ticketGonePage());
    return found && { ...found, hash: ticketHash(ticket), action: `/set-password/${ticket}` };
  }

  app.get('/set-password/:ticket', pageSecurity, async (req, res) => {
    const ticket = await liveTicket(req, res);
    if (ticket) res.send(setPasswordPage(ticket));
  });

  app.post(
    '/set-password/:ticket',
    pageSecurity,
    express.urlencoded({ extended: false, limit: '8kb' }),
    async (req, res) => {
      const ticket = await liveTicket(req, res);
      if (!ticket) return;
      const password = String(req.body?.password ?? '');
      const repeat = String(req.body?.repeat ?? '');
      const lengthProblem = newPasswordProblem(password);
      const problem = lengthProblem ?? newPasswordProblem(password, repeat);
      if (problem) {
        const field = lengthProblem ? 'password' : 'repeat';
        res.status(400).send(setPasswordPage({ ...ticket, error: { field, message: problem } }));
        return;
      }
      const redeemed = await accounts.redeemPasswordTicket(ticket.hash, password, now());
      // Another submission of the same link won the race, or it expired meanwhile.
      if (!redeemed) {
        res.status(410).send(ticketGonePage());
        return;
      }
      res.redirect(303, redeemed.returnTo);
    },
  );
}
