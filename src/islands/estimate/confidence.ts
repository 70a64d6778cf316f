/**
 * How sure the estimate is of each figure the form sends. A person may say it themselves
 * ("a guess", "near enough", "known"); where they have not, a value the form filled in and
 * they never touched counts as a guess, and one they typed as near enough. The engine widens
 * the range by these, so typical values never pass for known ones.
 */
import { PLANT_INPUT_DEFAULTS, type PlantInput } from '../../engine';

export type Confidence = 'measured' | 'estimated' | 'guessed';

/** Whether the person typed the value now at a path (rather than leaving what the form filled in). */
export type WasTyped = (path: string, value: unknown) => boolean;

export const NOTHING_TYPED: WasTyped = () => false;

/** The plant-wide air the form fills in on the first step. */
const CONDITION_FIELDS = [
  'indoorAirTemperatureC',
  'indoorRelativeHumidityPercent',
  'draughtyAirSpeedMPerS',
  'outdoorAirTemperatureC',
  'outdoorRelativeHumidityPercent',
  'outdoorWindSpeedMPerS',
  'altitudeM',
] as const;

const given = (value: unknown) => value !== undefined && value !== null && value !== '';

/** What the form fills in: the engine's own defaults. */
const PREFILLED = {
  hours: PLANT_INPUT_DEFAULTS.operatingHoursPerYear,
  conditions: PLANT_INPUT_DEFAULTS.conditions as Record<string, unknown>,
};

/** A value the form filled in counts as touched once it was typed or differs from what was filled in. */
function touched(path: string, value: unknown, prefill: unknown, wasTyped: WasTyped): boolean {
  return wasTyped(path, value) || (given(value) && value !== prefill);
}

/** The running hours: filled in with the engine's usual figure. */
export function hoursConfidence(hours: unknown, wasTyped: WasTyped): Confidence {
  return touched('estimate.operatingHoursPerYear', hours, PREFILLED.hours, wasTyped) ? 'estimated' : 'guessed';
}

/** The plant-wide air: filled in with the engine's usual figures; any one typed makes them near enough. */
export function conditionsConfidence(conditions: Partial<Record<string, unknown>> | undefined, wasTyped: WasTyped): Confidence {
  return CONDITION_FIELDS.some((key) => touched(`estimate.conditions.${key}`, conditions?.[key], PREFILLED.conditions[key], wasTyped)) ? 'estimated' : 'guessed';
}

/** An area's air: left empty, its kind's usual figures apply; any one given makes them near enough. */
export function areaConfidence(area: { average?: Record<string, unknown>; design?: Record<string, unknown> } | undefined): Confidence {
  const values = [...Object.values(area?.average ?? {}), ...Object.values(area?.design ?? {})];
  return values.some(given) ? 'estimated' : 'guessed';
}

/** The boiler's efficiency: left empty, the fuel's usual one applies. */
export function efficiencyConfidence(efficiency: unknown): Confidence {
  return given(efficiency) ? 'estimated' : 'guessed';
}

/**
 * The estimate with every confidence the person left unsaid filled in: untouched pre-fills
 * guessed, typed figures estimated. What they said themselves stays as they said it.
 */
export function withConfidences(estimate: PlantInput, wasTyped: WasTyped): PlantInput {
  const conditions = estimate.conditions ?? {};
  return {
    ...estimate,
    operatingHoursConfidence: estimate.operatingHoursConfidence ?? hoursConfidence(estimate.operatingHoursPerYear, wasTyped),
    conditions: {
      ...conditions,
      confidence: conditions.confidence ?? conditionsConfidence(conditions as Record<string, unknown>, wasTyped),
    },
    areas: (estimate.areas ?? []).map((area) => ({
      ...area,
      confidence: area.confidence ?? areaConfidence(area as { average?: Record<string, unknown>; design?: Record<string, unknown> }),
    })),
    energy: {
      ...estimate.energy,
      // The price is always typed: near enough unless the person says it is a guess or known from a bill.
      priceConfidence: estimate.energy.priceConfidence ?? 'estimated',
      boilerEfficiencyConfidence: estimate.energy.boilerEfficiencyConfidence ?? efficiencyConfidence(estimate.energy.boilerEfficiency),
    },
  };
}
