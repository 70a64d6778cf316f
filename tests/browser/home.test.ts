import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser, watchForErrors } from '../support/browser';
import { stack } from '../support/stack';

describe('home page in a browser', () => {
  let browser: Browser;
  beforeAll(async () => {
    browser = await launchBrowser();
  });
  afterAll(async () => {
    await browser?.close();
  });

  it('renders our name and a way to the estimate, with no console errors', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    const problems = watchForErrors(page);
    const response = await page.goto(stack.appUrl, { waitUntil: 'networkidle' });
    expect(response?.status()).toBe(200);
    await expect(page.title()).resolves.toMatch(/Lagwise/);
    expect(await page.locator('h1').first().textContent()).toBeTruthy();
    expect(await page.locator('a[href="/estimate"]').count()).toBeGreaterThan(0);
    expect(problems).toEqual([]);
    await context.close();
  });
});
