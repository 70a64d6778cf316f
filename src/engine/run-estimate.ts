import { annualCostOf, annualFigures, addFigures, ZERO_FIGURES, type AnnualFigures, type Rates } from './annual-figures';
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
import type { OptionKind, ParsedPlantInput, ParsedPlantRun } from './plant-input';
import type {
  ChoiceReason,
  FaceProfile,
  InputNotice,
  ResultDetail,
  RunEstimate,
  RunOption,
  ThicknessOption,
} from './plant-result';
import { vapourPressureKPa } from './psychrometrics';
import type { ParsedRunInput } from './run-input';
import { prepareRun, type PreparedRun, type RunWarning } from './run';
import { solveLean, solveResolvedRun, type CoreSolution, type ResolvedLayer, type ResolvedRun } from './run-solver';
import { formatNumber } from './schema-helpers';
import { saturationTemperatureC } from './steam-properties';
import { serviceDefaults } from './services';
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
  readonly noStock: { readonly need: 'touch' | 'dew'; readonly message: string } | null;
}

interface SolvedState {
  /** Signed W/m (positive out of the line). */
  readonly wPerM: number;
  readonly surfaceC: number;
}

type MutableRun = { -readonly [K in keyof ResolvedRun]: ResolvedRun[K] };
type MutableLayer = { -readonly [K in keyof ResolvedLayer]: ResolvedLayer[K] };

/** A stock thickness of an option's series, in the shape the options are built from. */
interface SeriesEntry {
  readonly t: number;
  readonly avg: SolvedState;
  readonly design: SolvedState | null;
  readonly meets: boolean;
}

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
/** A bare steam reading this far under saturation points at a fault or a false reading (method.md). */
const SATURATION_SHORTFALL_K = 5;
/** A measured insulated surface is trusted for a condition factor only this far from the air (method.md). */
const CONDITION_FACTOR_MIN_DIFFERENCE_K = 10;
const RUN_LENGTH_NOTICE_M = 1000;
const MANY_VALVES = 50;
const GLYCOL_NOTICE_C = 60;
/** Usual gauge pressure of a hot-water main when none is given, kPa — common practice. */
const TYPICAL_LIQUID_GAUGE_KPA = 300;

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
  const runInput: ParsedRunInput = {
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
    touchLimitC,
  };
  let prepared: PreparedRun = prepareRun(runInput);
  const bareEmittance = prepared.resolved.surfaceEmittance;
  const steamSaturationC = prepared.steam ? prepared.steam.saturationTemperatureC : null;

  // Site readings: a bare reading sets the line temperature; an insulated one the condition factor.
  const reading: MeasurementReading | null = interpretMeasurements(run, prepared, bareEmittance, run.current.state === 'insulated' ? currentLayers(run) : null);
  if (reading?.lineTemperatureC !== null && reading?.lineTemperatureC !== undefined) {
    prepared = { ...prepared, resolved: { ...prepared.resolved, fluidTemperatureC: reading.lineTemperatureC } };
    if (steamSaturationC !== null && reading.lineTemperatureC < steamSaturationC - SATURATION_SHORTFALL_K) {
      notices.push({
        code: 'MEASURED_BELOW_SATURATION',
        path: `runs.${run.id}.measurements.surfaceTemperatureC`,
        message: `The bare steam line reads about ${formatNumber(Math.round(reading.lineTemperatureC))} °C, more than ${SATURATION_SHORTFALL_K} K under the ${formatNumber(Math.round(steamSaturationC))} °C of saturated steam at the stated pressure: the line may run only part of the time, hold condensate, have a wrong gauge, or a shiny surface may have misled an infrared reading.`,
        params: { quantity: 'temperature', givenSI: reading.lineTemperatureC, limitSI: steamSaturationC - SATURATION_SHORTFALL_K, limit: 'min' },
      });
    }
  }
  if (reading && reading.closeToAir) {
    notices.push({
      code: 'MEASURED_CLOSE_TO_AIR',
      path: `runs.${run.id}.measurements.surfaceTemperatureC`,
      message: `The insulated surface reads within ${CONDITION_FACTOR_MIN_DIFFERENCE_K} K of the air, too close to judge the insulation's condition from; the catalogue figure is kept.`,
    });
  }
  const base = prepared.resolved;
  const fluidC = base.fluidTemperatureC;
  const cold = service.cold;
  const sign = cold ? -1 : 1;
  const rates = cold ? ctx.coldRates : ctx.hotRates;
  const hours = run.operatingHoursPerYear ?? plant.operatingHoursPerYear;
  const latent = prepared.steam ? prepared.steam.latentHeatJPerKg : null;
  const billed = (wPerM: number) => Math.max(0, sign * wPerM);
  const wrongWay = (wPerM: number) => Math.max(0, -sign * wPerM);

  // Safety needs at design air (the service decides hot or cold).
  const burnNeed = !cold && fluidC > touchLimitC;
  const sweatNeed = cold && fluidC < cond.designWet.dewPointC + marginK;
  const dewLimitC = cond.designWet.dewPointC + marginK;
  const designAir: AirState | null = burnNeed ? cond.designHot : sweatNeed ? cond.designWet : null;
  const meets = (surfaceC: number) => (burnNeed ? surfaceC <= touchLimitC : sweatNeed ? surfaceC >= dewLimitC : true);
  const worse = (a: number, b: number) => (cold ? Math.min(a, b) : Math.max(a, b));

  // Bare pipe.
  // Lean solves for the figures; the full solve (profiles, resistances) only where a full answer shows it.
  // A full answer shows the bare pipe's face profile: solve it in full once, from the start a
  // lean solve takes (the same root, to the last digit), rather than lean now and in full later.
  const bareFull = ctx.detail === 'full' ? solveResolvedRun(base) : null;
  const bareLean = bareFull ?? solveLean(base);
  const bareAvg: SolvedState = { wPerM: bareLean.heatLossWPerM, surfaceC: bareLean.surfaceTemperatureC };
  const bareLatentWPerM = bareLean.latentGainWPerM;
  const bareDesign = designAir ? lean(withAir(base, designAir, [], bareEmittance)) : bareAvg;

  // Fittings at the run's size.
  const fittingItems: { type: FittingTypeId; count: number; covered: boolean }[] = [
    ...(run.valves > 0 ? [{ type: 'valve-flanged' as const, count: run.valves, covered: run.fittingsInsulated && run.current.state !== 'bare' }] : []),
    ...(run.flangePairs > 0 ? [{ type: 'flange-pair' as const, count: run.flangePairs, covered: run.fittingsInsulated && run.current.state !== 'bare' }] : []),
    ...run.fittings.map((f) => ({ type: f.type, count: f.count, covered: f.covered && run.current.state !== 'bare' })),
  ];
  let fitBareEqL = 0;
  let fitCoveredEqL = 0;
  let uncoveredCount = 0;
  for (const item of fittingItems) {
    const eq = item.count * fittingEquivalentLengthM(item.type, base.pipeOuterDiameterM);
    if (item.covered) fitCoveredEqL += eq;
    else {
      fitBareEqL += eq;
      uncoveredCount += item.count;
    }
  }
  const fitEqL = fitBareEqL + fitCoveredEqL;

  // Today.
  const state = run.current.state;
  const bareFraction = state === 'bare' ? 1 : state === 'damaged' ? run.current.bareFraction : 0;
  let existing: { material: InsulationMaterial; thicknessM: number; jacket: string; emittance: number; layers: ResolvedLayer[] } | null = null;
  let currentIns: SolvedState | null = null;
  let currentInsDesign: SolvedState | null = null;
  let currentInsRun: ResolvedRun | null = null;
  let currentInsFull: CoreSolution | null = null;
  const conditionFactor = reading?.conditionFactor ?? 1;
  if (run.current.state !== 'bare') {
    const material = materialOrFail(run.current.material);
    const layers = [laggingInPlace(material, run.current.thicknessM, run.current.condition)];
    const emittance = emittanceOf(run.current.jacket);
    existing = { material, thicknessM: run.current.thicknessM, jacket: run.current.jacket, emittance, layers };
    currentInsRun = { ...base, layers, surfaceEmittance: emittance };
    currentInsFull = ctx.detail === 'full' ? solveResolvedRun(currentInsRun) : null;
    const solved = currentInsFull ? { wPerM: currentInsFull.heatLossWPerM, surfaceC: currentInsFull.surfaceTemperatureC } : lean(currentInsRun);
    currentIns = { wPerM: solved.wPerM * conditionFactor, surfaceC: solved.surfaceC };
    currentInsDesign = designAir ? lean(withAir(base, designAir, layers, emittance)) : currentIns;
  }
  const insW = currentIns ? currentIns.wPerM : bareAvg.wPerM;
  const currentSignedWPerM = bareFraction * bareAvg.wPerM + (1 - bareFraction) * insW;
  const fittingsCoveredToday = currentIns ? currentIns.wPerM : bareAvg.wPerM;
  const currentBilledW = lengthM * (bareFraction * billed(bareAvg.wPerM) + (1 - bareFraction) * billed(insW)) + fitBareEqL * billed(bareAvg.wPerM) + fitCoveredEqL * billed(fittingsCoveredToday);
  const currentWrongW = lengthM * (bareFraction * wrongWay(bareAvg.wPerM) + (1 - bareFraction) * wrongWay(insW)) + fitBareEqL * wrongWay(bareAvg.wPerM) + fitCoveredEqL * wrongWay(fittingsCoveredToday);
  const currentLatentW = lengthM * bareFraction * bareLatentWPerM + fitBareEqL * bareLatentWPerM;
  const currentFigures = annualFigures(currentBilledW, hours, rates, fuel, latent);
  const currentHasBare = bareFraction > 0 || fitBareEqL > 0;
  const currentDesignSurfaceC = currentHasBare ? (currentInsDesign ? worse(bareDesign.surfaceC, currentInsDesign.surfaceC) : bareDesign.surfaceC) : (currentInsDesign as SolvedState).surfaceC;
  const currentAvgSurfaceC = currentHasBare || !currentIns ? bareAvg.surfaceC : currentIns.surfaceC;

  // Hazards today.
  const hazards: RunWarning[] = [];
  if (bareFraction === 0 && currentInsRun) {
    if (burnNeed && (currentInsDesign as SolvedState).surfaceC > touchLimitC) {
      hazards.push({ code: 'SURFACE_ABOVE_TOUCH_LIMIT', message: `On the hottest day the insulated surface reaches about ${Math.round((currentInsDesign as SolvedState).surfaceC)} °C, above the ${touchLimitC} °C touch limit (ASTM C1055 basis): it can burn on contact.` });
    }
    if (sweatNeed && (currentInsDesign as SolvedState).surfaceC < cond.designWet.dewPointC) {
      hazards.push({ code: 'SURFACE_BELOW_DEW_POINT', message: `In the wettest hour the insulated surface falls to about ${formatNumber(Math.round((currentInsDesign as SolvedState).surfaceC * 10) / 10)} °C, below the ${formatNumber(Math.round(cond.designWet.dewPointC * 10) / 10)} °C dew point: it will sweat.` });
    }
  } else if (bareFraction > 0) {
    if (burnNeed && bareDesign.surfaceC > touchLimitC) {
      hazards.push({ code: 'SURFACE_ABOVE_TOUCH_LIMIT', message: `The bare pipe runs at about ${Math.round(bareDesign.surfaceC)} °C, above the ${touchLimitC} °C touch limit (ASTM C1055 basis): it can burn on contact.` });
    }
    if (sweatNeed && bareDesign.surfaceC < cond.designWet.dewPointC) {
      hazards.push({ code: 'SURFACE_BELOW_DEW_POINT', message: `The bare pipe runs at about ${formatNumber(Math.round(bareDesign.surfaceC * 10) / 10)} °C, below the ${formatNumber(Math.round(cond.designWet.dewPointC * 10) / 10)} °C dew point of the wettest hour: it will sweat or frost.` });
    }
  }
  if (uncoveredCount > 0 && burnNeed && bareDesign.surfaceC > touchLimitC) {
    hazards.push({ code: 'BARE_FITTINGS_ABOVE_TOUCH_LIMIT', message: `${uncoveredCount} bare fitting${uncoveredCount === 1 ? '' : 's'} on this line run at about ${Math.round(bareDesign.surfaceC)} °C, above the ${touchLimitC} °C touch limit: removable covers would stop burns.` });
  }
  if (uncoveredCount > 0 && sweatNeed && bareDesign.surfaceC < cond.designWet.dewPointC) {
    hazards.push({ code: 'BARE_FITTINGS_BELOW_DEW_POINT', message: `${uncoveredCount} bare fitting${uncoveredCount === 1 ? '' : 's'} on this line sit at about ${formatNumber(Math.round(bareDesign.surfaceC * 10) / 10)} °C, below the ${formatNumber(Math.round(cond.designWet.dewPointC * 10) / 10)} °C dew point: they will drip onto whatever is below; removable covers with a vapour retarder stop it.` });
  }

  // Prices.
  const proposal = run.proposed;
  const material = materialOrFail(proposal.material ?? service.defaultInsulation);
  const jacket = proposal.jacket ?? service.defaultJacket;
  const jacketEmittance = emittanceOf(jacket);
  const coverFittings = proposal.coverFittings;
  const priceAt = (thicknessM: number) => installedCostPerMetre(ctx.table, base.pipeOuterDiameterM, thicknessM) * material.installedCostFactor;
  const coverEach = proposal.price?.coverEach ?? fittingCoverCost(ctx.table, base.pipeOuterDiameterM);
  const pwf = ctx.pwf;
  const annualCostOfBilledW = (w: number) => annualCostOf(w, hours, rates);

  // New insulation on bare pipe: the stock series (nominal thickness; C585 actual on the pipe for the inch series).
  const actual = (t: number) => (ctx.stockSeries === 'inch' ? c585ActualThicknessM(base.pipeOuterDiameterM, t) : t);
  let thicknesses = stockThicknessesM(material, ctx.stockSeries);
  if (proposal.thicknessM !== undefined) thicknesses = [proposal.thicknessM];
  // In a summary answer the walk stops past the least life-cycle cost; the full answer keeps every stock thickness for its chart.
  const fitCoversPlanned = coverFittings ? uncoveredCount : 0;
  const seriesCost = (extraPerMetre: number, factor: number) =>
    ctx.detail === 'summary' && proposal.thicknessM === undefined
      ? (t: number, wPerM: number) =>
          (priceAt(t) + extraPerMetre) * lengthM + fitCoversPlanned * coverEach + pwf * annualCostOfBilledW((lengthM + fitEqL) * billed(wPerM * factor))
      : undefined;
  // One scratch run at average and one at design air, re-layered per thickness: a walk's solves allocate no runs.
  const newLayer: MutableLayer = { thicknessM: 0, curve: material.conductivity };
  const newLayers = [newLayer];
  const avgRun: MutableRun = { ...base, layers: newLayers, surfaceEmittance: jacketEmittance };
  const designRun: MutableRun | null = designAir ? { ...withAir(base, designAir, newLayers, jacketEmittance) } : null;
  const newSeries = walkStockSeries({
    thicknessesM: thicknesses,
    runAt: (t) => {
      newLayer.thicknessM = actual(t);
      avgRun.layers = newLayers;
      return avgRun;
    },
    designRunAt: designRun
      ? (t) => {
          newLayer.thicknessM = actual(t);
          designRun.layers = newLayers;
          return designRun;
        }
      : null,
    meets,
    ...(seriesCost(0, 1) ? { lifeCycleCost: seriesCost(0, 1) } : {}),
  }).map(toSeriesEntry(1));

  // Adding a layer over what is there (insulated or damaged runs).
  let addSeries: SeriesEntry[] = [];
  if (existing) {
    const under = existing;
    const repairPerMetre = bareFraction > 0 ? bareFraction * installedCostPerMetre(ctx.table, base.pipeOuterDiameterM, under.thicknessM) * under.material.installedCostFactor : 0;
    const outerLayer: MutableLayer = { thicknessM: 0, curve: material.conductivity };
    const twoLayers: ResolvedLayer[] = [...under.layers, outerLayer];
    addSeries = walkStockSeries({
      thicknessesM: thicknesses,
      runAt: (t) => {
        outerLayer.thicknessM = t;
        avgRun.layers = twoLayers;
        return avgRun;
      },
      designRunAt: designRun
        ? (t) => {
            outerLayer.thicknessM = t;
            designRun.layers = twoLayers;
            return designRun;
          }
        : null,
      meets,
      ...(seriesCost(repairPerMetre, conditionFactor) ? { lifeCycleCost: seriesCost(repairPerMetre, conditionFactor) } : {}),
    }).map(toSeriesEntry(conditionFactor));
  }

  // Options.
  const options: (Required<RunOption> & { readonly pipeWPerM: number; readonly pipeBareFraction: number; readonly fitInsulatedW: number; readonly fitBareW: number; readonly perMetrePrice: number; readonly fixedPrice: number })[] = [];
  const fitCovers = coverFittings ? uncoveredCount : 0;
  // Billed W of an option's pipe and fittings, and its safety at design air.
  const optionBilledW = (pipeWPerM: number, pipeBareFraction: number, fittingsWPerM: number, coversFitted: number) => {
    const fitBareEq = coversFitted > 0 ? 0 : fitBareEqL;
    const fitInsulatedEq = fitEqL - fitBareEq;
    return lengthM * ((1 - pipeBareFraction) * billed(pipeWPerM) + pipeBareFraction * billed(bareAvg.wPerM)) + fitBareEq * billed(bareAvg.wPerM) + fitInsulatedEq * billed(fittingsWPerM);
  };
  const meetsTouchAt = (designSurfaceC: number, meetsAll: boolean) => !burnNeed || (meetsAll && designSurfaceC <= touchLimitC);
  const meetsDewAt = (designSurfaceC: number, meetsAll: boolean) => !sweatNeed || (meetsAll && designSurfaceC >= dewLimitC);
  const optionFrom = (
    kind: OptionKind,
    spec: { material: string | null; thicknessM: number | null; jacket: string | null },
    pipeWPerM: number,
    pipeBareFraction: number,
    fittingsWPerM: number,
    coversFitted: number,
    lengthInsulatedM: number,
    perMetrePrice: number,
    designSurfaceC: number,
    meetsAll: boolean,
  ) => {
    const fitBareEq = coversFitted > 0 ? 0 : fitBareEqL;
    const fitInsulatedEq = fitEqL - fitBareEq;
    const billedW = optionBilledW(pipeWPerM, pipeBareFraction, fittingsWPerM, coversFitted);
    const installed = perMetrePrice * lengthInsulatedM + coversFitted * coverEach;
    const figures = annualFigures(billedW, hours, rates, fuel, latent);
    const annualCost = figures.annualCost;
    const saving = currentFigures.annualCost - annualCost;
    options.push({
      kind,
      material: spec.material,
      thicknessM: spec.thicknessM,
      jacket: spec.jacket,
      lengthInsulatedM,
      fittingCovers: coversFitted,
      installedCost: installed,
      annualHeatGJ: figures.annualHeatGJ,
      annualCost,
      annualCo2Kg: figures.annualCo2Kg,
      annualCostSaving: saving,
      simplePaybackYears: kind === 'leave' ? null : simplePaybackYears(installed, saving),
      lifeCycleCost: installed + pwf * annualCost,
      designSurfaceTemperatureC: designSurfaceC,
      meetsTouchLimit: meetsTouchAt(designSurfaceC, meetsAll),
      meetsDewPoint: meetsDewAt(designSurfaceC, meetsAll),
      pipeWPerM,
      pipeBareFraction,
      fitInsulatedW: fitInsulatedEq * billed(fittingsWPerM),
      fitBareW: fitBareEq * billed(bareAvg.wPerM),
      perMetrePrice,
      fixedPrice: coversFitted * coverEach,
    });
  };

  // Leave as it is.
  {
    const designC = currentDesignSurfaceC;
    optionFrom('leave', { material: existing?.material.id ?? null, thicknessM: existing?.thicknessM ?? null, jacket: existing?.jacket ?? null }, insW, bareFraction, fittingsCoveredToday, 0, 0, 0, designC, meets(designC));
    // The leave option keeps today's covered fittings as they are.
  }
  // Repair only what is bare: the bare stretch at the existing insulation, and covers on bare fittings.
  if (existing && currentIns && currentInsDesign && (bareFraction > 0 || (uncoveredCount > 0 && coverFittings))) {
    const designC = uncoveredCount > 0 && !coverFittings ? worse(currentInsDesign.surfaceC, bareDesign.surfaceC) : currentInsDesign.surfaceC;
    const repairPrice = installedCostPerMetre(ctx.table, base.pipeOuterDiameterM, existing.thicknessM) * existing.material.installedCostFactor;
    optionFrom('repair', { material: existing.material.id, thicknessM: existing.thicknessM, jacket: existing.jacket }, currentIns.wPerM, 0, currentIns.wPerM, fitCovers, bareFraction * lengthM, repairPrice, designC, meets(designC));
  }
  const designOf = (entry: SeriesEntry, index: number, series: SeriesEntry[]) => {
    if (entry.design) return entry.design.surfaceC;
    // Past the first thickness that meets the need the design surface only gets safer; report the first met.
    for (let j = index; j >= 0; j--) if (series[j]?.design) return (series[j]?.design as SolvedState).surfaceC;
    return entry.avg.surfaceC;
  };
  const coversDesign = (c: number) => (uncoveredCount > 0 && !coverFittings ? worse(c, bareDesign.surfaceC) : c);
  /**
   * The one option of a series: the least life-cycle cost of the thicknesses that meet the
   * safety checks, else the thickest. Each thickness is costed in place; only the one kept
   * becomes an option.
   */
  const pickBest = (series: SeriesEntry[], kind: OptionKind, perMetreAt: (thicknessM: number) => number) => {
    let best = -1;
    let bestCost = 0;
    for (let i = 0; i < series.length; i++) {
      const entry = series[i] as SeriesEntry;
      const designC = coversDesign(designOf(entry, i, series));
      const meetsAll = entry.meets && meets(designC);
      if (!(meetsTouchAt(designC, meetsAll) && meetsDewAt(designC, meetsAll))) continue;
      const installed = perMetreAt(entry.t) * lengthM + fitCovers * coverEach;
      const lifeCycleCost = installed + pwf * annualCostOfBilledW(optionBilledW(entry.avg.wPerM, 0, entry.avg.wPerM, fitCovers));
      if (best < 0 || lifeCycleCost < bestCost) {
        best = i;
        bestCost = lifeCycleCost;
      }
    }
    if (best < 0) best = series.length - 1;
    if (best < 0) return;
    const entry = series[best] as SeriesEntry;
    const designC = coversDesign(designOf(entry, best, series));
    optionFrom(kind, { material: material.id, thicknessM: entry.t, jacket }, entry.avg.wPerM, 0, entry.avg.wPerM, fitCovers, lengthM, perMetreAt(entry.t), designC, entry.meets && meets(designC));
  };
  // Insulate a bare run, or replace what is there.
  pickBest(newSeries, state === 'bare' ? 'insulate' : 'replace', priceAt);
  if (existing) {
    const repairPrice = installedCostPerMetre(ctx.table, base.pipeOuterDiameterM, existing.thicknessM) * existing.material.installedCostFactor;
    // A damaged run's bare stretch is repaired first, then the layer goes over the whole run.
    pickBest(addSeries, 'add-layer', (t) => priceAt(t) + (bareFraction > 0 ? bareFraction * repairPrice : 0));
  }

  // A typed price overrides the table: scale every option by the typed price over the table's for the proposal.
  const typed = proposal.price;
  const scaleOptions = (reference: (typeof options)[number]) => {
    if (!typed || reference.kind === 'leave') return;
    const tableCost = reference.installedCost;
    const typedCost =
      typed.lumpSum !== undefined ? typed.lumpSum : typed.perMetre !== undefined ? typed.perMetre * reference.lengthInsulatedM + reference.fixedPrice : tableCost;
    const ratio = tableCost > 0 ? typedCost / tableCost : 1;
    for (let i = 0; i < options.length; i++) {
      const o = options[i] as (typeof options)[number];
      if (o.kind === 'leave') continue;
      const installed = o === reference ? typedCost : o.installedCost * ratio;
      options[i] = { ...o, installedCost: installed, lifeCycleCost: installed + pwf * o.annualCost, simplePaybackYears: simplePaybackYears(installed, o.annualCostSaving) };
    }
  };

  const choose = (): { chosen: (typeof options)[number]; reason: ChoiceReason } => {
    if (proposal.option !== undefined) {
      const forced = options.find((o) => o.kind === proposal.option);
      if (forced) return { chosen: forced, reason: { code: 'FORCED', message: `${optionName(forced.kind)} was chosen for this run by hand; the other options are shown beside it.` } };
    }
    const safe = options.filter((o) => o.meetsTouchLimit && o.meetsDewPoint);
    const cheapest = (list: typeof options) => list.reduce((a, b) => (b.lifeCycleCost < a.lifeCycleCost ? b : a));
    if (safe.length === 0) {
      const best = options.reduce((a, b) => (cold ? (b.designSurfaceTemperatureC > a.designSurfaceTemperatureC ? b : a) : b.designSurfaceTemperatureC < a.designSurfaceTemperatureC ? b : a));
      return { chosen: best, reason: { code: 'NO_OPTION_MEETS_SAFETY', message: `No option in stock meets the ${burnNeed ? 'touch limit' : 'dew point'} on this run; ${optionName(best.kind).toLowerCase()} comes closest.` } };
    }
    const chosen = cheapest(safe);
    const overall = cheapest(options);
    if (chosen.kind === 'leave') {
      const worthy = options.length > 1;
      return { chosen, reason: { code: 'NOTHING_PAYS', message: worthy ? 'Left as it is: no work on this run pays for itself over the horizon, and it meets the safety checks as it stands.' : 'Left as it is.' } };
    }
    if (overall.kind === 'leave' && !(overall.meetsTouchLimit && overall.meetsDewPoint)) {
      return { chosen, reason: { code: 'SAFETY_ONLY', message: `${optionName(chosen.kind)} is for safety: as it stands the run ${burnNeed ? 'can burn on contact' : 'sweats'}, but the work does not pay for itself in energy over the horizon.` } };
    }
    return { chosen, reason: { code: 'LEAST_LIFE_CYCLE_COST', message: `${optionName(chosen.kind)} costs least over the horizon of the options that meet the safety checks.` } };
  };
  let { chosen, reason } = choose();
  if (typed && chosen.kind !== 'leave') {
    scaleOptions(chosen);
    ({ chosen, reason } = choose());
  }

  // Plain words where nothing in stock meets a need.
  let noStock: RunOutcome['noStock'] = null;
  if ((burnNeed || sweatNeed) && !options.some((o) => o.kind !== 'leave' && o.meetsTouchLimit && o.meetsDewPoint) && !(options[0]?.meetsTouchLimit && options[0]?.meetsDewPoint)) {
    const thickest = newSeries[newSeries.length - 1];
    const thickestC = thickest?.design?.surfaceC ?? thickest?.avg.surfaceC ?? bareDesign.surfaceC;
    noStock = burnNeed
      ? { need: 'touch', message: `Run "${run.label}": no stock thickness of ${material.name.toLowerCase()} keeps the surface at or under the ${touchLimitC} °C touch limit on the hottest day; the thickest (${formatNumber(Math.round((thickest?.t ?? 0) * 1000))} mm) leaves it at about ${Math.round(thickestC)} °C, ${formatNumber(Math.round((thickestC - touchLimitC) * 10) / 10)} K over. Guard the line or choose another material.` }
      : { need: 'dew', message: `Run "${run.label}": no stock thickness of ${material.name.toLowerCase()} keeps the surface above the ${formatNumber(Math.round(cond.designWet.dewPointC * 10) / 10)} °C dew point (+${marginK} K) in the wettest hour; the thickest (${formatNumber(Math.round((thickest?.t ?? 0) * 1000))} mm) leaves it at about ${formatNumber(Math.round(thickestC * 10) / 10)} °C, ${formatNumber(Math.round((dewLimitC - thickestC) * 10) / 10)} K short. Dry the room's air or choose a better material.` };
  }

  // Figures of the chosen option.
  const proposedFigures = annualFigures(
    lengthM * ((1 - chosen.pipeBareFraction) * billed(chosen.pipeWPerM) + chosen.pipeBareFraction * billed(bareAvg.wPerM)) + chosen.fitBareW + chosen.fitInsulatedW,
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
    if (ctx.detail === 'full') {
      const full = solveResolvedRun({ ...base, layers, surfaceEmittance: emittance });
      proposedSurfaceC = full.surfaceTemperatureC;
      proposedProfile = faceProfile(full);
    } else {
      proposedSurfaceC = lean({ ...base, layers, surfaceEmittance: emittance }).surfaceC;
    }
  }

  // The series shown for the proposed material, and the least thicknesses for safety.
  const seriesOut: ThicknessOption[] = newSeries.map((e) => {
    const installed = priceAt(e.t) * lengthM + fitCovers * coverEach;
    const fitW = fitEqL * billed(e.avg.wPerM);
    return {
      thicknessM: e.t,
      actualThicknessM: actual(e.t),
      heatLossWPerM: e.avg.wPerM,
      surfaceTemperatureC: e.avg.surfaceC,
      installedCost: installed,
      lifeCycleCost: installed + pwf * annualCostOfBilledW(lengthM * billed(e.avg.wPerM) + fitW),
    };
  });
  let economic: ThicknessOption | undefined;
  for (const o of seriesOut) if (!economic || o.lifeCycleCost < economic.lifeCycleCost) economic = o;
  const leastMeeting = newSeries.find((e) => e.meets && e.design !== null) ?? (designAir ? newSeries.find((e) => e.meets) : undefined);

  // Plausibility notices at the field.
  const at = (field: string) => `runs.${plant.runs.indexOf(run)}.${field}`;
  if (lengthM > RUN_LENGTH_NOTICE_M) {
    notices.push({ code: 'RUN_LONGER_THAN_1_KM', path: at('lengthM'), message: `Run "${run.label}" is over 1 km long (${formatNumber(Math.round(lengthM))} m); a small plant's runs are usually far shorter — check the length and its unit.`, params: { quantity: 'length', limit: 'max', limitSI: RUN_LENGTH_NOTICE_M, givenSI: lengthM } });
  }
  const valveCount = run.valves + run.fittings.filter((f) => f.type === 'valve-flanged' || f.type === 'valve-screwed').reduce((n, f) => n + f.count, 0);
  if (valveCount > MANY_VALVES) {
    notices.push({ code: 'MANY_VALVES', path: at('valves'), message: `Run "${run.label}" lists ${valveCount} valves; more than ${MANY_VALVES} on one run is unusual — check the count.`, params: { quantity: 'count', limit: 'max', limitSI: MANY_VALVES, givenSI: valveCount } });
  }
  if (service.kind === 'liquid' && !cold && service.liquid === 'water') {
    const gauge = run.liquidGaugePressureKPa ?? TYPICAL_LIQUID_GAUGE_KPA;
    const boilingC = saturationTemperatureC(Math.max(gauge + ctx.atmosphereKPa, 1));
    if (fluidC > boilingC) {
      notices.push({ code: 'HOT_WATER_ABOVE_BOILING', path: at('fluidTemperatureC'), message: `Run "${run.label}" carries water at ${formatNumber(Math.round(fluidC))} °C, above its boiling point of about ${formatNumber(Math.round(boilingC))} °C at ${formatNumber(Math.round(gauge))} kPa gauge — it would flash to steam. Check the temperature or give the line's pressure.`, params: { quantity: 'temperature', limit: 'max', limitSI: boilingC, givenSI: fluidC } });
    }
  }
  if (run.service === 'glycol' && fluidC > GLYCOL_NOTICE_C) {
    notices.push({ code: 'GLYCOL_ABOVE_60C', path: at('fluidTemperatureC'), message: `Run "${run.label}" carries glycol at ${formatNumber(Math.round(fluidC))} °C; glycol loops in food plants run cold, rarely above ${GLYCOL_NOTICE_C} °C — check the service or the temperature.`, params: { quantity: 'temperature', limit: 'max', limitSI: GLYCOL_NOTICE_C, givenSI: fluidC } });
  }
  if (steamGauge !== undefined && steamGauge < 0) {
    notices.push({ code: 'STEAM_BELOW_ATMOSPHERIC', path: at('steamGaugePressureKPa'), message: `Run "${run.label}" gives steam below atmospheric pressure (${formatNumber(steamGauge)} kPa gauge); process steam in a food plant is above it — check the sign and the unit.`, params: { quantity: 'pressure', limit: 'min', limitSI: 0, givenSI: steamGauge } });
  }

  // Sampling terms.
  const speedDelta = 0.5;
  const emittanceDelta = 0.1;
  // Bare pipe's sensitivities matter only where bare pipe or bare fittings remain, today or after the choice.
  const bareMatters = currentHasBare || chosen.pipeBareFraction > 0 || chosen.fitBareW > 0;
  const bareAtSpeed = bareMatters ? lean({ ...base, windSpeedMPerS: avg.speedMPerS + speedDelta }, bareAvg.surfaceC).wPerM : bareAvg.wPerM;
  const bareAtEmittance = bareMatters ? lean({ ...base, surfaceEmittance: Math.min(1, bareEmittance + emittanceDelta) }, bareAvg.surfaceC).wPerM : bareAvg.wPerM;
  const rel = (x: number) => (Math.abs(bareAvg.wPerM) > 1e-9 ? (x - bareAvg.wPerM) / bareAvg.wPerM : 0);
  const tDiff = fluidC - avg.temperatureC;
  const confidence = cond.confidence;
  const speedSpread = Math.max(CONFIDENCE_SPREADS[confidence] * avg.speedMPerS, confidence === 'measured' ? 0.05 : confidence === 'estimated' ? 0.2 : 0.5);
  const terms: SampleTerms = {
    lengthM,
    lengthSpread: CONFIDENCE_SPREADS[lengthConfidence],
    hours,
    cold,
    costPerJHeat: rates.costPerJHeat,
    co2PerJHeat: rates.co2PerJHeat,
    currentBareWPerM: billed(bareAvg.wPerM),
    currentInsulatedWPerM: billed(insW),
    bareFraction,
    bareFractionSpread: run.current.state === 'damaged' ? CONFIDENCE_SPREADS[run.current.bareFractionConfidence] : 0,
    currentFittingsBareW: fitBareEqL * billed(bareAvg.wPerM),
    currentFittingsInsulatedW: fitCoveredEqL * billed(fittingsCoveredToday),
    proposedBareWPerM: billed(bareAvg.wPerM),
    proposedInsulatedWPerM: billed(chosen.pipeWPerM),
    proposedBareFraction: chosen.pipeBareFraction,
    proposedFittingsBareW: chosen.fitBareW,
    proposedFittingsInsulatedW: chosen.fitInsulatedW,
    bareSensitivityPerK: Math.abs(tDiff) > 1e-9 ? -1.25 / tDiff : 0,
    bareSensitivityPerMPerS: rel(bareAtSpeed) / speedDelta,
    bareSensitivityPerEmittance: rel(bareAtEmittance) / emittanceDelta,
    insulatedSensitivityPerK: Math.abs(tDiff) > 1e-9 ? -1 / tDiff : 0,
    airSpreadK: AIR_SPREAD_K[confidence],
    speedSpreadMPerS: speedSpread,
    emittanceSpread: run.finish !== undefined ? EMITTANCE_SPREAD.given : EMITTANCE_SPREAD.assumed,
    conditionSpread: existing ? (reading?.conditionFactor !== null && reading?.conditionFactor !== undefined ? CONFIDENCE_SPREADS.measured : CONFIDENCE_SPREADS.guessed) : 0,
    installedPerMetre: chosen.lengthInsulatedM > 0 ? (chosen.installedCost - chosen.fixedPrice * (typed?.lumpSum !== undefined ? 0 : 1)) / lengthM : 0,
    installedFixed: typed?.lumpSum !== undefined ? 0 : chosen.kind === 'leave' ? 0 : chosen.fixedPrice,
    priceSpread: typed ? CONFIDENCE_SPREADS.measured : ctx.table.illustrative ? CONFIDENCE_SPREADS.guessed : CONFIDENCE_SPREADS.estimated,
  };

  const publicOptions: RunOption[] = options.map((o) =>
    ctx.detail === 'full'
      ? {
          kind: o.kind,
          thicknessM: o.thicknessM,
          installedCost: o.installedCost,
          annualCost: o.annualCost,
          simplePaybackYears: o.simplePaybackYears,
          lifeCycleCost: o.lifeCycleCost,
          meetsTouchLimit: o.meetsTouchLimit,
          meetsDewPoint: o.meetsDewPoint,
          material: o.material,
          jacket: o.jacket,
          lengthInsulatedM: o.lengthInsulatedM,
          fittingCovers: o.fittingCovers,
          annualHeatGJ: o.annualHeatGJ,
          annualCo2Kg: o.annualCo2Kg,
          annualCostSaving: o.annualCostSaving,
          designSurfaceTemperatureC: o.designSurfaceTemperatureC,
        }
      : {
          kind: o.kind,
          thicknessM: o.thicknessM,
          installedCost: o.installedCost,
          annualCost: o.annualCost,
          simplePaybackYears: o.simplePaybackYears,
          lifeCycleCost: o.lifeCycleCost,
          meetsTouchLimit: o.meetsTouchLimit,
          meetsDewPoint: o.meetsDewPoint,
        },
  );
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
    options: publicOptions,
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

/** The name of an option in our words. */
export function optionName(kind: OptionKind): string {
  switch (kind) {
    case 'leave':
      return 'Leaving it as it is';
    case 'repair':
      return 'Repairing only the bare parts';
    case 'insulate':
      return 'Insulating it';
    case 'add-layer':
      return 'Adding a layer over the old insulation';
    case 'replace':
      return 'Replacing the insulation';
  }
}

export { ZERO_FIGURES };
export type { AnnualFigures };
