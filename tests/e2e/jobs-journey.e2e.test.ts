// The estimator's day with a new enquiry, all through the pages: a customer and its site, a job
// for them, the survey booked and recorded with a damp slab, a site photo, the garage floor
// drawn and saved as a takeoff version, and the job dragged along the board. Everything it
// makes carries a time stamp in its name, so it runs on any database and beside other tests.
import type { Browser, Locator, Page } from 'playwright-core';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { appUrl, expectClean, guardedContext, launchChromium, shot } from './support/browser';
import { expectedAnswers, signIn } from './support/sign-in';

const ESTIMATOR = 'estimator@kestrel-floorworks.test';
const stamp = Date.now().toString(36);
const CUSTOMER = `Harrowgate Tool Hire ${stamp}`;
const SITE = `Yard unit ${stamp}`;
const JOB = `Workshop floor ${stamp}`;
const AREA = `Garage bay ${stamp}`;
const PHOTO = `slab-${stamp}.png`;

/** Picks `option` from the Material select labelled `label` inside `scope`. */
async function choose(page: Page, scope: Locator | Page, label: string, option: string) {
  await scope.getByRole('combobox', { name: label }).click();
  await page.getByRole('option', { name: option, exact: true }).click();
}

/**
 * Waits until a dialog has taken the focus: the dialog focuses its first field once it has
 * opened, and a field filled before that would lose the rest of its typing to the first one.
 */
async function opened(page: Page): Promise<Locator> {
  const dialog = page.getByRole('dialog');
  await dialog.waitFor();
  await expect
    .poll(() => page.evaluate(() => !!document.activeElement?.closest('mat-dialog-container')))
    .toBe(true);
  return dialog;
}

/** A board column by its heading. */
const column = (page: Page, stage: string): Locator =>
  page.locator('section.column', {
    has: page.getByRole('heading', { level: 2, name: stage, exact: true }),
  });

/**
 * Drags `card` onto `target` with the mouse in small steps: the CDK starts a drag only after
 * the pointer has moved a few pixels with the button down, and sorts on every move.
 */
async function drag(page: Page, card: Locator, target: Locator): Promise<void> {
  const from = await card.boundingBox();
  const to = await target.boundingBox();
  if (!from || !to) throw new Error('card or column not on screen');
  const x = from.x + from.width / 2;
  const y = from.y + 20;
  await page.mouse.move(x, y);
  await page.mouse.down();
  await page.mouse.move(x + 8, y + 8, { steps: 4 });
  await page.mouse.move(to.x + to.width / 2, to.y + 40, { steps: 20 });
  await page.mouse.move(to.x + to.width / 2, to.y + 44, { steps: 2 });
  await page.mouse.up();
}

describe('jobs journey', () => {
  let browser: Browser;

  beforeAll(async () => {
    browser = await launchChromium();
  });

  afterAll(async () => {
    await browser?.close();
  });

  it('takes an enquiry from a new customer to a surveyed job with a photo and a drawn floor', async () => {
    const guarded = await guardedContext(
      browser,
      { viewport: { width: 1440, height: 900 }, locale: 'en-GB' },
      expectedAnswers,
    );
    const page = await guarded.newPage();
    try {
      const nav = page.getByRole('navigation', { name: 'Main' });
      await page.goto(appUrl('/'));
      await signIn(page, ESTIMATOR);

      // A customer with a billing address, then a site of theirs.
      await nav.getByRole('link', { name: 'Customers' }).click();
      await page.getByRole('heading', { level: 1, name: 'Customers' }).waitFor();
      await page.getByRole('link', { name: 'New customer' }).first().click();
      await page.getByRole('heading', { level: 1, name: 'New customer' }).waitFor();
      await page.getByLabel('Name', { exact: true }).fill(CUSTOMER);
      await page.getByLabel('E-mail').fill(`accounts.${stamp}@harrowgate-hire.test`);
      await page.getByLabel('Phone').fill('01632 960 418');
      await page.getByLabel('Address line 1').fill('4 Chandlers Row');
      await page.getByLabel('Town').fill('Wexcombe');
      await page.getByLabel('Postcode').fill('WX4 7QT');
      await shot(page, 'jobs-journey-customer-form');
      await page.getByRole('button', { name: 'Add customer' }).click();
      await page.getByRole('heading', { level: 1, name: CUSTOMER }).waitFor();
      const customerUrl = page.url();

      await page.getByRole('tab', { name: 'Sites (0)' }).click();
      await page.getByRole('button', { name: 'Add a site' }).click();
      const siteDialog = await opened(page);
      await siteDialog.getByLabel('Site name').fill(SITE);
      await siteDialog.getByLabel('Address line 1').fill('Unit 3, Ferrier Yard');
      await siteDialog.getByLabel('Town').fill('Wexcombe');
      await siteDialog.getByLabel('Postcode').fill('WX4 9BD');
      await siteDialog.getByLabel('Floor type').fill('Power-floated concrete');
      await siteDialog.getByRole('button', { name: 'Save site' }).click();
      await siteDialog.waitFor({ state: 'detached' });
      await page.getByRole('heading', { level: 3, name: SITE }).waitFor();
      await page.getByRole('tab', { name: 'Sites (1)' }).waitFor();
      await shot(page, 'jobs-journey-customer');

      // A job for them at that site, opened from the board.
      await nav.getByRole('link', { name: 'Jobs' }).click();
      await page.getByRole('heading', { level: 1, name: 'Jobs' }).waitFor();
      await page.getByRole('button', { name: 'New job' }).click();
      const jobDialog = await opened(page);
      await jobDialog
        .getByRole('combobox', { name: 'Customer' })
        .fill(`Harrowgate Tool Hire ${stamp}`);
      await page.getByRole('option', { name: new RegExp(`^${CUSTOMER}`) }).click();
      await choose(page, jobDialog, 'Site', `${SITE} WX4 9BD`);
      await jobDialog.getByLabel('Title').fill(JOB);
      await jobDialog.getByLabel('Value estimate').fill('4,850.00');
      await shot(page, 'jobs-journey-new-job');
      await jobDialog.getByRole('button', { name: 'Open job' }).click();
      await page.getByRole('heading', { level: 1, name: JOB }).waitFor();
      const jobUrl = page.url();
      const reference = await page.locator('.head__ref').innerText();
      expect(reference).toMatch(/\d/);
      const header = page.locator('header.head');
      expect(await header.innerText()).toContain(`${CUSTOMER}`);
      expect(await header.innerText()).toContain(`${SITE} WX4 9BD`);
      expect(await page.locator('.facts').innerText()).toContain('£4,850.00');

      // Survey booked, from the job page's stage menu.
      const stageButton = page.getByRole('button', { name: 'Move the job to another stage' });
      expect(await stageButton.innerText()).toContain('Enquiry');
      await stageButton.click();
      await page.getByRole('menuitem', { name: 'Move to Survey booked' }).click();
      await expect.poll(() => stageButton.innerText()).toContain('Survey booked');
      await page.locator('.history').getByText('Enquiry → Survey booked').waitFor();

      // The survey: concrete slab, and a relative humidity of 82 % by in-slab probe, over the
      // 75 % limit (BS 8203), so it fails and the job header warns.
      await page.getByRole('tab', { name: 'Survey' }).click();
      const details = page.getByRole('form', { name: 'Survey details' });
      await choose(page, details, 'Substrate', 'Concrete');
      await details.getByLabel('Notes').fill('Slab looks dark along the back wall.');
      await details.getByRole('button', { name: 'Save details' }).click();
      await details.getByRole('status').getByText('Saved.').waitFor();

      const readingForm = page.getByRole('form', { name: 'Add a reading' });
      expect(await readingForm.getByRole('combobox', { name: 'Reading' }).innerText()).toContain(
        'Relative humidity',
      );
      await choose(page, readingForm, 'Method', 'in-slab probe');
      await readingForm.getByLabel('Value').fill('82');
      await readingForm.getByLabel('Where').fill('back wall, bay 2');
      await page.getByText('Limit: BS 8203').first().waitFor();
      await readingForm.getByRole('button', { name: 'Add reading' }).click();
      const warnings = page.locator('lw-survey-warnings');
      await warnings.getByText('1 of 1 readings failed').waitFor();
      expect(await warnings.innerText()).toContain('Slab too wet');
      await page.locator('lw-readings-table').getByText('back wall, bay 2').waitFor();
      expect(await page.locator('lw-readings-table').innerText()).toMatch(/82\s*%/);
      await shot(page, 'jobs-journey-survey');

      // A site photo through the Files tab's file picker; it is listed with its thumbnail.
      const photo = await sharp({
        create: { width: 96, height: 64, channels: 3, background: { r: 150, g: 140, b: 120 } },
      })
        .png()
        .toBuffer();
      await page.getByRole('tab', { name: 'Files' }).click();
      await page
        .locator('lw-file-panel input[type="file"]')
        .setInputFiles({ name: PHOTO, mimeType: 'image/png', buffer: photo });
      const listed = page.locator('.fp__file', { hasText: PHOTO });
      await listed.waitFor();
      await expect
        .poll(() => listed.locator('img').evaluate((img: HTMLImageElement) => img.naturalWidth))
        .toBeGreaterThan(0);
      await shot(page, 'jobs-journey-files');

      // An area, drawn in the floor editor as the garage of the takeoff worked example
      // (issue 4 §8, from memory): 6000 × 6500 mm at 500 mm from a wall corner = 156 tiles.
      await page.getByRole('tab', { name: 'Survey' }).click();
      await page.getByLabel('New area').fill(AREA);
      await page.getByRole('button', { name: 'Add area' }).click();
      await page.getByRole('heading', { level: 1, name: AREA }).waitFor();
      await page.getByLabel('Width (x)').fill('6000');
      await page.getByLabel('Length (y)').fill('6500');
      await page
        .getByRole('radio', { name: '500' })
        .or(page.getByRole('button', { name: '500', exact: true }))
        .first()
        .click();
      await page.getByLabel('Gap at walls').fill('5');
      await page.getByRole('button', { name: 'Start at a wall corner' }).click();
      await expect
        .poll(() => page.locator('[data-test="tiles-laid"]').innerText(), { timeout: 10_000 })
        .toBe('156');
      await page.getByRole('button', { name: 'Save as new version' }).click();
      await page.getByRole('status').getByText('Saved as version 1.').waitFor();
      await shot(page, 'jobs-journey-area');
      await page.getByRole('link', { name: 'Back to the job' }).first().click();
      await page.getByRole('heading', { level: 1, name: JOB }).waitFor();
      await page.getByRole('tab', { name: 'Survey' }).click();
      const area = page.locator('.sa__area', { hasText: AREA });
      await area.getByText('v1 ·').waitFor();
      // The room is 6.0 × 6.5 m = 39 m² (by hand), laid with the 156 tiles of the example.
      const figures = await area.locator('.sa__figures').innerText();
      expect(figures).toMatch(/Area\s+39 m²/);
      expect(figures).toMatch(/Tiles laid\s+156\b/);
      await shot(page, 'jobs-journey-survey-area');

      // The board, narrowed to this job, and a drag from Survey booked to Surveyed.
      await page.goto(appUrl(`/jobs?q=${encodeURIComponent(stamp)}`));
      const card = column(page, 'Survey booked').locator('.card', { hasText: reference });
      await card.waitFor();
      await shot(page, 'jobs-journey-board-before');
      await drag(page, card, column(page, 'Surveyed').locator('.column__cards'));
      await column(page, 'Surveyed').locator('.card', { hasText: reference }).waitFor();
      await page.reload();
      await column(page, 'Surveyed').locator('.card', { hasText: reference }).waitFor();
      expect(
        await column(page, 'Survey booked').locator('.card', { hasText: reference }).count(),
      ).toBe(0);
      await shot(page, 'jobs-journey-board-after');

      await page.goto(jobUrl);
      await page.getByRole('heading', { level: 1, name: JOB }).waitFor();
      await page.getByText('Moved from Survey booked to Surveyed').waitFor();
      const timeline = await page.locator('lw-job-timeline').innerText();
      expect(timeline).toContain('Moved from Enquiry to Survey booked');
      expect(await stageButton.innerText()).toContain('Surveyed');
      await shot(page, 'jobs-journey-timeline');

      // The customer page lists the job under its Jobs tab.
      await page.goto(customerUrl);
      await page.getByRole('tab', { name: 'Jobs (1)' }).click();
      await page.getByRole('link', { name: reference }).waitFor();

      expectClean(guarded);
    } catch (err) {
      // What the page looked like when a step failed, for the person reading the failure.
      await shot(page, 'jobs-journey-failure').catch(() => undefined);
      throw err;
    } finally {
      await guarded.context.close();
    }
  }, 240_000);
});
