// The identity-provider fake, driven like a browser and a server-side client would: discovery,
// the authorization-code flow through our own sign-in page, token exchange, userinfo, and
// RP-initiated sign-out. Accounts come from the JSON file (no IDP_DATABASE_URL).
import { createPublicKey, verify } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { setPassword } from '../../docker-free-dev/identity-provider/accounts.mjs';
import { COOKIE_NAMES } from '../../docker-free-dev/identity-provider/server.mjs';
import {
  AFTER_LOGOUT,
  Browser,
  CLIENT_ID,
  type Discovery,
  FAILED,
  type Idp,
  REDIRECT_URI,
  startIdp,
} from './identity-provider-support';
import { foreignUrls, must, tempDataDir } from './support';

const EMAIL = 'owner@harbourfloors.test';
const PASSWORD = 'tiles-and-trims-42';

let data: Awaited<ReturnType<typeof tempDataDir>>;
let idp: Idp;
let discovery: Discovery;

async function restart() {
  ({ idp, discovery } = await startIdp({ dataDir: data.dir }));
}

function decodeJwtPart(part: string) {
  return JSON.parse(Buffer.from(part, 'base64url').toString('utf8'));
}

beforeAll(async () => {
  data = await tempDataDir('idp');
  await setPassword(EMAIL, PASSWORD, 'Hana Harbour', { dataDir: data.dir });
  await restart();
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
    const browser = new Browser(idp, discovery);
    const { jar } = browser;
    const { html, page } = await browser.openSignInPage();
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
    const browser = new Browser(idp, discovery);
    const { action } = await browser.openSignInPage();

    const wrong = await browser.postForm(action, { email: EMAIL, password: 'not-the-password' });
    expect(wrong.status).toBe(401);
    const wrongHtml = await wrong.text();
    expect(wrongHtml).toMatch(/<div class="alert" role="alert" id="form-error">/);
    expect(wrongHtml).toContain(FAILED);
    expect(wrongHtml).toContain(`value="${EMAIL}"`); // the e-mail is kept for the next try

    const unknown = await browser.postForm(action, {
      email: 'nobody@harbourfloors.test',
      password: PASSWORD,
    });
    expect(unknown.status).toBe(401);
    expect(await unknown.text()).toContain(FAILED);
  });

  it('runs the authorization-code flow without a consent screen, and userinfo gives the e-mail', async () => {
    const browser = new Browser(idp, discovery);
    const { action } = await browser.openSignInPage('state-xyz', 'nonce-xyz');
    // e-mail case does not matter
    const posted = await browser.postForm(action, {
      email: EMAIL.toUpperCase(),
      password: PASSWORD,
    });
    expect(posted.status).toBe(303);
    const { url } = await browser.followUntil(posted, REDIRECT_URI);
    const back = must(url, 'a redirect back to the app');
    expect(back.searchParams.get('state')).toBe('state-xyz');
    expect(back.searchParams.get('iss')).toBe(idp.url);
    const code = must(back.searchParams.get('code'), 'a code');

    const tokens = await browser.exchangeCode(code);
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
    expect((await browser.exchangeCode(code)).status).toBe(400);
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
    const browser = new Browser(idp, discovery);
    const { jar } = browser;
    const tokens = await browser.signIn(EMAIL, PASSWORD);
    expect(jar.cookies.has(COOKIE_NAMES.session)).toBe(true);

    // signed in at the provider: a second authorize goes straight back to the app
    const again = await jar.fetch(browser.authorizeUrl('s3', 'n3'));
    expect((await browser.followUntil(again, REDIRECT_URI)).url).toBeDefined();

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

    const confirmed = await browser.postForm(new URL(action, idp.url), {
      xsrf,
      logout: 'yes',
    });
    expect(confirmed.status).toBe(303);
    const back = new URL(must(confirmed.headers.get('location'), 'a redirect'));
    expect(`${back.origin}${back.pathname}`).toBe(AFTER_LOGOUT);
    expect(back.searchParams.get('state')).toBe('bye');
    expect(jar.cookies.has(COOKIE_NAMES.session)).toBe(false);

    // the next sign-in shows the form again
    const next = await jar.fetch(browser.authorizeUrl('s4', 'n4'));
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
    await restart();
    const after = await (await fetch(discovery.jwks_uri)).json();
    expect(after).toEqual(before);
    const tokens = await new Browser(idp, discovery).signIn(EMAIL, PASSWORD);
    expect(tokens['access_token']).toBeTruthy();
  });
});
