import { returnToOf, safePath, signInHref } from './sign-in-link';

describe('sign-in links', () => {
  it('returns to the page the person was on', () => {
    expect(signInHref('/audit?action=sign-in')).toBe(
      '/api/v1/auth/login?returnTo=%2Faudit%3Faction%3Dsign-in',
    );
  });

  it('needs no returnTo for the start page or nothing at all', () => {
    expect(signInHref('/')).toBe('/api/v1/auth/login');
    expect(signInHref(null)).toBe('/api/v1/auth/login');
  });

  it('never passes on an address that could leave the site', () => {
    for (const bad of ['//evil.test/x', 'https://evil.test', 'team', '/\\evil', '/a b']) {
      expect(safePath(bad), bad).toBeNull();
      expect(signInHref(bad)).toBe('/api/v1/auth/login');
    }
  });

  it('reads the page a guard turned the person away from off the start page’s address', () => {
    expect(returnToOf('/?returnTo=%2Fteam')).toBe('/team');
    expect(returnToOf('/?signin=no-account')).toBeNull();
    expect(returnToOf('/?returnTo=%2F%2Fevil.test')).toBeNull();
    expect(returnToOf('/settings')).toBe('/settings');
  });
});
