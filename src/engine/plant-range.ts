import { J_PER_GJ, SECONDS_PER_HOUR } from './annual-figures';
import { HOURS_PER_YEAR } from './physical-constants';
import type { ParsedPlantInput } from './plant-input';
import type { PlantResult, Range } from './plant-result';
import type { SampleTerms } from './run-estimate';
import { CONFIDENCE_SPREADS, nextDraw, quantileSorted, seedDraws, triangularFactor, type Confidence } from './uncertainty';

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
 * (code after a hot loop that has never run would throw the loop's optimised code away on
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
  // Column by column in typed arrays held in locals: the inner loop runs samples × runs times.
  const runCount = terms.length;
  // Plain loops, no per-call closures: optimised code that held a closure made here would be
  // thrown away by the next full collection, and the loop below run unoptimised again.
  const lengthMCol = new Float64Array(runCount);
  const lengthSpreadCol = new Float64Array(runCount);
  const hoursCol = new Float64Array(runCount);
  const costPerJHeatCol = new Float64Array(runCount);
  const co2PerJHeatCol = new Float64Array(runCount);
  const currentBareWPerMCol = new Float64Array(runCount);
  const currentInsulatedWPerMCol = new Float64Array(runCount);
  const bareFractionCol = new Float64Array(runCount);
  const bareFractionSpreadCol = new Float64Array(runCount);
  const currentFittingsBareWCol = new Float64Array(runCount);
  const currentFittingsInsulatedWCol = new Float64Array(runCount);
  const proposedBareWPerMCol = new Float64Array(runCount);
  const proposedInsulatedWPerMCol = new Float64Array(runCount);
  const proposedBareFractionCol = new Float64Array(runCount);
  const proposedFittingsBareWCol = new Float64Array(runCount);
  const proposedFittingsInsulatedWCol = new Float64Array(runCount);
  const bareAirCol = new Float64Array(runCount);
  const airSpreadCol = new Float64Array(runCount);
  const bareSpeedCol = new Float64Array(runCount);
  const speedSpreadCol = new Float64Array(runCount);
  const bareEmittanceCol = new Float64Array(runCount);
  const emittanceSpreadCol = new Float64Array(runCount);
  const insulatedAirCol = new Float64Array(runCount);
  const conditionSpreadCol = new Float64Array(runCount);
  const installedPerMetreCol = new Float64Array(runCount);
  const installedFixedCol = new Float64Array(runCount);
  const priceSpreadCol = new Float64Array(runCount);
  const coldCol = new Uint8Array(runCount);
  for (let r = 0; r < runCount; r++) {
    const t = terms[r] as SampleTerms;
    lengthMCol[r] = t.lengthM;
    lengthSpreadCol[r] = t.lengthSpread;
    hoursCol[r] = t.hours;
    costPerJHeatCol[r] = t.costPerJHeat;
    co2PerJHeatCol[r] = t.co2PerJHeat;
    currentBareWPerMCol[r] = t.currentBareWPerM;
    currentInsulatedWPerMCol[r] = t.currentInsulatedWPerM;
    bareFractionCol[r] = t.bareFraction;
    bareFractionSpreadCol[r] = t.bareFractionSpread;
    currentFittingsBareWCol[r] = t.currentFittingsBareW;
    currentFittingsInsulatedWCol[r] = t.currentFittingsInsulatedW;
    proposedBareWPerMCol[r] = t.proposedBareWPerM;
    proposedInsulatedWPerMCol[r] = t.proposedInsulatedWPerM;
    proposedBareFractionCol[r] = t.proposedBareFraction;
    proposedFittingsBareWCol[r] = t.proposedFittingsBareW;
    proposedFittingsInsulatedWCol[r] = t.proposedFittingsInsulatedW;
    bareAirCol[r] = t.bareSensitivityPerK;
    airSpreadCol[r] = t.airSpreadK;
    bareSpeedCol[r] = t.bareSensitivityPerMPerS;
    speedSpreadCol[r] = t.speedSpreadMPerS;
    bareEmittanceCol[r] = t.bareSensitivityPerEmittance;
    emittanceSpreadCol[r] = t.emittanceSpread;
    insulatedAirCol[r] = t.insulatedSensitivityPerK;
    conditionSpreadCol[r] = t.conditionSpread;
    installedPerMetreCol[r] = t.installedPerMetre;
    installedFixedCol[r] = t.installedFixed;
    priceSpreadCol[r] = t.priceSpread;
    coldCol[r] = t.cold ? 1 : 0;
  }
  for (let s = 0; s < n; s++) {
    const hoursFactor = triangularFactor(hoursSpread, nextDraw());
    const fuelFactor = triangularFactor(priceSpread, nextDraw());
    // The efficiency cannot pass 1, so its factor is capped where it would.
    const efficiencyFactor = Math.min(triangularFactor(efficiencySpread, nextDraw()), 1 / boilerEfficiency);
    // Shared by every run of the sample: the air, the surfaces and the prices err together.
    const airOffset = triangularFactor(1, nextDraw()) - 1;
    const speedOffset = triangularFactor(1, nextDraw()) - 1;
    const emittanceOffset = triangularFactor(1, nextDraw()) - 1;
    const conditionOffset = triangularFactor(1, nextDraw()) - 1;
    const priceOffset = triangularFactor(1, nextDraw()) - 1;
    let currentCost = 0;
    let currentHeat = 0;
    let currentCo2 = 0;
    let proposedCost = 0;
    let proposedHeat = 0;
    let proposedCo2 = 0;
    let installed = 0;
    for (let r = 0; r < runCount; r++) {
      const length = lengthMCol[r]! * triangularFactor(lengthSpreadCol[r]!, nextDraw());
      const bareFractionSpread = bareFractionSpreadCol[r]!;
      const fraction =
        bareFractionSpread > 0 ? Math.min(1, Math.max(0, bareFractionCol[r]! * triangularFactor(bareFractionSpread, nextDraw()))) : bareFractionCol[r]!;
      const airSpread = airSpreadCol[r]!;
      const bareFactor = Math.max(
        0,
        1 + bareAirCol[r]! * airOffset * airSpread + bareSpeedCol[r]! * speedOffset * speedSpreadCol[r]! + bareEmittanceCol[r]! * emittanceOffset * emittanceSpreadCol[r]!,
      );
      const insulatedFactor = Math.max(0, 1 + insulatedAirCol[r]! * airOffset * airSpread);
      const conditionFactor = 1 + conditionOffset * conditionSpreadCol[r]!;
      const seconds = Math.min(HOURS_PER_YEAR, hoursCol[r]! * hoursFactor) * SECONDS_PER_HOUR;
      const currentW =
        length * (fraction * currentBareWPerMCol[r]! * bareFactor + (1 - fraction) * currentInsulatedWPerMCol[r]! * insulatedFactor * conditionFactor) +
        currentFittingsBareWCol[r]! * bareFactor +
        currentFittingsInsulatedWCol[r]! * insulatedFactor;
      const proposedBareFraction = proposedBareFractionCol[r]!;
      const proposedW =
        length * (proposedBareFraction * proposedBareWPerMCol[r]! * bareFactor + (1 - proposedBareFraction) * proposedInsulatedWPerMCol[r]! * insulatedFactor) +
        proposedFittingsBareWCol[r]! * bareFactor +
        proposedFittingsInsulatedWCol[r]! * insulatedFactor;
      const currentJ = currentW * seconds;
      const proposedJ = proposedW * seconds;
      const cold = coldCol[r] === 1;
      const perJCost = cold ? costPerJHeatCol[r]! * fuelFactor : (costPerJHeatCol[r]! * fuelFactor) / efficiencyFactor;
      const perJCo2 = cold ? co2PerJHeatCol[r]! : co2PerJHeatCol[r]! / efficiencyFactor;
      currentCost += currentJ * perJCost;
      currentHeat += currentJ;
      currentCo2 += currentJ * perJCo2;
      proposedCost += proposedJ * perJCost;
      proposedHeat += proposedJ;
      proposedCo2 += proposedJ * perJCo2;
      installed += (installedPerMetreCol[r]! * length + installedFixedCol[r]!) * (1 + priceOffset * priceSpreadCol[r]!);
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
