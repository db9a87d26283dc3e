// An owner invites a new fitter; the invitation e-mail arrives in the mail fake; its link lets
// the fitter set a password at the identity provider, once; the fitter signs in and sees what
// an installer may use. All traffic stays on 127.0.0.1.
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { appUrl, expectClean, guardedContext, launchChromium, shot } from './support/browser';
import { waitForMessagesTo } from '../support/stack';
import { expectedAnswers, expectedNav, signIn, signOut } from './support/sign-in';

const IDP_ISSUER = process.env['IDP_ISSUER'] ?? 'http://127.0.0.1:13400';

describe('inviting a new member', () => {
  let browser: Browser;

  beforeAll(async () => {
    browser = await launchChromium();
  });

  afterAll(async () => {
    await browser?.close();
  });

  it('takes a fitter from the invitation e-mail to signed in, with a single-use link', async () => {
    // Besides the usual signed-out answers, the used link's 410 page is expected to log.
    const usedLink = (text: string) =>
      text === 'Failed to load resource: the server responded with a status of 410 (Gone)';
    const guarded = await guardedContext(
      browser,
      { viewport: { width: 1280, height: 800 } },
      (text, url) => expectedAnswers(text, url) || usedLink(text),
    );
    const email = `new-fitter-${Date.now()}@wexbridge-tiling.test`;
    const password = 'Grout-and-Gravel-2026';
    try {
      const page = await guarded.newPage();
      await page.goto(appUrl('/'));
      await signIn(page, 'owner@kestrel-floorworks.test');
      await page.goto(appUrl('/team'));
      await page.getByLabel('E-mail').fill(email);
      await page.getByLabel('Name').fill('Nell Hazeldine');
      await page.getByRole('button', { name: 'Send invitation', exact: true }).click();
      await page.getByRole('cell', { name: email }).waitFor();
      await signOut(page);

      const text = (await waitForMessagesTo(email))[0]?.text ?? '';
      const link = new RegExp(
        `${IDP_ISSUER.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}/set-password/\\S+`,
      ).exec(text)?.[0];
      expect(link, 'the e-mail carries a set-password link at the identity provider').toBeTruthy();

      await page.goto(link ?? '');
      await page.getByLabel('New password', { exact: true }).fill(password);
      await page.getByLabel('Repeat the new password').fill(password);
      await page.getByRole('button', { name: 'Save password' }).click();
      // The provider sends the fitter to the app's sign-in, which comes back to its own page.
      await page.getByLabel('Password').waitFor();
      await page.getByLabel('E-mail').fill(email);
      await page.getByLabel('Password').fill(password);
      await page.getByRole('button', { name: 'Sign in' }).click();
      await page.getByRole('button', { name: 'Sign out' }).waitFor();
      const nav = await page
        .getByRole('navigation', { name: 'Main' })
        .getByRole('link')
        .allInnerTexts();
      const labels = nav
        .map((t) => t.trim().split('\n').at(-1)?.trim() ?? '')
        .filter((t) => t !== 'API reference');
      expect(labels).toEqual(expectedNav('installer'));
      await shot(page, 'invited-fitter-signed-in');

      // The link works once.
      const again = await page.goto(link ?? '');
      expect(again?.status()).toBe(410);
      await page.getByText('This link has expired or has already been used').waitFor();
      expectClean(guarded);
    } finally {
      await guarded.context.close();
    }
  });
});
