/** Stefan–Boltzmann constant, W/(m²·K⁴) — CODATA 2018 (exact from h, c, k). */
export const STEFAN_BOLTZMANN_W_PER_M2K4 = 5.670374419e-8;

/** Standard acceleration of gravity, m/s² — CGPM 1901, as listed in NIST SP 811 §B.8. */
export const STANDARD_GRAVITY_M_PER_S2 = 9.80665;

/** 0 °C in kelvin (ITS-90 / SI definition). */
export const ZERO_CELSIUS_K = 273.15;

/** Standard atmosphere, kPa (NIST SP 811 §B.8: 1 atm = 101 325 Pa exactly). */
export const STANDARD_ATMOSPHERE_KPA = 101.325;

/** Hours in a common year, used for "continuous operation". */
export const HOURS_PER_YEAR = 8760;
