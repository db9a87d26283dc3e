import passport from 'passport';
import { Strategy as OpenIdConnectStrategy } from 'passport-openidconnect';
import type { Request, Response } from 'express';

export interface OidcSettings {
  issuer: string;
  clientId: string;
  clientSecret: string;
  /** Absolute URL of GET /api/v1/auth/callback as the browser sees it. */
  callbackUrl: string;
}

interface Discovery {
  authorization_endpoint: string;
  token_endpoint: string;
  userinfo_endpoint: string;
  end_session_endpoint?: string;
}

export interface SignedInIdentity {
  email: string;
  idToken: string;
}

/**
 * The authorization-code flow with passport-openidconnect (state and nonce kept in the
 * session). The provider's endpoints come from its discovery document, read on first use
 * so the API can start before the provider does.
 */
export class OidcClient {
  private readonly passport = new passport.Passport();
  private discovery?: Promise<Discovery>;

  constructor(private readonly settings: OidcSettings) {}

  private discover(): Promise<Discovery> {
    this.discovery ??= fetch(`${this.settings.issuer}/.well-known/openid-configuration`)
      .then((res) => {
        if (!res.ok) throw new Error(`discovery answered ${res.status}`);
        return res.json() as Promise<Discovery>;
      })
      .then((d) => {
        this.passport.use(
          'oidc',
          new OpenIdConnectStrategy(
            {
              issuer: this.settings.issuer,
              authorizationURL: d.authorization_endpoint,
              tokenURL: d.token_endpoint,
              userInfoURL: d.userinfo_endpoint,
              clientID: this.settings.clientId,
              clientSecret: this.settings.clientSecret,
              callbackURL: this.settings.callbackUrl,
              scope: ['openid', 'email', 'profile'],
              skipUserProfile: false,
              nonce: 'true',
              sessionKey: 'oidc',
            } as ConstructorParameters<typeof OpenIdConnectStrategy>[0],
            // Five parameters: the strategy picks the verify signature by its arity and then
            // passes the ID token, kept for the provider's sign-out.
            ((
              _issuer: string,
              profile: { emails?: { value: string }[] },
              _context: unknown,
              idToken: string,
              done: (err: unknown, user?: SignedInIdentity | false, info?: unknown) => void,
            ) => {
              const email = profile.emails?.[0]?.value;
              if (!email)
                return done(null, false, {
                  message: 'The identity provider did not share an e-mail address.',
                });
              done(null, { email: email.toLowerCase(), idToken });
            }) as unknown as ConstructorParameters<typeof OpenIdConnectStrategy>[1],
          ),
        );
        return d;
      })
      .catch((err) => {
        this.discovery = undefined;
        throw err;
      });
    return this.discovery;
  }

  /** Redirects the browser to the provider's sign-in page. */
  async redirectToProvider(req: Request, res: Response): Promise<void> {
    await this.discover();
    await new Promise<void>((resolve, reject) => {
      this.passport.authenticate('oidc', { session: false })(req, res, (err: unknown) =>
        err ? reject(err) : resolve(),
      );
      res.once('finish', () => resolve());
    });
  }

  /** Completes the flow on the callback: the identity, or the reason it failed. */
  async complete(
    req: Request,
    res: Response,
  ): Promise<{ identity?: SignedInIdentity; failure?: string }> {
    await this.discover();
    return new Promise((resolve, reject) => {
      this.passport.authenticate(
        'oidc',
        { session: false },
        (err: unknown, user: SignedInIdentity | false, info: { message?: string } | undefined) => {
          if (err) return reject(err);
          if (!user) return resolve({ failure: info?.message ?? 'Sign-in was not completed.' });
          resolve({ identity: user });
        },
      )(req, res, reject);
    });
  }

  /** The provider's sign-out URL (RP-initiated logout), or undefined if it has none. */
  async signOutUrl(
    idToken: string | undefined,
    postLogoutRedirectUri: string,
  ): Promise<string | undefined> {
    const d = await this.discover();
    if (!d.end_session_endpoint) return undefined;
    const url = new URL(d.end_session_endpoint);
    if (idToken) url.searchParams.set('id_token_hint', idToken);
    url.searchParams.set('post_logout_redirect_uri', postLogoutRedirectUri);
    url.searchParams.set('client_id', this.settings.clientId);
    return url.toString();
  }
}
