/**
 * On a 390 px phone, the detail of a run the engine now takes: the area it sits in, what its
 * bare metal looks like and the fittings on it. Each choice shows in the results: the run's
 * place, a smaller heat loss from shiny metal, and bare fittings among its hazards.
 */
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb } from '../../src/db/client';
import { launchBrowser, watchForErrors } from '../support/browser';
import { ensureTestRegion } from '../support/fixtures';
import { stack } from '../support/stack';

const PHONE = { width: 390, height: 844 };

async function next(page: Page, heading: string): Promise<void> {
  await page.getByRole('button', { name: /^Next:/ }).click();
  await page.locator('#estimate-step-heading', { hasText: heading }).waitFor();
}

/** Waits until no estimate is on its way, and returns the first run card's heat line. */
async function settledHeat(page: Page): Promise<string> {
  await page.waitForFunction(() => !document.querySelector('[aria-busy="true"]'));
  return (await page.locator('.run-result').first().locator('dd').first().textContent())?.trim() ?? '';
}

describe('a run’s area, finish and fittings on a phone', () => {
  let browser: Browser;
  beforeAll(async () => {
    await ensureTestRegion();
    browser = await launchBrowser();
  });
  afterAll(async () => {
    await browser?.close();
    await closeDb();
  });

  it('a washdown room, shiny metal and two bare valves show in the run’s results', async () => {
    const context = await browser.newContext({ viewport: PHONE, locale: 'en-US', isMobile: true, hasTouch: true });
    const page = await context.newPage();
    const problems = watchForErrors(page);
    await page.goto(new URL('/estimate', stack.appUrl).href, { waitUntil: 'networkidle' });
    await page.locator('#estimate-step-heading').waitFor();
    await page.getByLabel(/^US/).check();
    await page.getByLabel('What the plant makes').selectOption('creamery');
    await page.getByLabel('Country').selectOption('US');
    await page.getByLabel('Postal code').fill('05401');
    await next(page, 'Fuel and its price');
    await page.getByLabel(/^Fuel price \(/).fill('1.35');
    await next(page, 'Pipe runs');

    // A steam line in the usual 2 in steel pipe, 80 ft, bare.
    await page.locator('#f-estimate-runs-0-lengthM').fill('80');

    // The area: picking a kind makes the area, listed with its usual air.
    await page.getByLabel('Where is this run?').selectOption('new:washdown-room');
    const area = page.getByRole('region', { name: 'Washdown room' });
    await area.waitFor();
    expect(await page.getByLabel('Name of the area').inputValue()).toBe('Washdown room');
    await area.getByText('Its air').click();
    expect(await area.getByText(/Usual for a washdown room: 64\.4\s°F at 80\s% humidity/).count()).toBe(1);
    expect(await page.getByLabel(/^Usual humidity/).getAttribute('placeholder')).toBe('80');

    // The finish, as the owner sees it: first left to the usual, then shiny metal.
    await next(page, 'The figures for your plant');
    const place = page.locator('.run-result').first().locator('.run-result-place');
    await place.filter({ hasText: 'Washdown room' }).waitFor();
    const usualHeat = await settledHeat(page);
    await page.getByRole('button', { name: /^Back/ }).click();
    await page.locator('#estimate-step-heading', { hasText: 'Pipe runs' }).waitFor();
    await page.getByLabel(/^What the bare metal looks like/).selectOption('bright-metal');

    // Two bare flanged valves, under "More about this run".
    await page.locator('.run-more > summary').first().click();
    await page.getByRole('button', { name: 'Add valves, flanges or traps' }).click();
    await page.locator('#f-estimate-runs-0-fittings-0-count').fill('2');
    expect(await page.locator('#f-estimate-runs-0-fittings-0-type').inputValue()).toBe('valve-flanged');
    expect(await page.getByText(/2 × flanged valve/).count()).toBe(1);

    await next(page, 'The figures for your plant');
    const card = page.locator('.run-result').first();
    await card.getByText('Bare fittings burn').waitFor();
    const shinyHeat = await settledHeat(page);
    expect(await place.textContent()).toBe('Washdown room');
    // Shiny metal gives off less heat than the usual rusty steel: the per-foot loss falls.
    const perFoot = (text: string) => Number(/^([\d,.]+)/.exec(text)?.[1]?.replace(/,/g, ''));
    expect(perFoot(shinyHeat)).toBeLessThan(perFoot(usualHeat));
    expect(problems).toEqual([]);
    await context.close();
  });
});
