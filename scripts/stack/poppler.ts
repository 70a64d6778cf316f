/** The report tests read PDFs with Debian's poppler-utils (pdftotext); installed when missing, like chromium. */
import { existsSync } from 'node:fs';
import { aptInstall, canInstallPackages } from './debian.ts';
import { StackError } from './errors.ts';

const candidates = ['/usr/bin/pdftotext', '/usr/local/bin/pdftotext'];

export function ensurePdftotext(): string {
  const configured = process.env.LAGWISE_PDFTOTEXT;
  if (configured && existsSync(configured)) return configured;
  const found = candidates.find((c) => existsSync(c));
  if (found) return found;
  if (canInstallPackages()) {
    console.log('[lagwise] pdftotext not found; installing the Debian package "poppler-utils" for the report tests…');
    if (aptInstall('poppler-utils')) {
      const installed = candidates.find((c) => existsSync(c));
      if (installed) return installed;
    }
  }
  throw new StackError(
    'The report tests need pdftotext. Install it (on Debian: `sudo apt-get install poppler-utils`) or set LAGWISE_PDFTOTEXT to its path.',
  );
}
