/**
 * The JavaScript a built page loads before anything is clicked: its module scripts and island
 * components with their static imports, followed through, gzip-compressed. Lazy chunks
 * (dynamic import) are not counted. `npm run budget` (./budget.ts) prints it for the estimate page.
 */
import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { gzipSync } from 'node:zlib';

export interface JsWeight {
  totalGzipBytes: number;
  files: { url: string; gzipBytes: number }[];
}

const STATIC_IMPORT = /(?:^|[;\s}])import\s*(?:[\w*{}\s,$]+from\s*)?["']([^"']+)["']|\bfrom\s*["']([^"']+)["']/g;

export function initialJavaScript(clientDir: string, pagePath: string): JsWeight {
  const html = readFileSync(path.join(clientDir, pagePath), 'utf8');
  const entries = new Set<string>();
  for (const m of html.matchAll(/<script[^>]*type="module"[^>]*src="([^"]+)"/g)) if (m[1]) entries.add(m[1]);
  for (const m of html.matchAll(/(?:component-url|renderer-url)="([^"]+)"/g)) if (m[1]) entries.add(m[1]);
  const sizes = new Map<string, number>();
  const walk = (url: string): void => {
    if (sizes.has(url)) return;
    const file = path.join(clientDir, url);
    if (!existsSync(file)) throw new Error(`${pagePath} loads ${url}, which the build does not contain`);
    const code = readFileSync(file);
    sizes.set(url, gzipSync(code, { level: 9 }).length);
    for (const m of code.toString().matchAll(STATIC_IMPORT)) {
      const spec = m[1] ?? m[2];
      if (spec && (spec.startsWith('.') || spec.startsWith('/'))) walk(spec.startsWith('/') ? spec : path.posix.join(path.posix.dirname(url), spec));
    }
  };
  for (const entry of entries) walk(entry);
  const inline = [...html.matchAll(/<script(?![^>]*type="application\/(?:ld\+)?json")[^>]*>([\s\S]*?)<\/script>/g)].map((m) => m[1] ?? '').join('\n');
  const files = [...sizes].map(([url, gzipBytes]) => ({ url, gzipBytes })).sort((a, b) => b.gzipBytes - a.gzipBytes);
  if (inline.trim()) files.push({ url: '(inline scripts)', gzipBytes: gzipSync(Buffer.from(inline), { level: 9 }).length });
  return { totalGzipBytes: files.reduce((sum, f) => sum + f.gzipBytes, 0), files };
}
