// @ts-check
// Runs the identity-provider fake from environment variables:
//   IDP_PORT (3400), IDP_ISSUER (http://127.0.0.1:<port>), IDP_CLIENT_ID (latchwork),
//   IDP_CLIENT_SECRET, IDP_REDIRECT_URIS and IDP_POST_LOGOUT_REDIRECT_URIS (comma lists),
//   IDP_TOKEN_ENDPOINT_AUTH_METHOD (client_secret_post), IDP_DATABASE_URL (accounts in
//   PostgreSQL; a JSON file under LW_DATA_DIR otherwise), IDP_ADMIN_TOKEN (admin API),
//   IDP_EVENT_URL (sign-in events; empty turns them off) and IDP_EVENT_SECRET, LW_DATA_DIR
//   (<repo>/.local/data).
import { DEFAULT_EVENT_URL } from './provider-events.mjs';
import { defaultDataDir, runFake } from '../lib/run-fake.mjs';
import { DEFAULT_CLIENT_SECRET, start } from './server.mjs';

const env = process.env;
/** @param {string | undefined} value @param {string} fallback */
const list = (value, fallback) =>
  (value || fallback)
    .split(',')
    .map((s) => s.trim())
    .filter(Boolean);
const port = Number(env['IDP_PORT'] || 3400);

await runFake('identity-provider', () =>
  start({
    port,
    issuer: env['IDP_ISSUER'] || `http://127.0.0.1:${port}`,
    clientId: env['IDP_CLIENT_ID'] || 'latchwork',
    clientSecret: env['IDP_CLIENT_SECRET'] || DEFAULT_CLIENT_SECRET,
    redirectUris: list(env['IDP_REDIRECT_URIS'], 'http://127.0.0.1:4200/api/v1/auth/callback'),
    postLogoutRedirectUris: list(env['IDP_POST_LOGOUT_REDIRECT_URIS'], 'http://127.0.0.1:4200/'),
    tokenEndpointAuthMethod:
      /** @type {any} */ (env['IDP_TOKEN_ENDPOINT_AUTH_METHOD']) || undefined,
    databaseUrl: env['IDP_DATABASE_URL'] || undefined,
    adminToken: env['IDP_ADMIN_TOKEN'] || undefined,
    // Set but empty means "send no events"; unset means the local app's default address.
    eventUrl: env['IDP_EVENT_URL'] ?? DEFAULT_EVENT_URL,
    eventSecret: env['IDP_EVENT_SECRET'] || undefined,
    dataDir: defaultDataDir(),
  }),
);
