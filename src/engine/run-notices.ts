import type { MeasurementReading } from './measurements';
import type { ParsedPlantRun } from './plant-input';
import type { InputNotice } from './plant-result';
import { formatNumber } from './schema-helpers';
import type { ServiceDefaults } from './services';
import { saturationTemperatureC } from './steam-properties';

/** A bare steam reading this far under saturation points at a fault or a false reading (method.md). */
const SATURATION_SHORTFALL_K = 5;
/** A measured insulated surface is trusted for a condition factor only this far from the air (method.md). */
const CONDITION_FACTOR_MIN_DIFFERENCE_K = 10;
const RUN_LENGTH_NOTICE_M = 1000;
const MANY_VALVES = 50;
const GLYCOL_NOTICE_C = 60;
/** Usual gauge pressure of a hot-water main when none is given, kPa — common practice. */
const TYPICAL_LIQUID_GAUGE_KPA = 300;

/** What the site readings of a run say that a person should check. */
export function measurementNotices(run: ParsedPlantRun, reading: MeasurementReading | null, steamSaturationC: number | null, notices: InputNotice[]): void {
  if (!reading) return;
  const lineC = reading.lineTemperatureC;
  if (lineC !== null && steamSaturationC !== null && lineC < steamSaturationC - SATURATION_SHORTFALL_K) {
    notices.push({
      code: 'MEASURED_BELOW_SATURATION',
      path: `runs.${run.id}.measurements.surfaceTemperatureC`,
      message: `The bare steam line reads about ${formatNumber(Math.round(lineC))} °C, more than ${SATURATION_SHORTFALL_K} K under the ${formatNumber(Math.round(steamSaturationC))} °C of saturated steam at the stated pressure: the line may run only part of the time, hold condensate, have a wrong gauge, or a shiny surface may have misled an infrared reading.`,
      params: { quantity: 'temperature', givenSI: lineC, limitSI: steamSaturationC - SATURATION_SHORTFALL_K, limit: 'min' },
    });
  }
  if (reading.closeToAir) {
    notices.push({
      code: 'MEASURED_CLOSE_TO_AIR',
      path: `runs.${run.id}.measurements.surfaceTemperatureC`,
      message: `The insulated surface reads within ${CONDITION_FACTOR_MIN_DIFFERENCE_K} K of the air, too close to judge the insulation's condition from; the catalog figure is kept.`,
    });
  }
}

/**
 * Soft warnings at the field, in the field's own terms, for input that is legal but unlikely
 * for a small plant (not refusals).
 */
export function plausibilityNotices(
  run: ParsedPlantRun,
  plantRuns: readonly ParsedPlantRun[],
  service: ServiceDefaults,
  lengthM: number,
  fluidC: number,
  steamGaugeKPa: number | undefined,
  atmosphereKPa: number,
  notices: InputNotice[],
): void {
  const at = (field: string) => `runs.${plantRuns.indexOf(run)}.${field}`;
  if (lengthM > RUN_LENGTH_NOTICE_M) {
    notices.push({ code: 'RUN_LONGER_THAN_1_KM', path: at('lengthM'), message: `Run "${run.label}" is over 1 km long (${formatNumber(Math.round(lengthM))} m); a small plant's runs are usually far shorter — check the length and its unit.`, params: { quantity: 'length', limit: 'max', limitSI: RUN_LENGTH_NOTICE_M, givenSI: lengthM } });
  }
  const valveCount = run.valves + run.fittings.filter((f) => f.type === 'valve-flanged' || f.type === 'valve-screwed').reduce((n, f) => n + f.count, 0);
  if (valveCount > MANY_VALVES) {
    notices.push({ code: 'MANY_VALVES', path: at('valves'), message: `Run "${run.label}" lists ${valveCount} valves; more than ${MANY_VALVES} on one run is unusual — check the count.`, params: { quantity: 'count', limit: 'max', limitSI: MANY_VALVES, givenSI: valveCount } });
  }
  if (service.kind === 'liquid' && !service.cold && service.liquid === 'water') {
    const gauge = run.liquidGaugePressureKPa ?? TYPICAL_LIQUID_GAUGE_KPA;
    const boilingC = saturationTemperatureC(Math.max(gauge + atmosphereKPa, 1));
    if (fluidC > boilingC) {
      notices.push({ code: 'HOT_WATER_ABOVE_BOILING', path: at('fluidTemperatureC'), message: `Run "${run.label}" carries water at ${formatNumber(Math.round(fluidC))} °C, above its boiling point of about ${formatNumber(Math.round(boilingC))} °C at ${formatNumber(Math.round(gauge))} kPa gauge — it would flash to steam. Check the temperature or give the line's pressure.`, params: { quantity: 'temperature', limit: 'max', limitSI: boilingC, givenSI: fluidC } });
    }
  }
  if (run.service === 'glycol' && fluidC > GLYCOL_NOTICE_C) {
    notices.push({ code: 'GLYCOL_ABOVE_60C', path: at('fluidTemperatureC'), message: `Run "${run.label}" carries glycol at ${formatNumber(Math.round(fluidC))} °C; glycol loops in food plants run cold, rarely above ${GLYCOL_NOTICE_C} °C — check the service or the temperature.`, params: { quantity: 'temperature', limit: 'max', limitSI: GLYCOL_NOTICE_C, givenSI: fluidC } });
  }
  if (steamGaugeKPa !== undefined && steamGaugeKPa < 0) {
    notices.push({ code: 'STEAM_BELOW_ATMOSPHERIC', path: at('steamGaugePressureKPa'), message: `Run "${run.label}" gives steam below atmospheric pressure (${formatNumber(steamGaugeKPa)} kPa gauge); process steam in a food plant is above it — check the sign and the unit.`, params: { quantity: 'pressure', limit: 'min', limitSI: 0, givenSI: steamGaugeKPa } });
  }
}
