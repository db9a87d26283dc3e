// @ts-check
// The identity-provider fake: a real OpenID Connect provider (oidc-provider) with the
// authorization-code flow, discovery, userinfo with the `email` scope, RP-initiated logout, and
// a sign-in page of our own with attempt limits. Consent is skipped for our own client (the
// product is the only client). Sessions and grants survive a restart (file-adapter.mjs);
// accounts and password-set tickets come from accounts.mjs (PostgreSQL or JSON files). Failed
// sign-ins are streamed to the app (provider-events.mjs).
import http from 'node:http';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import express from 'express';
import Provider from 'oidc-provider';
import { openAccounts } from './accounts.mjs';
import { createFileStore } from './file-adapter.mjs';
import { interactionErrors, mountInteractions } from './interactions.mjs';
import { mountPasswordTickets } from './password-tickets.mjs';
import { createEventSender } from './provider-events.mjs';
import { COOKIE_NAMES, loadOrCreateSecrets, providerConfiguration } from './provider-config.mjs';
import { createSignInLimits } from './sign-in-limits.mjs';

export { COOKIE_NAMES };

const here = dirname(fileURLToPath(import.meta.url));

/**
 * @typedef {object} IdentityProviderOptions
 * @property {number} [port] 0 picks a free port (tests); default 3400
 * @property {string} [host] default 127.0.0.1
 * @property {string} [issuer] default http://127.0.0.1:<port>
 * @property {string} [clientId] default latchwork
 * @property {string} [clientSecret]
 * @property {string[]} [redirectUris]
 * @property {string[]} [postLogoutRedirectUris]
 * @property {'client_secret_post' | 'client_secret_basic'} [tokenEndpointAuthMethod]
 *   passport-openidconnect (via the `oauth` package) sends the secret in the body, hence the
 *   default `client_secret_post`.
 * @property {string} dataDir root data folder (LW_DATA_DIR); this fake writes to its
 *   `identity-provider/` subfolder
 * @property {string} [databaseUrl] accounts in PostgreSQL when set, else in a JSON file
 * @property {import('./accounts.mjs').AccountStore} [accounts] injected store (tests)
 * @property {string} [adminToken] bearer token of the admin API; without it the API says 401
 * @property {string} [eventUrl] where sign-in events go; empty or absent: not sent
 * @property {string} [eventSecret] HMAC key of the events' `x-idp-signature`
 * @property {() => Date} [now] clock for password-set tickets (tests move it forward)
 */

/** The same local secret the app's config hands both processes (docker-free-dev/lib/config.mjs). */
export const DEFAULT_CLIENT_SECRET = 'latchwork-local-client-secret';

/**
 * @param {IdentityProviderOptions} options
 * @returns {Promise<{ url: string, port: number, issuer: string, provider: Provider, close(): Promise<void> }>}
 */
export async function start(options) {
  const {
    port = 3400,
    host = '127.0.0.1',
    clientId = 'latchwork',
    clientSecret = DEFAULT_CLIENT_SECRET,
    redirectUris = ['http://127.0.0.1:4200/api/v1/auth/callback'],
    postLogoutRedirectUris = ['http://127.0.0.1:4200/'],
    tokenEndpointAuthMethod = 'client_secret_post',
    dataDir,
  } = options;
  if (!dataDir) throw new Error('identity-provider: dataDir is required');
  const ownDir = join(dataDir, 'identity-provider');
  const accounts = options.accounts ?? openAccounts({ databaseUrl: options.databaseUrl, dataDir });
  const ownsAccounts = !options.accounts;

  // Listen first: with port 0 the issuer depends on the port we get.
  /** @type {http.RequestListener} */
  let handler = (_req, res) => {
    res.statusCode = 503;
    res.end();
  };
  const server = http.createServer((req, res) => handler(req, res));
  await new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, host, () => {
      server.off('error', reject);
      resolve(undefined);
    });
  });
  const actualPort = /** @type {import('node:net').AddressInfo} */ (server.address()).port;
  const url = `http://${host}:${actualPort}`;
  const issuer = options.issuer ?? url;

  let built;
  try {
    built = createApp({
      issuer,
      ownDir,
      accounts,
      adminToken: options.adminToken,
      events: createEventSender({ url: options.eventUrl, secret: options.eventSecret }),
      now: options.now ?? (() => new Date()),
      clientId,
      clientSecret,
      redirectUris,
      postLogoutRedirectUris,
      tokenEndpointAuthMethod,
    });
  } catch (error) {
    server.close();
    if (ownsAccounts) await accounts.close();
    throw error;
  }
  const { app, provider, store, events } = built;
  handler = app;

  return {
    url,
    port: actualPort,
    issuer,
    provider,
    async close() {
      await new Promise((resolve) => {
        server.close(() => resolve(undefined));
        server.closeAllConnections();
      });
      store.flush();
      await events.settle();
      if (ownsAccounts) await accounts.close();
    },
  };
}

/**
 * The provider and the Express app around it (health, assets, our interaction pages).
 * @param {{
 *   issuer: string,
 *   ownDir: string,
 *   accounts: import('./accounts.mjs').AccountStore,
 *   adminToken: string | undefined,
 *   events: import('./provider-events.mjs').EventSender,
 *   now: () => Date,
 *   clientId: string,
 *   clientSecret: string,
 *   redirectUris: string[],
 *   postLogoutRedirectUris: string[],
 *   tokenEndpointAuthMethod: string,
 * }} settings
 */
function createApp({
  issuer,
  ownDir,
  accounts,
  adminToken,
  events,
  now,
  postLogoutRedirectUris,
  ...client
}) {
  const store = createFileStore(join(ownDir, 'oidc-store.json'));
  const firstParty = new Set([client.clientId]);
  const fallbackLink = { href: postLogoutRedirectUris[0] ?? '/', text: 'Back to Latchwork' };
  const provider = new Provider(
    issuer,
    providerConfiguration({
      ...client,
      postLogoutRedirectUris,
      secrets: loadOrCreateSecrets(join(ownDir, 'keys.json')),
      adapter: store.adapter,
      accounts,
      firstParty,
      fallbackLink,
    }),
  );
  provider.on('server_error', (/** @type {any} */ _ctx, /** @type {Error} */ error) =>
    console.error('identity-provider:', error),
  );

  const app = express();
  app.disable('x-powered-by');
  app.get('/health', (_req, res) => {
    res.json({ status: 'ok', issuer });
  });
  app.use('/assets', express.static(join(here, 'public'), { maxAge: '1h', index: false }));
  mountInteractions(app, {
    provider,
    accounts,
    firstParty,
    limits: createSignInLimits(),
    events,
  });
  // An invitation's link may send the person back only to where the app lives.
  const allowedOrigins = [...client.redirectUris, ...postLogoutRedirectUris].map(
    (uri) => new URL(uri).origin,
  );
  mountPasswordTickets(app, { accounts, issuer, adminToken, allowedOrigins, now });
  // Everything else is the OpenID Connect provider itself.
  app.use(provider.callback());
  app.use(interactionErrors(fallbackLink));
  return { app, provider, store, events };
}
