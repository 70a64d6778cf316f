/**
 * Engine benchmark (`npm run bench`): bundles the engine the way the server gets it (esbuild,
 * one ESM file) and times that bundle beside a baseline bundled the same way in the same run —
 * the engine as it stood at BENCH_BASELINE (a git ref, default e05611b: the engine before the
 * issue-9 judgment work), taken with `git archive` into a temp folder. Prints per figure the
 * new value, the baseline and their ratio, plus allocation and GC time per 200-run plant.
 * No test depends on timing. The plant is an invented one (a creamery in the made-up town of
 * Wrenfold), in the request shape both engines accept.
 */
import { execFileSync } from 'node:child_process';
import { mkdirSync, rmSync } from 'node:fs';
import os from 'node:os';
import { join, resolve } from 'node:path';
import { PerformanceObserver } from 'node:perf_hooks';
import { pathToFileURL } from 'node:url';
import { build } from 'esbuild';

const root = resolve(import.meta.dirname, '..');
// In the child started below (a young generation too large to collect during one call), only allocations are measured.
const allocationChild = process.env.LAGWISE_BENCH_ALLOCATIONS === '1';
const baselineRef = process.env.BENCH_BASELINE ?? 'e05611b';
const work = join(root, 'node_modules', '.cache', 'lagwise-bench');
if (!allocationChild) {
  rmSync(work, { recursive: true, force: true });
  mkdirSync(join(work, 'baseline'), { recursive: true });
  execFileSync('sh', ['-c', `git -C "${root}" archive ${baselineRef} src/engine | tar -x -C "${join(work, 'baseline')}"`]);
}

async function bundle(entry: string, out: string): Promise<string> {
  await build({ entryPoints: [entry], bundle: true, format: 'esm', platform: 'node', target: 'node20', outfile: out, external: ['zod'], logLevel: 'error' });
  return out;
}

type Engine = {
  solveRun: (input: unknown) => { heatLossWPerM: number };
  estimatePlant: (input: unknown, options?: unknown) => { runs: readonly unknown[]; totals: { installedCost: number } };
};

const newPath = allocationChild ? join(work, 'new.mjs') : await bundle(join(root, 'src/engine/index.ts'), join(work, 'new.mjs'));
const basePath = allocationChild ? join(work, 'base.mjs') : await bundle(join(work, 'baseline/src/engine/index.ts'), join(work, 'base.mjs'));
const engines: Record<'new' | 'baseline', Engine> = {
  new: (await import(pathToFileURL(newPath).href)) as Engine,
  baseline: (await import(pathToFileURL(basePath).href)) as Engine,
};

/**
 * CPU time of this process, ms (user + system): on a machine shared with other work, wall
 * time counts the waits too; CPU time counts only the engine's own work.
 */
function cpuMs(): number {
  const usage = process.cpuUsage();
  return (usage.user + usage.system) / 1000;
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = Math.floor(sorted.length / 2);
  return sorted.length % 2 ? (sorted[mid] as number) : ((sorted[mid - 1] as number) + (sorted[mid] as number)) / 2;
}

const SIZES4 = ['1', '2', '4', '6'];
const bare = (i: number) => ({ pipe: { standard: 'ASME-B36.10M', size: SIZES4[i % 4], schedule: '40', material: 'carbon-steel' }, steam: { gaugePressureKPa: 500 + i * 5 }, ambientTemperatureC: 20 });
const twoLayer = (i: number) => ({ ...bare(i), surface: 'aluminium-jacket', insulation: [{ thicknessM: 0.04, material: 'calcium-silicate' }, { thicknessM: 0.03, material: 'mineral-wool' }] });

/** Median over batches of the per-call time, µs; varies the input slightly so nothing is cached. */
function microsecondsPerCall(engine: Engine, make: (i: number) => unknown, batches = 25, perBatch = 4000): number {
  const inputs = Array.from({ length: 64 }, (_, i) => make(i));
  let sink = 0;
  for (let i = 0; i < 20000; i++) sink += engine.solveRun(inputs[i % 64]).heatLossWPerM;
  const times: number[] = [];
  for (let b = 0; b < batches; b++) {
    const start = cpuMs();
    for (let i = 0; i < perBatch; i++) sink += engine.solveRun(inputs[i % 64]).heatLossWPerM;
    times.push(((cpuMs() - start) * 1000) / perBatch);
  }
  if (!Number.isFinite(sink)) throw new Error('non-finite result in bench');
  return median(times);
}

const SERVICES = ['steam', 'condensate-return', 'hot-water', 'cip-supply', 'cip-return', 'chilled-water', 'glycol'] as const;
const SIZES = ['1/2', '3/4', '1', '1-1/2', '2', '3', '4', '6'];
function plant() {
  return {
    label: 'Wrenfold Creamery (invented)',
    operatingHoursPerYear: 5200,
    energy: { fuel: 'natural-gas', price: 1.1, priceUnit: 'therm', electricityPricePerKWh: 0.14 },
    runs: Array.from({ length: 200 }, (_, i) => {
      const service = SERVICES[i % SERVICES.length] as (typeof SERVICES)[number];
      const cold = service === 'chilled-water' || service === 'glycol';
      const current = i % 3 === 0 ? { state: 'bare' } : i % 3 === 1 ? { state: 'damaged', bareFraction: 0.3 } : { state: 'insulated', material: cold ? 'flexible-elastomeric' : 'mineral-wool', thicknessM: 0.025 };
      return {
        id: `run-${i}`,
        label: `Run ${i}`,
        service,
        pipe: { standard: 'ASME-B36.10M', size: SIZES[i % SIZES.length], schedule: '40' },
        lengthM: 5 + (i % 17) * 3,
        lengthConfidence: i % 4 === 0 ? 'guessed' : 'estimated',
        ...(service === 'steam' ? { steamGaugePressureKPa: 300 + (i % 5) * 150 } : {}),
        ambient: i % 5 === 0 ? { kind: 'outdoor' } : i % 5 === 1 ? { kind: 'indoor-draughty' } : { kind: 'indoor-still' },
        current,
        valves: i % 3,
        flangePairs: i % 4,
      };
    }),
  };
}

const gcDurations: number[] = [];
const observer = new PerformanceObserver((list) => {
  for (const entry of list.getEntries()) gcDurations.push(entry.duration);
});
observer.observe({ entryTypes: ['gc'] });
const gc = (globalThis as { gc?: () => void }).gc;
if (!gc) throw new Error('Run the bench with node --expose-gc (npm run bench does).');
const tick = () => new Promise((resolve) => setTimeout(resolve, 0));

interface PlantFigures {
  ms: number;
  gcShare: number;
}

/**
 * Times the engines' estimatePlant (CPU time) interleaved, call by call, so a machine shared with other
 * work slows each alike; GC time is summed from the gc performance entries of each engine's calls.
 */
async function plantFigures(runs: { name: string; engine: Engine; options?: unknown }[], rounds = 21): Promise<PlantFigures[]> {
  const input = plant();
  for (const r of runs) for (let i = 0; i < 5; i++) r.engine.estimatePlant(input, r.options);
  const times = runs.map(() => [] as number[]);
  const gcTimes = runs.map(() => 0);
  const totals = runs.map(() => 0);
  const wall = runs.map(() => 0);
  for (let round = 0; round < rounds; round++) {
    for (let k = 0; k < runs.length; k++) {
      const r = runs[k] as (typeof runs)[number];
      await tick();
      gcDurations.length = 0;
      const t0 = cpuMs();
      const w0 = performance.now();
      r.engine.estimatePlant(input, r.options);
      const elapsed = cpuMs() - t0;
      wall[k] = (wall[k] as number) + performance.now() - w0;
      await tick();
      (times[k] as number[]).push(elapsed);
      totals[k] = (totals[k] as number) + elapsed;
      gcTimes[k] = (gcTimes[k] as number) + gcDurations.reduce((a, b) => a + b, 0);
    }
  }
  return runs.map((_r, k) => ({ ms: median(times[k] as number[]), gcShare: (gcTimes[k] as number) / (wall[k] as number) }));
}

/**
 * MB allocated by one estimatePlant: heap growth after a full GC, with no collection possible
 * in between; the least of several calls, so code the optimiser happens to compile meanwhile
 * does not count.
 */
function allocatedMB(engine: Engine, options?: unknown): number {
  const input = plant();
  for (let i = 0; i < 15; i++) engine.estimatePlant(input, options);
  const samples: number[] = [];
  for (let i = 0; i < 9; i++) {
    (gc as () => void)();
    const before = process.memoryUsage().heapUsed;
    engine.estimatePlant(input, options);
    samples.push((process.memoryUsage().heapUsed - before) / 1e6);
  }
  return Math.min(...samples);
}

if (allocationChild) {
  console.log(JSON.stringify({ full: allocatedMB(engines.new, { detail: 'full' }), summary: allocatedMB(engines.new, { detail: 'summary' }), baseline: allocatedMB(engines.baseline) }));
  process.exit(0);
}

const ratio = (a: number, b: number) => `${(a / b).toFixed(2)}×`;
const bareNew = microsecondsPerCall(engines.new, bare);
const bareBase = microsecondsPerCall(engines.baseline, bare);
const twoNew = microsecondsPerCall(engines.new, twoLayer);
const twoBase = microsecondsPerCall(engines.baseline, twoLayer);
const [plantNew, plantNewSummary, plantBase] = (await plantFigures(
  [
  { name: 'full', engine: engines.new, options: { detail: 'full' } },
  { name: 'summary', engine: engines.new, options: { detail: 'summary' } },
  { name: 'baseline', engine: engines.baseline },
  ],
  41,
)) as [PlantFigures, PlantFigures, PlantFigures];
observer.disconnect();

const allocation = JSON.parse(
  execFileSync(process.execPath, ['--expose-gc', '--min-semi-space-size=256', '--max-semi-space-size=256', '--import', 'tsx', join(root, 'scripts/bench.ts')], {
    env: { ...process.env, LAGWISE_BENCH_ALLOCATIONS: '1' },
    encoding: 'utf8',
  }).trim().split('\n').at(-1) as string,
) as { full: number; summary: number; baseline: number };
const mb = (x: number) => `${x.toFixed(1)} MB`;
console.log(`bundled engine (esbuild) vs baseline ${baselineRef}, same run, node ${process.version}, load average ${os.loadavg().map((x) => x.toFixed(1)).join(' ')}`);
console.log('times are CPU time of this process (median), so other work on the machine does not count');
console.log(`solveRun, bare steam run:           ${bareNew.toFixed(2)} µs   baseline ${bareBase.toFixed(2)} µs   ratio ${ratio(bareNew, bareBase)}   (target ≤ 5 µs)`);
console.log(`solveRun, two-layer insulated run:  ${twoNew.toFixed(2)} µs   baseline ${twoBase.toFixed(2)} µs   ratio ${ratio(twoNew, twoBase)}`);
console.log(`estimatePlant, 200 runs, options + range + thickness searches, full detail: ${plantNew.ms.toFixed(1)} ms   baseline ${plantBase.ms.toFixed(1)} ms   ratio ${ratio(plantNew.ms, plantBase.ms)}   (target ≤ 20 ms)`);
console.log(`estimatePlant, 200 runs, summary detail (what /api/estimate answers): ${plantNewSummary.ms.toFixed(1)} ms   ratio to baseline ${ratio(plantNewSummary.ms, plantBase.ms)}`);
console.log(`allocated per 200-run plant: ${mb(allocation.full)} full, ${mb(allocation.summary)} summary   baseline ${mb(allocation.baseline)}`);
console.log(`GC share of plant time: ${(plantNew.gcShare * 100).toFixed(1)} % full, ${(plantNewSummary.gcShare * 100).toFixed(1)} % summary   baseline ${(plantBase.gcShare * 100).toFixed(1)} %`);
