import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { initialJavaScript } from '../../scripts/js-budget';

// `npm test` builds the site before the tests run; these read that build.
const client = path.resolve('dist/client');

describe('JavaScript budget of the built site', () => {
  it('the estimate page loads under 152 kB of gzip JavaScript before anything is clicked', () => {
    const weight = initialJavaScript(client, 'estimate/index.html');
    expect(weight.files.length).toBeGreaterThan(0);
    expect(weight.totalGzipBytes).toBeLessThan(152_000);
  });

  it.each(['index.html', 'how-it-works/index.html', 'savings/index.html', 'safety/index.html', 'consultants/index.html', 'privacy/index.html'])(
    '%s loads no JavaScript at all',
    (page) => {
      expect(initialJavaScript(client, page).totalGzipBytes).toBe(0);
    },
  );
});
