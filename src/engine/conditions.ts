import { AREA_PRESETS, DEFAULT_DESIGN } from './data/areas';
import type { ParsedPlantInput, ParsedPlantRun } from './plant-input';
import { dewPointC } from './psychrometrics';
import type { Confidence } from './uncertainty';

/** The air one check or figure of a run is made at. */
export interface AirState {
  readonly temperatureC: number;
  readonly relativeHumidityPercent: number;
  readonly speedMPerS: number;
  readonly dewPointC: number;
}

/** Where a run sits: its air on average (energy) and at design (burns, sweating). */
export interface RunConditions {
  /** The area's id, or the plant-wide room (`indoor`, `outdoor`) a run without an area uses. */
  readonly areaId: string;
  readonly areaLabel: string;
  readonly setting: 'indoor' | 'outdoor';
  readonly average: AirState;
  /** The hot still hour: burns are checked here. */
  readonly designHot: AirState;
  /** The wettest still hour: sweating is checked here. */
  readonly designWet: AirState;
  readonly confidence: Confidence;
}

function air(temperatureC: number, relativeHumidityPercent: number, speedMPerS: number): AirState {
  return { temperatureC, relativeHumidityPercent, speedMPerS, dewPointC: dewPointC(temperatureC, relativeHumidityPercent) };
}

/**
 * The conditions of a run: its area's (preset filled in where left out), or, without an area,
 * the plant-wide indoor or outdoor air with the plant's design air. Design air is never milder
 * than the average, and design checks take still air.
 */
export function runConditions(run: ParsedPlantRun, plant: ParsedPlantInput): RunConditions {
  if (run.areaId !== undefined) {
    const area = plant.areas.find((a) => a.id === run.areaId);
    if (area) {
      const preset = AREA_PRESETS.find((p) => p.id === area.preset) ?? AREA_PRESETS[1];
      const avgC = area.average.airTemperatureC ?? preset.average.airTemperatureC;
      const avgRh = area.average.relativeHumidityPercent ?? preset.average.relativeHumidityPercent;
      const avgV = area.average.airSpeedMPerS ?? preset.average.airSpeedMPerS;
      const hotC = Math.max(area.design.hotAirTemperatureC ?? preset.design.hotAirTemperatureC, avgC);
      const wetC = area.design.wetAirTemperatureC ?? Math.max(preset.design.wetAirTemperatureC, avgC);
      const wetRh = Math.max(area.design.wetRelativeHumidityPercent ?? preset.design.wetRelativeHumidityPercent, avgRh);
      return {
        areaId: area.id,
        areaLabel: area.label,
        setting: preset.setting,
        average: air(avgC, avgRh, avgV),
        designHot: air(hotC, avgRh, 0),
        designWet: air(wetC, wetRh, 0),
        confidence: area.confidence,
      };
    }
  }
  const c = plant.conditions;
  const d = c.design;
  if (run.ambient.kind === 'outdoor') {
    const speed = run.ambient.windSpeedMPerS ?? c.outdoorWindSpeedMPerS;
    const avgC = c.outdoorAirTemperatureC;
    const avgRh = c.outdoorRelativeHumidityPercent;
    return {
      areaId: 'outdoor',
      areaLabel: 'Outdoors',
      setting: 'outdoor',
      average: air(avgC, avgRh, speed),
      designHot: air(Math.max(d.outdoorHotAirTemperatureC ?? DEFAULT_DESIGN.outdoorHotAirTemperatureC, avgC), avgRh, 0),
      designWet: air(
        Math.max(d.outdoorWetAirTemperatureC ?? DEFAULT_DESIGN.outdoorWetAirTemperatureC, avgC),
        Math.max(d.outdoorWetRelativeHumidityPercent ?? DEFAULT_DESIGN.outdoorWetRelativeHumidityPercent, avgRh),
        0,
      ),
      confidence: c.confidence,
    };
  }
  const speed = run.ambient.kind === 'indoor-draughty' ? (run.ambient.airSpeedMPerS ?? c.draughtyAirSpeedMPerS) : 0;
  const avgC = c.indoorAirTemperatureC;
  const avgRh = c.indoorRelativeHumidityPercent;
  return {
    areaId: 'indoor',
    areaLabel: 'Indoors',
    setting: 'indoor',
    average: air(avgC, avgRh, speed),
    designHot: air(Math.max(d.indoorHotAirTemperatureC ?? DEFAULT_DESIGN.indoorHotAirTemperatureC, avgC), avgRh, 0),
    designWet: air(avgC, Math.max(d.indoorWetRelativeHumidityPercent ?? DEFAULT_DESIGN.indoorWetRelativeHumidityPercent, avgRh), 0),
    confidence: c.confidence,
  };
}
