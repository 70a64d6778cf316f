import { J_PER_GJ, SECONDS_PER_HOUR } from './annual-figures';
import { HOURS_PER_YEAR } from './physical-constants';
import type { ParsedPlantInput } from './plant-input';
import type { PlantResult, Range } from './plant-result';
import type { SampleTerms } from './run-estimate';
import { CONFIDENCE_SPREADS, fillTriangularOffsets, quantileSorted, seedDraws, type Confidence } from './uncertainty';

/** The inputs the range samples, in words for the result. */
export const SAMPLED_INPUTS = [
  'run lengths (by their confidence)',
  'damaged share of damaged runs',
  'operating hours',
  'fuel price',
  'boiler efficiency',
  'installed price (demo table ±50 %, a consultant’s table ±20 %, a typed price ±5 %)',
  'air temperature (guessed ±5 K, estimated ±2 K, measured ±0.5 K)',
  'air speed',
  'bare-surface emittance (finish named ±0.1, assumed ±0.2)',
  'condition of insulation in place (±50 %, measured ±5 %)',
] as const;

/**
 * Seeded Monte Carlo over the uncertain inputs: triangular spreads by confidence, with the
 * air, surface and price factors shared by every run of a sample (they err together), and
 * lengths drawn run by run. Air temperature, air speed and emittance act through each run's
 * own sensitivities, taken by finite differences at the average air.
 */
export function sampleRanges(
  plant: ParsedPlantInput,
  terms: readonly SampleTerms[],
  likely: PlantResult['totals'],
  boilerEfficiency: number,
  boilerConfidence: Confidence,
): PlantResult['range'] {
  const n = plant.range.samples;
  const out: SampleColumns = {
    currentCost: new Float64Array(n),
    currentHeatGJ: new Float64Array(n),
    currentCo2: new Float64Array(n),
    saving: new Float64Array(n),
    heatSavingGJ: new Float64Array(n),
    co2Saving: new Float64Array(n),
    installed: new Float64Array(n),
    payback: new Float64Array(n),
  };
  drawSamples(
    out,
    terms,
    plant.range.seed,
    CONFIDENCE_SPREADS[plant.operatingHoursConfidence],
    CONFIDENCE_SPREADS[plant.energy.priceConfidence],
    CONFIDENCE_SPREADS[boilerConfidence],
    boilerEfficiency,
  );
  const range = (values: Float64Array, point: number): Range => {
    values.sort();
    return { low: quantileSorted(values, 0.1), likely: point, high: quantileSorted(values, 0.9) };
  };
  const payback = range(out.payback, likely.simplePaybackYears ?? Number.POSITIVE_INFINITY);
  return {
    samples: n,
    seed: plant.range.seed,
    currentAnnualCost: range(out.currentCost, likely.current.annualCost),
    currentAnnualHeatGJ: range(out.currentHeatGJ, likely.current.annualHeatGJ),
    currentAnnualCo2Kg: range(out.currentCo2, likely.current.annualCo2Kg),
    annualCostSaving: range(out.saving, likely.savings.annualCost),
    annualHeatSavingGJ: range(out.heatSavingGJ, likely.savings.annualHeatGJ),
    annualCo2SavingKg: range(out.co2Saving, likely.savings.annualCo2Kg),
    installedCost: range(out.installed, likely.installedCost),
    simplePaybackYears:
      Number.isFinite(payback.low) && Number.isFinite(payback.high) && Number.isFinite(payback.likely) ? payback : null,
    sampled: SAMPLED_INPUTS,
  };
}

// Offsets of a run's terms in its record of the sampling loop's one typed array.
const LENGTH_M = 0;
const LENGTH_SPREAD = 1;
const HOURS = 2;
const COST_PER_J = 3;
const CO2_PER_J = 4;
const CURRENT_BARE_W_PER_M = 5;
const CURRENT_INSULATED_W_PER_M = 6;
const BARE_FRACTION = 7;
const BARE_FRACTION_SPREAD = 8;
const CURRENT_FITTINGS_BARE_W = 9;
const CURRENT_FITTINGS_INSULATED_W = 10;
const PROPOSED_BARE_W_PER_M = 11;
const PROPOSED_INSULATED_W_PER_M = 12;
const PROPOSED_BARE_FRACTION = 13;
const PROPOSED_FITTINGS_BARE_W = 14;
const PROPOSED_FITTINGS_INSULATED_W = 15;
const BARE_PER_K = 16;
const AIR_SPREAD_K = 17;
const BARE_PER_M_PER_S = 18;
const SPEED_SPREAD = 19;
const BARE_PER_EMITTANCE = 20;
const EMITTANCE_SPREAD = 21;
const INSULATED_PER_K = 22;
const CONDITION_SPREAD = 23;
const INSTALLED_PER_M = 24;
const INSTALLED_FIXED = 25;
const PRICE_SPREAD = 26;
const COLD = 27;
const RUN_RECORD = 28;
/** Draws of a sample shared by every run: hours, fuel price, boiler efficiency, air, air speed, emittance, condition, installed price. */
const SHARED_DRAWS = 8;

/** One figure per sample, filled by {@link drawSamples}. */
interface SampleColumns {
  readonly currentCost: Float64Array;
  readonly currentHeatGJ: Float64Array;
  readonly currentCo2: Float64Array;
  readonly saving: Float64Array;
  readonly heatSavingGJ: Float64Array;
  readonly co2Saving: Float64Array;
  readonly installed: Float64Array;
  readonly payback: Float64Array;
}

/**
 * The samples themselves, written into `out`. A function of its own that ends with its loop
 * (code after a hot loop that has never run would throw the loop's optimized code away on
 * every estimate) and reads no parsed input (the shapes of objects the parser made die with
 * them, and a full collection would throw away code that knew them).
 */
function drawSamples(
  out: SampleColumns,
  terms: readonly SampleTerms[],
  seed: number,
  hoursSpread: number,
  priceSpread: number,
  efficiencySpread: number,
  boilerEfficiency: number,
): void {
  const n = out.currentCost.length;
  seedDraws(seed);
  const currentCostS = out.currentCost;
  const currentHeatS = out.currentHeatGJ;
  const currentCo2S = out.currentCo2;
  const savingS = out.saving;
  const heatSavingS = out.heatSavingGJ;
  const co2SavingS = out.co2Saving;
  const installedS = out.installed;
  const paybackS = out.payback;
  // One record of numbers per run in a single typed array: the inner loop runs samples × runs
  // times, and one array (one bounds check, one base pointer) serves all of a run's terms.
  const runCount = terms.length;
  // Plain loops, no per-call closures: optimized code that held a closure made here would be
  // thrown away by the next full collection, and the loop below run unoptimized again.
  const runs = new Float64Array(runCount * RUN_RECORD);
  for (let r = 0; r < runCount; r++) {
    const t = terms[r] as SampleTerms;
    const o = r * RUN_RECORD;
    runs[o + LENGTH_M] = t.lengthM;
    runs[o + LENGTH_SPREAD] = t.lengthSpread;
    runs[o + HOURS] = t.hours;
    runs[o + COST_PER_J] = t.costPerJHeat;
    runs[o + CO2_PER_J] = t.co2PerJHeat;
    runs[o + CURRENT_BARE_W_PER_M] = t.currentBareWPerM;
    runs[o + CURRENT_INSULATED_W_PER_M] = t.currentInsulatedWPerM;
    runs[o + BARE_FRACTION] = t.bareFraction;
    runs[o + BARE_FRACTION_SPREAD] = t.bareFractionSpread;
    runs[o + CURRENT_FITTINGS_BARE_W] = t.currentFittingsBareW;
    runs[o + CURRENT_FITTINGS_INSULATED_W] = t.currentFittingsInsulatedW;
    runs[o + PROPOSED_BARE_W_PER_M] = t.proposedBareWPerM;
    runs[o + PROPOSED_INSULATED_W_PER_M] = t.proposedInsulatedWPerM;
    runs[o + PROPOSED_BARE_FRACTION] = t.proposedBareFraction;
    runs[o + PROPOSED_FITTINGS_BARE_W] = t.proposedFittingsBareW;
    runs[o + PROPOSED_FITTINGS_INSULATED_W] = t.proposedFittingsInsulatedW;
    runs[o + BARE_PER_K] = t.bareSensitivityPerK;
    runs[o + AIR_SPREAD_K] = t.airSpreadK;
    runs[o + BARE_PER_M_PER_S] = t.bareSensitivityPerMPerS;
    runs[o + SPEED_SPREAD] = t.speedSpreadMPerS;
    runs[o + BARE_PER_EMITTANCE] = t.bareSensitivityPerEmittance;
    runs[o + EMITTANCE_SPREAD] = t.emittanceSpread;
    runs[o + INSULATED_PER_K] = t.insulatedSensitivityPerK;
    runs[o + CONDITION_SPREAD] = t.conditionSpread;
    runs[o + INSTALLED_PER_M] = t.installedPerMetre;
    runs[o + INSTALLED_FIXED] = t.installedFixed;
    runs[o + PRICE_SPREAD] = t.priceSpread;
    runs[o + COLD] = t.cold ? 1 : 0;
  }
  // Each sample draws the shared factors, then each run's length and (a damaged run) its bare share.
  let drawsPerSample = SHARED_DRAWS;
  for (let o = 0; o < runs.length; o += RUN_RECORD) drawsPerSample += runs[o + BARE_FRACTION_SPREAD]! > 0 ? 2 : 1;
  const offsets = new Float64Array(drawsPerSample);
  for (let s = 0; s < n; s++) {
    fillTriangularOffsets(offsets, drawsPerSample);
    const hoursFactor = 1 + hoursSpread * offsets[0]!;
    const fuelFactor = 1 + priceSpread * offsets[1]!;
    // The efficiency cannot pass 1, so its factor is capped where it would.
    const efficiencyFactor = Math.min(1 + efficiencySpread * offsets[2]!, 1 / boilerEfficiency);
    // Shared by every run of the sample: the air, the surfaces and the prices err together.
    const airOffset = 1 + offsets[3]! - 1;
    const speedOffset = 1 + offsets[4]! - 1;
    const emittanceOffset = 1 + offsets[5]! - 1;
    const conditionOffset = 1 + offsets[6]! - 1;
    const priceOffset = 1 + offsets[7]! - 1;
    let k = SHARED_DRAWS;
    let currentCost = 0;
    let currentHeat = 0;
    let currentCo2 = 0;
    let proposedCost = 0;
    let proposedHeat = 0;
    let proposedCo2 = 0;
    let installed = 0;
    for (let o = 0; o < runs.length; o += RUN_RECORD) {
      const length = runs[o + LENGTH_M]! * (1 + runs[o + LENGTH_SPREAD]! * offsets[k++]!);
      const bareFractionSpread = runs[o + BARE_FRACTION_SPREAD]!;
      const fraction =
        bareFractionSpread > 0 ? Math.min(1, Math.max(0, runs[o + BARE_FRACTION]! * (1 + bareFractionSpread * offsets[k++]!))) : runs[o + BARE_FRACTION]!;
      const airSpread = runs[o + AIR_SPREAD_K]!;
      const bareFactor = Math.max(
        0,
        1 + runs[o + BARE_PER_K]! * airOffset * airSpread + runs[o + BARE_PER_M_PER_S]! * speedOffset * runs[o + SPEED_SPREAD]! + runs[o + BARE_PER_EMITTANCE]! * emittanceOffset * runs[o + EMITTANCE_SPREAD]!,
      );
      const insulatedFactor = Math.max(0, 1 + runs[o + INSULATED_PER_K]! * airOffset * airSpread);
      const conditionFactor = 1 + conditionOffset * runs[o + CONDITION_SPREAD]!;
      const seconds = Math.min(HOURS_PER_YEAR, runs[o + HOURS]! * hoursFactor) * SECONDS_PER_HOUR;
      const currentW =
        length * (fraction * runs[o + CURRENT_BARE_W_PER_M]! * bareFactor + (1 - fraction) * runs[o + CURRENT_INSULATED_W_PER_M]! * insulatedFactor * conditionFactor) +
        runs[o + CURRENT_FITTINGS_BARE_W]! * bareFactor +
        runs[o + CURRENT_FITTINGS_INSULATED_W]! * insulatedFactor;
      const proposedBareFraction = runs[o + PROPOSED_BARE_FRACTION]!;
      const proposedW =
        length * (proposedBareFraction * runs[o + PROPOSED_BARE_W_PER_M]! * bareFactor + (1 - proposedBareFraction) * runs[o + PROPOSED_INSULATED_W_PER_M]! * insulatedFactor) +
        runs[o + PROPOSED_FITTINGS_BARE_W]! * bareFactor +
        runs[o + PROPOSED_FITTINGS_INSULATED_W]! * insulatedFactor;
      const currentJ = currentW * seconds;
      const proposedJ = proposedW * seconds;
      const cold = runs[o + COLD] === 1;
      const perJCost = cold ? runs[o + COST_PER_J]! * fuelFactor : (runs[o + COST_PER_J]! * fuelFactor) / efficiencyFactor;
      const perJCo2 = cold ? runs[o + CO2_PER_J]! : runs[o + CO2_PER_J]! / efficiencyFactor;
      currentCost += currentJ * perJCost;
      currentHeat += currentJ;
      currentCo2 += currentJ * perJCo2;
      proposedCost += proposedJ * perJCost;
      proposedHeat += proposedJ;
      proposedCo2 += proposedJ * perJCo2;
      installed += (runs[o + INSTALLED_PER_M]! * length + runs[o + INSTALLED_FIXED]!) * (1 + priceOffset * runs[o + PRICE_SPREAD]!);
    }
    currentCostS[s] = currentCost;
    currentHeatS[s] = currentHeat / J_PER_GJ;
    currentCo2S[s] = currentCo2;
    savingS[s] = currentCost - proposedCost;
    heatSavingS[s] = (currentHeat - proposedHeat) / J_PER_GJ;
    co2SavingS[s] = currentCo2 - proposedCo2;
    installedS[s] = installed;
    paybackS[s] = currentCost - proposedCost > 0 ? installed / (currentCost - proposedCost) : Number.POSITIVE_INFINITY;
  }
}
