/** Debian's chromium driven by playwright-core; never a downloaded browser. */
import { chromium, type Browser, type Page } from 'playwright-core';
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
