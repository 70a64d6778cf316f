/**
 * Liquid properties for the inside film.
 *
 * Water: saturated liquid, Incropera et al., Fundamentals of Heat and Mass
 * Transfer 6th ed., Table A.6 — from memory. Columns: T (K), density (kg/m³,
 * from the tabulated specific volume), dynamic viscosity (Pa·s), conductivity
 * (W/(m·K)), Prandtl number.
 *
 * Propylene glycol 30 % by mass in water: approximate values after ASHRAE
 * Handbook—Fundamentals ch. 31 (secondary coolants) — from memory; the inside
 * film is a small resistance on any insulated line, so rough values suffice.
 */
export interface LiquidTable {
  readonly temperaturesK: readonly number[];
  readonly densityKgPerM3: readonly number[];
  readonly viscosityPaS: readonly number[];
  readonly conductivityWPerMK: readonly number[];
  readonly prandtl: readonly number[];
}

export const WATER: LiquidTable = {
  temperaturesK: [273.15, 280, 290, 300, 310, 320, 330, 340, 350, 360, 370, 380, 390, 400, 410, 420, 430, 440, 450],
  densityKgPerM3: [1000, 1000, 999, 997, 993, 989.1, 984.3, 979.4, 973.7, 967.1, 960.6, 953.3, 945.2, 937.2, 928.5, 919.1, 909.9, 900.9, 890.5],
  viscosityPaS: [1750e-6, 1422e-6, 1080e-6, 855e-6, 695e-6, 577e-6, 489e-6, 420e-6, 365e-6, 324e-6, 289e-6, 260e-6, 237e-6, 217e-6, 200e-6, 185e-6, 173e-6, 162e-6, 152e-6],
  conductivityWPerMK: [0.569, 0.582, 0.598, 0.613, 0.628, 0.64, 0.65, 0.66, 0.668, 0.674, 0.679, 0.683, 0.686, 0.688, 0.688, 0.688, 0.685, 0.682, 0.678],
  prandtl: [12.99, 10.26, 7.56, 5.83, 4.62, 3.77, 3.15, 2.66, 2.29, 2.02, 1.8, 1.61, 1.47, 1.34, 1.24, 1.16, 1.09, 1.04, 0.99],
};

export const PROPYLENE_GLYCOL_30: LiquidTable = {
  temperaturesK: [253.15, 263.15, 273.15, 293.15, 313.15, 333.15, 353.15],
  densityKgPerM3: [1043, 1039, 1036, 1028, 1018, 1006, 993],
  viscosityPaS: [15e-3, 9.0e-3, 5.7e-3, 2.6e-3, 1.4e-3, 0.9e-3, 0.6e-3],
  conductivityWPerMK: [0.42, 0.425, 0.43, 0.445, 0.46, 0.47, 0.48],
  prandtl: [136, 81, 51, 23, 12, 7.6, 5.0],
};
