// Helpers for the identity-provider fake's tests: start it on port 0, walk the
// authorization-code flow like a browser, and post the sign-in form from a chosen loopback
// address (127.0.0.0/8 all reach a server on 127.0.0.1), so per-address limits can be told
// apart from per-account ones.
import http from 'node:http';
import { expect } from 'vitest';
import { start } from '../../docker-free-dev/identity-provider/server.mjs';
import { CookieJar, must } from './support';

export const CLIENT_ID = 'latchwork';
export const CLIENT_SECRET = 'test-client-secret';
// Never fetched: the tests read the code off the redirect, as the app's callback would.
export const REDIRECT_URI = 'http://127.0.0.1:4299/api/v1/auth/callback';
export const AFTER_LOGOUT = 'http://127.0.0.1:4299/';
export const FAILED = 'That e-mail and password do not match an account.';

export type Idp = Awaited<ReturnType<typeof start>>;
export interface Discovery {
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

/** Starts the fake for a test file with our test client; extra options pass through. */
export async function startIdp(options: Parameters<typeof start>[0]) {
  const idp = await start({
    port: 0,
    clientId: CLIENT_ID,
    clientSecret: CLIENT_SECRET,
    redirectUris: [REDIRECT_URI],
    postLogoutRedirectUris: [AFTER_LOGOUT],
    ...options,
  });
  const response = await fetch(`${idp.url}/.well-known/openid-configuration`);
  const discovery = (await response.json()) as Discovery;
  return { idp, discovery };
}

/** A browser at the provider: one cookie jar, following the flow step by step. */
export class Browser {
  readonly jar = new CookieJar();
  constructor(
    private readonly idp: Idp,
    private readonly discovery: Discovery,
  ) {}

  authorizeUrl(state = 'st-1', nonce = 'n-1') {
    const url = new URL(this.discovery.authorization_endpoint);
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
  async followUntil(response: Response, prefix: string) {
    let current = response;
    for (let hops = 0; hops < 10; hops++) {
      const location = current.headers.get('location');
      if (!location) return { response: current, url: undefined };
      const next = new URL(location, this.idp.url);
      if (next.href.startsWith(prefix)) return { response: current, url: next };
      current = await this.jar.fetch(next);
    }
    throw new Error('too many redirects');
  }

  /** Starts a sign-in and returns the form action of our sign-in page. */
  async openSignInPage(state = 'st-1', nonce = 'n-1') {
    const first = await this.jar.fetch(this.authorizeUrl(state, nonce));
    expect(first.status).toBe(303);
    const location = must(first.headers.get('location'), 'a redirect');
    const page = await this.jar.fetch(new URL(location, this.idp.url));
    expect(page.status).toBe(200);
    const html = await page.text();
    const action = /<form method="post" action="([^"]+)"/.exec(html)?.[1];
    expect(action).toMatch(/^\/interaction\/[\w-]+\/login$/);
    return { html, action: new URL(must(action, 'a form action'), this.idp.url), page };
  }

  postForm(url: URL, fields: Record<string, string>) {
    return this.jar.fetch(url, {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams(fields),
    });
  }

  async exchangeCode(code: string) {
    const response = await fetch(this.discovery.token_endpoint, {
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

  /** Signs in all the way and returns the tokens. */
  async signIn(email: string, password: string) {
    const { action } = await this.openSignInPage('st-2', 'n-2');
    const posted = await this.postForm(action, { email, password });
    const { url } = await this.followUntil(posted, REDIRECT_URI);
    const code = must(must(url, 'a redirect to the app').searchParams.get('code'), 'a code');
    return (await this.exchangeCode(code)).body;
  }

  /** Posts the sign-in form from another loopback address (node:http: fetch cannot bind). */
  postSignInFrom(localAddress: string, action: URL, fields: Record<string, string>) {
    const body = new URLSearchParams(fields).toString();
    return new Promise<{ status: number; headers: http.IncomingHttpHeaders; text: string }>(
      (resolve, reject) => {
        const request = http.request(
          action,
          {
            method: 'POST',
            localAddress,
            headers: {
              'content-type': 'application/x-www-form-urlencoded',
              'content-length': Buffer.byteLength(body),
              cookie: this.jar.header(),
            },
          },
          (response) => {
            let text = '';
            response.setEncoding('utf8');
            response.on('data', (chunk: string) => (text += chunk));
            response.on('end', () =>
              resolve({ status: response.statusCode ?? 0, headers: response.headers, text }),
            );
          },
        );
        request.on('error', reject);
        request.end(body);
      },
    );
  }
}
