/**
 * A first-time owner on a 390 px phone: a three-run plant from the plain questions only (one
 * size found with a string round the pipe), through to the results. Every box, list and choice
 * touched is counted (at most 25 for three runs), and nothing on the results may stick out
 * sideways past the screen.
 */
import type { Locator, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { closeDb } from '../../src/db/client';
import { launchBrowser, watchForErrors } from '../support/browser';
import { ensureTestRegion } from '../support/fixtures';
import { stack } from '../support/stack';

const PHONE = { width: 390, height: 844 };

/** The elements of the results that reach past the screen's right edge (or start left of it). */
async function overflowing(page: Page, root: string): Promise<string[]> {
  return page.evaluate((selector) => {
    const width = document.documentElement.clientWidth;
    const found: string[] = [];
    const scrollWidth = document.scrollingElement?.scrollWidth ?? 0;
    if (scrollWidth > width) found.push(`the page scrolls sideways: ${scrollWidth} px in ${width} px`);
    for (const element of document.querySelectorAll(`${selector}, ${selector} *`)) {
      // What nobody can see (a closed "show the numbers" panel) cannot stick out.
      if (!element.checkVisibility({ visibilityProperty: true })) continue;
      const box = element.getBoundingClientRect();
      if (box.width === 0 && box.height === 0) continue;
      if (box.right > width + 0.5 || box.left < -0.5) {
        const name = `${element.tagName.toLowerCase()}${element.id ? `#${element.id}` : ''}${element.className && typeof element.className === 'string' ? `.${element.className.split(' ').join('.')}` : ''}`;
        found.push(`${name} spans ${Math.round(box.left)}–${Math.round(box.right)} px`);
      }
    }
    return found.slice(0, 12);
  }, root);
}

describe('a first visit on a phone', () => {
  let browser: Browser;
  beforeAll(async () => {
    await ensureTestRegion();
    browser = await launchBrowser();
  });
  afterAll(async () => {
    await browser?.close();
    await closeDb();
  });

  it('three runs from the plain questions, one sized with a string, in at most 25 inputs, and results that fit the screen', async () => {
    const context = await browser.newContext({ viewport: PHONE, locale: 'en-US', isMobile: true, hasTouch: true });
    const page = await context.newPage();
    const problems = watchForErrors(page);
    let touched = 0;
    const fill = async (target: Locator, text: string) => {
      touched += 1;
      await target.fill(text);
    };
    const select = async (target: Locator, value: string) => {
      touched += 1;
      await target.selectOption(value);
    };
    const check = async (target: Locator) => {
      touched += 1;
      await target.check();
    };
    const next = async (heading: string) => {
      await page.getByRole('button', { name: /^Next:/ }).click();
      await page.locator('#estimate-step-heading', { hasText: heading }).waitFor();
    };

    const started = Date.now();
    await page.goto(new URL('/estimate', stack.appUrl).href, { waitUntil: 'networkidle' });
    await page.locator('#estimate-step-heading').waitFor();
    await check(page.getByLabel(/^US/));

    // The plant: what it makes and where.
    await select(page.getByLabel('What the plant makes'), 'creamery');
    await select(page.getByLabel('Country'), 'US');
    await fill(page.getByLabel('Postal code'), '05401');
    await next('Fuel and its price');

    // The price from a bill.
    await fill(page.getByLabel(/^Fuel price \(/), '1.35');
    await next('Pipe runs');

    // Run 1: steam, sized with a string (7.5 in round is NPS 2 steel), 120 ft.
    await fill(page.getByLabel('Distance round the pipe (in)').first(), '7.5');
    await check(page.getByLabel(/^2 in steel pipe|^NPS 2 steel pipe/).first());
    expect(await page.locator('#f-estimate-runs-0-pipe-size').inputValue()).toBe('2');
    await fill(page.locator('#f-estimate-runs-0-lengthM'), '120');

    // Run 2: hot water in copper the owner knows as 1 inch, lagged with gaps.
    await page.getByRole('button', { name: 'Add a run' }).click();
    await select(page.locator('#f-estimate-runs-1-service'), 'hot-water');
    await fill(page.locator('#f-estimate-runs-1-lengthM'), '60');
    await check(page.locator('#f-estimate-runs-1-current-state-damaged'));
    await fill(page.locator('#f-estimate-runs-1-current-bareFraction'), '30');

    // Run 3: glycol, outdoors across the yard (one pick makes the plant's outdoor area).
    await page.getByRole('button', { name: 'Add a run' }).click();
    await select(page.locator('#f-estimate-runs-2-service'), 'glycol');
    await fill(page.locator('#f-estimate-runs-2-lengthM'), '40');
    await select(page.getByLabel('Where is this run?').nth(2), 'new:outdoors');

    await page.getByRole('region', { name: 'Live estimate' }).getByText(/a year now/).waitFor();
    await next('The figures for your plant');
    await page.getByRole('heading', { name: 'Lost every year as things are' }).waitFor();
    await page.locator('.run-result').nth(2).waitFor();
    const seconds = (Date.now() - started) / 1000;

    console.log(`[first visit] ${touched} inputs touched, ${seconds.toFixed(1)} s from opening the page to the results`);
    expect(touched).toBeLessThanOrEqual(25);
    expect(await page.locator('.run-result').count()).toBe(3);
    expect(await page.locator('.run-table').isVisible()).toBe(false);
    expect(await overflowing(page, '.results')).toEqual([]);
    expect(await overflowing(page, '.estimate')).toEqual([]);
    expect(problems).toEqual([]);
    await context.close();
  });
});
