/**
 * Every on-demand route the site serves, read from src/pages: a page or endpoint file that
 * says `prerender = false`, with the methods it answers (`GET` for pages; the exported handler
 * names for endpoints). Prerendered pages are static files and need no guard.
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';

export interface DiscoveredRoute {
  method: string;
  /** The route as Astro spells it: `/api/leads/[id]/claim`. */
  route: string;
  file: string;
}

function walk(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const full = path.join(dir, name);
    return statSync(full).isDirectory() ? walk(full) : [full];
  });
}

export function onDemandRoutes(pagesDir = 'src/pages'): DiscoveredRoute[] {
  const found: DiscoveredRoute[] = [];
  for (const file of walk(pagesDir)) {
    const ext = path.extname(file);
    if (!['.astro', '.ts', '.tsx', '.js', '.mjs'].includes(ext)) continue;
    const source = readFileSync(file, 'utf8');
    if (!/export\s+const\s+prerender\s*=\s*false/.test(source)) continue;
    const relative = path.relative(pagesDir, file).split(path.sep).join('/');
    const withoutExt = relative.slice(0, -ext.length);
    const route = `/${withoutExt.replace(/(^|\/)index$/, '')}`.replace(/\/$/, '') || '/';
    const methods =
      ext === '.astro' ? ['GET'] : [...source.matchAll(/export\s+(?:const|async\s+function|function)\s+(GET|POST|PUT|PATCH|DELETE|ALL)\b/g)].map((m) => m[1]!);
    for (const method of methods) found.push({ method, route, file: relative });
  }
  return found.sort((a, b) => `${a.route} ${a.method}`.localeCompare(`${b.route} ${b.method}`));
}
