import type { AirProperties } from './air-properties';
import { ZERO_CELSIUS_K } from './physical-constants';
import { saturationVapourPressureKPa } from './psychrometrics';

/** Molar mass of water over the universal gas constant, kg·K/J (18.01528 g/mol ÷ 8.314462618 J/(mol·K)). */
const WATER_M_OVER_R = 0.01801528 / 8.314462618;

/**
 * Diffusion coefficient of water vapor in air, m²/s: 0.26 × 10⁻⁴ at 298 K scaled as T^(3/2)
 * (Incropera et al., Fundamentals of Heat and Mass Transfer 6th ed., Table A.8 and eq. 14.7
 * — from memory).
 */
export function vapourDiffusivityM2PerS(temperatureK: number): number {
  return 0.26e-4 * Math.pow(temperatureK / 298, 1.5);
}

/**
 * Latent heat given up by vapor condensing on a surface at `surfaceC`, J/kg: condensation
 * h_fg ≈ 2 501 kJ/kg − 2.37 kJ/(kg·K)·T above 0 °C, plus the heat of fusion 334 kJ/kg where it
 * frosts (below 0 °C) — the usual psychrometric approximations, from memory.
 */
export function latentHeatOfDepositionJPerKg(surfaceC: number): number {
  return surfaceC >= 0 ? 2.501e6 - 2370 * surfaceC : 2.501e6 - 2370 * surfaceC + 3.34e5;
}

/**
 * Water condensing on a cold surface, kg/(m²·s), by the Chilton–Colburn heat and mass
 * transfer analogy (Incropera eq. 6.60): h_m = h_c / (ρ c_p Le^(2/3)) = h_c α / (k Le^(2/3)),
 * flux = h_m (ρ_v,air − ρ_v,sat(T_s)). Positive when vapor condenses (surface below the
 * dew point), negative (evaporation, which a dry surface cannot do) otherwise.
 *
 * @param convectionWPerM2K the surface's convection coefficient
 * @param air air properties at the film temperature (ν, k, Pr)
 * @param vapourPressureKPa the air's vapor partial pressure
 */
export function condensationFluxKgPerM2S(
  convectionWPerM2K: number,
  air: AirProperties,
  surfaceC: number,
  airC: number,
  vapourPressureKPa: number,
): number {
  const diffusivity = air.kinematicViscosityM2PerS / air.prandtl;
  const filmK = 0.5 * (surfaceC + airC) + ZERO_CELSIUS_K;
  const lewis = diffusivity / vapourDiffusivityM2PerS(filmK);
  const massCoefficient = (convectionWPerM2K * diffusivity) / (air.conductivityWPerMK * Math.pow(lewis, 2 / 3));
  const airDensity = (vapourPressureKPa * 1000 * WATER_M_OVER_R) / (airC + ZERO_CELSIUS_K);
  const surfaceDensity = (saturationVapourPressureKPa(surfaceC) * 1000 * WATER_M_OVER_R) / (surfaceC + ZERO_CELSIUS_K);
  return massCoefficient * (airDensity - surfaceDensity);
}
