/** Where the API starts the sign-in redirect to the identity provider. */
export const SIGN_IN_PATH = '/api/v1/auth/login';

/**
 * The Sign in link that brings the person back to `returnTo` after signing in. Only a path on
 * this site is passed on (the API refuses anything else, to stop open redirects); the start
 * page needs no returnTo at all.
 */
export function signInHref(returnTo: string | null | undefined): string {
  const path = safePath(returnTo);
  return path && path !== '/'
    ? `${SIGN_IN_PATH}?returnTo=${encodeURIComponent(path)}`
    : SIGN_IN_PATH;
}

/** A same-site path (`/team?x=1`), or null for anything that could leave the site (`//evil`). */
export function safePath(value: string | null | undefined): string | null {
  if (!value || !value.startsWith('/') || value.startsWith('//')) return null;
  // The API accepts these characters only; a path with others is dropped rather than mangled.
  return /^\/[\w\-./?=&%#~]*$/.test(value) ? value : null;
}

/**
 * Where a Sign in link on the page at `url` should bring the person back to: the page itself,
 * or, on the start page, the page a guard turned them away from (`/?returnTo=/team`).
 */
export function returnToOf(url: string): string | null {
  const parsed = new URL(url, 'http://app.invalid');
  if (parsed.pathname !== '/') return safePath(url);
  return safePath(parsed.searchParams.get('returnTo'));
}
