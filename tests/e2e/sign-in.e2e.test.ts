// Signing in as each demo role through the identity provider's real sign-in page, seeing the
// navigation that role should see, switching firm, the owner's pages, and signing out. All
// traffic stays on 127.0.0.1.
// Relative: the e2e project's vitest does not resolve the workspace's path aliases.
import { ROLES, type Role } from '@latchwork/shared-access';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { appUrl, expectClean, shot, guardedContext, launchChromium } from './support/browser';
import { expectedAnswers, expectedNav, signIn, signOut } from './support/sign-in';

const DESKTOP = { width: 1280, height: 800 };

/** The demo firm's people, one per role (docker-free-dev/demo/demo-scenario.json). */
const DEMO: Readonly<Record<Role, string>> = {
  owner: 'owner@kestrel-floorworks.test',
  estimator: 'estimator@kestrel-floorworks.test',
  stores: 'stores@kestrel-floorworks.test',
  bookkeeper: 'books@kestrel-floorworks.test',
  installer: 'crew@kestrel-floorworks.test',
};

async function navLabels(page: Page): Promise<string[]> {
  const links = page.getByRole('navigation', { name: 'Main' }).getByRole('link');
  const texts = await links.allInnerTexts();
  // The icon's ligature is text too; the label is the last line. API reference leaves the app.
  return texts
    .map((t) => t.trim().split('\n').at(-1)?.trim() ?? '')
    .filter((t) => t !== 'API reference');
}

describe('signing in with each role', () => {
  let browser: Browser;
  const roundTrips: number[] = [];

  beforeAll(async () => {
    browser = await launchChromium();
  });

  afterAll(async () => {
    await browser?.close();
    if (roundTrips.length) {
      const sorted = [...roundTrips].sort((a, b) => a - b);
      console.log(
        `sign-in round trip (click Sign in → signed in), ms: ${sorted.join(', ')}; median ${sorted[Math.floor(sorted.length / 2)]}`,
      );
    }
  });

  it.each([...ROLES])('%s sees exactly what the role may use, then signs out', async (role) => {
    const guarded = await guardedContext(browser, { viewport: DESKTOP }, expectedAnswers);
    try {
      const page = await guarded.newPage();
      await page.goto(appUrl('/'));
      roundTrips.push(await signIn(page, DEMO[role]));

      await page.getByRole('heading', { level: 1, name: /Welcome/ }).waitFor();
      expect(await navLabels(page)).toEqual(expectedNav(role));
      expect(await page.locator('lw-account-bar').innerText()).toContain('Kestrel Floorworks Ltd');
      await shot(page, `signed-in-${role}`);

      await signOut(page);
      expect(await navLabels(page)).toEqual(['Home', 'System status']);
      expectClean(guarded);
    } finally {
      await guarded.context.close();
    }
  });

  it('turns away a page outside the role, and sends a signed-out visitor to sign in first', async () => {
    const guarded = await guardedContext(browser, { viewport: DESKTOP }, expectedAnswers);
    try {
      const page = await guarded.newPage();
      await page.goto(appUrl('/team'));
      await page.getByText('Sign in to open that page.').waitFor();
      // Sign in from there returns to the page asked for; the installer's role lacks it.
      await signIn(page, DEMO.installer);
      await page.getByRole('heading', { name: 'Your role does not include this' }).waitFor();
      expect(new URL(page.url()).pathname).toBe('/team');
      await shot(page, 'not-in-your-role');
      await signOut(page);
      expectClean(guarded);
    } finally {
      await guarded.context.close();
    }
  });

  it('after the session ends, says so and signs the person back in where they were', async () => {
    // Once the server has forgotten the session, the page's own API calls answer 401 too.
    const ended = (text: string, url: string): boolean =>
      expectedAnswers(text, url) ||
      (text.includes('status of 401') && new URL(url).pathname.startsWith('/api/v1/'));
    const guarded = await guardedContext(browser, { viewport: DESKTOP }, ended);
    try {
      const page = await guarded.newPage();
      await page.goto(appUrl('/'));
      await signIn(page, DEMO.owner);
      await page
        .getByRole('navigation', { name: 'Main' })
        .getByRole('link', { name: 'Team' })
        .click();
      await page.getByRole('heading', { name: 'Team' }).waitFor();

      // The server forgets the session (as on expiry): the app's cookie no longer opens it.
      const cookies = await guarded.context.cookies(appUrl('/'));
      expect(cookies.length).toBeGreaterThan(0);
      await guarded.context.clearCookies({ domain: '127.0.0.1', path: '/' });
      await page
        .getByRole('navigation', { name: 'Main' })
        .getByRole('link', { name: 'Audit log' })
        .click();

      await page.getByText('Your session has ended. Sign in again to carry on.').waitFor();
      expect(new URL(page.url()).pathname).toBe('/');
      expect(await page.getByRole('link', { name: 'Sign in' }).first().getAttribute('href')).toBe(
        '/api/v1/auth/login?returnTo=%2Faudit',
      );
      await shot(page, 'session-ended');

      await signIn(page, DEMO.owner);
      expect(new URL(page.url()).pathname).toBe('/audit');
      await page.getByRole('heading', { name: 'Audit log' }).waitFor();
      await signOut(page);
      expectClean(guarded);
    } finally {
      await guarded.context.close();
    }
  });

  it('fits a phone once signed in, with Sign out still in reach', async () => {
    const guarded = await guardedContext(
      browser,
      {
        viewport: { width: 390, height: 844 },
        isMobile: true,
        hasTouch: true,
        deviceScaleFactor: 2,
      },
      expectedAnswers,
    );
    try {
      const page = await guarded.newPage();
      await page.goto(appUrl('/'));
      await signIn(page, 'ledger@tallow-accounts.test');
      await page.getByRole('heading', { level: 1, name: /Welcome/ }).waitFor();
      await shot(page, 'phone-signed-in');
      expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(
        390,
      );
      await signOut(page);
      expectClean(guarded);
    } finally {
      await guarded.context.close();
    }
  });

  it('lets a person of two firms switch between them', async () => {
    const guarded = await guardedContext(browser, { viewport: DESKTOP }, expectedAnswers);
    try {
      const page = await guarded.newPage();
      await page.goto(appUrl('/'));
      await signIn(page, 'ledger@tallow-accounts.test');
      const firm = page.getByRole('button', { name: /^Firm: / });
      const before = (await firm.getAttribute('aria-label')) ?? '';
      const other = before.includes('Kestrel')
        ? 'Pennick & Daughters Flooring'
        : 'Kestrel Floorworks Ltd';

      await firm.click();
      await page.getByRole('menuitem', { name: new RegExp(other) }).click();
      await page.getByRole('button', { name: `Firm: ${other}. Switch firm` }).waitFor();
      await page.locator('.head__kicker', { hasText: other }).waitFor();
      expect(await navLabels(page)).toEqual(expectedNav('bookkeeper'));
      await shot(page, 'switched-firm');
      await signOut(page);
      expectClean(guarded);
    } finally {
      await guarded.context.close();
    }
  });

  it('gives the owner the Team, Firm settings and Audit log pages', async () => {
    const guarded = await guardedContext(browser, { viewport: DESKTOP }, expectedAnswers);
    try {
      const page = await guarded.newPage();
      await page.goto(appUrl('/'));
      await signIn(page, DEMO.owner);
      const nav = page.getByRole('navigation', { name: 'Main' });

      await nav.getByRole('link', { name: 'Team' }).click();
      await page.getByRole('cell', { name: DEMO.estimator }).waitFor();
      expect(await page.locator('tbody tr').count()).toBeGreaterThanOrEqual(5);
      await shot(page, 'owner-team');

      await nav.getByRole('link', { name: 'Firm settings' }).click();
      const firmName = page.getByLabel('Firm name');
      await firmName.waitFor();
      expect(await firmName.inputValue()).toBe('Kestrel Floorworks Ltd');
      expect(await page.getByLabel('Default tax rate').inputValue()).toBe('20');
      await shot(page, 'owner-settings');

      await nav.getByRole('link', { name: 'Audit log' }).click();
      const ownSignIn = page
        .locator('tbody tr')
        .filter({ hasText: 'Signed in' })
        .filter({ hasText: 'Rosalind Achterberg' });
      await ownSignIn.first().waitFor();
      // The filter goes into the address, so the filtered view can be bookmarked.
      await page.getByRole('combobox', { name: 'What' }).click();
      await page.getByRole('option', { name: 'Signed in' }).click();
      await page.getByRole('button', { name: 'Apply' }).click();
      await page.waitForURL((url) => url.searchParams.get('action') === 'sign-in');
      await ownSignIn.first().waitFor();
      expect(await page.locator('tbody tr').filter({ hasNotText: 'Signed in' }).count()).toBe(0);
      await shot(page, 'owner-audit');

      await signOut(page);
      expectClean(guarded);
    } finally {
      await guarded.context.close();
    }
  });
});
