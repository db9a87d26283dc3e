// Shared set-up for browser tests: Debian's chromium driven by playwright-core, with guards that
// record every request leaving 127.0.0.1 and every console error, so a test can fail on them.
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import {
  chromium,
  type Browser,
  type BrowserContext,
  type BrowserContextOptions,
  type Page,
} from 'playwright-core';
import { expect } from 'vitest';

/** Where the app under test is served (the gateway of the test profile by default). */
export const APP_URL = process.env['LW_APP_URL'] ?? 'http://127.0.0.1:14200';

/** Screenshots go to a git-ignored folder so a person can look at what the test saw. */
export const SCREENSHOT_DIR = fileURLToPath(new URL('../../output/screenshots/', import.meta.url));

const CHROMIUM = process.env['LW_CHROMIUM'] ?? '/usr/bin/chromium';

// Nothing in the background may phone home: the tests must prove that only 127.0.0.1 is used.
const FLAGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
  '--no-first-run',
];

/** Launches chromium. Playwright gives every launch a fresh temporary profile (user-data-dir). */
export async function launchChromium(): Promise<Browser> {
  mkdirSync(SCREENSHOT_DIR, { recursive: true });
  return chromium.launch({ executablePath: CHROMIUM, headless: true, args: FLAGS });
}

/** What a guarded context saw that a test should fail on. */
export interface Incidents {
  /** URLs of requests to any host other than 127.0.0.1 (they are also blocked). */
  readonly offHost: string[];
  /** Console errors and uncaught page errors. */
  readonly consoleErrors: string[];
}

/** A browser context whose off-host requests and console errors are recorded in `incidents`. */
export interface GuardedContext {
  readonly context: BrowserContext;
  readonly incidents: Incidents;
  newPage(): Promise<Page>;
}

/**
 * Opens a context that blocks and records any request to a host other than 127.0.0.1, and
 * records console errors. `ignoreConsole` lists known, expected messages (kept narrow).
 */
export async function guardedContext(
  browser: Browser,
  options: BrowserContextOptions = {},
  ignoreConsole: (text: string, url: string) => boolean = () => false,
): Promise<GuardedContext> {
  const context = await browser.newContext(options);
  const incidents: Incidents = { offHost: [], consoleErrors: [] };
  const offHost = (url: string): boolean => {
    const { protocol, hostname } = new URL(url);
    return /^(https?|wss?):$/.test(protocol) && hostname !== '127.0.0.1';
  };
  context.on('request', (request) => {
    if (offHost(request.url())) incidents.offHost.push(request.url());
  });
  await context.route('**/*', (route) =>
    offHost(route.request().url()) ? route.abort('blockedbyclient') : route.continue(),
  );
  const watch = (page: Page): void => {
    page.on('console', (message) => {
      const text = message.text();
      if (message.type() === 'error' && !ignoreConsole(text, message.location().url)) {
        incidents.consoleErrors.push(text);
      }
    });
    page.on('pageerror', (error) => incidents.consoleErrors.push(String(error)));
  };
  context.on('page', watch);
  return { context, incidents, newPage: () => context.newPage() };
}

/** An absolute URL of the app under test. */
export function appUrl(pathname: string): string {
  return new URL(pathname, APP_URL).toString();
}

/** Saves a full-page screenshot under tests/output/screenshots/ for a person to look at. */
export async function shot(page: Page, name: string): Promise<void> {
  await page.screenshot({ path: path.join(SCREENSHOT_DIR, `${name}.png`), fullPage: true });
}

/** Fails the test on any request that left 127.0.0.1 and on any untolerated console error. */
export function expectClean(guarded: GuardedContext): void {
  expect(guarded.incidents.offHost, 'requests that left 127.0.0.1').toEqual([]);
  expect(guarded.incidents.consoleErrors, 'console errors').toEqual([]);
}
