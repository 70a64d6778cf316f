import { annualCostOf, annualFigures, type Rates } from './annual-figures';
import type { Fuel } from './data/fuels';
import type { InstalledCostTable } from './data/installed-cost-demo';
import type { InsulationMaterial } from './data/insulation-materials';
import { installedCostPerMetre, simplePaybackYears } from './economics';
import type { OptionKind, ParsedPlantRun } from './plant-input';
import type { ChoiceReason, RunOption } from './plant-result';

/** Heat flow and surface of one solve: signed W/m (positive out of the line) and °C. */
export interface SolvedState {
  readonly wPerM: number;
  readonly surfaceC: number;
}

/** A stock thickness of an option's series, in the shape the options are built from. */
export interface SeriesEntry {
  readonly t: number;
  readonly avg: SolvedState;
  readonly design: SolvedState | null;
  readonly meets: boolean;
}

/**
 * What every option of one run is weighed against, fixed once per run: its length, hours and
 * rates, the bare pipe and fittings that stay as they are, the prices and the safety needs.
 */
export interface OptionBasis {
  readonly cold: boolean;
  readonly lengthM: number;
  readonly hours: number;
  readonly rates: Rates;
  readonly fuel: Fuel;
  readonly latentHeatJPerKg: number | null;
  readonly presentWorthFactor: number;
  /** Signed W/m of the bare pipe at average air. */
  readonly bareWPerM: number;
  /** The bare surface at design air, °C. */
  readonly bareDesignC: number;
  readonly fitBareEqL: number;
  readonly fitEqL: number;
  readonly uncoveredCount: number;
  readonly coverFittings: boolean;
  readonly coverEach: number;
  readonly burnNeed: boolean;
  readonly sweatNeed: boolean;
  readonly touchLimitC: number;
  readonly dewLimitC: number;
  readonly currentAnnualCost: number;
  readonly table: InstalledCostTable;
  readonly pipeOuterDiameterM: number;
}

/** An option as weighed, with what its figures and the range are built from. */
export interface WeighedOption extends Required<RunOption> {
  readonly pipeWPerM: number;
  readonly pipeBareFraction: number;
  readonly fitInsulatedW: number;
  readonly fitBareW: number;
  readonly perMetrePrice: number;
  readonly fixedPrice: number;
}

/** What an option puts on the pipe, for the result. */
export interface OptionSpec {
  readonly material: string | null;
  readonly thicknessM: number | null;
  readonly jacket: string | null;
}

/** The W the energy system pays for: heat out of a hot line, heat into a cold one. */
export function billedW(basis: OptionBasis, wPerM: number): number {
  return Math.max(0, (basis.cold ? -1 : 1) * wPerM);
}

/** Heat flowing the way the service does not pay for (a hot line gaining, a cold one losing). */
export function wrongWayW(basis: OptionBasis, wPerM: number): number {
  return Math.max(0, -(basis.cold ? -1 : 1) * wPerM);
}

/** A surface at design air meets the run's safety need (or there is none). */
export function meetsNeed(basis: OptionBasis, surfaceC: number): boolean {
  return basis.burnNeed ? surfaceC <= basis.touchLimitC : basis.sweatNeed ? surfaceC >= basis.dewLimitC : true;
}

/** The less safe of two surfaces: the hotter on a hot line, the colder on a cold one. */
export function worseSurface(basis: OptionBasis, a: number, b: number): number {
  return basis.cold ? Math.min(a, b) : Math.max(a, b);
}

/** Installed price per meter of a material at a stock thickness, from the plant's table. */
export function pricePerMetre(basis: OptionBasis, material: InsulationMaterial, thicknessM: number): number {
  return installedCostPerMetre(basis.table, basis.pipeOuterDiameterM, thicknessM) * material.installedCostFactor;
}

/** The year's cost of a billed heat flow. */
export function annualCostOfBilled(basis: OptionBasis, heatW: number): number {
  return annualCostOf(heatW, basis.hours, basis.rates);
}

/** Billed W of an option's pipe and fittings. */
export function optionBilledW(basis: OptionBasis, pipeWPerM: number, pipeBareFraction: number, fittingsWPerM: number, coversFitted: number): number {
  const fitBareEq = coversFitted > 0 ? 0 : basis.fitBareEqL;
  const fitInsulatedEq = basis.fitEqL - fitBareEq;
  return (
    basis.lengthM * ((1 - pipeBareFraction) * billedW(basis, pipeWPerM) + pipeBareFraction * billedW(basis, basis.bareWPerM)) +
    fitBareEq * billedW(basis, basis.bareWPerM) +
    fitInsulatedEq * billedW(basis, fittingsWPerM)
  );
}

function meetsTouchAt(basis: OptionBasis, designSurfaceC: number, meetsAll: boolean): boolean {
  return !basis.burnNeed || (meetsAll && designSurfaceC <= basis.touchLimitC);
}

function meetsDewAt(basis: OptionBasis, designSurfaceC: number, meetsAll: boolean): boolean {
  return !basis.sweatNeed || (meetsAll && designSurfaceC >= basis.dewLimitC);
}

/** Weighs one option and adds it to the list. */
export function addOption(
  basis: OptionBasis,
  options: WeighedOption[],
  kind: OptionKind,
  spec: OptionSpec,
  pipeWPerM: number,
  pipeBareFraction: number,
  fittingsWPerM: number,
  coversFitted: number,
  lengthInsulatedM: number,
  perMetrePrice: number,
  designSurfaceC: number,
  meetsAll: boolean,
): void {
  const fitBareEq = coversFitted > 0 ? 0 : basis.fitBareEqL;
  const fitInsulatedEq = basis.fitEqL - fitBareEq;
  const heatW = optionBilledW(basis, pipeWPerM, pipeBareFraction, fittingsWPerM, coversFitted);
  const installed = perMetrePrice * lengthInsulatedM + coversFitted * basis.coverEach;
  const figures = annualFigures(heatW, basis.hours, basis.rates, basis.fuel, basis.latentHeatJPerKg);
  const annualCost = figures.annualCost;
  const saving = basis.currentAnnualCost - annualCost;
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
    lifeCycleCost: installed + basis.presentWorthFactor * annualCost,
    designSurfaceTemperatureC: designSurfaceC,
    meetsTouchLimit: meetsTouchAt(basis, designSurfaceC, meetsAll),
    meetsDewPoint: meetsDewAt(basis, designSurfaceC, meetsAll),
    pipeWPerM,
    pipeBareFraction,
    fitInsulatedW: fitInsulatedEq * billedW(basis, fittingsWPerM),
    fitBareW: fitBareEq * billedW(basis, basis.bareWPerM),
    perMetrePrice,
    fixedPrice: coversFitted * basis.coverEach,
  });
}

/**
 * The design surface of a series entry: past the first thickness that meets the need the design
 * surface only gets safer, so an entry not solved at design air reports the first met.
 */
export function designSurfaceOf(entry: SeriesEntry, index: number, series: readonly SeriesEntry[]): number {
  if (entry.design) return entry.design.surfaceC;
  for (let j = index; j >= 0; j--) {
    const design = (series[j] as SeriesEntry).design;
    if (design) return design.surfaceC;
  }
  return entry.avg.surfaceC;
}

/** The exposed surface at design air once bare fittings left uncovered are counted. */
export function withUncoveredFittings(basis: OptionBasis, designC: number): number {
  return basis.uncoveredCount > 0 && !basis.coverFittings ? worseSurface(basis, designC, basis.bareDesignC) : designC;
}

/**
 * The one option of a series: the least life-cycle cost of the thicknesses that meet the
 * safety checks, else the thickest. Each thickness is costed in place; only the one kept
 * becomes an option. The price per meter is the material's at the thickness plus
 * `extraPerMetre` (repairing a damaged stretch first).
 */
export function addBestOfSeries(
  basis: OptionBasis,
  options: WeighedOption[],
  series: readonly SeriesEntry[],
  kind: OptionKind,
  material: InsulationMaterial,
  jacket: string,
  extraPerMetre: number,
): void {
  const fitCovers = basis.coverFittings ? basis.uncoveredCount : 0;
  let best = -1;
  let bestCost = 0;
  for (let i = 0; i < series.length; i++) {
    const entry = series[i] as SeriesEntry;
    const designC = withUncoveredFittings(basis, designSurfaceOf(entry, i, series));
    const meetsAll = entry.meets && meetsNeed(basis, designC);
    if (!(meetsTouchAt(basis, designC, meetsAll) && meetsDewAt(basis, designC, meetsAll))) continue;
    const installed = (pricePerMetre(basis, material, entry.t) + extraPerMetre) * basis.lengthM + fitCovers * basis.coverEach;
    const lifeCycleCost = installed + basis.presentWorthFactor * annualCostOfBilled(basis, optionBilledW(basis, entry.avg.wPerM, 0, entry.avg.wPerM, fitCovers));
    if (best < 0 || lifeCycleCost < bestCost) {
      best = i;
      bestCost = lifeCycleCost;
    }
  }
  if (best < 0) best = series.length - 1;
  if (best < 0) return;
  const entry = series[best] as SeriesEntry;
  const designC = withUncoveredFittings(basis, designSurfaceOf(entry, best, series));
  addOption(
    basis,
    options,
    kind,
    { material: material.id, thicknessM: entry.t, jacket },
    entry.avg.wPerM,
    0,
    entry.avg.wPerM,
    fitCovers,
    basis.lengthM,
    pricePerMetre(basis, material, entry.t) + extraPerMetre,
    designC,
    entry.meets && meetsNeed(basis, designC),
  );
}

/** A typed price overrides the table: every option is scaled by the typed price over the table's for the reference. */
export function scaleToTypedPrice(basis: OptionBasis, options: WeighedOption[], reference: WeighedOption, typed: NonNullable<ParsedPlantRun['proposed']['price']>): void {
  if (reference.kind === 'leave') return;
  const tableCost = reference.installedCost;
  const typedCost =
    typed.lumpSum !== undefined ? typed.lumpSum : typed.perMetre !== undefined ? typed.perMetre * reference.lengthInsulatedM + reference.fixedPrice : tableCost;
  const ratio = tableCost > 0 ? typedCost / tableCost : 1;
  for (let i = 0; i < options.length; i++) {
    const o = options[i] as WeighedOption;
    if (o.kind === 'leave') continue;
    const installed = o === reference ? typedCost : o.installedCost * ratio;
    options[i] = { ...o, installedCost: installed, lifeCycleCost: installed + basis.presentWorthFactor * o.annualCost, simplePaybackYears: simplePaybackYears(installed, o.annualCostSaving) };
  }
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

function cheapest(list: readonly WeighedOption[]): WeighedOption {
  return list.reduce((a, b) => (b.lifeCycleCost < a.lifeCycleCost ? b : a));
}

/**
 * The option recommended and why: one forced by hand, else the cheapest over the horizon of
 * those meeting the safety checks, else the one coming closest to them.
 */
export function chooseOption(basis: OptionBasis, options: readonly WeighedOption[], forcedKind: OptionKind | undefined): { chosen: WeighedOption; reason: ChoiceReason } {
  if (forcedKind !== undefined) {
    const forced = options.find((o) => o.kind === forcedKind);
    if (forced) return { chosen: forced, reason: { code: 'FORCED', message: `${optionName(forced.kind)} was chosen for this run by hand; the other options are shown beside it.` } };
  }
  const safe = options.filter((o) => o.meetsTouchLimit && o.meetsDewPoint);
  if (safe.length === 0) {
    const best = options.reduce((a, b) =>
      basis.cold ? (b.designSurfaceTemperatureC > a.designSurfaceTemperatureC ? b : a) : b.designSurfaceTemperatureC < a.designSurfaceTemperatureC ? b : a,
    );
    return { chosen: best, reason: { code: 'NO_OPTION_MEETS_SAFETY', message: `No option in stock meets the ${basis.burnNeed ? 'touch limit' : 'dew point'} on this run; ${optionName(best.kind).toLowerCase()} comes closest.` } };
  }
  const chosen = cheapest(safe);
  const overall = cheapest(options);
  if (chosen.kind === 'leave') {
    const worthy = options.length > 1;
    return { chosen, reason: { code: 'NOTHING_PAYS', message: worthy ? 'Left as it is: no work on this run pays for itself over the horizon, and it meets the safety checks as it stands.' : 'Left as it is.' } };
  }
  if (overall.kind === 'leave' && !(overall.meetsTouchLimit && overall.meetsDewPoint)) {
    return { chosen, reason: { code: 'SAFETY_ONLY', message: `${optionName(chosen.kind)} is for safety: as it stands the run ${basis.burnNeed ? 'can burn on contact' : 'sweats'}, but the work does not pay for itself in energy over the horizon.` } };
  }
  return { chosen, reason: { code: 'LEAST_LIFE_CYCLE_COST', message: `${optionName(chosen.kind)} costs least over the horizon of the options that meet the safety checks.` } };
}
