// @ts-check
// oidc-provider's configuration for the fake: one confidential client (the product), our cookie
// names, signing and cookie keys kept on disk, scopes/claims for e-mail, RP-initiated logout
// with our own pages, and no consent screen for our own client.
import { generateKeyPairSync, randomBytes } from 'node:crypto';
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { dirname } from 'node:path';
import { messagePage, signOutPage } from './views.mjs';

/** Cookie names of our own, so they never collide with the app's on the shared 127.0.0.1. */
export const COOKIE_NAMES = {
  session: 'lw_idp_session',
  interaction: 'lw_idp_interaction',
  resume: 'lw_idp_resume',
};

/**
 * Signing keys and cookie keys, made once and kept, so tokens and cookies outlive restarts.
 * @param {string} file
 * @returns {{ cookieKeys: string[], jwks: { keys: Record<string, unknown>[] } }}
 */
export function loadOrCreateSecrets(file) {
  try {
    return JSON.parse(readFileSync(file, 'utf8'));
  } catch {
    const { privateKey } = generateKeyPairSync('rsa', { modulusLength: 2048 });
    const jwk = privateKey.export({ format: 'jwk' });
    const secrets = {
      cookieKeys: [randomBytes(32).toString('base64url')],
      jwks: { keys: [{ ...jwk, kid: randomBytes(8).toString('hex'), use: 'sig', alg: 'RS256' }] },
    };
    mkdirSync(dirname(file), { recursive: true });
    writeFileSync(file, JSON.stringify(secrets, null, 2), { mode: 0o600 });
    return secrets;
  }
}

/**
 * @param {{
 *   clientId: string,
 *   clientSecret: string,
 *   redirectUris: string[],
 *   postLogoutRedirectUris: string[],
 *   tokenEndpointAuthMethod: string,
 *   secrets: ReturnType<typeof loadOrCreateSecrets>,
 *   adapter: (model: string) => object,
 *   accounts: import('./accounts.mjs').AccountStore,
 *   firstParty: Set<string>,
 *   fallbackLink: { href: string, text: string },
 * }} settings
 * @returns {Record<string, any>}
 */
export function providerConfiguration({
  clientId,
  clientSecret,
  redirectUris,
  postLogoutRedirectUris,
  tokenEndpointAuthMethod,
  secrets,
  adapter,
  accounts,
  firstParty,
  fallbackLink,
}) {
  // oidc-provider ships no types here; its configuration is checked by the provider at start.
  /** @type {Record<string, any>} */
  const configuration = {
    adapter,
    clients: [
      {
        client_id: clientId,
        client_secret: clientSecret,
        client_name: 'Latchwork',
        redirect_uris: redirectUris,
        post_logout_redirect_uris: postLogoutRedirectUris,
        grant_types: ['authorization_code'],
        response_types: ['code'],
        token_endpoint_auth_method: tokenEndpointAuthMethod,
      },
    ],
    jwks: secrets.jwks,
    cookies: {
      names: COOKIE_NAMES,
      keys: secrets.cookieKeys,
      long: { httpOnly: true, sameSite: 'lax', signed: true },
      short: { httpOnly: true, sameSite: 'lax', signed: true },
    },
    scopes: ['openid', 'email', 'profile'],
    claims: { openid: ['sub'], email: ['email', 'email_verified'], profile: ['name'] },
    features: {
      devInteractions: { enabled: false },
      userinfo: { enabled: true },
      revocation: { enabled: true },
      rpInitiatedLogout: {
        enabled: true,
        /** @param {any} ctx @param {string} form */
        async logoutSource(ctx, form) {
          const nonce = randomBytes(16).toString('base64');
          ctx.set(
            'Content-Security-Policy',
            `default-src 'none'; style-src 'self'; img-src 'self' data:; script-src 'nonce-${nonce}'; frame-ancestors 'none'; base-uri 'none'`,
          );
          // No form-action: browsers apply it to the redirect back to the app's origin too.
          // A valid id_token_hint means our own app asked (the provider has checked it).
          const autoConfirm = Boolean(ctx.oidc.params?.['id_token_hint']);
          ctx.body = signOutPage({ form, autoConfirm, nonce });
        },
        /** @param {any} ctx */
        async postLogoutSuccessSource(ctx) {
          ctx.body = messagePage({
            title: 'Signed out',
            message: 'You are signed out of Latchwork on this device.',
            link: fallbackLink,
          });
        },
      },
    },
    interactions: {
      url: (/** @type {any} */ _ctx, /** @type {any} */ interaction) =>
        `/interaction/${interaction.uid}`,
    },
    /** @param {any} _ctx @param {string} sub */
    async findAccount(_ctx, sub) {
      const account = await accounts.findById(sub);
      if (!account) return undefined;
      return {
        accountId: account.id,
        async claims() {
          return {
            sub: account.id,
            email: account.email,
            email_verified: true,
            name: account.name,
          };
        },
      };
    },
    // Our own client never sees a consent screen: the grant covers whatever it asks for.
    /** @param {any} ctx */
    async loadExistingGrant(ctx) {
      const { oidc } = ctx;
      const { client, account, session } = oidc;
      const grantId = oidc.result?.consent?.grantId || session.grantIdFor(client.clientId);
      let grant = grantId ? await oidc.provider.Grant.find(grantId) : undefined;
      if (!firstParty.has(client.clientId)) return grant;
      grant ??= new oidc.provider.Grant({
        clientId: client.clientId,
        accountId: account.accountId,
      });
      grant.addOIDCScope([...oidc.requestParamOIDCScopes].join(' '));
      const claims = [...oidc.requestParamClaims];
      if (claims.length) grant.addOIDCClaims(claims);
      await grant.save();
      return grant;
    },
    /** @param {any} ctx @param {Record<string, string>} out */
    async renderError(ctx, out) {
      ctx.type = 'html';
      ctx.body = messagePage({
        title: 'Sign-in could not continue',
        message: out['error_description'] || out['error'] || 'Something went wrong.',
        link: fallbackLink,
      });
    },
    clientBasedCORS: () => false,
    ttl: {
      AccessToken: 60 * 60,
      AuthorizationCode: 60,
      IdToken: 60 * 60,
      Interaction: 60 * 60,
      Session: 14 * 24 * 60 * 60,
      Grant: 14 * 24 * 60 * 60,
    },
  };
  return configuration;
}
