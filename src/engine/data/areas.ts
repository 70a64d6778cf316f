/**
 * Typical areas of a small food plant, each with the year's average air (for energy) and
 * design air (for safety): the hot still hour that sets burn checks and the wettest hour that
 * sets sweating checks. Design checks always take still air, the worst case for both.
 * Common practice (our own typical values; a plant should put in its own where it knows
 * them). Washdown rooms run at 80–90 % relative humidity (method.md).
 */
export interface AreaConditions {
  readonly airTemperatureC: number;
  readonly relativeHumidityPercent: number;
  readonly airSpeedMPerS: number;
}

export interface AreaDesign {
  /** The hot still hour: burns are checked at this air temperature. */
  readonly hotAirTemperatureC: number;
  /** The wettest hour: sweating is checked at this air. */
  readonly wetAirTemperatureC: number;
  readonly wetRelativeHumidityPercent: number;
}

export interface AreaPreset {
  readonly id: string;
  readonly name: string;
  readonly setting: 'indoor' | 'outdoor';
  readonly average: AreaConditions;
  readonly design: AreaDesign;
}

export const AREA_PRESETS = [
  { id: 'boiler-room', name: 'Boiler room', setting: 'indoor', average: { airTemperatureC: 30, relativeHumidityPercent: 40, airSpeedMPerS: 0.3 }, design: { hotAirTemperatureC: 40, wetAirTemperatureC: 30, wetRelativeHumidityPercent: 60 } },
  { id: 'process-room', name: 'Process room', setting: 'indoor', average: { airTemperatureC: 20, relativeHumidityPercent: 60, airSpeedMPerS: 0.2 }, design: { hotAirTemperatureC: 32, wetAirTemperatureC: 24, wetRelativeHumidityPercent: 75 } },
  { id: 'washdown-room', name: 'Washdown room', setting: 'indoor', average: { airTemperatureC: 18, relativeHumidityPercent: 80, airSpeedMPerS: 0.2 }, design: { hotAirTemperatureC: 30, wetAirTemperatureC: 20, wetRelativeHumidityPercent: 90 } },
  { id: 'cold-store', name: 'Cold store', setting: 'indoor', average: { airTemperatureC: 3, relativeHumidityPercent: 85, airSpeedMPerS: 1 }, design: { hotAirTemperatureC: 12, wetAirTemperatureC: 6, wetRelativeHumidityPercent: 95 } },
  { id: 'plant-room', name: 'Plant room or corridor', setting: 'indoor', average: { airTemperatureC: 22, relativeHumidityPercent: 50, airSpeedMPerS: 0.2 }, design: { hotAirTemperatureC: 35, wetAirTemperatureC: 24, wetRelativeHumidityPercent: 70 } },
  { id: 'outdoors', name: 'Outdoors', setting: 'outdoor', average: { airTemperatureC: 10, relativeHumidityPercent: 75, airSpeedMPerS: 3 }, design: { hotAirTemperatureC: 35, wetAirTemperatureC: 25, wetRelativeHumidityPercent: 85 } },
] as const satisfies readonly AreaPreset[];

export type AreaPresetId = (typeof AREA_PRESETS)[number]['id'];
export const AREA_PRESET_IDS = AREA_PRESETS.map((a) => a.id) as [AreaPresetId, ...AreaPresetId[]];

/**
 * Design air for the plant-wide rooms of an estimate without areas: never milder than the
 * average — the hot hour at least 32 °C indoors and 35 °C outdoors, the wettest hour at the
 * average temperature indoors (25 °C outdoors) and at least 75 % (85 % outdoors) relative
 * humidity. Common practice (our own choice).
 */
export const DEFAULT_DESIGN = {
  indoorHotAirTemperatureC: 32,
  outdoorHotAirTemperatureC: 35,
  indoorWetRelativeHumidityPercent: 75,
  outdoorWetAirTemperatureC: 25,
  outdoorWetRelativeHumidityPercent: 85,
} as const;
