/**
 * The report PDF's benchmark (`npm run bench`, last): the time to render a 50-run report's PDF
 * beside a baseline measured in the same run — the same report with one run — each the median
 * of several renders after a warm-up, wall time and this process's CPU time. Then whether the
 * web server stays responsive while a PDF renders: a scratch PostgreSQL cluster (.lagwise/bench)
 * and the built web server, GET /api/health timed while idle and while a second process renders
 * 50-run PDFs back to back, as the worker does when a report is sent. The plant is invented
 * (a creamery in the made-up town of Wrenfold). Nothing here is asserted; no test depends on it.
 */
import { spawn, spawnSync } from 'node:child_process';
import { existsSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { migrateDatabase } from '../src/db/migrate.ts';
import { estimatePlant, type PlantResult } from '../src/engine/index.ts';
import { renderReportPdf } from '../src/lib/reports/pdf/render.ts';
import type { ReportSource } from '../src/lib/reports/present.ts';
import { reportCompositionSchema } from '../src/schemas/reports.ts';
import { appUrl, loadConfig, projectRoot } from './stack/config.ts';
import { ensureDatabase, ensurePostgresInstalled, initCluster, startPostgres } from './stack/postgres.ts';
import { webServerSpec } from './stack/services.ts';
import { Supervisor } from './stack/supervisor.ts';
import { waitForHttp } from './stack/wait.ts';

const RENDER_ROUNDS = Number(process.env.BENCH_REPORT_ROUNDS ?? 7);
const HEALTH_SECONDS = Number(process.env.BENCH_REPORT_HEALTH_SECONDS ?? 8);

const steel = (size: string) => ({ standard: 'ASME-B36.10M', size, schedule: '40', material: 'carbon-steel' });
const stainless = (size: string) => ({ standard: 'ASME-B36.19M', size, schedule: '10S', material: 'stainless-steel' });
const SIZES = ['1/2', '3/4', '1', '1-1/2', '2', '3', '4'];

/** Run `i` of the invented plant: steam, condensate, hot water, CIP and glycol in turn, some bare, some worn. */
function run(i: number): Record<string, unknown> {
  const size = SIZES[i % SIZES.length]!;
  const kinds = [
    { service: 'steam', pipe: steel(size), steamGaugePressureKPa: 350 + (i % 4) * 120 },
    { service: 'condensate-return', pipe: steel(size), current: { state: 'damaged', bareFraction: 0.35, material: 'glass-fibre', thicknessM: 0.025 } },
    { service: 'hot-water', pipe: stainless(size), fluidTemperatureC: 70 + (i % 3) * 5 },
    { service: 'cip-supply', pipe: stainless(size), flangePairs: 2 },
    { service: 'glycol', pipe: stainless(size) },
  ];
  return { id: `run-${i + 1}`, label: `Line ${i + 1}, bay ${1 + (i % 6)}`, lengthM: 6 + (i % 9) * 4, valves: i % 3, ...kinds[i % kinds.length] };
}

function plantOf(runs: number): Record<string, unknown> {
  return {
    unitSystem: 'US',
    operatingHoursPerYear: 6000,
    energy: { fuel: 'natural-gas', price: 1.1, priceUnit: 'therm', currency: 'USD', boilerEfficiency: 0.8 },
    runs: Array.from({ length: runs }, (_, i) => run(i)),
  };
}

/** A sent version's source, as the worker hands it to the renderer. */
function sourceOf(runs: number): ReportSource {
  const plantInput = plantOf(runs);
  const result = estimatePlant(plantInput as never, { detail: 'summary' }) as PlantResult;
  return {
    result,
    composition: reportCompositionSchema.parse({
      introduction: 'Thank you for the walk round the plant on Thursday.',
      incentives: [{ text: 'Wrenfold gas utility efficiency rebate', amount: 1200 }],
      exclusions: ['Scaffolding above 4 m', 'Asbestos survey and removal'],
      findings: [{ kind: 'burn-point', runId: 'run-1', place: 'Header valve by the boiler door', surfaceTemperatureC: 151 }],
    }),
    plantInput,
    consultant: { name: 'Wren Tallowwood', firm: 'Tallowwood Thermal', email: 'wren@tallowwood-thermal.example', phone: '+1 503 555 0199' },
    plant: { name: 'Wrenfold Creamery', reference: 'LW-BENCH-50', unitSystem: 'US' },
    version: 1,
    sentAt: '2026-11-30T09:00:00.000Z',
    replacedBy: null,
    baseRevisionNumber: 1,
  };
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = Math.floor(sorted.length / 2);
  return sorted.length % 2 ? sorted[mid]! : (sorted[mid - 1]! + sorted[mid]!) / 2;
}

function percentile(values: number[], p: number): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)]!;
}

const cpuMs = () => {
  const usage = process.cpuUsage();
  return (usage.user + usage.system) / 1000;
};

async function renderOnce(source: ReportSource): Promise<{ wallMs: number; cpuMs: number; bytes: number; pages: number }> {
  const wall = performance.now();
  const cpu = cpuMs();
  const pdf = await renderReportPdf(source, { pageSize: 'LETTER', createdAt: new Date('2026-11-30T09:00:00Z') });
  return { wallMs: performance.now() - wall, cpuMs: cpuMs() - cpu, bytes: pdf.byteLength, pages: pdf.toString('latin1').match(/\/Type \/Page\b/g)?.length ?? 0 };
}

async function renderTimes(): Promise<void> {
  const small = sourceOf(1);
  const large = sourceOf(50);
  // Warm-up: fonts read and subset once, code compiled.
  await renderOnce(small);
  await renderOnce(large);
  const samples = { small: [] as Awaited<ReturnType<typeof renderOnce>>[], large: [] as Awaited<ReturnType<typeof renderOnce>>[] };
  for (let i = 0; i < RENDER_ROUNDS; i++) {
    samples.small.push(await renderOnce(small));
    samples.large.push(await renderOnce(large));
  }
  const wall = (s: typeof samples.small) => median(s.map((x) => x.wallMs));
  const cpu = (s: typeof samples.small) => median(s.map((x) => x.cpuMs));
  const last = (s: typeof samples.small) => s[s.length - 1]!;
  console.log(`\nReport PDF (@react-pdf/renderer, Manrope embedded), median of ${RENDER_ROUNDS} renders after a warm-up, node ${process.version}, load average ${os.loadavg().map((x) => x.toFixed(1)).join(' ')}`);
  console.log(`  baseline, 1-run report:  ${wall(samples.small).toFixed(0)} ms wall, ${cpu(samples.small).toFixed(0)} ms CPU   (${last(samples.small).pages} pages, ${(last(samples.small).bytes / 1024).toFixed(0)} kB)`);
  console.log(`  50-run report:           ${wall(samples.large).toFixed(0)} ms wall, ${cpu(samples.large).toFixed(0)} ms CPU   (${last(samples.large).pages} pages, ${(last(samples.large).bytes / 1024).toFixed(0)} kB)`);
  console.log(`  ratio 50-run / 1-run:    ${(wall(samples.large) / wall(samples.small)).toFixed(2)}× wall   (target: 50-run ≤ 2000 ms)`);
}

/** The child started below: renders 50-run PDFs back to back until killed, as a busy worker would. */
async function renderLoop(): Promise<void> {
  const large = sourceOf(50);
  let count = 0;
  for (;;) {
    await renderOnce(large);
    count += 1;
    process.stdout.write(`${count}\n`);
  }
}

async function healthLatency(url: string, seconds: number): Promise<number[]> {
  const samples: number[] = [];
  const end = performance.now() + seconds * 1000;
  while (performance.now() < end) {
    const start = performance.now();
    const response = await fetch(`${url}/api/health`);
    await response.arrayBuffer();
    if (!response.ok) throw new Error(`/api/health answered ${response.status}`);
    samples.push(performance.now() - start);
    await new Promise((r) => setTimeout(r, 20));
  }
  return samples;
}

function describe(label: string, samples: number[]): string {
  return `  ${label.padEnd(40)} ${String(samples.length).padStart(4)} requests   p50 ${percentile(samples, 50).toFixed(1).padStart(6)} ms   p95 ${percentile(samples, 95).toFixed(1).padStart(6)} ms   max ${Math.max(...samples).toFixed(1).padStart(6)} ms`;
}

async function responsiveness(): Promise<void> {
  const supervisor = new Supervisor();
  try {
    const config = await loadConfig('bench');
    const binDir = ensurePostgresInstalled();
    initCluster(binDir, config);
    await startPostgres(binDir, config, supervisor);
    await ensureDatabase(config, { fresh: true });
    const env = webServerSpec(config).env ?? {};
    await migrateDatabase(env.DATABASE_URL!, { migrationsFolder: path.join(projectRoot, 'drizzle'), retryDelaySeconds: 1 });
    if (!existsSync(path.join(projectRoot, 'dist', 'server', 'entry.mjs'))) {
      console.log('  (building the site for the web server: astro build)');
      const built = spawnSync('npx', ['astro', 'build'], { cwd: projectRoot, stdio: 'ignore', env: { ...process.env, ASTRO_TELEMETRY_DISABLED: '1' } });
      if (built.status !== 0) throw new Error('astro build failed');
    }
    supervisor.start({ ...webServerSpec(config), logFile: path.join(config.stateDir, 'web.log') });
    const url = appUrl(config);
    await waitForHttp(`${url}/api/health`, { timeoutMs: 60_000 });
    await healthLatency(url, 1);
    const idle = await healthLatency(url, HEALTH_SECONDS);
    const child = spawn(process.execPath, ['--import', 'tsx', path.join(projectRoot, 'scripts', 'bench-report.ts'), '--render-loop'], { cwd: projectRoot, stdio: ['ignore', 'pipe', 'inherit'] });
    let rendered = 0;
    child.stdout.on('data', (chunk: Buffer) => {
      rendered = Number(chunk.toString().trim().split('\n').pop()) || rendered;
    });
    // Started rendering (its modules loaded) before timing begins.
    while (rendered === 0) await new Promise((r) => setTimeout(r, 100));
    const busy = await healthLatency(url, HEALTH_SECONDS);
    const before = rendered;
    child.kill('SIGTERM');
    console.log(`\nWeb server while a PDF renders in another process (as the worker renders it), GET /api/health every 20 ms for ${HEALTH_SECONDS} s, ${os.cpus().length} cores, load average ${os.loadavg().map((x) => x.toFixed(1)).join(' ')}`);
    console.log(describe('idle', idle));
    console.log(describe(`while 50-run PDFs render (${before - 1}+ done)`, busy));
    console.log(`  ratio p95 busy / idle: ${(percentile(busy, 95) / percentile(idle, 95)).toFixed(2)}×`);
  } finally {
    await supervisor.stopAll();
  }
}

if (process.env.BENCH_REPORT_SAVE) {
  // For looking at: the 50-run report's PDF, saved where asked.
  writeFileSync(process.env.BENCH_REPORT_SAVE, await renderReportPdf(sourceOf(50), { pageSize: 'LETTER', createdAt: new Date('2026-11-30T09:00:00Z') }));
} else if (process.argv.includes('--render-loop')) {
  await renderLoop();
} else {
  await renderTimes();
  if (!process.argv.includes('--render-times-only')) await responsiveness();
}
