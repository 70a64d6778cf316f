import { addFigures, annualFigures, ZERO_FIGURES, type AnnualFigures, type Rates } from './annual-figures';
import { findInsulationMaterial, findSurface } from './catalogue';
import { runConditions, type AirState, type RunConditions } from './conditions';
import { c585ActualThicknessM } from './data/c585';
import { fittingEquivalentLengthM, type FittingTypeId } from './data/fittings';
import type { Fuel } from './data/fuels';
import type { InstalledCostTable } from './data/installed-cost-demo';
import type { InsulationMaterial } from './data/insulation-materials';
import { fittingCoverCost, installedCostPerMetre, simplePaybackYears } from './economics';
import { EngineError } from './errors';
import { walkStockSeries, type SeriesPoint } from './least-thickness';
import { LAGGING_CONDITIONS, type LaggingConditionId } from './data/lagging-condition';
import { interpretMeasurements, type MeasurementReading } from './measurements';
import type { ParsedPlantInput, ParsedPlantRun } from './plant-input';
import type { FaceProfile, InputNotice, ResultDetail, RunEstimate, RunOption, ThicknessOption } from './plant-result';
import { vapourPressureKPa } from './psychrometrics';
import type { ParsedRunInput } from './run-input';
import { prepareRun, type PreparedRun } from './run';
import { hazardsToday, noStockMeetsNeed, type NoStock } from './run-hazards';
import { measurementNotices, plausibilityNotices } from './run-notices';
import {
  addBestOfSeries,
  addOption,
  annualCostOfBilled,
  billedW,
  chooseOption,
  meetsNeed,
  pricePerMetre,
  scaleToTypedPrice,
  worseSurface,
  wrongWayW,
  type OptionBasis,
  type SeriesEntry,
  type SolvedState,
  type WeighedOption,
} from './run-options';
import { solveLean, solveResolvedRun, startAtOtherAir, type CoreSolution, type ResolvedLayer, type ResolvedRun } from './run-solver';
import { serviceDefaults, type ServiceDefaults } from './services';
import { CONFIDENCE_SPREADS, type Confidence } from './uncertainty';

/** What a plant estimate shares with each of its runs. */
export interface PlantContext {
  readonly plant: ParsedPlantInput;
  readonly fuel: Fuel;
  readonly hotRates: Rates;
  readonly coldRates: Rates;
  readonly table: InstalledCostTable;
  readonly pwf: number;
  readonly atmosphereKPa: number;
  readonly stockSeries: 'inch' | 'mm';
  readonly detail: ResultDetail;
}

/** What the Monte Carlo needs of a run: everything linear in the sampled factors. */
export interface SampleTerms {
  readonly lengthM: number;
  readonly lengthSpread: number;
  readonly hours: number;
  readonly cold: boolean;
  readonly costPerJHeat: number;
  readonly co2PerJHeat: number;
  /** Billed W/m of the bare and the insulated parts today, and the bare fraction. */
  readonly currentBareWPerM: number;
  readonly currentInsulatedWPerM: number;
  readonly bareFraction: number;
  readonly bareFractionSpread: number;
  readonly currentFittingsBareW: number;
  readonly currentFittingsInsulatedW: number;
  /** The chosen option: billed W/m over the run and W of its fittings, bare and insulated parts. */
  readonly proposedBareWPerM: number;
  readonly proposedInsulatedWPerM: number;
  readonly proposedBareFraction: number;
  readonly proposedFittingsBareW: number;
  readonly proposedFittingsInsulatedW: number;
  /** Relative change of the bare loss per K of air, per m/s of air speed and per unit of emittance. */
  readonly bareSensitivityPerK: number;
  readonly bareSensitivityPerMPerS: number;
  readonly bareSensitivityPerEmittance: number;
  /** Relative change of an insulated loss per K of air. */
  readonly insulatedSensitivityPerK: number;
  readonly airSpreadK: number;
  readonly speedSpreadMPerS: number;
  readonly emittanceSpread: number;
  readonly conditionSpread: number;
  readonly installedPerMetre: number;
  readonly installedFixed: number;
  readonly priceSpread: number;
}

/** A run's result and its sampling terms. */
export interface RunOutcome {
  readonly estimate: RunEstimate;
  readonly terms: SampleTerms;
  readonly noStock: NoStock | null;
}

type MutableRun = { -readonly [K in keyof ResolvedRun]: ResolvedRun[K] };
type MutableLayer = { -readonly [K in keyof ResolvedLayer]: ResolvedLayer[K] };

/** A walked point as a series entry, its loss scaled by the insulation's condition factor where one applies. */
function toSeriesEntry(factor: number): (p: SeriesPoint) => SeriesEntry {
  return (p) => ({
    t: p.thicknessM,
    avg: { wPerM: p.heatLossWPerM * factor, surfaceC: p.surfaceTemperatureC },
    design: p.designSurfaceTemperatureC === null ? null : { wPerM: 0, surfaceC: p.designSurfaceTemperatureC },
    meets: p.meets,
  });
}

/** Air temperature spread (±K) of the range, by how well the air is known — common practice (our choice). */
const AIR_SPREAD_K: Readonly<Record<Confidence, number>> = { measured: 0.5, estimated: 2, guessed: 5 };
/** Emittance spread of the range: a finish named ±0.1, left to the material's usual one ±0.2 — common practice. */
const EMITTANCE_SPREAD = { given: 0.1, assumed: 0.2 } as const;
function materialOrFail(id: string): InsulationMaterial {
  const material = findInsulationMaterial(id);
  if (!material) throw new EngineError('UNKNOWN_MATERIAL', `Unknown insulation material "${id}".`);
  return material;
}

function emittanceOf(surfaceId: string): number {
  return findSurface(surfaceId)?.emittance ?? 0.9;
}

function stockThicknessesM(material: InsulationMaterial, series: 'inch' | 'mm'): number[] {
  const list = series === 'inch' ? material.thicknessSeriesIn.map((t) => t * 0.0254) : material.thicknessSeriesMm.map((t) => t / 1000);
  return list.filter((t) => t < 0.5);
}

function faceProfile(solution: { readonly interfaceDiametersM: readonly number[]; readonly interfaceTemperaturesC: readonly number[] }): FaceProfile {
  return { faceDiametersM: solution.interfaceDiametersM, faceTemperaturesC: solution.interfaceTemperaturesC.slice(1) };
}

/** The run's resolved numbers with another air and insulation. */
function withAir(base: ResolvedRun, airState: AirState, layers: readonly ResolvedLayer[], emittance: number): ResolvedRun {
  return {
    ...base,
    ambientTemperatureC: airState.temperatureC,
    surroundingsTemperatureC: airState.temperatureC,
    windSpeedMPerS: airState.speedMPerS,
    layers,
    surfaceEmittance: emittance,
    airVapourPressureKPa: vapourPressureKPa(airState.temperatureC, airState.relativeHumidityPercent),
  };
}

function lean(run: ResolvedRun, guess?: number): SolvedState {
  const s = solveLean(run, guess);
  return { wPerM: s.heatLossWPerM, surfaceC: s.surfaceTemperatureC };
}

/** Estimates one run of a plant: its conditions, today's figures, every option and the choice. */
export function estimateRun(run: ParsedPlantRun, ctx: PlantContext): RunOutcome {
  const { plant, fuel } = ctx;
  const service = serviceDefaults(run.service);
  const cond: RunConditions = runConditions(run, plant);
  const avg = cond.average;
  const touchLimitC = plant.economics.touchLimitC;
  const marginK = plant.economics.condensationMarginK;
  const notices: InputNotice[] = [];
  const lengthM = run.measurements?.lengthM ?? run.lengthM;
  const lengthConfidence: Confidence = run.measurements?.lengthM !== undefined ? 'measured' : run.lengthConfidence;

  const steamGauge = service.kind === 'steam' ? (run.steamGaugePressureKPa ?? (service.typicalGaugePressureKPa as number)) : undefined;
  let prepared: PreparedRun = prepareRun(bareRunInput(run, ctx, service, cond, lengthM, steamGauge));
  const bareEmittance = prepared.resolved.surfaceEmittance;
  const steamSaturationC = prepared.steam ? prepared.steam.saturationTemperatureC : null;

  // Site readings: a bare reading sets the line temperature; an insulated one the condition factor.
  const reading: MeasurementReading | null = interpretMeasurements(run, prepared, bareEmittance, run.current.state === 'insulated' ? currentLayers(run) : null);
  if (reading !== null && reading.lineTemperatureC !== null) {
    prepared = { ...prepared, resolved: { ...prepared.resolved, fluidTemperatureC: reading.lineTemperatureC } };
  }
  measurementNotices(run, reading, steamSaturationC, notices);
  const base = prepared.resolved;
  const fluidC = base.fluidTemperatureC;
  const cold = service.cold;
  const rates = cold ? ctx.coldRates : ctx.hotRates;
  const hours = run.operatingHoursPerYear ?? plant.operatingHoursPerYear;
  const latent = prepared.steam ? prepared.steam.latentHeatJPerKg : null;

  // Safety needs at design air (the service decides hot or cold).
  const burnNeed = !cold && fluidC > touchLimitC;
  const sweatNeed = cold && fluidC < cond.designWet.dewPointC + marginK;
  const dewLimitC = cond.designWet.dewPointC + marginK;
  const designAir: AirState | null = burnNeed ? cond.designHot : sweatNeed ? cond.designWet : null;

  // Bare pipe.
  // Lean solves for the figures; the full solve (profiles, resistances) only where a full answer shows it.
  // A full answer shows the bare pipe's face profile: solve it in full once, from the start a
  // lean solve takes (the same root, to the last digit), rather than lean now and in full later.
  const bareFull = ctx.detail === 'full' ? solveResolvedRun(base) : null;
  const bareLean = bareFull ?? solveLean(base);
  const bareAvg: SolvedState = { wPerM: bareLean.heatLossWPerM, surfaceC: bareLean.surfaceTemperatureC };
  const bareLatentWPerM = bareLean.latentGainWPerM;
  const bareDesign = designAir ? lean(withAir(base, designAir, [], bareEmittance), startAtOtherAir(bareAvg.surfaceC, base.fluidTemperatureC, base.ambientTemperatureC, designAir.temperatureC)) : bareAvg;

  const fittings = fittingsOf(run, base.pipeOuterDiameterM);
  const { bareEqL: fitBareEqL, eqL: fitEqL, uncoveredCount } = fittings;

  // Prices of the proposal.
  const proposal = run.proposed;
  const material = materialOrFail(proposal.material ?? service.defaultInsulation);
  const jacket = proposal.jacket ?? service.defaultJacket;
  const jacketEmittance = emittanceOf(jacket);
  const coverFittings = proposal.coverFittings;
  const coverEach = proposal.price?.coverEach ?? fittingCoverCost(ctx.table, base.pipeOuterDiameterM);
  const pwf = ctx.pwf;

  // Today.
  const state = run.current.state;
  const bareFraction = state === 'bare' ? 1 : state === 'damaged' ? run.current.bareFraction : 0;
  let existing: ExistingLagging | null = null;
  let currentIns: SolvedState | null = null;
  let currentInsDesign: SolvedState | null = null;
  let currentInsFull: CoreSolution | null = null;
  const conditionFactor = reading?.conditionFactor ?? 1;
  if (run.current.state !== 'bare') {
    const lagging = materialOrFail(run.current.material);
    const layers = [laggingInPlace(lagging, run.current.thicknessM, run.current.condition)];
    const emittance = emittanceOf(run.current.jacket);
    existing = { material: lagging, thicknessM: run.current.thicknessM, jacket: run.current.jacket, emittance, layers };
    const currentInsRun: ResolvedRun = { ...base, layers, surfaceEmittance: emittance };
    currentInsFull = ctx.detail === 'full' ? solveResolvedRun(currentInsRun) : null;
    const solved = currentInsFull ? { wPerM: currentInsFull.heatLossWPerM, surfaceC: currentInsFull.surfaceTemperatureC } : lean(currentInsRun);
    currentIns = { wPerM: solved.wPerM * conditionFactor, surfaceC: solved.surfaceC };
    currentInsDesign = designAir ? lean(withAir(base, designAir, layers, emittance), startAtOtherAir(solved.surfaceC, base.fluidTemperatureC, base.ambientTemperatureC, designAir.temperatureC)) : currentIns;
  }
  const basisWithoutToday = {
    cold,
    lengthM,
    hours,
    rates,
    fuel,
    latentHeatJPerKg: latent,
    presentWorthFactor: pwf,
    bareWPerM: bareAvg.wPerM,
    bareDesignC: bareDesign.surfaceC,
    fitBareEqL,
    fitEqL,
    uncoveredCount,
    coverFittings,
    coverEach,
    burnNeed,
    sweatNeed,
    touchLimitC,
    dewLimitC,
    currentAnnualCost: 0,
    table: ctx.table,
    pipeOuterDiameterM: base.pipeOuterDiameterM,
  };
  const insW = currentIns ? currentIns.wPerM : bareAvg.wPerM;
  const currentSignedWPerM = bareFraction * bareAvg.wPerM + (1 - bareFraction) * insW;
  const fittingsCoveredToday = currentIns ? currentIns.wPerM : bareAvg.wPerM;
  const b0: OptionBasis = basisWithoutToday;
  const currentBilledW = lengthM * (bareFraction * billedW(b0, bareAvg.wPerM) + (1 - bareFraction) * billedW(b0, insW)) + fitBareEqL * billedW(b0, bareAvg.wPerM) + fittings.coveredEqL * billedW(b0, fittingsCoveredToday);
  const currentWrongW = lengthM * (bareFraction * wrongWayW(b0, bareAvg.wPerM) + (1 - bareFraction) * wrongWayW(b0, insW)) + fitBareEqL * wrongWayW(b0, bareAvg.wPerM) + fittings.coveredEqL * wrongWayW(b0, fittingsCoveredToday);
  const currentLatentW = lengthM * bareFraction * bareLatentWPerM + fitBareEqL * bareLatentWPerM;
  const currentFigures = annualFigures(currentBilledW, hours, rates, fuel, latent);
  const basis: OptionBasis = { ...basisWithoutToday, currentAnnualCost: currentFigures.annualCost };
  const currentHasBare = bareFraction > 0 || fitBareEqL > 0;
  const currentDesignSurfaceC = currentHasBare ? (currentInsDesign ? worseSurface(basis, bareDesign.surfaceC, currentInsDesign.surfaceC) : bareDesign.surfaceC) : (currentInsDesign as SolvedState).surfaceC;
  const currentAvgSurfaceC = currentHasBare || !currentIns ? bareAvg.surfaceC : currentIns.surfaceC;

  const hazards = hazardsToday({
    burnNeed,
    sweatNeed,
    touchLimitC,
    wetDewPointC: cond.designWet.dewPointC,
    bareFraction,
    insulatedDesignC: currentInsDesign ? currentInsDesign.surfaceC : null,
    bareDesignC: bareDesign.surfaceC,
    uncoveredCount,
  });

  // New insulation on bare pipe: the stock series (nominal thickness; C585 actual on the pipe for the inch series).
  const actual = (t: number) => (ctx.stockSeries === 'inch' ? c585ActualThicknessM(base.pipeOuterDiameterM, t) : t);
  const thicknesses = proposal.thicknessM !== undefined ? [proposal.thicknessM] : stockThicknessesM(material, ctx.stockSeries);
  // In a summary answer the walk stops past the least life-cycle cost; the full answer keeps every stock thickness for its chart.
  const costed = ctx.detail === 'summary' && proposal.thicknessM === undefined;
  const avgRun: MutableRun = { ...base, layers: [], surfaceEmittance: jacketEmittance };
  const designRun: MutableRun | null = designAir ? { ...withAir(base, designAir, [], jacketEmittance) } : null;
  const series: SeriesWalkBasis = { basis, material, thicknesses, avgRun, designRun, actual, costed };
  const newSeries = walkSeries(series, [], 0, 1, undefined);

  // Adding a layer over what is there (insulated or damaged runs).
  let addSeries: SeriesEntry[] = [];
  let repairPrice = 0;
  if (existing) {
    repairPrice = pricePerMetre(basis, existing.material, existing.thicknessM);
    const repairPerMetre = bareFraction > 0 ? bareFraction * installedCostPerMetre(ctx.table, base.pipeOuterDiameterM, existing.thicknessM) * existing.material.installedCostFactor : 0;
    // The first added layer starts from the surface of the lagging in place.
    addSeries = walkSeries(series, existing.layers, repairPerMetre, conditionFactor, currentIns?.surfaceC);
  }

  // Options.
  const options: WeighedOption[] = [];
  const fitCovers = coverFittings ? uncoveredCount : 0;
  // Leave as it is (today's covered fittings stay as they are).
  addOption(basis, options, 'leave', { material: existing?.material.id ?? null, thicknessM: existing?.thicknessM ?? null, jacket: existing?.jacket ?? null }, insW, bareFraction, fittingsCoveredToday, 0, 0, 0, currentDesignSurfaceC, meetsNeed(basis, currentDesignSurfaceC));
  // Repair only what is bare: the bare stretch at the existing insulation, and covers on bare fittings.
  if (existing && currentIns && currentInsDesign && (bareFraction > 0 || (uncoveredCount > 0 && coverFittings))) {
    const designC = uncoveredCount > 0 && !coverFittings ? worseSurface(basis, currentInsDesign.surfaceC, bareDesign.surfaceC) : currentInsDesign.surfaceC;
    addOption(basis, options, 'repair', { material: existing.material.id, thicknessM: existing.thicknessM, jacket: existing.jacket }, currentIns.wPerM, 0, currentIns.wPerM, fitCovers, bareFraction * lengthM, repairPrice, designC, meetsNeed(basis, designC));
  }
  // Insulate a bare run, or replace what is there.
  addBestOfSeries(basis, options, newSeries, state === 'bare' ? 'insulate' : 'replace', material, jacket, 0);
  // A damaged run's bare stretch is repaired first, then the layer goes over the whole run.
  if (existing) addBestOfSeries(basis, options, addSeries, 'add-layer', material, jacket, bareFraction > 0 ? bareFraction * repairPrice : 0);

  const typed = proposal.price;
  let { chosen, reason } = chooseOption(basis, options, proposal.option);
  if (typed && chosen.kind !== 'leave') {
    scaleToTypedPrice(basis, options, chosen, typed);
    ({ chosen, reason } = chooseOption(basis, options, proposal.option));
  }

  // Plain words where nothing in stock meets a need.
  const noStock: NoStock | null =
    (burnNeed || sweatNeed) && !options.some((o) => o.kind !== 'leave' && o.meetsTouchLimit && o.meetsDewPoint) && !(options[0]?.meetsTouchLimit && options[0]?.meetsDewPoint)
      ? noStockMeetsNeed(run.label, material, newSeries, bareDesign.surfaceC, { burnNeed, touchLimitC, wetDewPointC: cond.designWet.dewPointC, marginK, dewLimitC })
      : null;

  // Figures of the chosen option.
  const proposedFigures = annualFigures(
    lengthM * ((1 - chosen.pipeBareFraction) * billedW(basis, chosen.pipeWPerM) + chosen.pipeBareFraction * billedW(basis, bareAvg.wPerM)) + chosen.fitBareW + chosen.fitInsulatedW,
    hours,
    rates,
    fuel,
    latent,
  );
  const savings = addFigures(currentFigures, proposedFigures, -1);
  const currentLifeCycle = pwf * currentFigures.annualCost;
  const proposedLifeCycle = chosen.installedCost + pwf * proposedFigures.annualCost;

  // The chosen option's surface and face profile (a full solve, once).
  let proposedProfile: FaceProfile | undefined;
  let proposedSurfaceC = currentAvgSurfaceC;
  if (chosen.kind === 'leave') {
    const today = currentHasBare || !currentInsFull ? bareFull : currentInsFull;
    proposedProfile = today ? faceProfile(today) : undefined;
  } else {
    const layers: ResolvedLayer[] =
      chosen.kind === 'repair' && existing
        ? existing.layers
        : chosen.kind === 'add-layer' && existing
          ? [...existing.layers, { thicknessM: chosen.thicknessM as number, curve: material.conductivity }]
          : [{ thicknessM: actual(chosen.thicknessM as number), curve: material.conductivity }];
    const emittance = chosen.kind === 'repair' && existing ? existing.emittance : jacketEmittance;
    // The same run was solved for the options already: its surface is the start.
    const startC =
      chosen.kind === 'repair' ? currentIns?.surfaceC : (chosen.kind === 'add-layer' ? addSeries : newSeries).find((e) => e.t === chosen.thicknessM)?.avg.surfaceC;
    if (ctx.detail === 'full') {
      const full = solveResolvedRun({ ...base, layers, surfaceEmittance: emittance }, startC);
      proposedSurfaceC = full.surfaceTemperatureC;
      proposedProfile = faceProfile(full);
    } else {
      proposedSurfaceC = lean({ ...base, layers, surfaceEmittance: emittance }, startC).surfaceC;
    }
  }

  // The series shown for the proposed material, and the least thicknesses for safety.
  const seriesOut = thicknessSeriesOut(basis, newSeries, material, fitCovers, actual);
  let economic: ThicknessOption | undefined;
  for (const o of seriesOut) if (!economic || o.lifeCycleCost < economic.lifeCycleCost) economic = o;
  const leastMeeting = newSeries.find((e) => e.meets && e.design !== null) ?? (designAir ? newSeries.find((e) => e.meets) : undefined);

  plausibilityNotices(run, plant.runs, service, lengthM, fluidC, steamGauge, ctx.atmosphereKPa, notices);

  // Bare pipe's sensitivities matter only where bare pipe or bare fittings remain, today or after the choice.
  const bareMatters = currentHasBare || chosen.pipeBareFraction > 0 || chosen.fitBareW > 0;
  const terms = samplingTerms({
    basis,
    run,
    cond,
    base,
    bareAvg,
    bareEmittance,
    bareMatters,
    lengthConfidence,
    chosen,
    hasLagging: existing !== null,
    conditionMeasured: reading?.conditionFactor !== null && reading?.conditionFactor !== undefined,
    illustrativePrices: ctx.table.illustrative,
    bareFraction,
    insW,
    fittingsCoveredToday,
    fitCoveredEqL: fittings.coveredEqL,
  });

  const estimate: RunEstimate = {
    id: run.id,
    label: run.label,
    service: run.service,
    cold,
    lengthM,
    operatingHoursPerYear: hours,
    fluidTemperatureC: fluidC,
    steamAbsolutePressureKPa: prepared.steam ? prepared.steam.absolutePressureKPa : null,
    latentHeatJPerKg: latent,
    areaId: cond.areaId,
    air: { temperatureC: avg.temperatureC, speedMPerS: avg.speedMPerS, relativeHumidityPercent: avg.relativeHumidityPercent, dewPointC: avg.dewPointC },
    designAir: {
      hotTemperatureC: cond.designHot.temperatureC,
      wetTemperatureC: cond.designWet.temperatureC,
      wetRelativeHumidityPercent: cond.designWet.relativeHumidityPercent,
      wetDewPointC: cond.designWet.dewPointC,
    },
    pipeOuterDiameterM: base.pipeOuterDiameterM,
    fittings: { valves: run.valves, flangePairs: run.flangePairs, equivalentLengthM: fitEqL, bareEquivalentLengthM: fitBareEqL, uncoveredCount },
    bare: { heatLossWPerM: bareAvg.wPerM, surfaceTemperatureC: bareAvg.surfaceC },
    // Spelled out rather than spread: a spread into a literal with more keys takes V8's slow path.
    current: {
      heatW: currentFigures.heatW,
      annualHeatGJ: currentFigures.annualHeatGJ,
      annualFuelGJ: currentFigures.annualFuelGJ,
      annualFuelQuantity: currentFigures.annualFuelQuantity,
      annualChillerElectricityKWh: currentFigures.annualChillerElectricityKWh,
      annualCost: currentFigures.annualCost,
      annualCo2Kg: currentFigures.annualCo2Kg,
      steamKgPerHour: currentFigures.steamKgPerHour,
      steamKgPerYear: currentFigures.steamKgPerYear,
      state,
      heatLossWPerM: currentSignedWPerM,
      surfaceTemperatureC: currentAvgSurfaceC,
      designSurfaceTemperatureC: currentDesignSurfaceC,
      latentGainW: currentLatentW,
      wrongWayHeatW: currentWrongW,
      ...(bareFull ? { profile: faceProfile(bareFraction > 0 || !currentInsFull ? bareFull : currentInsFull) } : {}),
    },
    proposed: {
      heatW: proposedFigures.heatW,
      annualHeatGJ: proposedFigures.annualHeatGJ,
      annualFuelGJ: proposedFigures.annualFuelGJ,
      annualFuelQuantity: proposedFigures.annualFuelQuantity,
      annualChillerElectricityKWh: proposedFigures.annualChillerElectricityKWh,
      annualCost: proposedFigures.annualCost,
      annualCo2Kg: proposedFigures.annualCo2Kg,
      steamKgPerHour: proposedFigures.steamKgPerHour,
      steamKgPerYear: proposedFigures.steamKgPerYear,
      option: chosen.kind,
      material: chosen.material ?? 'none',
      thicknessM: chosen.thicknessM ?? 0,
      jacket: chosen.jacket ?? 'none',
      heatLossWPerM: chosen.kind === 'leave' ? currentSignedWPerM : chosen.pipeWPerM,
      surfaceTemperatureC: proposedSurfaceC,
      designSurfaceTemperatureC: chosen.designSurfaceTemperatureC,
      coverFittings: chosen.fittingCovers > 0,
      ...(proposedProfile ? { profile: proposedProfile } : {}),
    },
    savings,
    installedCost: chosen.installedCost,
    simplePaybackYears: chosen.kind === 'leave' ? null : simplePaybackYears(chosen.installedCost, savings.annualCost),
    lifeCycle: { currentCost: currentLifeCycle, proposedCost: proposedLifeCycle, netSaving: currentLifeCycle - proposedLifeCycle },
    choice: reason,
    options: options.map(ctx.detail === 'full' ? fullOption : summaryOption),
    economicThickness: economic ? { thicknessM: economic.thicknessM, lifeCycleCost: economic.lifeCycleCost } : null,
    ...(ctx.detail === 'full' ? { thicknessSeries: seriesOut } : {}),
    personnelProtection: { applies: burnNeed, touchLimitC, designAirTemperatureC: cond.designHot.temperatureC, leastThicknessM: burnNeed ? (leastMeeting?.t ?? null) : null },
    condensationControl: { applies: sweatNeed, dewPointC: cond.designWet.dewPointC, marginK, leastThicknessM: sweatNeed ? (leastMeeting?.t ?? null) : null },
    measurements: reading ? { measuredHeatLossWPerM: reading.measuredHeatLossWPerM, surfaceTemperatureC: reading.surfaceTemperatureC, lineTemperatureC: reading.lineTemperatureC, conditionFactor: reading.conditionFactor } : null,
    hazards,
    notices,
  };
  return { estimate, terms, noStock };
}

/** The bare run's input to the solver: the pipe, what it carries, and the year's average air. */
function bareRunInput(run: ParsedPlantRun, ctx: PlantContext, service: ServiceDefaults, cond: RunConditions, lengthM: number, steamGauge: number | undefined): ParsedRunInput {
  const avg = cond.average;
  return {
    pipe: run.pipe,
    ...(steamGauge !== undefined
      ? { steam: { gaugePressureKPa: steamGauge, atmosphericPressureKPa: ctx.atmosphereKPa } }
      : { fluidTemperatureC: run.fluidTemperatureC ?? service.typicalTemperatureC }),
    ...(service.liquid ? { fluid: { kind: service.liquid, velocityMPerS: run.velocityMPerS ?? service.typicalVelocityMPerS } } : {}),
    ambientTemperatureC: avg.temperatureC,
    windSpeedMPerS: avg.speedMPerS,
    orientation: run.orientation,
    runHeightM: run.runHeightM ?? 3,
    runLengthM: lengthM,
    relativeHumidityPercent: avg.relativeHumidityPercent,
    ...(run.finish !== undefined ? { surface: run.finish } : {}),
    insulation: [],
    touchLimitC: ctx.plant.economics.touchLimitC,
  };
}

/** The lagging on a run today, as the options see it. */
interface ExistingLagging {
  readonly material: InsulationMaterial;
  readonly thicknessM: number;
  readonly jacket: string;
  readonly emittance: number;
  readonly layers: ResolvedLayer[];
}

/** A run's fittings as equivalent lengths of bare pipe at its size: all, those bare today, and how many are bare. */
interface FittingsTally {
  readonly eqL: number;
  readonly bareEqL: number;
  readonly coveredEqL: number;
  readonly uncoveredCount: number;
}

function fittingsOf(run: ParsedPlantRun, pipeOuterDiameterM: number): FittingsTally {
  const coveredToday = run.current.state !== 'bare';
  let bareEqL = 0;
  let coveredEqL = 0;
  let uncoveredCount = 0;
  const add = (type: FittingTypeId, count: number, covered: boolean) => {
    const eq = count * fittingEquivalentLengthM(type, pipeOuterDiameterM);
    if (covered) coveredEqL += eq;
    else {
      bareEqL += eq;
      uncoveredCount += count;
    }
  };
  if (run.valves > 0) add('valve-flanged', run.valves, run.fittingsInsulated && coveredToday);
  if (run.flangePairs > 0) add('flange-pair', run.flangePairs, run.fittingsInsulated && coveredToday);
  for (const f of run.fittings) add(f.type, f.count, f.covered && coveredToday);
  return { eqL: bareEqL + coveredEqL, bareEqL, coveredEqL, uncoveredCount };
}

/** How one series is walked: the run at average and design air, re-layered per thickness (no run is allocated per solve). */
interface SeriesWalkBasis {
  readonly basis: OptionBasis;
  readonly material: InsulationMaterial;
  readonly thicknesses: readonly number[];
  readonly avgRun: MutableRun;
  readonly designRun: MutableRun | null;
  /** The thickness a stock (nominal) thickness has on bare pipe. */
  readonly actual: (thicknessM: number) => number;
  /** Stop past the least life-cycle cost (a summary answer shows no series). */
  readonly costed: boolean;
}

/**
 * The proposed material's stock series on the bare pipe (no layers `under`), or added over the
 * lagging in place, with each loss scaled by `factor` (the condition of what is there).
 */
function walkSeries(w: SeriesWalkBasis, under: readonly ResolvedLayer[], extraPerMetre: number, factor: number, firstGuessC: number | undefined): SeriesEntry[] {
  const { basis, avgRun, designRun } = w;
  const layer: MutableLayer = { thicknessM: 0, curve: w.material.conductivity };
  const layers: ResolvedLayer[] = [...under, layer];
  const over = under.length > 0;
  const fitCovers = basis.coverFittings ? basis.uncoveredCount : 0;
  return walkStockSeries({
    thicknessesM: w.thicknesses,
    runAt: (t) => {
      layer.thicknessM = over ? t : w.actual(t);
      avgRun.layers = layers;
      return avgRun;
    },
    designRunAt: designRun
      ? (t) => {
          layer.thicknessM = over ? t : w.actual(t);
          designRun.layers = layers;
          return designRun;
        }
      : null,
    meets: (surfaceC) => meetsNeed(basis, surfaceC),
    ...(firstGuessC !== undefined ? { firstGuessC } : {}),
    ...(w.costed
      ? {
          lifeCycleCost: (t: number, wPerM: number) =>
            (pricePerMetre(basis, w.material, t) + extraPerMetre) * basis.lengthM +
            fitCovers * basis.coverEach +
            basis.presentWorthFactor * annualCostOfBilled(basis, (basis.lengthM + basis.fitEqL) * billedW(basis, wPerM * factor)),
        }
      : {}),
  }).map(toSeriesEntry(factor));
}

/** The proposed material's series as the full answer shows it: each stock thickness with its cost over the horizon. */
function thicknessSeriesOut(basis: OptionBasis, series: readonly SeriesEntry[], material: InsulationMaterial, fitCovers: number, actual: (thicknessM: number) => number): ThicknessOption[] {
  return series.map((e) => {
    const installed = pricePerMetre(basis, material, e.t) * basis.lengthM + fitCovers * basis.coverEach;
    const fitW = basis.fitEqL * billedW(basis, e.avg.wPerM);
    return {
      thicknessM: e.t,
      actualThicknessM: actual(e.t),
      heatLossWPerM: e.avg.wPerM,
      surfaceTemperatureC: e.avg.surfaceC,
      installedCost: installed,
      lifeCycleCost: installed + basis.presentWorthFactor * annualCostOfBilled(basis, basis.lengthM * billedW(basis, e.avg.wPerM) + fitW),
    };
  });
}

/** What the range needs of a run, beyond its figures. */
interface TermsFacts {
  readonly basis: OptionBasis;
  readonly run: ParsedPlantRun;
  readonly cond: RunConditions;
  readonly base: ResolvedRun;
  readonly bareAvg: SolvedState;
  readonly bareEmittance: number;
  /** Bare pipe or bare fittings remain, today or after the choice. */
  readonly bareMatters: boolean;
  readonly lengthConfidence: Confidence;
  readonly chosen: WeighedOption;
  readonly hasLagging: boolean;
  readonly conditionMeasured: boolean;
  readonly illustrativePrices: boolean;
  readonly bareFraction: number;
  readonly insW: number;
  readonly fittingsCoveredToday: number;
  readonly fitCoveredEqL: number;
}

/** Air speed and emittance steps of the bare pipe's sensitivities (finite differences). */
const SPEED_STEP_M_PER_S = 0.5;
const EMITTANCE_STEP = 0.1;
/** Least air-speed spread of the range by confidence, m/s — common practice (our choice). */
const LEAST_SPEED_SPREAD_M_PER_S: Readonly<Record<Confidence, number>> = { measured: 0.05, estimated: 0.2, guessed: 0.5 };

/** A run's sampling terms: its figures split linear in the sampled factors, and its sensitivities. */
function samplingTerms(f: TermsFacts): SampleTerms {
  const { basis, run, cond, base, bareAvg, chosen } = f;
  const avg = cond.average;
  const typed = run.proposed.price;
  const bareAtSpeed = f.bareMatters ? lean({ ...base, windSpeedMPerS: avg.speedMPerS + SPEED_STEP_M_PER_S }, bareAvg.surfaceC).wPerM : bareAvg.wPerM;
  const bareAtEmittance = f.bareMatters ? lean({ ...base, surfaceEmittance: Math.min(1, f.bareEmittance + EMITTANCE_STEP) }, bareAvg.surfaceC).wPerM : bareAvg.wPerM;
  const rel = (x: number) => (Math.abs(bareAvg.wPerM) > 1e-9 ? (x - bareAvg.wPerM) / bareAvg.wPerM : 0);
  const tDiff = base.fluidTemperatureC - avg.temperatureC;
  const confidence = cond.confidence;
  return {
    lengthM: basis.lengthM,
    lengthSpread: CONFIDENCE_SPREADS[f.lengthConfidence],
    hours: basis.hours,
    cold: basis.cold,
    costPerJHeat: basis.rates.costPerJHeat,
    co2PerJHeat: basis.rates.co2PerJHeat,
    currentBareWPerM: billedW(basis, bareAvg.wPerM),
    currentInsulatedWPerM: billedW(basis, f.insW),
    bareFraction: f.bareFraction,
    bareFractionSpread: run.current.state === 'damaged' ? CONFIDENCE_SPREADS[run.current.bareFractionConfidence] : 0,
    currentFittingsBareW: basis.fitBareEqL * billedW(basis, bareAvg.wPerM),
    currentFittingsInsulatedW: f.fitCoveredEqL * billedW(basis, f.fittingsCoveredToday),
    proposedBareWPerM: billedW(basis, bareAvg.wPerM),
    proposedInsulatedWPerM: billedW(basis, chosen.pipeWPerM),
    proposedBareFraction: chosen.pipeBareFraction,
    proposedFittingsBareW: chosen.fitBareW,
    proposedFittingsInsulatedW: chosen.fitInsulatedW,
    bareSensitivityPerK: Math.abs(tDiff) > 1e-9 ? -1.25 / tDiff : 0,
    bareSensitivityPerMPerS: rel(bareAtSpeed) / SPEED_STEP_M_PER_S,
    bareSensitivityPerEmittance: rel(bareAtEmittance) / EMITTANCE_STEP,
    insulatedSensitivityPerK: Math.abs(tDiff) > 1e-9 ? -1 / tDiff : 0,
    airSpreadK: AIR_SPREAD_K[confidence],
    speedSpreadMPerS: Math.max(CONFIDENCE_SPREADS[confidence] * avg.speedMPerS, LEAST_SPEED_SPREAD_M_PER_S[confidence]),
    emittanceSpread: run.finish !== undefined ? EMITTANCE_SPREAD.given : EMITTANCE_SPREAD.assumed,
    conditionSpread: f.hasLagging ? (f.conditionMeasured ? CONFIDENCE_SPREADS.measured : CONFIDENCE_SPREADS.guessed) : 0,
    installedPerMetre: chosen.lengthInsulatedM > 0 ? (chosen.installedCost - chosen.fixedPrice * (typed?.lumpSum !== undefined ? 0 : 1)) / basis.lengthM : 0,
    installedFixed: typed?.lumpSum !== undefined ? 0 : chosen.kind === 'leave' ? 0 : chosen.fixedPrice,
    priceSpread: typed ? CONFIDENCE_SPREADS.measured : f.illustrativePrices ? CONFIDENCE_SPREADS.guessed : CONFIDENCE_SPREADS.estimated,
  };
}

/** An option as a summary answer gives it: the figures the screens show. */
function summaryOption(o: WeighedOption): RunOption {
  return {
    kind: o.kind,
    thicknessM: o.thicknessM,
    installedCost: o.installedCost,
    annualCost: o.annualCost,
    simplePaybackYears: o.simplePaybackYears,
    lifeCycleCost: o.lifeCycleCost,
    meetsTouchLimit: o.meetsTouchLimit,
    meetsDewPoint: o.meetsDewPoint,
  };
}

/** An option as the full answer gives it: the summary's figures and the rest of what was weighed. */
function fullOption(o: WeighedOption): RunOption {
  return {
    ...summaryOption(o),
    material: o.material,
    jacket: o.jacket,
    lengthInsulatedM: o.lengthInsulatedM,
    fittingCovers: o.fittingCovers,
    annualHeatGJ: o.annualHeatGJ,
    annualCo2Kg: o.annualCo2Kg,
    annualCostSaving: o.annualCostSaving,
    designSurfaceTemperatureC: o.designSurfaceTemperatureC,
  };
}

function currentLayers(run: ParsedPlantRun): ResolvedLayer[] | null {
  if (run.current.state === 'bare') return null;
  const material = findInsulationMaterial(run.current.material);
  return material ? [laggingInPlace(material, run.current.thicknessM, run.current.condition)] : null;
}

/** The layer of lagging on the pipe today, as its condition leaves it (data/lagging-condition). */
function laggingInPlace(material: InsulationMaterial, thicknessM: number, condition: LaggingConditionId): ResolvedLayer {
  const found = LAGGING_CONDITIONS.find((c) => c.id === condition) ?? LAGGING_CONDITIONS[0];
  const { a, b, c } = material.conductivity;
  const k = found.conductivityFactor;
  return { thicknessM: thicknessM * found.thicknessFactor, curve: k === 1 ? material.conductivity : { a: a * k, b: b * k, c: c * k } };
}

export { ZERO_FIGURES };
export type { AnnualFigures };
