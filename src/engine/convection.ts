import { STANDARD_GRAVITY_M_PER_S2 } from './physical-constants';

/**
 * Natural convection from a long horizontal cylinder, Churchill & Chu (1975),
 * Int. J. Heat Mass Transfer 18, 1049: Nu_D = {0.60 + 0.387 Ra^(1/6) / [1 + (0.559/Pr)^(9/16)]^(8/27)}²,
 * for Ra_D ≤ 10¹².
 */
export function churchillChuHorizontalNusselt(rayleigh: number, prandtl: number): number {
  const shape = Math.pow(1 + Math.pow(0.559 / prandtl, 9 / 16), 8 / 27);
  const root = 0.6 + (0.387 * Math.pow(rayleigh, 1 / 6)) / shape;
  return root * root;
}

/**
 * Natural convection from a vertical plate (used for a vertical run on its height),
 * Churchill & Chu (1975), Int. J. Heat Mass Transfer 18, 1323:
 * Nu_L = {0.825 + 0.387 Ra_L^(1/6) / [1 + (0.492/Pr)^(9/16)]^(8/27)}², all Ra_L.
 */
export function churchillChuVerticalNusselt(rayleigh: number, prandtl: number): number {
  const shape = Math.pow(1 + Math.pow(0.492 / prandtl, 9 / 16), 8 / 27);
  const root = 0.825 + (0.387 * Math.pow(rayleigh, 1 / 6)) / shape;
  return root * root;
}

/**
 * Forced convection across a cylinder, Churchill & Bernstein (1977), J. Heat
 * Transfer 99, 300: Nu_D = 0.3 + 0.62 Re^½ Pr^⅓ / [1 + (0.4/Pr)^⅔]^¼ · [1 + (Re/282 000)^⅝]^⅘,
 * for Re·Pr ≥ 0.2. At Re → 0 it tends to 0.3, which is negligible beside natural
 * convection, so combining the two stays continuous as the wind drops to zero.
 */
export function churchillBernsteinNusselt(reynolds: number, prandtl: number): number {
  const lead =
    (0.62 * Math.sqrt(reynolds) * Math.cbrt(prandtl)) / Math.pow(1 + Math.pow(0.4 / prandtl, 2 / 3), 0.25);
  return 0.3 + lead * Math.pow(1 + Math.pow(reynolds / 282000, 5 / 8), 4 / 5);
}

/** Rayleigh number g β ΔT L³ / (ν α) with β = 1/T_film (ideal gas) and α = ν/Pr. */
export function rayleighNumber(
  temperatureDifferenceK: number,
  lengthM: number,
  filmTemperatureK: number,
  kinematicViscosityM2PerS: number,
  prandtl: number,
): number {
  return (
    (STANDARD_GRAVITY_M_PER_S2 * Math.abs(temperatureDifferenceK) * lengthM * lengthM * lengthM * prandtl) /
    (filmTemperatureK * kinematicViscosityM2PerS * kinematicViscosityM2PerS)
  );
}

/** Mixed convection, h = (h_F³ + h_N³)^(1/3) — Churchill's combination of Nusselt numbers (method.md). */
export function combineMixedConvection(forcedWPerM2K: number, naturalWPerM2K: number): number {
  return Math.cbrt(forcedWPerM2K * forcedWPerM2K * forcedWPerM2K + naturalWPerM2K * naturalWPerM2K * naturalWPerM2K);
}

/**
 * Popiel's correction of the vertical-plate Nusselt number for a slender vertical cylinder
 * (C. O. Popiel, "Free convection heat transfer from vertical slender cylinders: a review",
 * Heat Transfer Engineering 29 (2008) 521–536), as the ratio to the Churchill–Chu plate:
 * Nu/Nu_plate = 1 + B·[32^½ · Gr_L^(−¼) · L/D]^C, with
 * B = 0.0571322 + 0.20305 Pr^(−0.43) and C = 0.9165 − 0.0043 Pr^½ + 0.01333 ln Pr + 0.0004809/Pr
 * — coefficients from memory; checked in __tests__/correlations.test.ts.
 */
export function popielSlenderFactor(grashof: number, lengthOverDiameter: number, prandtl: number): number {
  return 1 + popielSlenderB(prandtl) * Math.pow((Math.sqrt(32) * lengthOverDiameter) / Math.sqrt(Math.sqrt(grashof)), popielSlenderC(prandtl));
}

/** B of {@link popielSlenderFactor}. */
export function popielSlenderB(prandtl: number): number {
  return 0.0571322 + 0.20305 * Math.pow(prandtl, -0.43);
}

/** C of {@link popielSlenderFactor}. */
export function popielSlenderC(prandtl: number): number {
  return 0.9165 - 0.0043 * Math.sqrt(prandtl) + 0.01333 * Math.log(prandtl) + 0.0004809 / prandtl;
}
