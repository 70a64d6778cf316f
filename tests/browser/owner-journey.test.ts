import sharp from 'sharp';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb } from '../../src/db/client';
import { launchBrowser, watchForErrors } from '../support/browser';
import { ensureTestRegion, testRegion, waitForMessages } from '../support/fixtures';
import { stack } from '../support/stack';

const owner = {
  name: 'Marta Okonkwo',
  company: 'Gillbrook Tofu Works',
  email: `marta.${Date.now()}@gillbrook.example`,
  phone: '+61 3 5550 7788',
};

async function waitForStep(page: Page, heading: string): Promise<void> {
  await page.locator('#estimate-step-heading', { hasText: heading }).waitFor();
}

async function next(page: Page, heading: string): Promise<void> {
  await page.getByRole('button', { name: /^Next:/ }).click();
  await waitForStep(page, heading);
}

/** Fills one run card by its position; ids follow the form's field paths. */
async function fillRun(page: Page, index: number, run: { name: string; service: string; length: string; temperature?: string }) {
  const id = (field: string) => `#f-estimate-runs-${index}-${field}`;
  await page.locator(id('label')).fill(run.name);
  await page.locator(id('service')).selectOption(run.service);
  await page.locator(id('lengthM')).fill(run.length);
  if (run.temperature) await page.locator(id('fluidTemperatureC')).fill(run.temperature);
}

describe('an owner’s whole journey, in a browser', () => {
  let browser: Browser;
  beforeAll(async () => {
    await ensureTestRegion();
    browser = await launchBrowser();
  });
  afterAll(async () => {
    await browser?.close();
    await closeDb();
  });

  it('estimates three runs, switches units, survives a reload, submits with a photo, and signs in from the e-mail', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    const problems = watchForErrors(page);
    await page.goto(new URL('/estimate', stack.appUrl).href, { waitUntil: 'networkidle' });

    // Plant, in the tests' own region, entered in SI (the form starts in the browser's usual system).
    await page.getByLabel(/^SI/).check();
    await page.getByLabel('Plant name').fill('Gillbrook Tofu Works');
    await page.getByLabel('What the plant makes').selectOption('tofu-plant');
    await page.getByLabel('Country').selectOption('AU');
    await page.getByLabel('Postal code').fill('3564');
    await next(page, 'Fuel and its price');
    await page.getByLabel(/^Fuel price \(/).fill('0.09');
    await next(page, 'Pipe runs');

    // Three runs: steam, hot water, glycol.
    await fillRun(page, 0, { name: 'Boiler to soy cooker', service: 'steam', length: '24' });
    await page.getByRole('button', { name: /Add a run/ }).click();
    await fillRun(page, 1, { name: 'Hot water to curd presses', service: 'hot-water', length: '18' });
    await page.getByRole('button', { name: /Add a run/ }).click();
    await fillRun(page, 2, { name: 'Glycol to tofu chiller', service: 'glycol', length: '30' });
    expect(await page.locator('.run-card').count()).toBe(3);

    // Units switched midway: the glycol run's 30 m reads 98.4 ft (three figures of a conversion), and 30 m again.
    await page.locator('#f-estimate-runs-2-lengthM').blur();
    await page.getByLabel(/^US/).check();
    expect(await page.locator('#f-estimate-runs-2-lengthM').inputValue()).toBe('98.4');
    await page.getByLabel(/^SI/).check();
    expect(await page.locator('#f-estimate-runs-2-lengthM').inputValue()).toBe('30');

    // A reload finds the draft where it was.
    await page.waitForFunction(() => localStorage.getItem('lagwise:estimate:v1:values')?.includes('Glycol to tofu chiller'));
    await page.reload({ waitUntil: 'networkidle' });
    await waitForStep(page, 'Pipe runs');
    expect(await page.locator('.run-card').count()).toBe(3);
    expect(await page.locator('#f-estimate-runs-1-label').inputValue()).toBe('Hot water to curd presses');

    // A photo of the steam run (photos are kept in memory, so it is attached after the reload).
    const photo = await sharp({ create: { width: 320, height: 240, channels: 3, background: '#8a8174' } }).jpeg().toBuffer();
    await page.locator('#f-estimate-runs-0-label').scrollIntoViewIfNeeded();
    await page.getByLabel(/^Photos of this run/).first().setInputFiles([{ name: 'soy-cooker-header.jpg', mimeType: 'image/jpeg', buffer: photo }]);
    await page.getByRole('list', { name: /^Photos of/ }).first().locator('.photo-name', { hasText: 'soy-cooker-header.jpg' }).waitFor();

    // Results with their charts.
    await next(page, 'The figures for your plant');
    await page.getByRole('heading', { name: 'Lost every year as things are' }).waitFor();
    await page.locator('canvas[role="img"]').first().waitFor();
    expect(await page.locator('canvas[role="img"]').count()).toBeGreaterThanOrEqual(3);
    // The chosen run's choices side by side, the recommended one marked.
    expect(await page.locator('.choice-card').count()).toBeGreaterThanOrEqual(2);
    expect(await page.locator('.choice-card-chosen').count()).toBe(1);
    expect(await page.locator('.run-table tbody tr').count()).toBe(3);

    // Contact and submission.
    await page.getByRole('button', { name: 'Ask a consultant to follow up' }).click();
    await waitForStep(page, 'Send it to a consultant');
    // The plant's name from the first step is offered as the company.
    expect(await page.getByLabel('Company or plant').inputValue()).toBe('Gillbrook Tofu Works');
    await page.getByLabel('Your name').fill(owner.name);
    await page.getByLabel('Company or plant').fill(owner.company);
    await page.getByLabel(/^E-mail/).fill(owner.email);
    await page.getByLabel(/^Phone/).fill(owner.phone);
    await page.getByLabel(/may contact me about this assessment/).check();
    await page.getByRole('button', { name: 'Send my assessment' }).click();
    await page.getByRole('heading', { name: 'Your assessment is in' }).waitFor();
    const reference = (await page.locator('.confirmation-reference strong').textContent())?.trim() ?? '';
    expect(reference).toMatch(/^LW-/);
    expect(await page.locator('.confirmation').textContent()).toContain(testRegion.name);

    expect(problems).toEqual([]);

    // The confirmation in the fake inbox, opened as a person would.
    await waitForMessages(owner.email, (m) => m.some((x) => x.subject.includes(reference)));
    await page.goto(stack.mailFakeUrl, { waitUntil: 'networkidle' });
    await page.getByRole('link', { name: `Your Lagwise assessment ${reference} is in` }).click();
    const mail = page.frameLocator('iframe');
    const signIn = await mail.getByRole('link', { name: 'See my assessment' }).getAttribute('href');
    expect(signIn).toContain('/api/auth/magic-link/verify');

    // The link signs the owner in to the assessment they sent. (The fake's own page is not ours to judge.)
    problems.length = 0;
    await page.goto(signIn!, { waitUntil: 'networkidle' });
    expect(new URL(page.url()).pathname).toMatch(/^\/my\/assessments\/[0-9a-f-]{36}$/);
    await page.getByText(`Assessment ${reference}`).waitFor();
    expect(await page.locator('h1').textContent()).toContain('Gillbrook Tofu Works');
    expect(await page.getByText('Sent to consultants').count()).toBe(1);
    expect(await page.getByText('1 photo').count()).toBeGreaterThan(0);

    // The region's consultant has been told, without the owner's e-mail or phone.
    const alerts = await waitForMessages(testRegion.consultant.email, (m) => m.some((x) => x.subject.includes(reference)));
    const alert = alerts.find((m) => m.subject.includes(reference))!;
    for (const secret of [owner.email, owner.phone, owner.name]) {
      expect(`${alert.html}${alert.text}`).not.toContain(secret);
    }

    expect(problems).toEqual([]);
    await context.close();
  });
});
