/**
 * Engine benchmark (`npm run bench`): median µs per solveRun for a bare and a
 * two-layer insulated run, and ms per estimatePlant for a 200-run plant with the
 * economic-thickness search and the low/likely/high range. Prints figures only;
 * no test depends on timing. The plant is an invented one (a creamery in the
 * made-up town of Wrenfold).
 */
import { estimatePlant, solveRun, type PlantInput, type RunInput } from '../src/engine/index';

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = Math.floor(sorted.length / 2);
  return sorted.length % 2 ? (sorted[mid] as number) : ((sorted[mid - 1] as number) + (sorted[mid] as number)) / 2;
}

/** Median over batches of the per-call time, µs; varies the input slightly so nothing is cached. */
function microsecondsPerCall(make: (i: number) => RunInput, batches = 25, perBatch = 4000): number {
  const inputs = Array.from({ length: 64 }, (_, i) => make(i));
  let sink = 0;
  for (let i = 0; i < 20000; i++) sink += solveRun(inputs[i % 64] as RunInput).heatLossWPerM;
  const times: number[] = [];
  for (let b = 0; b < batches; b++) {
    const start = performance.now();
    for (let i = 0; i < perBatch; i++) sink += solveRun(inputs[i % 64] as RunInput).heatLossWPerM;
    times.push(((performance.now() - start) * 1000) / perBatch);
  }
  if (!Number.isFinite(sink)) throw new Error('non-finite result in bench');
  return median(times);
}

const bare = (i: number): RunInput => ({
  pipe: { standard: 'ASME-B36.10M', size: ['1', '2', '4', '6'][i % 4] as string, schedule: '40', material: 'carbon-steel' },
  steam: { gaugePressureKPa: 500 + i * 5 },
  ambientTemperatureC: 20,
});

const twoLayer = (i: number): RunInput => ({
  pipe: { standard: 'ASME-B36.10M', size: ['1', '2', '4', '6'][i % 4] as string, schedule: '40', material: 'carbon-steel' },
  steam: { gaugePressureKPa: 500 + i * 5 },
  ambientTemperatureC: 20,
  surface: 'aluminium-jacket',
  insulation: [
    { thicknessM: 0.04, material: 'calcium-silicate' },
    { thicknessM: 0.03, material: 'mineral-wool' },
  ],
});

const SERVICES = ['steam', 'condensate-return', 'hot-water', 'cip-supply', 'cip-return', 'chilled-water', 'glycol'] as const;
const SIZES = ['1/2', '3/4', '1', '1-1/2', '2', '3', '4', '6'];

function plant(): PlantInput {
  return {
    label: 'Wrenfold Creamery (invented)',
    operatingHoursPerYear: 5200,
    energy: { fuel: 'natural-gas', price: 1.1, priceUnit: 'therm', electricityPricePerKWh: 0.14 },
    runs: Array.from({ length: 200 }, (_, i) => {
      const service = SERVICES[i % SERVICES.length] as (typeof SERVICES)[number];
      const state = i % 3 === 0 ? { state: 'bare' as const } : i % 3 === 1 ? { state: 'damaged' as const, bareFraction: 0.3 } : { state: 'insulated' as const, material: service === 'chilled-water' || service === 'glycol' ? 'flexible-elastomeric' as const : 'mineral-wool' as const, thicknessM: 0.025 };
      return {
        id: `run-${i}`,
        label: `Run ${i}`,
        service,
        pipe: { standard: 'ASME-B36.10M', size: SIZES[i % SIZES.length] as string, schedule: '40' },
        lengthM: 5 + (i % 17) * 3,
        lengthConfidence: i % 4 === 0 ? ('guessed' as const) : ('estimated' as const),
        ...(service === 'steam' ? { steamGaugePressureKPa: 300 + (i % 5) * 150 } : {}),
        ambient: i % 5 === 0 ? { kind: 'outdoor' as const } : i % 5 === 1 ? { kind: 'indoor-draughty' as const } : { kind: 'indoor-still' as const },
        current: state,
        valves: i % 3,
        flangePairs: i % 4,
      };
    }),
  };
}

const bareUs = microsecondsPerCall(bare);
const twoLayerUs = microsecondsPerCall(twoLayer);

const plantInput = plant();
for (let i = 0; i < 5; i++) estimatePlant(plantInput);
const plantTimes: number[] = [];
let solves = 0;
for (let i = 0; i < 15; i++) {
  const start = performance.now();
  const result = estimatePlant(plantInput);
  plantTimes.push(performance.now() - start);
  solves = result.runs.reduce((n, r) => n + r.thicknessSeries.length + (r.current.state === 'bare' ? 1 : 2), 0);
}

console.log(`solveRun, bare steam run:            ${bareUs.toFixed(2)} µs (median)`);
console.log(`solveRun, two-layer insulated run:   ${twoLayerUs.toFixed(2)} µs (median)`);
console.log(`estimatePlant, 200 runs (${solves} solves, thickness search, ${plantInput.range?.samples ?? 400} range samples): ${median(plantTimes).toFixed(1)} ms (median of ${plantTimes.length})`);
