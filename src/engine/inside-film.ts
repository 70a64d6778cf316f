import { PROPYLENE_GLYCOL_30, WATER, type LiquidTable } from './data/liquid-properties';
import { ZERO_CELSIUS_K } from './physical-constants';

/** Liquids the inside-film correlation knows. */
export type LiquidKind = 'water' | 'propylene-glycol-30';

/**
 * Inside film of condensing steam, W/(m²·K) — common practice (film condensation
 * in steam mains is several thousand W/(m²·K); its resistance is negligible beside
 * the outer surface).
 */
export const CONDENSING_STEAM_FILM_W_PER_M2K = 10000;

function interpolate(xs: readonly number[], ys: readonly number[], x: number): number {
  const last = xs.length - 1;
  if (x <= (xs[0] as number)) return ys[0] as number;
  if (x >= (xs[last] as number)) return ys[last] as number;
  let i = 0;
  while (x > (xs[i + 1] as number)) i++;
  const x0 = xs[i] as number;
  const x1 = xs[i + 1] as number;
  const y0 = ys[i] as number;
  return y0 + ((x - x0) / (x1 - x0)) * ((ys[i + 1] as number) - y0);
}

// Gnielinski (1976), Int. Chem. Eng. 16, 359, with Petukhov's friction factor
// f = (0.790 ln Re − 1.64)⁻²: Nu = (f/8)(Re − 1000)Pr / [1 + 12.7 (f/8)^½ (Pr^⅔ − 1)].
function gnielinskiNusselt(reynolds: number, prandtl: number): number {
  const f = Math.pow(0.79 * Math.log(reynolds) - 1.64, -2);
  return ((f / 8) * (reynolds - 1000) * prandtl) / (1 + 12.7 * Math.sqrt(f / 8) * (Math.pow(prandtl, 2 / 3) - 1));
}

/** Fully developed laminar flow at uniform wall temperature, Nu = 3.66 (Incropera eq. 8.55). */
const LAMINAR_NUSSELT = 3.66;

/**
 * Mean laminar Nusselt number over a tube of length L with the thermal entry length, Hausen
 * (1943) as given by Incropera eq. 8.57 (from memory): Nu = 3.66 + 0.0668 Gz / (1 + 0.04 Gz^(2/3)),
 * Gz = (D/L)·Re·Pr. It tends to 3.66 in a long tube; checked in __tests__/correlations.test.ts.
 */
export function laminarEntryNusselt(reynolds: number, prandtl: number, diameterOverLength: number): number {
  const graetz = diameterOverLength * reynolds * prandtl;
  return LAMINAR_NUSSELT + (0.0668 * graetz) / (1 + 0.04 * Math.pow(graetz, 2 / 3));
}

/**
 * Nusselt number for flow in a round tube: laminar below Re 2300 (with the entry length of a
 * run of length L, Hausen), Gnielinski from Re 10⁴, and in between the linear blend
 * Gnielinski (2013, Int. J. Heat Mass Transfer 63, 134) recommends, so the film is
 * continuous in velocity.
 *
 * @param diameterOverLength D/L of the run; 0 for a long (fully developed) tube
 */
export function tubeNusselt(reynolds: number, prandtl: number, diameterOverLength = 0): number {
  const laminar = diameterOverLength > 0 ? laminarEntryNusselt(Math.min(reynolds, 2300), prandtl, diameterOverLength) : LAMINAR_NUSSELT;
  if (reynolds <= 2300) return diameterOverLength > 0 ? laminarEntryNusselt(reynolds, prandtl, diameterOverLength) : LAMINAR_NUSSELT;
  if (reynolds >= 1e4) return gnielinskiNusselt(reynolds, prandtl);
  const blend = (reynolds - 2300) / (1e4 - 2300);
  return (1 - blend) * laminar + blend * gnielinskiNusselt(1e4, prandtl);
}

/** Inside film coefficient of a liquid flowing in the pipe, W/(m²·K). */
export function liquidFilmCoefficientWPerM2K(
  liquid: LiquidKind,
  bulkTemperatureC: number,
  velocityMPerS: number,
  innerDiameterM: number,
  runLengthM?: number,
): number {
  const table: LiquidTable = liquid === 'water' ? WATER : PROPYLENE_GLYCOL_30;
  const temperatureK = bulkTemperatureC + ZERO_CELSIUS_K;
  const density = interpolate(table.temperaturesK, table.densityKgPerM3, temperatureK);
  const viscosity = interpolate(table.temperaturesK, table.viscosityPaS, temperatureK);
  const conductivity = interpolate(table.temperaturesK, table.conductivityWPerMK, temperatureK);
  const prandtl = interpolate(table.temperaturesK, table.prandtl, temperatureK);
  const reynolds = (density * velocityMPerS * innerDiameterM) / viscosity;
  const diameterOverLength = runLengthM !== undefined && runLengthM > 0 ? innerDiameterM / runLengthM : 0;
  return (tubeNusselt(reynolds, prandtl, diameterOverLength) * conductivity) / innerDiameterM;
}
