// Signing in and out through the real pages: the app's Sign in link, the identity provider's
// sign-in form, and back. Also what the navigation should hold for a role, derived from the
// app's one route table and the permission table rather than listed by hand.
import { readFileSync } from 'node:fs';
// A relative import: the e2e project's vitest does not resolve the workspace's path aliases.
import { PERMISSIONS, roleHas, type Access, type Role } from '@latchwork/shared-access';
import type { Page } from 'playwright-core';
import { appUrl } from './browser';

/**
 * Console messages a test may tolerate: signed out, the app asks `/me` and gets 401, which
 * chromium logs as a failed resource; the status page's health check may log the same when a
 * service is down. Only those two answers are tolerated.
 */
export const expectedAnswers = (text: string, url: string): boolean =>
  text.startsWith('Failed to load resource') &&
  ['/api/v1/me', '/api/v1/health'].includes(new URL(url).pathname);

/** Every demo person's password (docker-free-dev/demo/demo-scenario.json). */
export const DEMO_PASSWORD = 'latchwork-demo';

/** The identity provider of the test profile. */
export const IDP_ORIGIN = new URL(process.env['IDP_ISSUER'] ?? 'http://127.0.0.1:13400').origin;

const APP_ORIGIN = new URL(appUrl('/')).origin;

/**
 * Clicks the app's Sign in link, signs in on the identity provider's own page, and waits until
 * the app shows the person signed in. Returns the milliseconds from the click to that moment.
 */
export async function signIn(page: Page, email: string, password = DEMO_PASSWORD): Promise<number> {
  const started = Date.now();
  await page.getByRole('link', { name: 'Sign in' }).first().click();
  await page.waitForURL((url) => url.origin === IDP_ORIGIN);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((url) => url.origin === APP_ORIGIN);
  await page.getByRole('button', { name: 'Sign out' }).waitFor();
  return Date.now() - started;
}

/** Signs out from the top bar and waits until the app is back, signed out. */
export async function signOut(page: Page): Promise<void> {
  await page.getByRole('button', { name: 'Sign out' }).click();
  await page.waitForURL((url) => url.origin === APP_ORIGIN && url.pathname === '/', {
    waitUntil: 'load',
  });
  await page.getByRole('link', { name: 'Sign in' }).first().waitFor();
}

/** A navigation entry as app.routes.ts declares it with `navData(label, icon, { permission })`. */
interface DeclaredNav {
  readonly label: string;
  readonly access: Access;
}

/** The navigation entries of the app's route table, read from its source in table order. */
export function declaredNav(): DeclaredNav[] {
  const source = readFileSync(
    new URL('../../../apps/web/src/app/app.routes.ts', import.meta.url),
    'utf8',
  );
  const calls = source.matchAll(/navData\(\s*'([^']+)',\s*'[^']+'(?:,\s*\{([^}]*)\})?\s*\)/g);
  return [...calls].map(([, label, options]) => ({
    label,
    access: (/permission:\s*'([^']+)'/.exec(options ?? '')?.[1] ?? 'public') as Access,
  }));
}

/** The navigation labels a signed-in person with `role` should see, per the permission table. */
export function expectedNav(role: Role): string[] {
  return declaredNav()
    .filter(({ access }) => {
      if (access === 'public' || access === 'signed-in') return true;
      if (!(access in PERMISSIONS))
        throw new Error(`app.routes.ts names unknown permission ${access}`);
      return roleHas(role, access);
    })
    .map(({ label }) => label);
}
