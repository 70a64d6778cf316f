import { J_PER_GJ, SECONDS_PER_HOUR } from './annual-figures';
import { HOURS_PER_YEAR } from './physical-constants';
import type { ParsedPlantInput } from './plant-input';
import type { PlantResult, Range } from './plant-result';
import type { SampleTerms } from './run-estimate';
import { CONFIDENCE_SPREADS, Mulberry32, quantileSorted, triangularFactor, type Confidence } from './uncertainty';

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
  const generator = new Mulberry32(plant.range.seed);
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
  // Column by column in typed arrays held in locals: the inner loop runs samples × runs times.
  const runCount = terms.length;
  const column = (pick: (t: SampleTerms) => number) => Float64Array.from(terms, pick);
  const lengthMCol = column((t) => t.lengthM);
  const lengthSpreadCol = column((t) => t.lengthSpread);
  const hoursCol = column((t) => t.hours);
  const coldCol = Uint8Array.from(terms, (t) => (t.cold ? 1 : 0));
  const costPerJHeatCol = column((t) => t.costPerJHeat);
  const co2PerJHeatCol = column((t) => t.co2PerJHeat);
  const currentBareWPerMCol = column((t) => t.currentBareWPerM);
  const currentInsulatedWPerMCol = column((t) => t.currentInsulatedWPerM);
  const bareFractionCol = column((t) => t.bareFraction);
  const bareFractionSpreadCol = column((t) => t.bareFractionSpread);
  const currentFittingsBareWCol = column((t) => t.currentFittingsBareW);
  const currentFittingsInsulatedWCol = column((t) => t.currentFittingsInsulatedW);
  const proposedBareWPerMCol = column((t) => t.proposedBareWPerM);
  const proposedInsulatedWPerMCol = column((t) => t.proposedInsulatedWPerM);
  const proposedBareFractionCol = column((t) => t.proposedBareFraction);
  const proposedFittingsBareWCol = column((t) => t.proposedFittingsBareW);
  const proposedFittingsInsulatedWCol = column((t) => t.proposedFittingsInsulatedW);
  const bareAirCol = column((t) => t.bareSensitivityPerK);
  const airSpreadCol = column((t) => t.airSpreadK);
  const bareSpeedCol = column((t) => t.bareSensitivityPerMPerS);
  const speedSpreadCol = column((t) => t.speedSpreadMPerS);
  const bareEmittanceCol = column((t) => t.bareSensitivityPerEmittance);
  const emittanceSpreadCol = column((t) => t.emittanceSpread);
  const insulatedAirCol = column((t) => t.insulatedSensitivityPerK);
  const conditionSpreadCol = column((t) => t.conditionSpread);
  const installedPerMetreCol = column((t) => t.installedPerMetre);
  const installedFixedCol = column((t) => t.installedFixed);
  const priceSpreadCol = column((t) => t.priceSpread);
  for (let s = 0; s < n; s++) {
    const hoursFactor = triangularFactor(hoursSpread, generator.next());
    const fuelFactor = triangularFactor(priceSpread, generator.next());
    // The efficiency cannot pass 1, so its factor is capped where it would.
    const efficiencyFactor = Math.min(triangularFactor(efficiencySpread, generator.next()), 1 / boilerEfficiency);
    // Shared by every run of the sample: the air, the surfaces and the prices err together.
    const airOffset = triangularFactor(1, generator.next()) - 1;
    const speedOffset = triangularFactor(1, generator.next()) - 1;
    const emittanceOffset = triangularFactor(1, generator.next()) - 1;
    const conditionOffset = triangularFactor(1, generator.next()) - 1;
    const priceOffset = triangularFactor(1, generator.next()) - 1;
    let currentCost = 0;
    let currentHeat = 0;
    let currentCo2 = 0;
    let proposedCost = 0;
    let proposedHeat = 0;
    let proposedCo2 = 0;
    let installed = 0;
    for (let r = 0; r < runCount; r++) {
      const length = lengthMCol[r]! * triangularFactor(lengthSpreadCol[r]!, generator.next());
      const bareFractionSpread = bareFractionSpreadCol[r]!;
      const fraction =
        bareFractionSpread > 0 ? Math.min(1, Math.max(0, bareFractionCol[r]! * triangularFactor(bareFractionSpread, generator.next()))) : bareFractionCol[r]!;
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
