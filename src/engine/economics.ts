import type { EmissionSourceId, Fuel, FuelPriceUnit } from './data/fuels';
import type { InstalledCostTable } from './data/installed-cost-demo';
import { EngineError } from './errors';
import { UNIT_FACTORS } from './units';

const GALLON_LITRES = UNIT_FACTORS.volume.gal / UNIT_FACTORS.volume.L;

/** Heat over a year of operation: W × h → J. */
export function annualEnergyJ(heatW: number, operatingHoursPerYear: number): number {
  return heatW * operatingHoursPerYear * 3600;
}

/** Fuel energy that delivers `heatJ` at a seasonal boiler efficiency (0–1]. */
export function fuelEnergyJ(heatJ: number, boilerEfficiency: number): number {
  return heatJ / boilerEfficiency;
}

/** Fuel quantity in the fuel's physical unit (m³ at 60 °F and 1 atm, liter, kWh) for a fuel energy. */
export function fuelQuantity(fuel: Fuel, fuelEnergyJoules: number): number {
  return fuelEnergyJoules / fuel.heatingValueJPerQuantityUnit;
}

/**
 * Cost of one joule of fuel energy (higher heating value) from a price in the
 * user's unit: energy units by definition (NIST SP 811), physical units by the
 * fuel's heating value (and density, for a price per kilogram).
 */
export function fuelCostPerJoule(fuel: Fuel, price: number, unit: FuelPriceUnit): number {
  if (!fuel.priceUnits.includes(unit)) {
    throw new EngineError('INVALID_INPUT', `${fuel.name} cannot be priced per ${unit}; use one of ${fuel.priceUnits.join(', ')}.`);
  }
  switch (unit) {
    case 'therm':
      return price / UNIT_FACTORS.energy.therm;
    case 'MMBtu':
      return price / UNIT_FACTORS.energy.MMBtu;
    case 'GJ':
      return price / 1e9;
    case 'kWh':
      return price / UNIT_FACTORS.energy.kWh;
    case 'm3':
      return price / fuel.heatingValueJPerQuantityUnit;
    case 'litre':
      return price / fuel.heatingValueJPerQuantityUnit;
    case 'gallon':
      return price / (fuel.heatingValueJPerQuantityUnit * GALLON_LITRES);
    case 'kg': {
      if (fuel.densityKgPerLitre === null) {
        throw new EngineError('INVALID_INPUT', `${fuel.name} cannot be priced per kg.`);
      }
      return price / (fuel.heatingValueJPerQuantityUnit / fuel.densityKgPerLitre);
    }
  }
}

/** kg CO₂ per joule of fuel energy from the chosen source, or undefined where the source has none. */
export function emissionKgPerJoule(fuel: Fuel, source: EmissionSourceId): number | undefined {
  const factor = fuel.emissionFactors.find((f) => f.source === source);
  return factor === undefined ? undefined : factor.kgCo2PerGJ / 1e9;
}

/**
 * Present worth of a yearly cost that starts at 1 and escalates: Σ_{y=1..N}
 * (1+e)^(y−1) / (1+d)^y — end-of-year amounts, the uniform-escalation present
 * worth of NIST Handbook 135 (Life-Cycle Costing Manual for FEMP) — from memory.
 */
export function presentWorthFactor(horizonYears: number, discountRate: number, escalationRate: number): number {
  let sum = 0;
  let growth = 1;
  let discount = 1 + discountRate;
  for (let year = 1; year <= horizonYears; year++) {
    sum += growth / discount;
    growth *= 1 + escalationRate;
    discount *= 1 + discountRate;
  }
  return sum;
}

/**
 * Cumulative cash flow of an insulation job: the installed cost in year 0, then a yearly
 * saving that escalates with the fuel price, counted at year end and discounted the same way
 * as {@link presentWorthFactor}, so the last present value is the life-cycle net saving.
 */
export function cashFlowByYear(
  installedCost: number,
  firstYearSaving: number,
  horizonYears: number,
  discountRate: number,
  escalationRate: number,
): { year: number; cumulative: number; cumulativePresentValue: number }[] {
  let cumulative = -installedCost;
  let presentValue = -installedCost;
  let saving = firstYearSaving;
  let discount = 1 + discountRate;
  const years = [{ year: 0, cumulative, cumulativePresentValue: presentValue }];
  for (let year = 1; year <= horizonYears; year++) {
    cumulative += saving;
    presentValue += saving / discount;
    years.push({ year, cumulative, cumulativePresentValue: presentValue });
    saving *= 1 + escalationRate;
    discount *= 1 + discountRate;
  }
  return years;
}

/** Simple payback, years; null when nothing is saved. */
export function simplePaybackYears(installedCost: number, annualCostSaving: number): number | null {
  return annualCostSaving > 0 ? installedCost / annualCostSaving : null;
}

/** Index of the segment of ascending `values` that x falls in (the end segments extend beyond). */
function segmentIndex(values: readonly number[], x: number): number {
  const n = values.length;
  let i = 0;
  while (i < n - 2 && x > (values[i + 1] as number)) i++;
  return i;
}

/** Weight of x along segment i of `values` (0 at its start, 1 at its end). */
function segmentWeight(values: readonly number[], i: number, x: number): number {
  const x0 = values[i] as number;
  const x1 = values[i + 1] as number;
  return (x - x0) / (x1 - x0);
}

/** One row of the price table at a thickness (linear between its columns). */
function rowAt(table: InstalledCostTable, r: number, ti: number, tw: number): number {
  const cells = table.costPerMetre[r] as readonly number[];
  if (table.thicknessesM.length === 1) return cells[0] as number;
  return (cells[ti] as number) + tw * ((cells[ti + 1] as number) - (cells[ti] as number));
}

/**
 * Installed cost per meter from a price table, bilinear in pipe OD and thickness.
 * Beyond the table's thicknesses it extends linearly (thicker costs more); beyond its
 * diameters it holds the end rows' trend linearly too, never below the first row.
 */
export function installedCostPerMetre(table: InstalledCostTable, pipeOuterDiameterM: number, thicknessM: number): number {
  const ods = table.pipeOuterDiametersM;
  const ts = table.thicknessesM;
  // Called for every stock thickness of every run: no closures or index records here.
  const ti = ts.length === 1 ? 0 : segmentIndex(ts, thicknessM);
  const tw = ts.length === 1 ? 0 : segmentWeight(ts, ti, thicknessM);
  if (ods.length === 1) return Math.max(0, rowAt(table, 0, ti, tw));
  const i = segmentIndex(ods, pipeOuterDiameterM);
  const w = segmentWeight(ods, i, pipeOuterDiameterM);
  const value = rowAt(table, i, ti, tw) + w * (rowAt(table, i + 1, ti, tw) - rowAt(table, i, ti, tw));
  return Math.max(value, 0.5 * rowAt(table, 0, ti, tw));
}

/** Cost of one removable fitting cover by pipe OD, from the table. */
export function fittingCoverCost(table: InstalledCostTable, pipeOuterDiameterM: number): number {
  const ods = table.pipeOuterDiametersM;
  const costs = table.fittingCoverCostEach;
  if (ods.length === 1) return costs[0] as number;
  const i = segmentIndex(ods, pipeOuterDiameterM);
  const w = segmentWeight(ods, i, pipeOuterDiameterM);
  const value = (costs[i] as number) + w * ((costs[i + 1] as number) - (costs[i] as number));
  return Math.max(value, 0.5 * (costs[0] as number));
}
