/**
 * The estimate form's number fields, declared once: the label a person reads, the unit the
 * value is typed in, and any advice that goes with a refusal. The form draws its labels from
 * here and every validation message (the browser's and the server's 400s alike) is worded
 * from here, so a message always names the field as its label does, in the unit it was typed in.
 *
 * Paths use `#` for a list index: `estimate.runs.#.lengthM` stands for every run's length.
 * Shared with any other form that asks the same engine inputs (the site-walk form).
 */
import type { DisplayQuantity, UnitSystem } from './units-display';

/** What a field's unit text depends on besides the unit system. */
export interface FieldContext {
  readonly system: UnitSystem;
  /** ISO code of the plant's currency, e.g. USD. */
  readonly currency: string;
  /** How the fuel's price unit reads in a sentence: "therm", "cubic meter (m³)". */
  readonly priceUnitName: string;
}

/** One number field of the form. */
export interface FormField {
  /** The label beside the box (without its unit). */
  readonly label: string;
  /** A physical quantity: typed in the unit system's unit, stored in SI. */
  readonly quantity?: DisplayQuantity;
  /** Unit text for what does not convert (hours, years, money, counts). */
  readonly unitText?: (context: FieldContext) => string;
  /** Decimals a limit or a given value is written with, when `unitText` is used. */
  readonly decimals?: number;
  /** The unit text for exactly one ("year" beside "years"). */
  readonly singular?: string;
  /** A sentence added to a refusal below the lower or above the upper limit. */
  readonly advice?: { readonly min?: string; readonly max?: string };
}

const hoursAYear = () => 'h a year';
const years = () => 'years';
const money = (per: (context: FieldContext) => string) => (context: FieldContext) => `${context.currency} per ${per(context)}`;

/** Every number field the estimate form shows, by path pattern. */
export const FORM_FIELDS = {
  'estimate.operatingHoursPerYear': {
    label: 'Running hours',
    unitText: hoursAYear,
    decimals: 0,
    advice: { max: 'A year has 8,760 hours: round the clock is 8,760 h.' },
  },
  'estimate.conditions.indoorAirTemperatureC': { label: 'Air temperature inside', quantity: 'temperature' },
  'estimate.conditions.indoorRelativeHumidityPercent': { label: 'Humidity inside', quantity: 'percent' },
  'estimate.conditions.draughtyAirSpeedMPerS': { label: 'Air speed in drafty spots', quantity: 'speed' },
  'estimate.conditions.outdoorAirTemperatureC': { label: 'Outdoor air temperature while running', quantity: 'temperature' },
  'estimate.conditions.outdoorRelativeHumidityPercent': { label: 'Outdoor humidity', quantity: 'percent' },
  'estimate.conditions.outdoorWindSpeedMPerS': { label: 'Typical wind speed', quantity: 'speed' },
  'estimate.conditions.altitudeM': { label: 'Altitude above sea level', quantity: 'altitude' },
  'estimate.energy.price': {
    label: 'Fuel price',
    unitText: money((context) => context.priceUnitName),
    decimals: 4,
    advice: { min: 'Type what one unit of fuel costs you, from a recent bill.' },
  },
  'estimate.energy.boilerEfficiency': {
    label: 'Boiler efficiency',
    quantity: 'fraction',
    advice: { min: 'Type it as a percentage: 80 for 80 %.', max: 'No boiler turns more than all of its fuel into heat.' },
  },
  'estimate.energy.electricityPricePerKWh': { label: 'Electricity price for the chillers', unitText: money(() => 'kWh'), decimals: 4 },
  'estimate.economics.horizonYears': { label: 'Years to count', unitText: years, singular: 'year', decimals: 0 },
  'estimate.economics.discountRatePercent': { label: 'Discount rate', quantity: 'percent' },
  'estimate.economics.fuelEscalationPercent': { label: 'Yearly rise in fuel price', quantity: 'percent' },
  'estimate.areas.#.average.airTemperatureC': { label: 'Usual air temperature', quantity: 'temperature' },
  'estimate.areas.#.average.relativeHumidityPercent': { label: 'Usual humidity', quantity: 'percent' },
  'estimate.areas.#.average.airSpeedMPerS': { label: 'Usual air speed', quantity: 'speed' },
  'estimate.areas.#.design.hotAirTemperatureC': { label: 'Air on the hottest day', quantity: 'temperature' },
  'estimate.areas.#.design.wetAirTemperatureC': { label: 'Air temperature at its dampest', quantity: 'temperature' },
  'estimate.areas.#.design.wetRelativeHumidityPercent': { label: 'Humidity at its dampest', quantity: 'percent' },
  'estimate.runs.#.lengthM': { label: 'Length', quantity: 'length', advice: { max: 'Split a run that long into several runs.' } },
  'estimate.runs.#.steamGaugePressureKPa': { label: 'Steam pressure on the gauge', quantity: 'gaugePressure' },
  'estimate.runs.#.fluidTemperatureC': { label: 'Temperature in the line', quantity: 'temperature' },
  'estimate.runs.#.ambient.windSpeedMPerS': { label: 'Wind speed at this run', quantity: 'speed' },
  'estimate.runs.#.ambient.airSpeedMPerS': { label: 'Air speed at this run', quantity: 'speed' },
  'estimate.runs.#.current.bareFraction': {
    label: 'Share of the run left bare',
    quantity: 'fraction',
    advice: { max: 'A run that is all bare is 100 %; choose “Bare” for it.' },
  },
  'estimate.runs.#.current.thicknessM': { label: 'Thickness of the insulation on it', quantity: 'thickness' },
  'estimate.runs.#.fittings.#.count': { label: 'Number fitted', unitText: () => '', decimals: 0 },
  'estimate.runs.#.proposed.thicknessM': { label: 'Proposed thickness', quantity: 'thickness' },
} as const satisfies Record<string, FormField>;

export type FormFieldPattern = keyof typeof FORM_FIELDS;

/** A form path with its list indexes as `#`: `estimate.runs.2.lengthM` → `estimate.runs.#.lengthM`. */
export function fieldPattern(path: string): string {
  return path
    .split('.')
    .map((segment) => (/^\d+$/.test(segment) ? '#' : segment))
    .join('.');
}

/** The number field at a form path, or undefined for anything else (a choice, a name). */
export function formFieldAt(path: string): FormField | undefined {
  return (FORM_FIELDS as Record<string, FormField>)[fieldPattern(path)];
}
