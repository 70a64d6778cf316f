import AxeBuilder from '@axe-core/playwright';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser, watchForErrors } from '../support/browser';
import { appFetch, stack } from '../support/stack';

const staticPages = ['/', '/how-it-works', '/savings', '/safety', '/consultants', '/privacy'];
const serverPages = ['/sign-in'];

describe('public pages', () => {
  let browser: Browser;
  beforeAll(async () => {
    browser = await launchBrowser();
  });
  afterAll(async () => {
    await browser?.close();
  });

  it.each([...staticPages, ...serverPages])('%s has no serious or critical accessibility violations, at desktop and phone widths', async (path) => {
    for (const viewport of [{ width: 1280, height: 900 }, { width: 390, height: 844 }]) {
      const context = await browser.newContext({ viewport });
      const page = await context.newPage();
      const problems = watchForErrors(page);
      const response = await page.goto(new URL(path, stack.appUrl).href, { waitUntil: 'networkidle' });
      expect(response?.status()).toBe(200);
      const results = await new AxeBuilder({ page }).analyze();
      const serious = results.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical');
      expect(serious.map((v) => `${v.id}: ${v.help} (${v.nodes.length})`)).toEqual([]);
      expect(problems).toEqual([]);
      await context.close();
    }
  });

  it.each(staticPages)('%s ships no JavaScript', async (path) => {
    const html = await (await appFetch(path)).text();
    expect(html).not.toMatch(/<script\b(?![^>]*type="application\/(ld\+)?json")/i);
  });

  it('answers an unknown address with our 404 page', async () => {
    const response = await appFetch('/no-such-page');
    expect(response.status).toBe(404);
    expect(await response.text()).toContain('Lagwise');
  });

  it('the main navigation works by keyboard: Tab reaches the skip link first and it moves focus to the content', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    await page.goto(stack.appUrl, { waitUntil: 'networkidle' });
    await page.keyboard.press('Tab');
    expect(await page.evaluate(() => document.activeElement?.textContent?.trim())).toBe('Skip to content');
    await page.keyboard.press('Enter');
    expect(await page.evaluate(() => document.activeElement?.id)).toBe('main');
    await context.close();
  });
});
