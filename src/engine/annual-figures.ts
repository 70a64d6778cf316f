import type { Fuel } from './data/fuels';

const SECONDS_PER_HOUR = 3600;
const J_PER_GJ = 1e9;
const J_PER_KWH = 3.6e6;

/** Energy, money and carbon of one state of a run (or of the plant), per year. */
export interface AnnualFigures {
  /** Heat the system pays for: lost by a hot line, gained by a cold one (a positive load), W. */
  readonly heatW: number;
  readonly annualHeatGJ: number;
  /** Boiler fuel energy (higher heating value), GJ/yr. */
  readonly annualFuelGJ: number;
  /** Boiler fuel in its physical unit (m³, liter or kWh), per year. */
  readonly annualFuelQuantity: number;
  /** Chiller electricity for heat gained by cold lines, kWh/yr. */
  readonly annualChillerElectricityKWh: number;
  readonly annualCost: number;
  readonly annualCo2Kg: number;
  /** Steam condensed by the loss, for steam runs; 0 otherwise. */
  readonly steamKgPerHour: number;
  readonly steamKgPerYear: number;
}

/** Per-joule rates that turn heat into money and carbon for the system a service uses. */
export interface Rates {
  readonly costPerJHeat: number;
  readonly co2PerJHeat: number;
  readonly fuelJPerJHeat: number;
  readonly electricityJPerJHeat: number;
}

/** The yearly cost alone of a heat flow the system pays for, W (as {@link annualFigures} reckons it). */
export function annualCostOf(heatW: number, hours: number, rates: Rates): number {
  return heatW * hours * SECONDS_PER_HOUR * rates.costPerJHeat;
}

/** The yearly figures of a heat flow the system pays for, W, over `hours` a year. */
export function annualFigures(heatW: number, hours: number, rates: Rates, fuel: Fuel, latentHeatJPerKg: number | null): AnnualFigures {
  const heatJ = heatW * hours * SECONDS_PER_HOUR;
  const fuelJ = heatJ * rates.fuelJPerJHeat;
  const steamKgPerHour = latentHeatJPerKg ? (heatW * SECONDS_PER_HOUR) / latentHeatJPerKg : 0;
  return {
    heatW,
    annualHeatGJ: heatJ / J_PER_GJ,
    annualFuelGJ: fuelJ / J_PER_GJ,
    annualFuelQuantity: fuelJ / fuel.heatingValueJPerQuantityUnit,
    annualChillerElectricityKWh: (heatJ * rates.electricityJPerJHeat) / J_PER_KWH,
    annualCost: heatJ * rates.costPerJHeat,
    annualCo2Kg: heatJ * rates.co2PerJHeat,
    steamKgPerHour,
    steamKgPerYear: steamKgPerHour * hours,
  };
}

/** Nothing, per year. */
export const ZERO_FIGURES: AnnualFigures = {
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

/** a + sign·b, figure by figure. */
export function addFigures(a: AnnualFigures, b: AnnualFigures, sign = 1): AnnualFigures {
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

export { SECONDS_PER_HOUR, J_PER_GJ, J_PER_KWH };
