import { STEFAN_BOLTZMANN_W_PER_M2K4 } from './physical-constants';

/**
 * Linearized radiation coefficient of a small gray surface in large surroundings,
 * h_r = ε σ (T_s² + T_sur²)(T_s + T_sur), temperatures in kelvin (Incropera eq. 1.9).
 */
export function radiationCoefficientWPerM2K(
  emittance: number,
  surfaceTemperatureK: number,
  surroundingsTemperatureK: number,
): number {
  return (
    emittance *
    STEFAN_BOLTZMANN_W_PER_M2K4 *
    (surfaceTemperatureK * surfaceTemperatureK + surroundingsTemperatureK * surroundingsTemperatureK) *
    (surfaceTemperatureK + surroundingsTemperatureK)
  );
}

/** Critical radius of insulation on a cylinder, r_cr = k / h (Incropera §3.3.1). */
export function criticalInsulationRadiusM(insulationConductivityWPerMK: number, outerCoefficientWPerM2K: number): number {
  return insulationConductivityWPerMK / outerCoefficientWPerM2K;
}
