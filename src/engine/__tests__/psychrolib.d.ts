// Minimal types for the psychrolib npm package (ASHRAE psychrometrics), used only by the tests.
declare module 'psychrolib' {
  const psychrolib: {
    SI: number;
    IP: number;
    SetUnitSystem(units: number): void;
    GetTDewPointFromRelHum(dryBulbTemperatureC: number, relativeHumidity: number): number;
    /** Saturation vapor pressure, Pa (SI). */
    GetSatVapPres(dryBulbTemperatureC: number): number;
  };
  export default psychrolib;
}
