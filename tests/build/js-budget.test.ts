import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { initialJavaScript } from '../../scripts/js-budget';

// `npm test` builds the site before the tests run; these read that build.
const client = path.resolve('dist/client');

describe('JavaScript budget of the built site', () => {
  it('the estimate page loads at most 110 kB of gzip JavaScript before anything is clicked', () => {
    const weight = initialJavaScript(client, 'estimate/index.html');
    expect(weight.files.length).toBeGreaterThan(0);
    expect(weight.totalGzipBytes).toBeLessThanOrEqual(110_000);
  });

  it('the estimate page leaves the validation library out of its first load (it comes with the first check)', () => {
    const weight = initialJavaScript(client, 'estimate/index.html');
    const code = weight.files.filter((f) => f.url.endsWith('.js')).map((f) => readFileSync(path.join(client, f.url), 'utf8'));
    expect(code.length).toBeGreaterThan(0);
    // zod's own error for a failed parse names its class; no first-load file may carry it.
    expect(code.filter((text) => text.includes('ZodError'))).toEqual([]);
  });

  it.each(['index.html', 'how-it-works/index.html', 'savings/index.html', 'safety/index.html', 'consultants/index.html', 'privacy/index.html'])(
    '%s loads no JavaScript at all',
    (page) => {
      expect(initialJavaScript(client, page).totalGzipBytes).toBe(0);
    },
  );
});
