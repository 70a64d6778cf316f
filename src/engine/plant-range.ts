import { J_PER_GJ, SECONDS_PER_HOUR } from './annual-figures';
import { HOURS_PER_YEAR } from './physical-constants';
import type { ParsedPlantInput } from './plant-input';
import type { PlantResult, Range } from './plant-result';
import type { SampleTerms } from './run-estimate';
import { CONFIDENCE_SPREADS, mulberry32, quantileSorted, triangularFactor, type Confidence } from './uncertainty';

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
  const random = mulberry32(plant.range.seed);
  const hoursSpread = CONFIDENCE_SPREADS[plant.operatingHoursConfidence];
  const priceSpread = CONFIDENCE_SPREADS[plant.energy.priceConfidence];
  const efficiencySpread = CONFIDENCE_SPREADS[boilerConfidence];
  const currentCostS = new Float64Array(n);
  const currentHeatS = new Float64Array(n);
  const currentCo2S = new Float64Array(n);
  const savingS = new Float64Array(n);
  const heatSavingS = new Float64Array(n);
  const co2SavingS = new Float64Array(n);
  const installedS = new Float64Array(n);
  const paybackS = new Float64Array(n);
  for (let s = 0; s < n; s++) {
    const hoursFactor = triangularFactor(hoursSpread, random());
    const fuelFactor = triangularFactor(priceSpread, random());
    // The efficiency cannot pass 1, so its factor is capped where it would.
    const efficiencyFactor = Math.min(triangularFactor(efficiencySpread, random()), 1 / boilerEfficiency);
    const uAir = random();
    const uSpeed = random();
    const uEmittance = random();
    const uCondition = random();
    const uPrice = random();
    let currentCost = 0;
    let currentHeat = 0;
    let currentCo2 = 0;
    let proposedCost = 0;
    let proposedHeat = 0;
    let proposedCo2 = 0;
    let installed = 0;
    for (const t of terms) {
      const length = t.lengthM * triangularFactor(t.lengthSpread, random());
      const fraction =
        t.bareFractionSpread > 0 ? Math.min(1, Math.max(0, t.bareFraction * triangularFactor(t.bareFractionSpread, random()))) : t.bareFraction;
      const dAir = (triangularFactor(1, uAir) - 1) * t.airSpreadK;
      const dSpeed = (triangularFactor(1, uSpeed) - 1) * t.speedSpreadMPerS;
      const dEmittance = (triangularFactor(1, uEmittance) - 1) * t.emittanceSpread;
      const bareFactor = Math.max(0, 1 + t.bareSensitivityPerK * dAir + t.bareSensitivityPerMPerS * dSpeed + t.bareSensitivityPerEmittance * dEmittance);
      const insulatedFactor = Math.max(0, 1 + t.insulatedSensitivityPerK * dAir);
      const conditionFactor = triangularFactor(t.conditionSpread, uCondition);
      const seconds = Math.min(HOURS_PER_YEAR, t.hours * hoursFactor) * SECONDS_PER_HOUR;
      const currentW =
        length * (fraction * t.currentBareWPerM * bareFactor + (1 - fraction) * t.currentInsulatedWPerM * insulatedFactor * conditionFactor) +
        t.currentFittingsBareW * bareFactor +
        t.currentFittingsInsulatedW * insulatedFactor;
      const proposedW =
        length * (t.proposedBareFraction * t.proposedBareWPerM * bareFactor + (1 - t.proposedBareFraction) * t.proposedInsulatedWPerM * insulatedFactor) +
        t.proposedFittingsBareW * bareFactor +
        t.proposedFittingsInsulatedW * insulatedFactor;
      const currentJ = currentW * seconds;
      const proposedJ = proposedW * seconds;
      const perJCost = t.cold ? t.costPerJHeat * fuelFactor : (t.costPerJHeat * fuelFactor) / efficiencyFactor;
      const perJCo2 = t.cold ? t.co2PerJHeat : t.co2PerJHeat / efficiencyFactor;
      currentCost += currentJ * perJCost;
      currentHeat += currentJ;
      currentCo2 += currentJ * perJCo2;
      proposedCost += proposedJ * perJCost;
      proposedHeat += proposedJ;
      proposedCo2 += proposedJ * perJCo2;
      installed += (t.installedPerMetre * length + t.installedFixed) * triangularFactor(t.priceSpread, uPrice);
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
  const range = (values: Float64Array, point: number): Range => {
    values.sort();
    return { low: quantileSorted(values, 0.1), likely: point, high: quantileSorted(values, 0.9) };
  };
  const payback = range(paybackS, likely.simplePaybackYears ?? Number.POSITIVE_INFINITY);
  return {
    samples: n,
    seed: plant.range.seed,
    currentAnnualCost: range(currentCostS, likely.current.annualCost),
    currentAnnualHeatGJ: range(currentHeatS, likely.current.annualHeatGJ),
    currentAnnualCo2Kg: range(currentCo2S, likely.current.annualCo2Kg),
    annualCostSaving: range(savingS, likely.savings.annualCost),
    annualHeatSavingGJ: range(heatSavingS, likely.savings.annualHeatGJ),
    annualCo2SavingKg: range(co2SavingS, likely.savings.annualCo2Kg),
    installedCost: range(installedS, likely.installedCost),
    simplePaybackYears:
      Number.isFinite(payback.low) && Number.isFinite(payback.high) && Number.isFinite(payback.likely) ? payback : null,
    sampled: SAMPLED_INPUTS,
  };
}
