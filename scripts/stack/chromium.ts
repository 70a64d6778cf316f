/** Browser tests drive Debian's chromium through playwright-core; no browser is downloaded. */
import { existsSync } from 'node:fs';
import { aptInstall, canInstallPackages } from './debian.ts';
import { StackError } from './errors.ts';

const candidates = ['/usr/bin/chromium', '/usr/bin/chromium-browser'];

export function ensureChromium(): string {
  const configured = process.env.LAGWISE_CHROMIUM;
  if (configured && existsSync(configured)) return configured;
  const found = candidates.find((c) => existsSync(c));
  if (found) return found;
  if (canInstallPackages()) {
    console.log('[lagwise] chromium not found; installing the Debian package "chromium" for the browser tests…');
    if (aptInstall('chromium')) {
      const installed = candidates.find((c) => existsSync(c));
      if (installed) return installed;
    }
  }
  throw new StackError(
    'The browser tests need Chromium. Install it (on Debian: `sudo apt-get install chromium`) or set LAGWISE_CHROMIUM to its path.',
  );
}
