/** Debian's chromium driven by playwright-core; never a downloaded browser. */
import AxeBuilder from '@axe-core/playwright';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';
import { expect } from 'vitest';
import { TEST_PASSWORD } from './desk';
import { stack } from './stack';

export async function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: stack.chromium,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
}

/** Collects console errors and failed page loads so a test can assert there were none. */
export function watchForErrors(page: Page): string[] {
  const problems: string[] = [];
  page.on('console', (message) => {
    if (message.type() === 'error') problems.push(`console: ${message.text()}`);
  });
  page.on('pageerror', (error) => problems.push(`page error: ${error.message}`));
  page.on('response', (response) => {
    if (response.status() >= 400) problems.push(`HTTP ${response.status()} for ${response.url()}`);
  });
  return problems;
}

/** Fails on any serious or critical axe finding, each named with `what` (the page as the test sees it). */
export async function expectAccessible(page: Page, what: string): Promise<void> {
  const results = await new AxeBuilder({ page }).analyze();
  const serious = results.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical');
  expect(serious.map((v) => `${what}: ${v.id}: ${v.help} (${v.nodes.map((n) => n.target.join(' ')).join(', ')})`)).toEqual([]);
}

/** Signs a consultant in through the team form and waits for the desk. */
export async function signInAtDesk(context: BrowserContext, email: string): Promise<Page> {
  const page = await context.newPage();
  await page.goto(new URL('/sign-in', stack.appUrl).href);
  await page.locator('#team-email').fill(email);
  await page.locator('#team-password').fill(TEST_PASSWORD);
  await Promise.all([page.waitForURL(/\/desk$/), page.locator('#team button[type=submit]').click()]);
  return page;
}
