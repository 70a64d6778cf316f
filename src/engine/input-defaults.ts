/**
 * The values a plant request takes when it leaves them out. Kept apart from the schemas so a
 * form can start from the very same values without loading the validation library.
 */

/** Plant-wide defaults, as `plantInputSchema` fills them in. */
export const PLANT_INPUT_DEFAULTS = {
  operatingHoursPerYear: 6000,
  conditions: {
    indoorAirTemperatureC: 20,
    indoorRelativeHumidityPercent: 60,
    outdoorAirTemperatureC: 10,
    outdoorRelativeHumidityPercent: 75,
    outdoorWindSpeedMPerS: 3,
    draughtyAirSpeedMPerS: 1,
    altitudeM: 0,
  },
  currency: 'USD',
  economics: {
    horizonYears: 10,
    discountRatePercent: 5,
    fuelEscalationPercent: 2,
    touchLimitC: 60,
    condensationMarginK: 1,
  },
} as const;

/** Lagging already on a damaged or insulated run, where the request does not say. */
export const EXISTING_LAGGING_DEFAULTS = {
  material: 'mineral-wool',
  thicknessM: 0.025,
  jacket: 'all-service-jacket',
} as const;
