import { findFuel, findInsulationMaterial, findSurface } from './catalogue';
import { DEMO_INSTALLED_COST_TABLE, type InstalledCostTable } from './data/installed-cost-demo';
import { FLANGE_PAIR_EQUIVALENT_LENGTH_M, VALVE_EQUIVALENT_LENGTH_M } from './data/fittings';
import type { EmissionSourceId, Fuel } from './data/fuels';
import type { InsulationMaterial } from './data/insulation-materials';
import {
  cashFlowByYear,
  emissionKgPerJoule,
  fittingCoverCost,
  fuelCostPerJoule,
  installedCostPerMetre,
  presentWorthFactor,
  simplePaybackYears,
} from './economics';
import { EngineError } from './errors';
import { plantInputSchema, type ParsedPlantInput, type ParsedPlantRun, type PlantInput } from './plant-input';
import { atmosphericPressureKPaAtAltitude } from './psychrometrics';
import type { ParsedRunInput } from './run-input';
import { prepareRun, solvePreparedRun, type PreparedRun, type RunWarning } from './run';
import { solveResolvedRun, type CoreSolution, type ResolvedRun } from './run-solver';
import { serviceDefaults, type ServiceId } from './services';
import { CONFIDENCE_SPREADS, mulberry32, quantileSorted, triangularFactor } from './uncertainty';
import { ENGINE_VERSION } from './version';

const SECONDS_PER_HOUR = 3600;
const J_PER_GJ = 1e9;

/** Energy, money and carbon of one state of a run (or of the plant), per year. */
export interface AnnualFigures {
  /** Heat lost (positive) or gained (cold lines, reported as a positive load), W. */
  readonly heatW: number;
  readonly annualHeatGJ: number;
  /** Boiler fuel energy (higher heating value), GJ/yr. */
  readonly annualFuelGJ: number;
  /** Boiler fuel in its physical unit (m³, litre or kWh), per year. */
  readonly annualFuelQuantity: number;
  /** Chiller electricity for heat gained by cold lines, kWh/yr. */
  readonly annualChillerElectricityKWh: number;
  readonly annualCost: number;
  readonly annualCo2Kg: number;
  /** Steam condensed by the loss, for steam runs; 0 otherwise. */
  readonly steamKgPerHour: number;
  readonly steamKgPerYear: number;
}

/**
 * Temperatures of the faces heat crosses, from the inside of the pipe wall outward (inner
 * wall, outer wall, the outer face of each layer; the last is the surface), with their
 * diameters. The fluid is inside the first face, the air outside the last.
 */
export interface FaceProfile {
  readonly faceDiametersM: readonly number[];
  readonly faceTemperaturesC: readonly number[];
}

/** One year of the proposal's cash flow: the installed cost is paid in year 0. */
export interface CashFlowYear {
  readonly year: number;
  /** Savings so far less the installed cost, with the fuel price escalating. */
  readonly cumulative: number;
  /** The same discounted to today; the last year equals the life-cycle net saving. */
  readonly cumulativePresentValue: number;
}

/** One point of the thickness series of a run's proposed material. */
export interface ThicknessOption {
  readonly thicknessM: number;
  readonly heatLossWPerM: number;
  readonly surfaceTemperatureC: number;
  readonly installedCost: number;
  readonly lifeCycleCost: number;
}

/** The estimate of one run. */
export interface RunEstimate {
  readonly id: string;
  readonly label: string;
  readonly service: ServiceId;
  readonly cold: boolean;
  readonly lengthM: number;
  readonly operatingHoursPerYear: number;
  readonly fluidTemperatureC: number;
  readonly steamAbsolutePressureKPa: number | null;
  readonly latentHeatJPerKg: number | null;
  readonly air: {
    readonly temperatureC: number;
    readonly speedMPerS: number;
    readonly relativeHumidityPercent: number;
    readonly dewPointC: number;
  };
  readonly pipeOuterDiameterM: number;
  readonly fittings: { readonly valves: number; readonly flangePairs: number; readonly equivalentLengthM: number };
  readonly bare: { readonly heatLossWPerM: number; readonly surfaceTemperatureC: number };
  readonly current: AnnualFigures & {
    readonly state: 'bare' | 'damaged' | 'insulated';
    /** Mean over the run (a damaged run mixes bare and insulated lengths), W/m. */
    readonly heatLossWPerM: number;
    /** Hottest (or, cold lines, coldest) exposed surface, °C. */
    readonly surfaceTemperatureC: number;
    /** Through the bare part of a damaged run; through the insulation of an insulated one. */
    readonly profile: FaceProfile;
  };
  readonly proposed: AnnualFigures & {
    readonly material: string;
    readonly thicknessM: number;
    readonly jacket: string;
    readonly heatLossWPerM: number;
    readonly surfaceTemperatureC: number;
    readonly coverFittings: boolean;
    readonly profile: FaceProfile;
  };
  readonly savings: AnnualFigures;
  readonly installedCost: number;
  readonly simplePaybackYears: number | null;
  readonly lifeCycle: { readonly currentCost: number; readonly proposedCost: number; readonly netSaving: number };
  readonly economicThickness: { readonly thicknessM: number; readonly lifeCycleCost: number } | null;
  readonly thicknessSeries: readonly ThicknessOption[];
  readonly personnelProtection: {
    readonly applies: boolean;
    readonly touchLimitC: number;
    readonly leastThicknessM: number | null;
  };
  readonly condensationControl: {
    readonly applies: boolean;
    readonly dewPointC: number;
    readonly marginK: number;
    readonly leastThicknessM: number | null;
  };
  /** Cautions about the run as it is today (touch burns, sweating, materials). */
  readonly hazards: readonly RunWarning[];
}

/** Low / likely / high of one figure. */
export interface Range {
  readonly low: number;
  readonly likely: number;
  readonly high: number;
}

/** Plant-level caution. */
export interface PlantWarning {
  readonly code: 'ILLUSTRATIVE_PRICES' | 'COLD_LINES_NOT_PRICED' | 'NO_SAVING';
  readonly message: string;
}

/** The estimate of a whole plant. */
export interface PlantResult {
  readonly engineVersion: string;
  readonly currency: string;
  readonly runs: readonly RunEstimate[];
  readonly totals: {
    readonly current: AnnualFigures;
    readonly proposed: AnnualFigures;
    readonly savings: AnnualFigures;
    readonly installedCost: number;
    readonly simplePaybackYears: number | null;
    readonly lifeCycle: { readonly currentCost: number; readonly proposedCost: number; readonly netSaving: number };
    /** Year 0 (the installed cost) to the horizon. */
    readonly cashFlow: readonly CashFlowYear[];
  };
  /** Percentiles 10 / 90 of seeded Monte Carlo samples over the uncertain inputs; likely = point estimate. */
  readonly range: {
    readonly samples: number;
    readonly seed: number;
    readonly currentAnnualCost: Range;
    readonly currentAnnualHeatGJ: Range;
    readonly currentAnnualCo2Kg: Range;
    readonly annualCostSaving: Range;
    readonly annualHeatSavingGJ: Range;
    readonly annualCo2SavingKg: Range;
    readonly installedCost: Range;
    readonly simplePaybackYears: Range | null;
  };
  readonly assumptions: {
    readonly fuel: string;
    readonly fuelQuantityUnit: string;
    readonly fuelCostPerGJ: number;
    readonly boilerEfficiency: number;
    readonly emissionFactor: { readonly source: string; readonly label: string; readonly kgCo2PerGJ: number };
    readonly chillerCoefficientOfPerformance: number;
    readonly electricityPricePerKWh: number | null;
    readonly atmosphericPressureKPa: number;
    readonly presentWorthFactor: number;
    readonly priceTable: string;
    readonly priceTableIllustrative: boolean;
    readonly horizonYears: number;
    readonly discountRatePercent: number;
    readonly fuelEscalationPercent: number;
  };
  readonly warnings: readonly PlantWarning[];
}

/** The faces of a solved run, without the fluid's own entry. */
function faceProfile(solution: { readonly interfaceDiametersM: readonly number[]; readonly interfaceTemperaturesC: readonly number[] }): FaceProfile {
  return { faceDiametersM: solution.interfaceDiametersM, faceTemperaturesC: solution.interfaceTemperaturesC.slice(1) };
}

/** Per-joule rates that turn heat into money and carbon for one run. */
interface Rates {
  readonly costPerJHeat: number;
  readonly co2PerJHeat: number;
  readonly fuelJPerJHeat: number;
  readonly electricityJPerJHeat: number;
}

function figures(
  heatW: number,
  hours: number,
  rates: Rates,
  fuel: Fuel,
  latentHeatJPerKg: number | null,
): AnnualFigures {
  const heatJ = heatW * hours * SECONDS_PER_HOUR;
  const fuelJ = heatJ * rates.fuelJPerJHeat;
  const steamKgPerHour = latentHeatJPerKg ? (heatW * SECONDS_PER_HOUR) / latentHeatJPerKg : 0;
  return {
    heatW,
    annualHeatGJ: heatJ / J_PER_GJ,
    annualFuelGJ: fuelJ / J_PER_GJ,
    annualFuelQuantity: fuelJ / fuel.heatingValueJPerQuantityUnit,
    annualChillerElectricityKWh: (heatJ * rates.electricityJPerJHeat) / 3.6e6,
    annualCost: heatJ * rates.costPerJHeat,
    annualCo2Kg: heatJ * rates.co2PerJHeat,
    steamKgPerHour,
    steamKgPerYear: steamKgPerHour * hours,
  };
}

const ZERO_FIGURES: AnnualFigures = {
  heatW: 0,
  annualHeatGJ: 0,
  annualFuelGJ: 0,
  annualFuelQuantity: 0,
  annualChillerElectricityKWh: 0,
  annualCost: 0,
  annualCo2Kg: 0,
  steamKgPerHour: 0,
  steamKgPerYear: 0,
};

function add(a: AnnualFigures, b: AnnualFigures, sign = 1): AnnualFigures {
  return {
    heatW: a.heatW + sign * b.heatW,
    annualHeatGJ: a.annualHeatGJ + sign * b.annualHeatGJ,
    annualFuelGJ: a.annualFuelGJ + sign * b.annualFuelGJ,
    annualFuelQuantity: a.annualFuelQuantity + sign * b.annualFuelQuantity,
    annualChillerElectricityKWh: a.annualChillerElectricityKWh + sign * b.annualChillerElectricityKWh,
    annualCost: a.annualCost + sign * b.annualCost,
    annualCo2Kg: a.annualCo2Kg + sign * b.annualCo2Kg,
    steamKgPerHour: a.steamKgPerHour + sign * b.steamKgPerHour,
    steamKgPerYear: a.steamKgPerYear + sign * b.steamKgPerYear,
  };
}

/** What the Monte Carlo needs of a run, all linear in the sampled factors. */
interface SampleTerms {
  readonly lengthM: number;
  readonly lengthSpread: number;
  readonly hours: number;
  readonly cold: boolean;
  readonly insulatedWPerM: number;
  readonly bareMinusInsulatedWPerM: number;
  readonly bareFraction: number;
  readonly bareFractionSpread: number;
  readonly fittingsCurrentW: number;
  readonly proposedWPerM: number;
  readonly fittingsProposedW: number;
  readonly costPerJHeat: number;
  readonly co2PerJHeat: number;
  readonly installedPerMetre: number;
  readonly installedFixed: number;
}

function thicknessSeriesM(material: InsulationMaterial, unitSystem: 'SI' | 'US'): number[] {
  const series =
    unitSystem === 'US'
      ? material.thicknessSeriesIn.map((t) => t * 0.0254)
      : material.thicknessSeriesMm.map((t) => t / 1000);
  return series.filter((t) => t < 0.5);
}

function insulatedRun(base: ResolvedRun, material: InsulationMaterial, thicknessM: number, emittance: number): ResolvedRun {
  return { ...base, layers: [{ thicknessM, curve: material.conductivity }], surfaceEmittance: emittance };
}

function materialOrFail(id: string): InsulationMaterial {
  const material = findInsulationMaterial(id);
  if (!material) throw new EngineError('UNKNOWN_MATERIAL', `Unknown insulation material "${id}".`);
  return material;
}

function emittanceOf(surfaceId: string): number {
  return findSurface(surfaceId)?.emittance ?? 0.9;
}

interface PlantContext {
  readonly plant: ParsedPlantInput;
  readonly fuel: Fuel;
  readonly hotRates: Rates;
  readonly coldRates: Rates;
  readonly table: InstalledCostTable;
  readonly pwf: number;
  readonly atmosphereKPa: number;
}

function estimateRun(run: ParsedPlantRun, ctx: PlantContext): { estimate: RunEstimate; terms: SampleTerms } {
  const { plant, fuel, table, pwf } = ctx;
  const service = serviceDefaults(run.service);
  const conditions = plant.conditions;
  const outdoor = run.ambient.kind === 'outdoor';
  const airC = outdoor ? conditions.outdoorAirTemperatureC : conditions.indoorAirTemperatureC;
  const humidity = outdoor ? conditions.outdoorRelativeHumidityPercent : conditions.indoorRelativeHumidityPercent;
  const airSpeed =
    run.ambient.kind === 'outdoor'
      ? (run.ambient.windSpeedMPerS ?? conditions.outdoorWindSpeedMPerS)
      : run.ambient.kind === 'indoor-draughty'
        ? (run.ambient.airSpeedMPerS ?? conditions.draughtyAirSpeedMPerS)
        : 0;
  const steamGauge =
    service.kind === 'steam' ? (run.steamGaugePressureKPa ?? (service.typicalGaugePressureKPa as number)) : undefined;

  const runInput: ParsedRunInput = {
    pipe: run.pipe,
    ...(steamGauge !== undefined
      ? { steam: { gaugePressureKPa: steamGauge, atmosphericPressureKPa: ctx.atmosphereKPa } }
      : { fluidTemperatureC: run.fluidTemperatureC ?? service.typicalTemperatureC }),
    ...(service.liquid
      ? { fluid: { kind: service.liquid, velocityMPerS: run.velocityMPerS ?? service.typicalVelocityMPerS } }
      : {}),
    ambientTemperatureC: airC,
    windSpeedMPerS: airSpeed,
    orientation: run.orientation,
    runHeightM: run.runHeightM ?? 3,
    relativeHumidityPercent: humidity,
    insulation: [],
    touchLimitC: plant.economics.touchLimitC,
  };
  const prepared: PreparedRun = prepareRun(runInput);
  const base = prepared.resolved;
  const fluidC = base.fluidTemperatureC;
  const dewC = prepared.dewPointC as number;
  const cold = fluidC < airC;
  const rates = cold ? ctx.coldRates : ctx.hotRates;
  const hours = run.operatingHoursPerYear ?? plant.operatingHoursPerYear;
  const latent = prepared.steam ? prepared.steam.latentHeatJPerKg : null;
  const sign = cold ? -1 : 1;

  const bareResult = solvePreparedRun(prepared);
  const bareWPerM = sign * bareResult.heatLossWPerM;
  const fittingLengthM = run.valves * VALVE_EQUIVALENT_LENGTH_M + run.flangePairs * FLANGE_PAIR_EQUIVALENT_LENGTH_M;

  // Current state.
  let currentInsulatedWPerM = bareWPerM;
  let currentSurfaceC = bareResult.surfaceTemperatureC;
  let currentProfile = faceProfile(bareResult);
  let bareFraction = 1;
  let hazards: RunWarning[] = bareResult.warnings.slice();
  if (run.current.state !== 'bare') {
    const material = materialOrFail(run.current.material);
    const solved = solvePreparedRun(
      { ...prepared, resolved: insulatedRun(base, material, run.current.thicknessM, emittanceOf(run.current.jacket)), layerMaterials: [material] },
    );
    currentInsulatedWPerM = sign * solved.heatLossWPerM;
    bareFraction = run.current.state === 'damaged' ? run.current.bareFraction : 0;
    if (bareFraction === 0) {
      currentSurfaceC = solved.surfaceTemperatureC;
      currentProfile = faceProfile(solved);
      hazards = solved.warnings.slice();
    } else {
      hazards = [...bareResult.warnings, ...solved.warnings.filter((w) => w.code.startsWith('MATERIAL_'))];
    }
  }
  const currentWPerM = bareFraction * bareWPerM + (1 - bareFraction) * currentInsulatedWPerM;
  const currentFittingsWPerM =
    run.fittingsInsulated && run.current.state !== 'bare' ? currentInsulatedWPerM : bareWPerM;
  const currentFittingsW = fittingLengthM * currentFittingsWPerM;
  const currentHeatW = currentWPerM * run.lengthM + currentFittingsW;

  // Proposed material, its thickness series and the searches over it.
  const material = materialOrFail(run.proposed.material ?? service.defaultInsulation);
  const jacket = run.proposed.jacket ?? service.defaultJacket;
  const jacketEmittance = emittanceOf(jacket);
  const coverFittings = run.proposed.coverFittings && fittingLengthM > 0;
  const fittingCount = run.valves + run.flangePairs;
  const coversCost = coverFittings ? fittingCount * fittingCoverCost(table, base.pipeOuterDiameterM) : 0;
  const costPerJ = rates.costPerJHeat;
  const annualCostOf = (pipeWPerM: number): number => {
    const fittingsW = fittingLengthM * (coverFittings ? pipeWPerM : currentFittingsWPerM);
    return (pipeWPerM * run.lengthM + fittingsW) * hours * SECONDS_PER_HOUR * costPerJ;
  };
  const installedPerMetreAt = (thicknessM: number): number =>
    installedCostPerMetre(table, base.pipeOuterDiameterM, thicknessM) * material.installedCostFactor;

  const series: ThicknessOption[] = [];
  const solutions: CoreSolution[] = [];
  let guess: number | undefined;
  for (const thicknessM of thicknessSeriesM(material, plant.unitSystem)) {
    const solution = solveResolvedRun(insulatedRun(base, material, thicknessM, jacketEmittance), guess);
    guess = solution.surfaceTemperatureC;
    solutions.push(solution);
    const wPerM = sign * solution.heatLossWPerM;
    const installed = installedPerMetreAt(thicknessM) * run.lengthM + coversCost;
    series.push({
      thicknessM,
      heatLossWPerM: solution.heatLossWPerM,
      surfaceTemperatureC: solution.surfaceTemperatureC,
      installedCost: installed,
      lifeCycleCost: installed + pwf * annualCostOf(wPerM),
    });
  }
  let economic: ThicknessOption | undefined;
  for (const option of series) if (!economic || option.lifeCycleCost < economic.lifeCycleCost) economic = option;
  const touchLimitC = plant.economics.touchLimitC;
  const protectionApplies = !cold && fluidC > touchLimitC;
  const protection = protectionApplies ? series.find((o) => o.surfaceTemperatureC <= touchLimitC) : undefined;
  const marginK = plant.economics.condensationMarginK;
  const condensationApplies = cold && fluidC < dewC + marginK;
  const condensation = condensationApplies ? series.find((o) => o.surfaceTemperatureC >= dewC + marginK) : undefined;

  let proposedThicknessM: number;
  if (run.proposed.thicknessM !== undefined) {
    proposedThicknessM = run.proposed.thicknessM;
  } else {
    const needs = [economic?.thicknessM, protection?.thicknessM, condensation?.thicknessM].filter(
      (t): t is number => t !== undefined,
    );
    proposedThicknessM = needs.length > 0 ? Math.max(...needs) : (series[series.length - 1]?.thicknessM ?? 0.025);
  }
  const seriesIndex = series.findIndex((o) => Math.abs(o.thicknessM - proposedThicknessM) < 1e-9);
  const proposedSolution =
    seriesIndex >= 0
      ? (solutions[seriesIndex] as CoreSolution)
      : solveResolvedRun(insulatedRun(base, material, proposedThicknessM, jacketEmittance), guess);
  const proposedWPerM = sign * proposedSolution.heatLossWPerM;
  const proposedFittingsW = fittingLengthM * (coverFittings ? proposedWPerM : currentFittingsWPerM);
  const proposedHeatW = proposedWPerM * run.lengthM + proposedFittingsW;
  const installedPerMetre = installedPerMetreAt(proposedThicknessM);
  const installedCost = installedPerMetre * run.lengthM + coversCost;

  const current = figures(currentHeatW, hours, rates, fuel, latent);
  const proposed = figures(proposedHeatW, hours, rates, fuel, latent);
  const savings = add(current, proposed, -1);
  const currentLifeCycle = pwf * current.annualCost;
  const proposedLifeCycle = installedCost + pwf * proposed.annualCost;

  const estimate: RunEstimate = {
    id: run.id,
    label: run.label,
    service: run.service,
    cold,
    lengthM: run.lengthM,
    operatingHoursPerYear: hours,
    fluidTemperatureC: fluidC,
    steamAbsolutePressureKPa: prepared.steam ? prepared.steam.absolutePressureKPa : null,
    latentHeatJPerKg: latent,
    air: { temperatureC: airC, speedMPerS: airSpeed, relativeHumidityPercent: humidity, dewPointC: dewC },
    pipeOuterDiameterM: base.pipeOuterDiameterM,
    fittings: { valves: run.valves, flangePairs: run.flangePairs, equivalentLengthM: fittingLengthM },
    bare: { heatLossWPerM: bareResult.heatLossWPerM, surfaceTemperatureC: bareResult.surfaceTemperatureC },
    current: {
      ...current,
      state: run.current.state,
      heatLossWPerM: sign * currentWPerM,
      surfaceTemperatureC: currentSurfaceC,
      profile: currentProfile,
    },
    proposed: {
      ...proposed,
      material: material.id,
      thicknessM: proposedThicknessM,
      jacket,
      heatLossWPerM: proposedSolution.heatLossWPerM,
      surfaceTemperatureC: proposedSolution.surfaceTemperatureC,
      coverFittings,
      profile: faceProfile(proposedSolution),
    },
    savings,
    installedCost,
    simplePaybackYears: simplePaybackYears(installedCost, savings.annualCost),
    lifeCycle: { currentCost: currentLifeCycle, proposedCost: proposedLifeCycle, netSaving: currentLifeCycle - proposedLifeCycle },
    economicThickness: economic ? { thicknessM: economic.thicknessM, lifeCycleCost: economic.lifeCycleCost } : null,
    thicknessSeries: series,
    personnelProtection: { applies: protectionApplies, touchLimitC, leastThicknessM: protection?.thicknessM ?? null },
    condensationControl: {
      applies: condensationApplies,
      dewPointC: dewC,
      marginK,
      leastThicknessM: condensation?.thicknessM ?? null,
    },
    hazards,
  };
  const lengthSpread = CONFIDENCE_SPREADS[run.lengthConfidence];
  const terms: SampleTerms = {
    lengthM: run.lengthM,
    lengthSpread,
    hours,
    cold,
    insulatedWPerM: currentInsulatedWPerM,
    bareMinusInsulatedWPerM: bareWPerM - currentInsulatedWPerM,
    bareFraction,
    bareFractionSpread: run.current.state === 'damaged' ? CONFIDENCE_SPREADS[run.current.bareFractionConfidence] : 0,
    fittingsCurrentW: currentFittingsW,
    proposedWPerM,
    fittingsProposedW: proposedFittingsW,
    costPerJHeat: rates.costPerJHeat,
    co2PerJHeat: rates.co2PerJHeat,
    installedPerMetre,
    installedFixed: coversCost,
  };
  return { estimate, terms };
}

function sampleRanges(
  plant: ParsedPlantInput,
  terms: readonly SampleTerms[],
  likely: PlantResult['totals'],
  boilerEfficiency: number,
): PlantResult['range'] {
  const n = plant.range.samples;
  const random = mulberry32(plant.range.seed);
  const hoursSpread = CONFIDENCE_SPREADS[plant.operatingHoursConfidence];
  const priceSpread = CONFIDENCE_SPREADS[plant.energy.priceConfidence];
  const efficiencySpread = CONFIDENCE_SPREADS[plant.energy.boilerEfficiencyConfidence];
  const out = {
    currentCost: new Float64Array(n),
    currentHeat: new Float64Array(n),
    currentCo2: new Float64Array(n),
    saving: new Float64Array(n),
    heatSaving: new Float64Array(n),
    co2Saving: new Float64Array(n),
    installed: new Float64Array(n),
    payback: new Float64Array(n),
  };
  for (let s = 0; s < n; s++) {
    const hoursFactor = triangularFactor(hoursSpread, random());
    const priceFactor = triangularFactor(priceSpread, random());
    // The efficiency cannot pass 1, so its factor is capped where it would.
    const efficiencyFactor = Math.min(triangularFactor(efficiencySpread, random()), 1 / boilerEfficiency);
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
        t.bareFractionSpread > 0
          ? Math.min(1, Math.max(0, t.bareFraction * triangularFactor(t.bareFractionSpread, random())))
          : t.bareFraction;
      const seconds = Math.min(8784, t.hours * hoursFactor) * SECONDS_PER_HOUR;
      const currentJ = (length * (t.insulatedWPerM + fraction * t.bareMinusInsulatedWPerM) + t.fittingsCurrentW) * seconds;
      const proposedJ = (length * t.proposedWPerM + t.fittingsProposedW) * seconds;
      const perJCost = t.cold ? t.costPerJHeat * priceFactor : (t.costPerJHeat * priceFactor) / efficiencyFactor;
      const perJCo2 = t.cold ? t.co2PerJHeat : t.co2PerJHeat / efficiencyFactor;
      currentCost += currentJ * perJCost;
      currentHeat += currentJ;
      currentCo2 += currentJ * perJCo2;
      proposedCost += proposedJ * perJCost;
      proposedHeat += proposedJ;
      proposedCo2 += proposedJ * perJCo2;
      installed += t.installedPerMetre * length + t.installedFixed;
    }
    out.currentCost[s] = currentCost;
    out.currentHeat[s] = currentHeat / J_PER_GJ;
    out.currentCo2[s] = currentCo2;
    out.saving[s] = currentCost - proposedCost;
    out.heatSaving[s] = (currentHeat - proposedHeat) / J_PER_GJ;
    out.co2Saving[s] = currentCo2 - proposedCo2;
    out.installed[s] = installed;
    out.payback[s] = currentCost - proposedCost > 0 ? installed / (currentCost - proposedCost) : Number.POSITIVE_INFINITY;
  }
  const range = (values: Float64Array, point: number): Range => {
    values.sort();
    return { low: quantileSorted(values, 0.1), likely: point, high: quantileSorted(values, 0.9) };
  };
  const payback = range(out.payback, likely.simplePaybackYears ?? Number.POSITIVE_INFINITY);
  return {
    samples: n,
    seed: plant.range.seed,
    currentAnnualCost: range(out.currentCost, likely.current.annualCost),
    currentAnnualHeatGJ: range(out.currentHeat, likely.current.annualHeatGJ),
    currentAnnualCo2Kg: range(out.currentCo2, likely.current.annualCo2Kg),
    annualCostSaving: range(out.saving, likely.savings.annualCost),
    annualHeatSavingGJ: range(out.heatSaving, likely.savings.annualHeatGJ),
    annualCo2SavingKg: range(out.co2Saving, likely.savings.annualCo2Kg),
    installedCost: range(out.installed, likely.installedCost),
    simplePaybackYears:
      Number.isFinite(payback.low) && Number.isFinite(payback.high) && Number.isFinite(payback.likely) ? payback : null,
  };
}

/**
 * Estimates a whole plant: per run and in total, heat lost (or gained), boiler fuel,
 * cost, CO₂ and steam condensed, today and with the proposed insulation; installed
 * cost, simple payback and life-cycle cost; the economic thickness (least
 * life-cycle cost over the material's stock thicknesses); the least thickness for
 * personnel protection and for condensation control; and a seeded low / likely /
 * high range over the inputs marked uncertain.
 *
 * @throws EngineError INVALID_INPUT with every issue and its path
 */
export function estimatePlant(input: PlantInput): PlantResult {
  const parsed = plantInputSchema.safeParse(input);
  if (!parsed.success) {
    const issues = parsed.error.issues.map((issue) => ({
      path: issue.path.filter((p): p is string | number => typeof p !== 'symbol'),
      message: issue.message,
    }));
    throw new EngineError('INVALID_INPUT', issues.map((i) => i.message).join(' '), issues);
  }
  return estimateParsedPlant(parsed.data);
}

/**
 * The estimate of a plant already parsed with {@link plantInputSchema} (an endpoint that has
 * just parsed the request), so the input is not checked twice.
 */
export function estimateParsedPlant(plant: ParsedPlantInput): PlantResult {
  const fuel = findFuel(plant.energy.fuel) as Fuel;
  const electricity = findFuel('electricity') as Fuel;
  const source: EmissionSourceId = plant.energy.emissionFactorSource ?? 'us-epa-2024';
  const fuelFactor = fuel.emissionFactors.find((f) => f.source === source) ?? (fuel.emissionFactors[0] as Fuel['emissionFactors'][number]);
  const boilerEfficiency = plant.energy.boilerEfficiency ?? fuel.defaultBoilerEfficiency;
  const costPerJFuel = fuelCostPerJoule(fuel, plant.energy.price, plant.energy.priceUnit ?? fuel.defaultPriceUnit);
  const co2PerJFuel = emissionKgPerJoule(fuel, fuelFactor.source) ?? 0;
  const cop = plant.energy.chillerCoefficientOfPerformance;
  const electricityPrice =
    plant.energy.electricityPricePerKWh ?? (fuel.id === 'electricity' ? plant.energy.price : null);
  const co2PerJElectricity = emissionKgPerJoule(electricity, source) ?? emissionKgPerJoule(electricity, 'us-epa-2024') ?? 0;
  const hotRates: Rates = {
    costPerJHeat: costPerJFuel / boilerEfficiency,
    co2PerJHeat: co2PerJFuel / boilerEfficiency,
    fuelJPerJHeat: 1 / boilerEfficiency,
    electricityJPerJHeat: 0,
  };
  const coldRates: Rates = {
    costPerJHeat: electricityPrice === null ? 0 : electricityPrice / 3.6e6 / cop,
    co2PerJHeat: co2PerJElectricity / cop,
    fuelJPerJHeat: 0,
    electricityJPerJHeat: 1 / cop,
  };
  const table = plant.priceTable ? { ...plant.priceTable, illustrative: false } : DEMO_INSTALLED_COST_TABLE;
  const pwf = presentWorthFactor(
    plant.economics.horizonYears,
    plant.economics.discountRatePercent / 100,
    plant.economics.fuelEscalationPercent / 100,
  );
  const ctx: PlantContext = {
    plant,
    fuel,
    hotRates,
    coldRates,
    table,
    pwf,
    atmosphereKPa: atmosphericPressureKPaAtAltitude(plant.conditions.altitudeM),
  };

  const runs: RunEstimate[] = [];
  const terms: SampleTerms[] = [];
  let current = ZERO_FIGURES;
  let proposed = ZERO_FIGURES;
  let installedCost = 0;
  for (const run of plant.runs) {
    const { estimate, terms: runTerms } = estimateRun(run, ctx);
    runs.push(estimate);
    terms.push(runTerms);
    current = add(current, estimate.current);
    proposed = add(proposed, estimate.proposed);
    installedCost += estimate.installedCost;
  }
  const savings = add(current, proposed, -1);
  const currentLifeCycle = pwf * current.annualCost;
  const proposedLifeCycle = installedCost + pwf * proposed.annualCost;
  const totals: PlantResult['totals'] = {
    current,
    proposed,
    savings,
    installedCost,
    simplePaybackYears: simplePaybackYears(installedCost, savings.annualCost),
    lifeCycle: { currentCost: currentLifeCycle, proposedCost: proposedLifeCycle, netSaving: currentLifeCycle - proposedLifeCycle },
    cashFlow: cashFlowByYear(
      installedCost,
      savings.annualCost,
      plant.economics.horizonYears,
      plant.economics.discountRatePercent / 100,
      plant.economics.fuelEscalationPercent / 100,
    ),
  };

  const warnings: PlantWarning[] = [];
  if (table.illustrative) {
    warnings.push({
      code: 'ILLUSTRATIVE_PRICES',
      message: 'Installed costs come from Lagwise’s illustrative demo prices, not a quotation; a consultant replaces them with their own.',
    });
  }
  if (electricityPrice === null && runs.some((r) => r.cold)) {
    warnings.push({
      code: 'COLD_LINES_NOT_PRICED',
      message: 'Heat gained by cold lines is not priced: give an electricity price for the chillers to include it.',
    });
  }
  if (savings.annualCost <= 0) {
    warnings.push({ code: 'NO_SAVING', message: 'The proposal saves nothing on these inputs.' });
  }

  return {
    engineVersion: ENGINE_VERSION,
    currency: plant.energy.currency,
    runs,
    totals,
    range: sampleRanges(plant, terms, totals, boilerEfficiency),
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
      horizonYears: plant.economics.horizonYears,
      discountRatePercent: plant.economics.discountRatePercent,
      fuelEscalationPercent: plant.economics.fuelEscalationPercent,
    },
    warnings,
  };
}
