// @ts-check
// The provider's interaction routes: our sign-in page (GET), the sign-in itself (POST), cancel,
// consent granted automatically for our own client, and friendly pages for expired sign-ins.
import express from 'express';
import { errors } from 'oidc-provider';
import { normaliseEmail } from './account-rules.mjs';
import { clientAddress, pageSecurity } from './page-security.mjs';
import { messagePage, signInPage } from './views.mjs';

const SIGN_IN_FAILED =
  'That e-mail and password do not match an account. Check both and try again.';
/** @param {number} seconds */
const tooManyAttempts = (seconds) => `Too many attempts. Try again in ${seconds} s.`;

/**
 * @param {import('express').Express} app
 * @param {{
 *   provider: any,
 *   accounts: import('./accounts.mjs').AccountStore,
 *   firstParty: Set<string>,
 *   limits: import('./sign-in-limits.mjs').SignInLimits,
 *   events: import('./provider-events.mjs').EventSender,
 * }} deps
 */
export function mountInteractions(app, { provider, accounts, firstParty, limits, events }) {
  app.get('/interaction/:uid', pageSecurity, async (req, res) => {
    const details = await provider.interactionDetails(req, res);
    if (details.uid !== req.params.uid) throw new errors.SessionNotFound('interaction mismatch');
    const prompt = details.prompt;
    if (prompt.name === 'login') {
      res.send(
        signInPage({
          uid: details.uid,
          email: String(details.params['login_hint'] ?? ''),
          abortUrl: `/interaction/${details.uid}/abort`,
        }),
      );
      return;
    }
    if (prompt.name === 'consent' && firstParty.has(String(details.params['client_id']))) {
      await provider.interactionFinished(
        req,
        res,
        { consent: { grantId: await grantConsent(provider, details) } },
        { mergeWithLastSubmission: true },
      );
      return;
    }
    res.status(400).send(
      messagePage({
        title: 'Not supported',
        message: `The "${prompt.name}" step is not supported here.`,
      }),
    );
  });

  app.post(
    '/interaction/:uid/login',
    pageSecurity,
    express.urlencoded({ extended: false, limit: '8kb' }),
    async (req, res) => {
      const details = await provider.interactionDetails(req, res);
      if (details.uid !== req.params.uid || details.prompt.name !== 'login') {
        throw new errors.SessionNotFound('interaction mismatch');
      }
      const email = String(req.body?.email ?? '').trim();
      const password = String(req.body?.password ?? '');
      const ipAddress = clientAddress(req);
      /** @param {number} status @param {string} error */
      const refuse = (status, error) =>
        res.status(status).send(
          signInPage({
            uid: details.uid,
            email,
            error,
            abortUrl: `/interaction/${details.uid}/abort`,
          }),
        );
      /** @param {'sign-in-failed' | 'sign-in-locked'} type */
      const report = (type) =>
        events.send({
          type,
          email: normaliseEmail(email).slice(0, 320),
          ipAddress: ipAddress || null,
          at: new Date().toISOString(),
        });

      const attempt = await limits.begin(email, ipAddress);
      if (attempt.lockedForSeconds) {
        res.set('Retry-After', String(attempt.lockedForSeconds));
        refuse(429, tooManyAttempts(attempt.lockedForSeconds));
        return;
      }
      const account = email ? await accounts.findByEmail(email) : undefined;
      const ok = await accounts.verifyPassword(account, password);
      if (!account || !ok) {
        report('sign-in-failed');
        const lockedFor = await attempt.failed();
        if (lockedFor) {
          // This failure used the last attempt: say so now rather than at the next try.
          report('sign-in-locked');
          res.set('Retry-After', String(lockedFor));
          refuse(429, tooManyAttempts(lockedFor));
        } else {
          refuse(401, SIGN_IN_FAILED);
        }
        return;
      }
      await attempt.succeeded();
      await provider.interactionFinished(
        req,
        res,
        { login: { accountId: account.id, amr: ['pwd'] } },
        { mergeWithLastSubmission: false },
      );
    },
  );

  app.get('/interaction/:uid/abort', async (req, res) => {
    await provider.interactionDetails(req, res);
    await provider.interactionFinished(
      req,
      res,
      { error: 'access_denied', error_description: 'The person cancelled the sign-in.' },
      { mergeWithLastSubmission: false },
    );
  });
}

/**
 * The last error handler: an expired or unknown interaction gets a friendly page.
 * @param {{ href: string, text: string }} fallbackLink
 */
export function interactionErrors(fallbackLink) {
  /**
   * @param {any} error
   * @param {express.Request} _req
   * @param {express.Response} res
   * @param {express.NextFunction} _next
   * @returns {void}
   */
  const onError = (error, _req, res, _next) => {
    if (error instanceof errors.SessionNotFound || error?.name === 'SessionNotFound') {
      res
        .status(400)
        .set('Cache-Control', 'no-store')
        .send(
          messagePage({
            title: 'This sign-in has expired',
            message:
              'The sign-in page was open too long or was already used. Start again from Latchwork.',
            link: fallbackLink,
          }),
        );
      return;
    }
    console.error('identity-provider:', error);
    res.status(500).send(
      messagePage({
        title: 'Something went wrong',
        message: 'The sign-in service hit an error. Its log has the details.',
        link: fallbackLink,
      }),
    );
  };
  return onError;
}

/**
 * Records consent for everything the interaction is missing (our own client only).
 * @param {any} provider
 * @param {any} details
 * @returns {Promise<string>}
 */
async function grantConsent(provider, details) {
  const { prompt, params, session } = details;
  const grant = details.grantId
    ? await provider.Grant.find(details.grantId)
    : new provider.Grant({ accountId: session.accountId, clientId: params.client_id });
  if (!grant) throw new errors.SessionNotFound('grant not found');
  const missing = prompt.details ?? {};
  if (missing.missingOIDCScope) grant.addOIDCScope(missing.missingOIDCScope.join(' '));
  if (missing.missingOIDCClaims) grant.addOIDCClaims(missing.missingOIDCClaims);
  for (const [indicator, scopes] of Object.entries(missing.missingResourceScopes ?? {})) {
    grant.addResourceScope(indicator, /** @type {string[]} */ (scopes).join(' '));
  }
  return grant.save();
}
