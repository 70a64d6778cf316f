/**
 * `npm run budget`: what the estimate page costs a phone, measured side by side with the home
 * page in one run on a fresh build (pass `--no-build` to measure dist/ as it is):
 * - the gzip JavaScript /estimate loads before anything is clicked (./js-budget), target 110 kB;
 * - time until each page answers a tap, on chromium with its CPU slowed 4× through the Chrome
 *   DevTools Protocol: the home page at its load event (it ships no JavaScript), the estimate
 *   page once its form is hydrated (the wizard draws its first step heading only then); the
 *   median of several loads each, and their ratio (target ≤ 3×);
 * - the 50-run estimate answer as the endpoint writes it, raw and as the server compresses it.
 * The built client is served by a small static server through the same compression as the
 * real one (src/server/compression-options), so nothing else has to run.
 */
import { execFileSync } from 'node:child_process';
import { createReadStream, existsSync, statSync } from 'node:fs';
import http from 'node:http';
import path from 'node:path';
import { brotliCompressSync, constants, gzipSync } from 'node:zlib';
import compression from 'compression';
import { chromium } from 'playwright-core';
import { ENGINE_VERSION, estimateParsedPlant, plantInputSchema, type PlantInput } from '../src/engine';
import { withAnswerDigits } from '../src/lib/answer-numbers';
import { BROTLI_QUALITY, compressionOptions } from '../src/server/compression-options';
import { initialJavaScript } from './js-budget';
import { ensureChromium } from './stack/chromium';

const CLIENT = path.resolve('dist/client');
const LOADS = 5;
const CPU_SLOWDOWN = 4;
const JS_TARGET_KB = 110;
const RATIO_TARGET = 3;
const TYPES: Record<string, string> = {
  '.html': 'text/html; charset=utf-8',
  '.js': 'text/javascript',
  '.css': 'text/css',
  '.woff2': 'font/woff2',
  '.svg': 'image/svg+xml',
  '.ico': 'image/x-icon',
  '.png': 'image/png',
  '.webmanifest': 'application/manifest+json',
};

function serveClient(): Promise<{ url: string; close: () => void }> {
  const compress = compression(compressionOptions);
  const server = http.createServer((req, res) => {
    compress(req as Parameters<typeof compress>[0], res as Parameters<typeof compress>[1], () => {
      const pathname = decodeURIComponent(new URL(req.url ?? '/', 'http://x').pathname);
      let file = path.join(CLIENT, pathname);
      if (!file.startsWith(CLIENT)) return void res.writeHead(403).end();
      if (existsSync(file) && statSync(file).isDirectory()) file = path.join(file, 'index.html');
      if (!existsSync(file)) return void res.writeHead(404).end();
      res.writeHead(200, { 'content-type': TYPES[path.extname(file)] ?? 'application/octet-stream' });
      createReadStream(file).pipe(res);
    });
  });
  return new Promise((resolve) =>
    server.listen(0, '127.0.0.1', () => {
      const address = server.address();
      const port = typeof address === 'object' && address ? address.port : 0;
      resolve({ url: `http://127.0.0.1:${port}`, close: () => server.close() });
    }),
  );
}

const median = (values: number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)] ?? NaN;

/** Median ms from navigation start until each page answers a tap, pages loaded in turn. */
async function timeToAnswer(base: string): Promise<{ home: number; estimate: number }> {
  const browser = await chromium.launch({ executablePath: ensureChromium(), args: ['--no-sandbox', '--disable-gpu'] });
  const home: number[] = [];
  const estimate: number[] = [];
  try {
    for (let i = 0; i < LOADS; i += 1) {
      for (const [pagePath, into] of [['/', home], ['/estimate', estimate]] as const) {
        const context = await browser.newContext({ viewport: { width: 390, height: 844 } });
        const page = await context.newPage();
        const cdp = await context.newCDPSession(page);
        await cdp.send('Emulation.setCPUThrottlingRate', { rate: CPU_SLOWDOWN });
        await page.goto(base + pagePath, { waitUntil: 'load' });
        const ms =
          pagePath === '/'
            ? await page.evaluate(() => (performance.getEntriesByType('navigation')[0] as PerformanceNavigationTiming).loadEventEnd)
            : // A string, not a function: tsx would wrap a named function in a helper the page lacks.
              await page.evaluate<number>(
                `new Promise((resolve) => { const check = () => document.querySelector('#estimate-step-heading') ? resolve(performance.now()) : requestAnimationFrame(check); check(); })`,
              );
        into.push(ms);
        await context.close();
      }
    }
  } finally {
    await browser.close();
  }
  return { home: median(home), estimate: median(estimate) };
}

/** A 50-run plant of the invented Harrow Vale Creamery. */
function fiftyRuns(): PlantInput {
  const services = ['steam', 'hot-water', 'glycol', 'condensate-return'] as const;
  return {
    market: 'US',
    energy: { fuel: 'natural-gas', price: 1.35, priceUnit: 'therm', currency: 'USD' },
    runs: Array.from({ length: 50 }, (_, i) => ({
      id: `run-${i + 1}`,
      label: `Line ${i + 1}`,
      service: services[i % services.length]!,
      pipe: { standard: 'ASME-B36.10M', size: ['1', '2', '3', '4'][i % 4]! },
      lengthM: 10 + (i % 7) * 6,
      ...(i % 3 === 0 ? { current: { state: 'damaged' as const, bareFraction: 0.3 } } : {}),
    })),
  };
}

/** The answer POST /api/estimate writes for the 50-run plant, and its size as the server sends it. */
function estimateAnswerBytes(): { raw: number; gzip: number; brotli: number } {
  const result = estimateParsedPlant(plantInputSchema.parse(fiftyRuns()), { detail: 'summary' });
  const body = Buffer.from(JSON.stringify({ engineVersion: ENGINE_VERSION, result }, withAnswerDigits));
  return {
    raw: body.length,
    gzip: gzipSync(body).length,
    brotli: brotliCompressSync(body, { params: { [constants.BROTLI_PARAM_QUALITY]: BROTLI_QUALITY } }).length,
  };
}

const kB = (bytes: number) => `${(bytes / 1000).toFixed(1)} kB`;

if (!process.argv.includes('--no-build')) {
  console.log('building the site (astro build)…');
  execFileSync('npx', ['astro', 'build'], { stdio: ['ignore', 'ignore', 'inherit'] });
}
if (!existsSync(path.join(CLIENT, 'estimate', 'index.html'))) throw new Error('No built site in dist/client: run without --no-build.');

const weight = initialJavaScript(CLIENT, 'estimate/index.html');
for (const f of weight.files) console.log(`${kB(f.gzipBytes).padStart(9)}  ${f.url}`);
console.log(`${kB(weight.totalGzipBytes).padStart(9)}  gzip, initial JavaScript of /estimate (target ≤ ${JS_TARGET_KB} kB: ${weight.totalGzipBytes <= JS_TARGET_KB * 1000 ? 'met' : 'missed'})`);

const served = await serveClient();
try {
  const times = await timeToAnswer(served.url);
  const ratio = times.estimate / times.home;
  console.log(`\nat ${CPU_SLOWDOWN}× CPU slowdown, 390 px wide, served compressed, median of ${LOADS} loads each:`);
  console.log(`  home page answers after      ${times.home.toFixed(0)} ms (load event; it runs no JavaScript)`);
  console.log(`  estimate page answers after  ${times.estimate.toFixed(0)} ms (form hydrated, first step drawn)`);
  console.log(`  ratio                        ${ratio.toFixed(2)}× (target ≤ ${RATIO_TARGET}×: ${ratio <= RATIO_TARGET ? 'met' : 'missed'})`);
} finally {
  served.close();
}

const answer = estimateAnswerBytes();
console.log(`\n50-run estimate answer: ${kB(answer.raw)} raw, ${kB(answer.gzip)} gzip, ${kB(answer.brotli)} brotli (quality ${BROTLI_QUALITY}, as the server sends it)`);
