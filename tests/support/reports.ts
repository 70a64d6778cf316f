/**
 * Helpers for the report's tests: waiting for a version's PDF, reading a PDF's text with
 * pdftotext, and the figures a report's web page shows (each marked `data-figure`).
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { asPerson } from './desk';
import { stack } from './stack';

/** Polls GET /api/reports/{id} until the worker has stored its PDF. */
export async function waitForPdf(cookie: string, reportId: string, timeoutMs = 60_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    const response = await asPerson(cookie, `/api/reports/${reportId}`);
    const body = (await response.json()) as { report?: { pdfReady?: boolean } };
    if (body.report?.pdfReady) return;
    await new Promise((r) => setTimeout(r, 300));
  }
  throw new Error(`the PDF of report ${reportId} was not ready in ${timeoutMs / 1000} s`);
}

/** Whitespace of any kind (line breaks, no-break spaces) as one space: figures compare by their characters. */
export function squeeze(text: string): string {
  return text.replace(/[\s\u00a0\u202f]+/g, ' ').trim();
}

/** The text of a PDF, as Debian's pdftotext reads it. */
export function pdfText(bytes: Uint8Array): string {
  const dir = mkdtempSync(path.join(tmpdir(), 'lagwise-pdf-'));
  try {
    const file = path.join(dir, 'report.pdf');
    writeFileSync(file, bytes);
    return execFileSync(stack.pdftotext, ['-enc', 'UTF-8', file, '-'], { encoding: 'utf8' });
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

function unescapeHtml(text: string): string {
  return text
    .replace(/&#x27;|&#39;/g, "'")
    .replace(/&quot;/g, '"')
    .replace(/&lt;/g, '<')
    .replace(/&gt;/g, '>')
    .replace(/&nbsp;/g, '\u00a0')
    .replace(/&amp;/g, '&');
}

/** Every figure a report page marks with `data-figure`, by key, as the page writes it. */
export function pageFigures(html: string): Map<string, string> {
  const figures = new Map<string, string>();
  for (const match of html.matchAll(/data-figure="([^"]+)"[^>]*>([^<]*)</g)) {
    figures.set(match[1]!, squeeze(unescapeHtml(match[2]!)));
  }
  return figures;
}
