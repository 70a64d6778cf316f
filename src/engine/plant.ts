import { addFigures, ZERO_FIGURES, J_PER_GJ, J_PER_KWH, type AnnualFigures, type Rates } from './annual-figures';
import { findFuel } from './catalogue';
import { DEMO_INSTALLED_COST_TABLE } from './data/installed-cost-demo';
import type { EmissionSourceId, Fuel } from './data/fuels';
import { findMarket, type MarketId } from './data/markets';
import { cashFlowByYear, emissionKgPerJoule, fuelCostPerJoule, presentWorthFactor, simplePaybackYears } from './economics';
import { invalidInput } from './errors';
import { plantInputSchema, type ParsedPlantInput, type PlantInput } from './plant-input';
import type { PlantResult, PlantWarning, ResultDetail, RunEstimate } from './plant-result';
import { sampleRanges } from './plant-range';
import { atmosphericPressureKPaAtAltitude } from './psychrometrics';
import { estimateRun, type PlantContext, type SampleTerms } from './run-estimate';
import type { Confidence } from './uncertainty';
import { ENGINE_VERSION } from './version';

export type {
  AnnualFigures,
  CashFlowYear,
  ChoiceReason,
  FaceProfile,
  InputNotice,
  MeasurementUse,
  PlantResult,
  PlantWarning,
  Range,
  ResultDetail,
  RunEstimate,
  RunOption,
  ThicknessOption,
} from './plant-result';

/** Options of an estimate. */
export interface EstimateOptions {
  /**
   * `full` (the default) adds each run's thickness series and face profiles; `summary`
   * leaves them out — the figures the screens show, a fraction of the size.
   */
  readonly detail?: ResultDetail;
}

/** The market of a parsed plant: given, or — for older requests — the inch market when they said `US`. */
export function marketOf(plant: ParsedPlantInput): MarketId {
  return plant.market ?? (plant.unitSystem === 'US' ? 'US' : 'EU');
}

/**
 * Estimates a whole plant: per run, the heat lost (or gained), what it costs, its CO₂ and
 * steam, the hazards at design air, and every option weighed on life-cycle cost (leave as it
 * is, repair the bare parts, insulate or add a layer, replace) with the one chosen and why;
 * in total, the recommended actions only; and a seeded low / likely / high range over the
 * uncertain inputs.
 *
 * @throws EngineError INVALID_INPUT with every issue, its path and (for ranges) its params
 */
export function estimatePlant(input: PlantInput, options: EstimateOptions = {}): PlantResult {
  const parsed = plantInputSchema.safeParse(input);
  if (!parsed.success) throw invalidInput(parsed.error);
  return estimateParsedPlant(parsed.data, options);
}

/**
 * The estimate of a plant already parsed with {@link plantInputSchema} (an endpoint that has
 * just parsed the request), so the input is not checked twice.
 */
export function estimateParsedPlant(plant: ParsedPlantInput, options: EstimateOptions = {}): PlantResult {
  const detail = options.detail ?? 'full';
  const fuel = findFuel(plant.energy.fuel) as Fuel;
  const electricity = findFuel('electricity') as Fuel;
  const source: EmissionSourceId = plant.energy.emissionFactorSource ?? 'us-epa-2024';
  const fuelFactor = fuel.emissionFactors.find((f) => f.source === source) ?? (fuel.emissionFactors[0] as Fuel['emissionFactors'][number]);
  const boilerEfficiency = plant.energy.boilerEfficiency ?? fuel.defaultBoilerEfficiency;
  const boilerConfidence: Confidence = plant.energy.boilerEfficiencyConfidence ?? (plant.energy.boilerEfficiency !== undefined ? 'estimated' : 'guessed');
  const costPerJFuel = fuelCostPerJoule(fuel, plant.energy.price, plant.energy.priceUnit ?? fuel.defaultPriceUnit);
  const co2PerJFuel = emissionKgPerJoule(fuel, fuelFactor.source) ?? 0;
  const cop = plant.energy.chillerCoefficientOfPerformance;
  const electricityPrice = plant.energy.electricityPricePerKWh ?? (fuel.id === 'electricity' ? plant.energy.price : null);
  const co2PerJElectricity = emissionKgPerJoule(electricity, source) ?? emissionKgPerJoule(electricity, 'us-epa-2024') ?? 0;
  const hotRates: Rates = {
    costPerJHeat: costPerJFuel / boilerEfficiency,
    co2PerJHeat: co2PerJFuel / boilerEfficiency,
    fuelJPerJHeat: 1 / boilerEfficiency,
    electricityJPerJHeat: 0,
  };
  const coldRates: Rates = {
    costPerJHeat: electricityPrice === null ? 0 : electricityPrice / J_PER_KWH / cop,
    co2PerJHeat: co2PerJElectricity / cop,
    fuelJPerJHeat: 0,
    electricityJPerJHeat: 1 / cop,
  };
  const table = plant.priceTable ? { ...plant.priceTable, illustrative: false } : DEMO_INSTALLED_COST_TABLE;
  const pwf = presentWorthFactor(plant.economics.horizonYears, plant.economics.discountRatePercent / 100, plant.economics.fuelEscalationPercent / 100);
  const market = findMarket(marketOf(plant));
  const ctx: PlantContext = {
    plant,
    fuel,
    hotRates,
    coldRates,
    table,
    pwf,
    atmosphereKPa: atmosphericPressureKPaAtAltitude(plant.conditions.altitudeM),
    stockSeries: market.stockSeries,
    detail,
  };

  const runs: RunEstimate[] = [];
  const terms: SampleTerms[] = [];
  const warnings: PlantWarning[] = [];
  let current: AnnualFigures = ZERO_FIGURES;
  let proposed: AnnualFigures = ZERO_FIGURES;
  let installedCost = 0;
  let runsWithWork = 0;
  for (const run of plant.runs) {
    const outcome = estimateRun(run, ctx);
    const estimate = outcome.estimate;
    runs.push(estimate);
    terms.push(outcome.terms);
    current = addFigures(current, estimate.current);
    proposed = addFigures(proposed, estimate.proposed);
    installedCost += estimate.installedCost;
    if (estimate.proposed.option !== 'leave') runsWithWork++;
    if (outcome.noStock) warnings.push({ code: 'NO_STOCK_MEETS_NEED', message: outcome.noStock.message, runId: run.id });
    for (const notice of estimate.notices) warnings.push({ code: 'INPUT_NOTICE', message: notice.message, runId: run.id, path: notice.path });
  }
  const savings = addFigures(current, proposed, -1);
  const currentLifeCycle = pwf * current.annualCost;
  const proposedLifeCycle = installedCost + pwf * proposed.annualCost;
  const totals: PlantResult['totals'] = {
    current,
    proposed,
    savings,
    installedCost,
    simplePaybackYears: simplePaybackYears(installedCost, savings.annualCost),
    lifeCycle: { currentCost: currentLifeCycle, proposedCost: proposedLifeCycle, netSaving: currentLifeCycle - proposedLifeCycle },
    cashFlow: cashFlowByYear(installedCost, savings.annualCost, plant.economics.horizonYears, plant.economics.discountRatePercent / 100, plant.economics.fuelEscalationPercent / 100),
    runsWithWork,
  };

  if (table.illustrative) {
    warnings.unshift({
      code: 'ILLUSTRATIVE_PRICES',
      message: 'Installed costs come from Lagwise’s illustrative demo prices, not a quotation; a consultant replaces them with their own.',
    });
  }
  if (electricityPrice === null && runs.some((r) => r.cold)) {
    warnings.push({ code: 'COLD_LINES_NOT_PRICED', message: 'Heat gained by cold lines is not priced: give an electricity price for the chillers to include it.' });
  }
  if (savings.annualCost <= 0 && runsWithWork > 0) {
    warnings.push({ code: 'NO_SAVING', message: 'The recommended work saves nothing on these inputs; it is there for safety.' });
  }

  return {
    engineVersion: ENGINE_VERSION,
    currency: plant.energy.currency,
    detail,
    market: market.id,
    runs,
    totals,
    range: sampleRanges(plant, terms, totals, boilerEfficiency, boilerConfidence),
    assumptions: {
      fuel: fuel.id,
      fuelQuantityUnit: fuel.quantityUnit,
      fuelCostPerGJ: costPerJFuel * J_PER_GJ,
      boilerEfficiency,
      emissionFactor: { source: fuelFactor.source, label: fuelFactor.label, kgCo2PerGJ: fuelFactor.kgCo2PerGJ },
      chillerCoefficientOfPerformance: cop,
      electricityPricePerKWh: electricityPrice,
      atmosphericPressureKPa: ctx.atmosphereKPa,
      presentWorthFactor: pwf,
      priceTable: table.label,
      priceTableIllustrative: table.illustrative,
      stockSeries: market.stockSeries,
      horizonYears: plant.economics.horizonYears,
      discountRatePercent: plant.economics.discountRatePercent,
      fuelEscalationPercent: plant.economics.fuelEscalationPercent,
    },
    warnings,
  };
}
