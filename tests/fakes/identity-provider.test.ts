// The identity-provider fake, driven like a browser and a server-side client would: discovery,
// the authorization-code flow through our own sign-in page, token exchange, userinfo, and
// RP-initiated sign-out. Accounts come from the JSON file (no IDP_DATABASE_URL).
import { createPublicKey, verify } from 'node:crypto';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openAccounts, setPassword } from '../../docker-free-dev/identity-provider/accounts.mjs';
import { COOKIE_NAMES, start } from '../../docker-free-dev/identity-provider/server.mjs';
import { CookieJar, foreignUrls, must, tempDataDir } from './support';

const CLIENT_ID = 'latchwork';
const CLIENT_SECRET = 'test-client-secret';
// Never fetched: the test reads the code off the redirect, as the app's callback would.
const REDIRECT_URI = 'http://127.0.0.1:4299/api/v1/auth/callback';
const AFTER_LOGOUT = 'http://127.0.0.1:4299/';
const EMAIL = 'owner@harbourfloors.test';
const PASSWORD = 'tiles-and-trims-42';
const FAILED = 'That e-mail and password do not match an account.';

type Idp = Awaited<ReturnType<typeof start>>;
interface Discovery {
  issuer: string;
  authorization_endpoint: string;
  token_endpoint: string;
  userinfo_endpoint: string;
  jwks_uri: string;
  end_session_endpoint: string;
  scopes_supported: string[];
  response_types_supported: string[];
  claims_supported: string[];
}

let data: Awaited<ReturnType<typeof tempDataDir>>;
let idp: Idp;
let discovery: Discovery;

async function startIdp() {
  return start({
    port: 0,
    dataDir: data.dir,
    clientId: CLIENT_ID,
    clientSecret: CLIENT_SECRET,
    redirectUris: [REDIRECT_URI],
    postLogoutRedirectUris: [AFTER_LOGOUT],
  });
}

function authorizeUrl(state: string, nonce: string) {
  const url = new URL(discovery.authorization_endpoint);
  url.search = new URLSearchParams({
    client_id: CLIENT_ID,
    response_type: 'code',
    scope: 'openid email profile',
    redirect_uri: REDIRECT_URI,
    state,
    nonce,
  }).toString();
  return url;
}

/** Follows redirects inside the provider until one leaves for `prefix`. */
async function followUntil(jar: CookieJar, response: Response, prefix: string) {
  let current = response;
  for (let hops = 0; hops < 10; hops++) {
    const location = current.headers.get('location');
    if (!location) return { response: current, url: undefined };
    const next = new URL(location, idp.url);
    if (next.href.startsWith(prefix)) return { response: current, url: next };
    current = await jar.fetch(next);
  }
  throw new Error('too many redirects');
}

/** Starts a sign-in and returns the form action of our sign-in page. */
async function openSignInPage(jar: CookieJar, state = 'st-1', nonce = 'n-1') {
  const first = await jar.fetch(authorizeUrl(state, nonce));
  expect(first.status).toBe(303);
  const page = await jar.fetch(new URL(must(first.headers.get('location'), 'a redirect'), idp.url));
  expect(page.status).toBe(200);
  const html = await page.text();
  const action = /<form method="post" action="([^"]+)"/.exec(html)?.[1];
  expect(action).toMatch(/^\/interaction\/[\w-]+\/login$/);
  return { html, action: new URL(must(action, 'a form action'), idp.url), page };
}

function postForm(jar: CookieJar, url: URL, fields: Record<string, string>) {
  return jar.fetch(url, {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams(fields),
  });
}

async function exchangeCode(code: string) {
  const response = await fetch(discovery.token_endpoint, {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({
      grant_type: 'authorization_code',
      code,
      redirect_uri: REDIRECT_URI,
      client_id: CLIENT_ID,
      client_secret: CLIENT_SECRET,
    }),
  });
  return { status: response.status, body: (await response.json()) as Record<string, string> };
}

function decodeJwtPart(part: string) {
  return JSON.parse(Buffer.from(part, 'base64url').toString('utf8'));
}

/** Signs in all the way and returns the tokens. */
async function signIn(jar: CookieJar) {
  const { action } = await openSignInPage(jar, 'st-2', 'n-2');
  const posted = await postForm(jar, action, { email: EMAIL, password: PASSWORD });
  const { url } = await followUntil(jar, posted, REDIRECT_URI);
  const code = must(must(url, 'a redirect to the app').searchParams.get('code'), 'a code');
  return (await exchangeCode(code)).body;
}

beforeAll(async () => {
  data = await tempDataDir('idp');
  await setPassword(EMAIL, PASSWORD, 'Hana Harbour', { dataDir: data.dir });
  idp = await startIdp();
  discovery = (await (
    await fetch(`${idp.url}/.well-known/openid-configuration`)
  ).json()) as Discovery;
});

afterAll(async () => {
  await idp?.close();
  await data?.remove();
});

describe('identity-provider fake', () => {
  it('answers its health check', async () => {
    const response = await fetch(`${idp.url}/health`);
    expect(response.status).toBe(200);
  });

  it('serves the discovery document for its issuer', () => {
    expect(discovery.issuer).toBe(idp.url);
    expect(idp.url).toMatch(/^http:\/\/127\.0\.0\.1:\d+$/);
    expect(discovery.authorization_endpoint.startsWith(idp.url)).toBe(true);
    expect(discovery.end_session_endpoint).toBe(`${idp.url}/session/end`);
    expect(discovery.scopes_supported).toEqual(expect.arrayContaining(['openid', 'email']));
    expect(discovery.response_types_supported).toContain('code');
    expect(discovery.claims_supported).toEqual(expect.arrayContaining(['email', 'email_verified']));
  });

  it('shows our own sign-in page, with labels, our CSS and nothing from another host', async () => {
    const jar = new CookieJar();
    const { html, page } = await openSignInPage(jar);
    expect(html).toContain('Latchwork');
    expect(html).toMatch(/<label for="email">E-mail<\/label>/);
    expect(html).toMatch(/<label for="password">Password<\/label>/);
    expect(html).toContain('<link rel="stylesheet" href="/assets/idp.css">');
    expect(foreignUrls(html, idp.url)).toEqual([]);
    expect(page.headers.get('content-security-policy')).toContain("default-src 'none'");
    // its cookies are ours, not oidc-provider's defaults, so they never meet the app's
    const names = [...jar.cookies.keys()];
    expect(names).toContain(COOKIE_NAMES.interaction);
    expect(names.every((name) => name.startsWith('lw_idp_'))).toBe(true);

    const css = await fetch(`${idp.url}/assets/idp.css`);
    expect(css.status).toBe(200);
    expect(css.headers.get('content-type')).toMatch(/text\/css/);
    expect(foreignUrls(await css.text(), idp.url)).toEqual([]);
  });

  it('refuses a wrong password and an unknown e-mail with the same message', async () => {
    const jar = new CookieJar();
    const { action } = await openSignInPage(jar);

    const wrong = await postForm(jar, action, { email: EMAIL, password: 'not-the-password' });
    expect(wrong.status).toBe(401);
    const wrongHtml = await wrong.text();
    expect(wrongHtml).toMatch(/<div class="alert" role="alert" id="form-error">/);
    expect(wrongHtml).toContain(FAILED);
    expect(wrongHtml).toContain(`value="${EMAIL}"`); // the e-mail is kept for the next try

    const unknown = await postForm(jar, action, {
      email: 'nobody@harbourfloors.test',
      password: PASSWORD,
    });
    expect(unknown.status).toBe(401);
    expect(await unknown.text()).toContain(FAILED);
  });

  it('runs the authorization-code flow without a consent screen, and userinfo gives the e-mail', async () => {
    const jar = new CookieJar();
    const { action } = await openSignInPage(jar, 'state-xyz', 'nonce-xyz');
    // e-mail case does not matter
    const posted = await postForm(jar, action, { email: EMAIL.toUpperCase(), password: PASSWORD });
    expect(posted.status).toBe(303);
    const { url } = await followUntil(jar, posted, REDIRECT_URI);
    const back = must(url, 'a redirect back to the app');
    expect(back.searchParams.get('state')).toBe('state-xyz');
    expect(back.searchParams.get('iss')).toBe(idp.url);
    const code = must(back.searchParams.get('code'), 'a code');

    const tokens = await exchangeCode(code);
    expect(tokens.status).toBe(200);
    expect(tokens.body['token_type']).toBe('Bearer');
    const [header = '', payload = '', signature = ''] = must(
      tokens.body['id_token'],
      'an ID token',
    ).split('.');
    const claims = decodeJwtPart(payload);
    expect(claims).toMatchObject({ iss: idp.url, aud: CLIENT_ID, nonce: 'nonce-xyz' });

    // the ID token is signed by a key the provider publishes
    const { keys } = (await (await fetch(discovery.jwks_uri)).json()) as {
      keys: { kid: string }[];
    };
    const { kid, alg } = decodeJwtPart(header);
    expect(alg).toBe('RS256');
    const jwk = keys.find((k) => k.kid === kid);
    expect(jwk).toBeDefined();
    const ok = verify(
      'RSA-SHA256',
      Buffer.from(`${header}.${payload}`),
      createPublicKey({ key: jwk as never, format: 'jwk' }),
      Buffer.from(signature, 'base64url'),
    );
    expect(ok).toBe(true);

    const userinfo = await fetch(discovery.userinfo_endpoint, {
      headers: { authorization: `Bearer ${tokens.body['access_token']}` },
    });
    expect(userinfo.status).toBe(200);
    expect(await userinfo.json()).toMatchObject({
      sub: claims.sub,
      email: EMAIL,
      email_verified: true,
      name: 'Hana Harbour',
    });

    // a code is single-use
    expect((await exchangeCode(code)).status).toBe(400);
  });

  it('rejects a token request with the wrong client secret', async () => {
    const response = await fetch(discovery.token_endpoint, {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams({
        grant_type: 'authorization_code',
        code: 'whatever',
        redirect_uri: REDIRECT_URI,
        client_id: CLIENT_ID,
        client_secret: 'wrong',
      }),
    });
    expect(response.status).toBe(401);
  });

  it('signs out through RP-initiated logout and asks for the password again afterwards', async () => {
    const jar = new CookieJar();
    const tokens = await signIn(jar);
    expect(jar.cookies.has(COOKIE_NAMES.session)).toBe(true);

    // signed in at the provider: a second authorize goes straight back to the app
    const again = await jar.fetch(authorizeUrl('s3', 'n3'));
    expect((await followUntil(jar, again, REDIRECT_URI)).url).toBeDefined();

    const end = new URL(discovery.end_session_endpoint);
    end.search = new URLSearchParams({
      id_token_hint: must(tokens['id_token'], 'an ID token'),
      post_logout_redirect_uri: AFTER_LOGOUT,
      state: 'bye',
    }).toString();
    const confirmPage = await jar.fetch(end);
    expect(confirmPage.status).toBe(200);
    const html = await confirmPage.text();
    expect(html).toContain('Sign out of Latchwork?');
    expect(foreignUrls(html, idp.url)).toEqual([]);
    const xsrf = must(/name="xsrf" value="([^"]+)"/.exec(html)?.[1], 'the xsrf field');
    const action = must(
      /<form id="op.logoutForm" method="post" action="([^"]+)"/.exec(html)?.[1],
      'the sign-out form',
    );

    const confirmed = await postForm(jar, new URL(action, idp.url), {
      xsrf,
      logout: 'yes',
    });
    expect(confirmed.status).toBe(303);
    const back = new URL(must(confirmed.headers.get('location'), 'a redirect'));
    expect(`${back.origin}${back.pathname}`).toBe(AFTER_LOGOUT);
    expect(back.searchParams.get('state')).toBe('bye');
    expect(jar.cookies.has(COOKIE_NAMES.session)).toBe(false);

    // the next sign-in shows the form again
    const next = await jar.fetch(authorizeUrl('s4', 'n4'));
    expect(next.headers.get('location')).toMatch(/^\/interaction\//);
  });

  it('shows a friendly page for an expired or unknown sign-in', async () => {
    const response = await fetch(`${idp.url}/interaction/not-a-real-one`);
    expect(response.status).toBe(400);
    expect(await response.text()).toContain('This sign-in has expired');
  });

  it('keeps accounts and signing keys across a restart', async () => {
    const before = await (await fetch(discovery.jwks_uri)).json();
    await idp.close();
    idp = await startIdp();
    discovery = (await (
      await fetch(`${idp.url}/.well-known/openid-configuration`)
    ).json()) as Discovery;
    const after = await (await fetch(discovery.jwks_uri)).json();
    expect(after).toEqual(before);
    const tokens = await signIn(new CookieJar());
    expect(tokens['access_token']).toBeTruthy();
  });
});

describe('identity-provider accounts (JSON file)', () => {
  it('finds by e-mail and id, checks passwords, and updates on setPassword', async () => {
    const accounts = openAccounts({ dataDir: data.dir });
    try {
      const account = must(await accounts.findByEmail(` ${EMAIL.toUpperCase()} `), 'the account');
      expect(account).toMatchObject({ email: EMAIL, name: 'Hana Harbour' });
      expect(account).not.toHaveProperty('passwordHash');
      expect(await accounts.findById(account.id)).toEqual(account);
      expect(await accounts.verifyPassword(account, PASSWORD)).toBe(true);
      expect(await accounts.verifyPassword(account, 'nope-nope')).toBe(false);
      expect(await accounts.verifyPassword(undefined, PASSWORD)).toBe(false);

      const updated = await accounts.setPassword(EMAIL, 'a-new-password-1');
      expect(updated.id).toBe(account.id);
      expect(updated.name).toBe('Hana Harbour');
      expect(await accounts.verifyPassword(updated, 'a-new-password-1')).toBe(true);
      await accounts.setPassword(EMAIL, PASSWORD);
      await expect(accounts.setPassword('not-an-email', 'long-enough-1')).rejects.toThrow();
      await expect(accounts.setPassword(EMAIL, 'short')).rejects.toThrow();
    } finally {
      await accounts.close();
    }
  });
});

// The PostgreSQL store is what the demo uses. `npm test` can point this at its database with
// LW_TEST_IDP_DATABASE_URL (a role that may create the `idp` schema); without it, it is skipped.
const databaseUrl = process.env['LW_TEST_IDP_DATABASE_URL'];
describe.runIf(databaseUrl)('identity-provider accounts (PostgreSQL)', () => {
  const email = `pg-${Date.now().toString(36)}@accounts.test`;

  afterAll(async () => {
    const pool = new pg.Pool({ connectionString: databaseUrl });
    await pool.query('delete from idp.account where email = $1', [email]);
    await pool.end();
  });

  it('creates the schema if missing, stores a hash and checks passwords', async () => {
    const created = await setPassword(email.toUpperCase(), 'pg-password-1', 'Pat Postgres', {
      databaseUrl,
    });
    expect(created).toMatchObject({ email, name: 'Pat Postgres' });
    const accounts = openAccounts({ databaseUrl });
    try {
      const account = must(await accounts.findByEmail(email), 'the account');
      expect(await accounts.findById(account.id)).toEqual(account);
      expect(await accounts.verifyPassword(account, 'pg-password-1')).toBe(true);
      expect(await accounts.verifyPassword(account, 'wrong-password')).toBe(false);
      const updated = await accounts.setPassword(email, 'pg-password-2');
      expect(updated).toEqual(account);
      expect(await accounts.verifyPassword(account, 'pg-password-2')).toBe(true);
    } finally {
      await accounts.close();
    }
    const pool = new pg.Pool({ connectionString: databaseUrl });
    const { rows } = await pool.query('select password_hash from idp.account where email = $1', [
      email,
    ]);
    await pool.end();
    expect(rows[0].password_hash).toMatch(/^scrypt\$N=32768,r=8,p=1\$/);
  });
});
