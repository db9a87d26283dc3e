// The app shell in a real browser: the frame, the fonts, the 404 page, keyboard use, phone
// layout and accessibility, all served from 127.0.0.1 with nothing fetched from anywhere else.
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seriousA11yProblems } from './support/accessibility';
import {
  appUrl,
  expectClean,
  shot,
  guardedContext,
  launchChromium,
  type GuardedContext,
} from './support/browser';
import { expectedAnswers } from './support/sign-in';

const DESKTOP = { width: 1280, height: 800 };
const PHONE = { width: 390, height: 844 };

/** Font and icon state of the page once every font it asked for has settled. */
async function fontState(page: Page) {
  return page.evaluate(async () => {
    await document.fonts.ready;
    const faces = [...document.fonts].map((face) => ({
      family: face.family.replace(/["']/g, ''),
      weight: face.weight,
      status: face.status,
    }));
    return {
      bodyFamily: getComputedStyle(document.body).fontFamily,
      workSansReady: document.fonts.check('16px "Work Sans"'),
      loaded: faces.filter((f) => f.status === 'loaded').map((f) => `${f.family} ${f.weight}`),
      failed: faces.filter((f) => f.status === 'error').map((f) => `${f.family} ${f.weight}`),
    };
  });
}

/** Opens an address of the app and waits until its page heading is on screen. */
async function open(page: Page, address: string): Promise<void> {
  await page.goto(appUrl(address));
  await page.getByRole('heading', { level: 1 }).waitFor();
}

/** Waits until the drawer has finished sliding in or out. */
async function drawerSettled(page: Page, open: boolean): Promise<void> {
  await page.waitForFunction((wantOpen) => {
    const drawer = document.querySelector('mat-sidenav');
    return (
      drawer !== null &&
      drawer.classList.contains('mat-drawer-opened') === wantOpen &&
      !drawer.classList.contains('mat-drawer-animating')
    );
  }, open);
}

describe('app shell in chromium', () => {
  let browser: Browser;

  beforeAll(async () => {
    browser = await launchChromium();
  });

  afterAll(async () => {
    await browser?.close();
  });

  describe('on a desktop screen', () => {
    let guarded: GuardedContext;
    let page: Page;

    beforeAll(async () => {
      guarded = await guardedContext(browser, { viewport: DESKTOP }, expectedAnswers);
      page = await guarded.newPage();
    });

    afterAll(async () => {
      await guarded?.context.close();
    });

    it('shows the shell with the product name, the navigation and the landing page', async () => {
      await open(page, '/');

      expect(await page.locator('.brand').innerText()).toContain('Latchwork');
      const nav = page.getByRole('navigation', { name: 'Main' });
      expect(await nav.getByRole('link').allInnerTexts()).toEqual([
        expect.stringContaining('Home'),
        expect.stringContaining('System status'),
        expect.stringContaining('API reference'),
      ]);
      expect(await nav.getByRole('link', { name: 'Home' }).getAttribute('aria-current')).toBe(
        'page',
      );
      const signIn = page.getByRole('link', { name: 'Sign in' }).first();
      expect(await signIn.getAttribute('href')).toBe('/api/v1/auth/login');
      expect(await page.title()).toBe('Latchwork');
      await shot(page, 'desktop-landing');
      expectClean(guarded);
    });

    it('sets body text in Work Sans and actually loads it and the icon font from the app', async () => {
      await open(page, '/');
      const fonts = await fontState(page);
      expect(fonts.bodyFamily.split(',')[0].replace(/["']/g, '').trim()).toBe('Work Sans');
      expect(fonts.workSansReady).toBe(true);
      // check() is also true for a font nobody declared, so require a loaded face as well.
      expect(fonts.loaded).toContain('Work Sans 400');
      expect(fonts.loaded).toContain('Material Icons Outlined 400');
      expect(fonts.failed).toEqual([]);
      expectClean(guarded);
    });

    it('can be used from the keyboard, starting with a skip link', async () => {
      await open(page, '/');
      await page.keyboard.press('Tab');
      const first = await page.evaluate(() => ({
        text: document.activeElement?.textContent?.trim(),
        outline: getComputedStyle(document.activeElement as Element).outlineStyle,
      }));
      expect(first).toEqual({ text: 'Skip to main content', outline: 'solid' });

      await page.keyboard.press('Enter');
      expect(await page.evaluate(() => document.activeElement?.id)).toBe('main');
      await page.keyboard.press('Tab');
      expect(await page.evaluate(() => document.activeElement?.textContent?.trim())).toContain(
        'Sign in',
      );
      expectClean(guarded);
    });

    it('shows the 404 page for an unknown address, inside the shell', async () => {
      await page.goto(appUrl('/no/such/page'));
      await page.getByRole('heading', { name: 'Page not found' }).waitFor();
      expect(await page.locator('.address').innerText()).toBe('/no/such/page');
      expect(await page.getByRole('navigation', { name: 'Main' }).isVisible()).toBe(true);
      expect(await page.title()).toBe('Page not found · Latchwork');
      await shot(page, 'desktop-not-found');
      expectClean(guarded);
    });

    it('shows the system status page with a report or a clear error, and a Retry button', async () => {
      await page.goto(appUrl('/status'));
      await page.locator('table.checks, [role="alert"]').first().waitFor();
      expect(await page.getByRole('button', { name: /Retry/ }).isEnabled()).toBe(true);
      await shot(page, 'desktop-status');
      expectClean(guarded);
    });

    it('has no serious accessibility problems on its pages, in light and dark colours', async () => {
      for (const colorScheme of ['light', 'dark'] as const) {
        await page.emulateMedia({ colorScheme });
        for (const address of ['/', '/status', '/no/such/page']) {
          await open(page, address);
          expect(await seriousA11yProblems(page), `${address} (${colorScheme})`).toEqual([]);
        }
      }
      await shot(page, 'desktop-not-found-dark');
      await page.emulateMedia({ colorScheme: 'light' });
      expectClean(guarded);
    });
  });

  describe('on a phone', () => {
    let guarded: GuardedContext;
    let page: Page;

    beforeAll(async () => {
      guarded = await guardedContext(
        browser,
        { viewport: PHONE, isMobile: true, hasTouch: true, deviceScaleFactor: 2 },
        expectedAnswers,
      );
      page = await guarded.newPage();
    });

    afterAll(async () => {
      await guarded?.context.close();
    });

    it('hides the rail behind a menu button and fits the screen without sideways scrolling', async () => {
      await open(page, '/');
      const nav = page.getByRole('navigation', { name: 'Main' });
      expect(await nav.isVisible()).toBe(false);
      expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(
        PHONE.width,
      );
      await shot(page, 'phone-landing');

      const menu = page.getByRole('button', { name: 'Open navigation' });
      await menu.click();
      await drawerSettled(page, true);
      await shot(page, 'phone-drawer');

      // Escape closes the drawer and gives focus back to the menu button.
      await page.keyboard.press('Escape');
      await drawerSettled(page, false);
      expect(await menu.evaluate((button) => button === document.activeElement)).toBe(true);
      expect(await menu.getAttribute('aria-expanded')).toBe('false');

      await menu.click();
      await drawerSettled(page, true);
      await nav.getByRole('link', { name: 'System status' }).click();
      await page.getByRole('heading', { name: 'System status' }).waitFor();
      await drawerSettled(page, false);
      await page.locator('table.checks, [role="alert"]').first().waitFor();
      await shot(page, 'phone-status');
      expectClean(guarded);
    });

    it('still fits at 360 px, the narrowest phone we support', async () => {
      await page.setViewportSize({ width: 360, height: 740 });
      for (const address of ['/', '/status', '/no/such/page']) {
        await open(page, address);
        const width = await page.evaluate(() => document.documentElement.scrollWidth);
        expect(width, address).toBeLessThanOrEqual(360);
      }
      expectClean(guarded);
    });
  });
});
