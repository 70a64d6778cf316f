/**
 * Thermophysical properties of dry air at 1 atm, every 50 K from 100 K to 900 K.
 *
 * Source: Incropera, DeWitt, Bergman & Lavine, Fundamentals of Heat and Mass
 * Transfer, 6th ed. (Wiley 2007), Table A.4 "Thermophysical properties of gases at
 * atmospheric pressure — Air". Values recalled from memory (the table was not
 * open while this was written); the air-properties test pins a few of them to
 * independent figures. Columns: kinematic viscosity ν (m²/s), thermal
 * conductivity k (W/(m·K)), Prandtl number.
 */
export const AIR_TABLE_START_K = 100;
export const AIR_TABLE_STEP_K = 50;

export const AIR_KINEMATIC_VISCOSITY_M2_PER_S = [
  2.0e-6, 4.426e-6, 7.59e-6, 11.44e-6, 15.89e-6, 20.92e-6, 26.41e-6, 32.39e-6, 38.79e-6, 45.57e-6, 52.69e-6,
  60.21e-6, 68.1e-6, 76.37e-6, 84.93e-6, 93.8e-6, 102.9e-6,
] as const;

export const AIR_CONDUCTIVITY_W_PER_MK = [
  9.34e-3, 13.8e-3, 18.1e-3, 22.3e-3, 26.3e-3, 30.0e-3, 33.8e-3, 37.3e-3, 40.7e-3, 43.9e-3, 46.9e-3, 49.7e-3,
  52.4e-3, 54.9e-3, 57.3e-3, 59.6e-3, 62.0e-3,
] as const;

export const AIR_PRANDTL = [
  0.786, 0.758, 0.737, 0.72, 0.707, 0.7, 0.69, 0.686, 0.684, 0.683, 0.685, 0.69, 0.695, 0.702, 0.709, 0.716, 0.72,
] as const;
