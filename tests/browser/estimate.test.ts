import AxeBuilder from '@axe-core/playwright';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser, watchForErrors } from '../support/browser';
import { closeDb } from '../../src/db/client';
import { ensureTestRegion } from '../support/fixtures';
import { stack } from '../support/stack';

/** A fresh browser context: its own localStorage, so no test sees another's draft. */
async function openEstimate(browser: Browser, viewport = { width: 1280, height: 900 }): Promise<{ context: BrowserContext; page: Page; problems: string[] }> {
  const context = await browser.newContext({ viewport, locale: 'en-US' });
  const page = await context.newPage();
  const problems = watchForErrors(page);
  const response = await page.goto(new URL('/estimate', stack.appUrl).href, { waitUntil: 'networkidle' });
  expect(response?.status()).toBe(200);
  await page.locator('#estimate-step-heading').waitFor();
  return { context, page, problems };
}

async function stepHeading(page: Page): Promise<string> {
  return (await page.locator('#estimate-step-heading').textContent())?.trim() ?? '';
}

async function waitForStep(page: Page, heading: string): Promise<void> {
  await page.locator('#estimate-step-heading', { hasText: heading }).waitFor();
}

async function seriousViolations(page: Page): Promise<string[]> {
  const results = await new AxeBuilder({ page }).analyze();
  return results.violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map((v) => `${v.id}: ${v.help} (${v.nodes.map((n) => n.target.join(' ')).join(', ')})`);
}

/** The plant of the invented Hollin Beck Creamery, in Portland, Oregon. */
async function fillPlant(page: Page): Promise<void> {
  await page.getByLabel('Plant name').fill('Hollin Beck Creamery');
  await page.getByLabel('What the plant makes').selectOption('creamery');
  await page.getByLabel('Country').selectOption('US');
  await page.getByLabel('Postal code').fill('97214');
}

async function next(page: Page, heading: string): Promise<void> {
  await page.getByRole('button', { name: /^Next:/ }).click();
  await waitForStep(page, heading);
}

async function resultsShown(page: Page): Promise<void> {
  await page.getByRole('heading', { name: 'Lost every year as things are' }).waitFor();
}

describe('the estimate wizard in a browser', () => {
  let browser: Browser;
  beforeAll(async () => {
    browser = await launchBrowser();
  });
  afterAll(async () => {
    await browser?.close();
    await closeDb();
  });

  // One test per width, so a slow machine never has to fit both sweeps in one test's time.
  it.each([
    ['desktop', { width: 1280, height: 900 }],
    ['phone', { width: 390, height: 844 }],
  ])('has no serious or critical accessibility violations on any step, results and contact included, at %s width', async (_width, viewport) => {
    const { context, page, problems } = await openEstimate(browser, viewport);
    const found: Record<string, string[]> = {};

    found.plant = await seriousViolations(page);
    await fillPlant(page);
    await next(page, 'Fuel and its price');

    found.energy = await seriousViolations(page);
    await page.getByLabel(/^Fuel price \(/).fill('1.15');
    await next(page, 'Pipe runs');

    await page.getByLabel(/^Length/).fill('120');
    await page.getByRole('region', { name: 'Live estimate' }).getByText(/a year now/).waitFor();
    found.runs = await seriousViolations(page);

    await next(page, 'The figures for your plant');
    await resultsShown(page);
    await page.locator('canvas[role="img"]').first().waitFor();
    found.results = await seriousViolations(page);

    await page.getByRole('button', { name: 'Ask a consultant to follow up' }).click();
    await waitForStep(page, 'Send it to a consultant');
    found.contact = await seriousViolations(page);

    // Errors shown next to their fields must pass too.
    await page.getByRole('button', { name: 'Send my assessment' }).click();
    await page.getByText('Enter your name.').first().waitFor();
    found.contactWithErrors = await seriousViolations(page);

    expect(found).toEqual({ plant: [], energy: [], runs: [], results: [], contact: [], contactWithErrors: [] });
    expect(problems).toEqual([]);
    await context.close();
    // Six axe passes: 13–20 s on a quiet machine, past 30 s on a loaded 2-core one.
  }, 120_000);

  it('works by keyboard alone: a plant, its energy and a run, a run added, duplicated and removed, then the results', async () => {
    const { context, page, problems } = await openEstimate(browser);
    await page.evaluate(() => {
      (window as unknown as { pointerPresses: number }).pointerPresses = 0;
      window.addEventListener('pointerdown', () => {
        (window as unknown as { pointerPresses: number }).pointerPresses += 1;
      }, true);
    });

    interface Target {
      /** The control's label starts with this. */
      label?: string;
      /** A button's own text. */
      text?: string;
      describedBy?: string;
    }
    /** Presses Tab (or Shift+Tab) until the focused element is the one described, as a keyboard user would. */
    async function tabTo(target: Target, backwards = false): Promise<void> {
      for (let presses = 0; presses < 150; presses++) {
        await page.keyboard.press(backwards ? 'Shift+Tab' : 'Tab');
        const found = await page.evaluate(({ label, text, describedBy }) => {
          const element = document.activeElement as HTMLInputElement | null;
          if (!element) return false;
          if (label !== undefined && !(element.labels?.[0]?.textContent?.trim().startsWith(label) ?? false)) return false;
          if (text !== undefined && element.textContent?.trim() !== text) return false;
          if (describedBy !== undefined && element.getAttribute('aria-describedby') !== describedBy) return false;
          return true;
        }, target);
        if (found) return;
      }
      throw new Error(`Tab never reached ${JSON.stringify(target)}`);
    }
    const labeled = (label: string): Target => ({ label });
    async function choose(optionText: string): Promise<void> {
      for (let presses = 0; presses < 40; presses++) {
        const chosen = await page.evaluate(() => {
          const select = document.activeElement as HTMLSelectElement;
          return select.selectedOptions[0]?.textContent ?? '';
        });
        if (chosen === optionText) return;
        await page.keyboard.press('ArrowDown');
      }
      throw new Error(`No option ${optionText}`);
    }
    const runCount = () => page.locator('.run-card').count();

    await tabTo(labeled('Plant name'));
    await page.keyboard.type('Hollin Beck Creamery');
    await tabTo(labeled('What the plant makes'));
    await choose('Creamery or dairy');
    await tabTo(labeled('Country'));
    await choose('United States');
    await tabTo(labeled('Postal code'));
    await page.keyboard.type('97214');
    await page.keyboard.press('Enter');
    await waitForStep(page, 'Fuel and its price');

    await tabTo(labeled('Fuel price ('));
    await page.keyboard.type('1.15');
    await page.keyboard.press('Enter');
    await waitForStep(page, 'Pipe runs');

    await tabTo(labeled('Name of the run'));
    await page.keyboard.press('ControlOrMeta+A');
    await page.keyboard.type('Boiler header');
    await tabTo(labeled('Length'));
    await page.keyboard.type('120');

    await tabTo({ text: '+ Add a run' });
    await page.keyboard.press('Enter');
    await page.locator('#f-estimate-runs-1-label').waitFor();
    expect(await runCount()).toBe(2);
    expect(await page.evaluate(() => document.activeElement?.id)).toBe('f-estimate-runs-1-label');
    await page.keyboard.press('ControlOrMeta+A');
    await page.keyboard.type('Kettle drop');
    await tabTo(labeled('Length'));
    await page.keyboard.type('40');

    await tabTo({ text: 'Duplicate', describedBy: 'run-1-heading' }, true);
    await page.keyboard.press('Enter');
    await page.locator('#f-estimate-runs-2-label').waitFor();
    expect(await runCount()).toBe(3);
    expect(await page.evaluate(() => document.activeElement?.id)).toBe('f-estimate-runs-2-label');
    expect(await page.locator('#f-estimate-runs-2-label').inputValue()).toBe('Kettle drop (copy)');
    expect(await page.locator('#f-estimate-runs-2-lengthM').inputValue()).toBe('40');

    await tabTo({ text: 'Remove', describedBy: 'run-2-heading' }, true);
    await page.keyboard.press('Enter');
    await page.getByText('Removed “Kettle drop (copy)”.').waitFor();
    expect(await runCount()).toBe(2);
    expect(await page.evaluate(() => document.activeElement?.id)).toBe('run-1-heading');

    await tabTo({ text: 'Next: results' });
    await page.keyboard.press('Enter');
    await waitForStep(page, 'The figures for your plant');
    await resultsShown(page);

    const rows = page.locator('.run-table tbody tr');
    expect(await rows.count()).toBe(2);
    expect(await rows.nth(0).textContent()).toContain('Boiler header');
    expect(await rows.nth(1).textContent()).toContain('Kettle drop');
    expect(await page.locator('.figure-heat .figure-value').first().textContent()).toMatch(/^\$[\d,]+$/);
    expect(await page.evaluate(() => (window as unknown as { pointerPresses: number }).pointerPresses)).toBe(0);
    expect(problems).toEqual([]);
    await context.close();
  });

  it('says at the plant step whether a consultant covers the postal code, and still lets the owner go on when none does', async () => {
    await ensureTestRegion();
    const { context, page, problems } = await openEstimate(browser);
    await page.getByLabel('What the plant makes').selectOption('creamery');
    await page.getByLabel('Country').selectOption('AU');
    await page.getByLabel('Postal code').fill('3564');
    const notice = page.locator('.coverage-notice');
    await page.locator('.coverage-notice[data-coverage="covered"]').waitFor();
    expect(await notice.textContent()).toBe('A consultant covers Wattle Valley: once you send, they can follow up on your plant.');
    await page.getByLabel('Postal code').fill('0870');
    await page.locator('.coverage-notice[data-coverage="not-covered"]').waitFor();
    expect(await notice.textContent()).toContain('No consultant covers postal code 0870 yet.');
    await next(page, 'Fuel and its price');
    expect(problems).toEqual([]);
    await context.close();
  });

  it('keeps a length through unit switches (131 ft reads 39.9 m in SI and 131 ft again in US); the catalog stays the plant’s', async () => {
    const { context, page, problems } = await openEstimate(browser);
    await page.getByLabel(/^US/).check();
    await fillPlant(page);
    await next(page, 'Fuel and its price');
    await page.getByLabel(/^Fuel price \(/).fill('1.15');
    await next(page, 'Pipe runs');

    const length = page.locator('#f-estimate-runs-0-lengthM');
    await length.fill('131');
    await length.blur();
    expect(await page.locator('label[for="f-estimate-runs-0-lengthM"]').textContent()).toBe('Length (ft)');

    await page.getByLabel(/^SI/).check();
    expect(await page.locator('label[for="f-estimate-runs-0-lengthM"]').textContent()).toBe('Length (m)');
    expect(await length.inputValue()).toBe('39.9');

    await page.getByLabel(/^US/).check();
    expect(await length.inputValue()).toBe('131');

    // A length that is not a round number of meters comes back exactly as typed.
    await length.fill('33.35');
    await length.blur();
    await page.getByLabel(/^SI/).check();
    expect(await length.inputValue()).toBe('10.2');
    await page.getByLabel(/^US/).check();
    expect(await length.inputValue()).toBe('33.35');

    // In SI a run added to this US plant is still NPS steel pipe; after a change of standard the wall is the usual one.
    await page.getByLabel(/^SI/).check();
    await page.getByRole('button', { name: 'Add a run' }).click();
    await page.locator('.run-card').nth(1).locator('summary', { hasText: 'More about this run' }).click();
    expect(await page.locator('#f-estimate-runs-1-pipe-standard').inputValue()).toBe('ASME-B36.10M');
    await page.locator('#f-estimate-runs-1-pipe-standard').selectOption('ASTM-B88-L');
    await page.locator('#f-estimate-runs-1-pipe-standard').selectOption('ASME-B36.10M');
    expect(await page.locator('#f-estimate-runs-1-pipe-schedule').inputValue()).toBe('40');
    expect(await page.locator('#f-estimate-runs-1-pipe-schedule option:checked').textContent()).toMatch(/^Schedule 40/);
    await page.getByLabel(/^US/).check();

    // The plant step shows the same switch, with the same choice.
    await page.getByRole('button', { name: /^Back to/ }).click();
    await page.getByRole('button', { name: /^Back to/ }).click();
    await waitForStep(page, 'Your plant');
    expect(await page.getByLabel(/^US/).isChecked()).toBe(true);
    expect(problems).toEqual([]);
    await context.close();
  });

  it('finds the half-filled draft again after a reload', async () => {
    const { context, page, problems } = await openEstimate(browser);
    await fillPlant(page);
    await next(page, 'Fuel and its price');
    await page.getByLabel(/^Fuel price \(/).fill('1.15');
    await next(page, 'Pipe runs');
    await page.locator('#f-estimate-runs-0-label').fill('Whey tank coil');
    await page.locator('#f-estimate-runs-0-lengthM').fill('65');
    await page.waitForFunction(() => localStorage.getItem('lagwise:estimate:v1:values')?.includes('Whey tank coil'));

    await page.reload({ waitUntil: 'networkidle' });
    await waitForStep(page, 'Pipe runs');
    expect(await page.locator('#f-estimate-runs-0-label').inputValue()).toBe('Whey tank coil');
    expect(await page.locator('#f-estimate-runs-0-lengthM').inputValue()).toBe('65');

    await page.getByRole('button', { name: 'Back to energy' }).click();
    await waitForStep(page, 'Fuel and its price');
    expect(await page.getByLabel(/^Fuel price \(/).inputValue()).toBe('1.15');
    await page.getByRole('button', { name: 'Back to plant' }).click();
    await waitForStep(page, 'Your plant');
    expect(await page.getByLabel('Plant name').inputValue()).toBe('Hollin Beck Creamery');
    expect(await page.getByLabel('Postal code').inputValue()).toBe('97214');
    expect(await page.getByLabel('Country').inputValue()).toBe('US');
    expect(await stepHeading(page)).toBe('Your plant');
    expect(problems).toEqual([]);
    await context.close();
  });

  it('refuses a file that is not a photo or a PDF beside the picker, and keeps a real photo', async () => {
    const { context, page, problems } = await openEstimate(browser);
    await fillPlant(page);
    await next(page, 'Fuel and its price');
    await page.getByLabel(/^Fuel price \(/).fill('1.15');
    await next(page, 'Pipe runs');

    const picker = page.getByLabel(/^Photos of this run/);
    await picker.setInputFiles([
      { name: 'valve-notes.txt', mimeType: 'text/plain', buffer: Buffer.from('notes from the boiler room') },
      { name: 'header.jpg', mimeType: 'image/jpeg', buffer: Buffer.from([0xff, 0xd8, 0xff, 0xe0, 0x00, 0x10]) },
    ]);
    await page.getByText('“valve-notes.txt” is not a JPEG, PNG, WebP, HEIC photo or a PDF.').waitFor();
    const kept = page.getByRole('list', { name: /^Photos of/ }).getByRole('listitem');
    expect(await kept.count()).toBe(1);
    expect(await kept.first().textContent()).toContain('header.jpg');
    expect(problems).toEqual([]);
    await context.close();
  });
});
