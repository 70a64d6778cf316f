/**
 * Every number field of the estimate form, refused in US and in SI units: the message names
 * the field as its label does, in the unit the box shows, with the limit rounded toward what
 * the box accepts. The rows were worked by hand from the engine's limits (e.g. −20 °C is −4 °F;
 * 16,000 kPa is 2,320.6 psi, said as "at most 2,320 psig").
 */
import { describe, expect, it } from 'vitest';
import { FORM_FIELDS, formFieldAt, type FormFieldPattern } from '../../lib/form-fields';
import { fieldMessage } from '../../lib/field-messages';
import { displayUnit, type UnitSystem } from '../../lib/units-display';
import { freshValues, type DraftValues } from './draft';
import { fieldContextOf } from './resolver';
import { fieldErrorsOf } from './validation';

const NB = '\u00a0';
const MINUS = '\u2212';

interface Row {
  readonly pattern: FormFieldPattern;
  /** What the person types in the box, and the sentence they read. */
  readonly US: readonly [typed: number, says: string];
  readonly SI: readonly [typed: number, says: string];
}

const rows: readonly Row[] = [
  {
    pattern: 'estimate.operatingHoursPerYear',
    US: [8784, 'Running hours must be at most 8,760 h a year; 8,784 h a year was given. A year has 8,760 hours: round the clock is 8,760 h.'],
    SI: [-5, 'Running hours must be at least 0 h a year; −5 h a year was given.'],
  },
  {
    pattern: 'estimate.conditions.indoorAirTemperatureC',
    US: [-300, 'Air temperature inside must be at least −4 °F; −300 °F was given.'],
    SI: [51, 'Air temperature inside must be at most 50 °C; 51 °C was given.'],
  },
  {
    pattern: 'estimate.conditions.indoorRelativeHumidityPercent',
    US: [150, 'Humidity inside must be at most 100 %; 150 % was given.'],
    SI: [0.5, 'Humidity inside must be at least 1 %; 0.5 % was given.'],
  },
  {
    pattern: 'estimate.conditions.draughtyAirSpeedMPerS',
    US: [30, 'Air speed in drafty spots must be at most 22.3 mph; 30 mph was given.'],
    SI: [-1, 'Air speed in drafty spots must be at least 0 m/s; −1 m/s was given.'],
  },
  {
    pattern: 'estimate.conditions.outdoorAirTemperatureC',
    US: [-70, 'Outdoor air temperature while running must be at least −58 °F; −70 °F was given.'],
    SI: [55, 'Outdoor air temperature while running must be at most 50 °C; 55 °C was given.'],
  },
  {
    pattern: 'estimate.conditions.outdoorRelativeHumidityPercent',
    US: [101, 'Outdoor humidity must be at most 100 %; 101 % was given.'],
    SI: [0, 'Outdoor humidity must be at least 1 %; 0 % was given.'],
  },
  {
    pattern: 'estimate.conditions.outdoorWindSpeedMPerS',
    US: [100, 'Typical wind speed must be at most 89.4 mph; 100 mph was given.'],
    SI: [41, 'Typical wind speed must be at most 40 m/s; 41 m/s was given.'],
  },
  {
    pattern: 'estimate.conditions.altitudeM',
    US: [20000, 'Altitude above sea level must be at most 16,404 ft; 20,000 ft was given.'],
    SI: [-600, 'Altitude above sea level must be at least −500 m; −600 m was given.'],
  },
  {
    pattern: 'estimate.energy.price',
    US: [0, 'Fuel price must be more than 0 USD per therm; 0 USD per therm was given. Type what one unit of fuel costs you, from a recent bill.'],
    SI: [-1, 'Fuel price must be more than 0 USD per kWh; −1 USD per kWh was given. Type what one unit of fuel costs you, from a recent bill.'],
  },
  {
    pattern: 'estimate.energy.boilerEfficiency',
    US: [0.8, 'Boiler efficiency must be at least 30 %; 0.8 % was given. Type it as a percentage: 80 for 80 %.'],
    SI: [120, 'Boiler efficiency must be at most 100 %; 120 % was given. No boiler turns more than all of its fuel into heat.'],
  },
  {
    pattern: 'estimate.energy.electricityPricePerKWh',
    US: [-0.1, 'Electricity price for the chillers must be at least 0 USD per kWh; −0.1 USD per kWh was given.'],
    SI: [150, 'Electricity price for the chillers must be at most 100 USD per kWh; 150 USD per kWh was given.'],
  },
  {
    pattern: 'estimate.economics.horizonYears',
    US: [0.8, 'Years to count must be at least 1 year; 0.8 years was given.'],
    SI: [60, 'Years to count must be at most 50 years; 60 years was given.'],
  },
  {
    pattern: 'estimate.economics.discountRatePercent',
    US: [35, 'Discount rate must be at most 30 %; 35 % was given.'],
    SI: [-1, 'Discount rate must be at least 0 %; −1 % was given.'],
  },
  {
    pattern: 'estimate.economics.fuelEscalationPercent',
    US: [-12, 'Yearly rise in fuel price must be at least −10 %; −12 % was given.'],
    SI: [31, 'Yearly rise in fuel price must be at most 30 %; 31 % was given.'],
  },
  {
    pattern: 'estimate.runs.#.lengthM',
    US: [-5, 'Length must be more than 0 ft; −5 ft was given.'],
    SI: [12000, 'Length must be at most 10,000 m; 12,000 m was given. Split a run that long into several runs.'],
  },
  {
    pattern: 'estimate.runs.#.steamGaugePressureKPa',
    US: [5000, 'Steam pressure on the gauge must be at most 2,320 psig; 5,000 psig was given.'],
    SI: [-2, 'Steam pressure on the gauge must be at least −1.01 bar (gauge); −2 bar (gauge) was given.'],
  },
  {
    pattern: 'estimate.runs.#.fluidTemperatureC',
    US: [-300, 'Temperature in the line must be at least −148 °F; −300 °F was given.'],
    SI: [700, 'Temperature in the line must be at most 650 °C; 700 °C was given.'],
  },
  {
    pattern: 'estimate.runs.#.ambient.windSpeedMPerS',
    US: [95, 'Wind speed at this run must be at most 89.4 mph; 95 mph was given.'],
    SI: [-3, 'Wind speed at this run must be at least 0 m/s; −3 m/s was given.'],
  },
  {
    pattern: 'estimate.runs.#.ambient.airSpeedMPerS',
    US: [25, 'Air speed at this run must be at most 22.3 mph; 25 mph was given.'],
    SI: [11, 'Air speed at this run must be at most 10 m/s; 11 m/s was given.'],
  },
  {
    pattern: 'estimate.runs.#.current.bareFraction',
    US: [150, 'Share of the run left bare must be at most 100 %; 150 % was given. A run that is all bare is 100 %; choose “Bare” for it.'],
    SI: [-10, 'Share of the run left bare must be at least 0 %; −10 % was given.'],
  },
  {
    pattern: 'estimate.runs.#.current.thicknessM',
    US: [24, 'Thickness of the insulation on it must be under 19.68 in; 24 in was given.'],
    SI: [0, 'Thickness of the insulation on it must be more than 0 mm; 0 mm was given.'],
  },
  { pattern: 'estimate.runs.#.fittings.#.count', US: [2.5, 'Fittings must be a whole number.'], SI: [501, 'At most 500 fittings per run.'] },
  {
    pattern: 'estimate.areas.#.average.airTemperatureC',
    US: [-70, 'Usual air temperature must be at least −58 °F; −70 °F was given.'],
    SI: [61, 'Usual air temperature must be at most 60 °C; 61 °C was given.'],
  },
  {
    pattern: 'estimate.areas.#.average.relativeHumidityPercent',
    US: [120, 'Usual humidity must be at most 100 %; 120 % was given.'],
    SI: [0, 'Usual humidity must be at least 1 %; 0 % was given.'],
  },
  {
    pattern: 'estimate.areas.#.average.airSpeedMPerS',
    US: [100, 'Usual air speed must be at most 89.4 mph; 100 mph was given.'],
    SI: [-1, 'Usual air speed must be at least 0 m/s; −1 m/s was given.'],
  },
  {
    pattern: 'estimate.areas.#.design.hotAirTemperatureC',
    US: [150, 'Air on the hottest day must be at most 140 °F; 150 °F was given.'],
    SI: [-51, 'Air on the hottest day must be at least −50 °C; −51 °C was given.'],
  },
  {
    pattern: 'estimate.areas.#.design.wetAirTemperatureC',
    US: [-60, 'Air temperature at its dampest must be at least −58 °F; −60 °F was given.'],
    SI: [65, 'Air temperature at its dampest must be at most 60 °C; 65 °C was given.'],
  },
  {
    pattern: 'estimate.areas.#.design.wetRelativeHumidityPercent',
    US: [101, 'Humidity at its dampest must be at most 100 %; 101 % was given.'],
    SI: [0.5, 'Humidity at its dampest must be at least 1 %; 0.5 % was given.'],
  },
  {
    pattern: 'estimate.runs.#.proposed.thicknessM',
    US: [-1, 'Proposed thickness must be more than 0 in; −1 in was given.'],
    SI: [600, 'Proposed thickness must be under 500 mm; 600 mm was given.'],
  },
];

/** A draft that passes on its estimate, with the run set up so the field under test is asked. */
function draftWith(pattern: string, system: UnitSystem): DraftValues {
  const values = freshValues(system);
  values.plant = { plantName: 'Harrow Vale Creamery', plantType: 'creamery', countryCode: 'US', postalCode: '05401' };
  values.estimate.energy.price = 1.2;
  const run = values.estimate.runs[0];
  if (!run) throw new Error('A fresh draft has one run.');
  run.lengthM = 30;
  if (pattern.includes('fluidTemperatureC')) Object.assign(run, { service: 'hot-water', steamGaugePressureKPa: undefined, fluidTemperatureC: 60 });
  if (pattern.includes('.current.')) {
    run.current = { state: 'damaged', bareFraction: 0.5, material: 'mineral-wool', thicknessM: 0.025, jacket: 'all-service-jacket' };
  }
  if (pattern.endsWith('ambient.windSpeedMPerS')) run.ambient = { kind: 'outdoor' };
  if (pattern.endsWith('ambient.airSpeedMPerS')) run.ambient = { kind: 'indoor-draughty' };
  if (pattern.includes('.fittings.')) run.fittings = [{ type: 'valve-flanged', count: 2, covered: false }];
  if (pattern.startsWith('estimate.areas.')) {
    values.estimate.areas = [{ id: 'boiler-room', label: 'Boiler room', preset: 'boiler-room', average: {}, design: {} }];
    run.areaId = 'boiler-room';
  }
  return values;
}

/** Puts what was typed into the draft the way the box does: converted to SI from the shown unit. */
function typeInto(values: DraftValues, path: string, typed: number, system: UnitSystem): void {
  const field = formFieldAt(path);
  if (!field) throw new Error(`${path} is not a form field`);
  const stored = field.quantity ? displayUnit(field.quantity, system).toBase(typed) : typed;
  const keys = path.split('.');
  let node = values as unknown as Record<string, unknown>;
  for (const key of keys.slice(0, -1)) node = node[key] as Record<string, unknown>;
  node[keys[keys.length - 1] as string] = stored;
}

/** The message as a person reads it: no-break spaces and true minus signs written plainly for the table. */
const plain = (text: string | undefined) => text?.replaceAll(NB, ' ').replaceAll(MINUS, '−');

describe('every number field of the estimate form is refused in its own words and units', () => {
  it('the table covers every number field the form shows', () => {
    expect(rows.map((row) => row.pattern).sort()).toEqual(Object.keys(FORM_FIELDS).sort());
  });

  for (const row of rows) {
    for (const system of ['US', 'SI'] as const) {
      const [typed, says] = row[system];
      it(`${row.pattern} in ${system}: ${typed} → “${says}”`, () => {
        const path = row.pattern.replaceAll('#', '0');
        const values = draftWith(row.pattern, system);
        typeInto(values, path, typed, system);
        const errors = fieldErrorsOf(values);
        expect(plain(errors[path]?.message)).toBe(says);
        // Only the field typed in is refused (the contact step is still empty).
        expect(Object.keys(errors).filter((key) => key.startsWith('estimate'))).toEqual([path]);
      });
    }
  }

  it('a number and its unit never break apart in a message', () => {
    const values = draftWith('estimate.runs.#.lengthM', 'US');
    typeInto(values, 'estimate.runs.0.lengthM', -5, 'US');
    expect(fieldErrorsOf(values)['estimate.runs.0.lengthM']?.message).toContain(`${MINUS}5${NB}ft`);
  });

  it('a required field left empty says so with its label and unit', () => {
    const values = draftWith('estimate.runs.#.lengthM', 'US');
    values.estimate.runs[0]!.lengthM = undefined as unknown as number;
    expect(fieldErrorsOf(values)['estimate.runs.0.lengthM']?.message).toBe('Length is required (in ft).');
  });

  it('text typed where a number belongs names what was typed', () => {
    const values = draftWith('estimate.runs.#.lengthM', 'SI');
    values.estimate.runs[0]!.lengthM = 'ten' as unknown as number;
    expect(plain(fieldErrorsOf(values)['estimate.runs.0.lengthM']?.message)).toBe('Length must be a number in m; “ten” was given.');
  });

  /**
   * A proposed material that cannot take the line's temperature is refused on the material,
   * in the unit the form shows: flexible foam tube is rated −40 °C to 104 °C (−40 °F to
   * 219.2 °F, said as "up to 219 °F"), a line at 230 °F is 110 °C.
   */
  const ratings = [
    { system: 'US', service: 'hot-water', lineC: 110, says: 'Flexible foam tube is rated up to 219 °F; this line runs at 230 °F. Choose a material rated for the line’s temperature.' },
    { system: 'SI', service: 'hot-water', lineC: 110, says: 'Flexible foam tube is rated up to 104 °C; this line runs at 110 °C. Choose a material rated for the line’s temperature.' },
    { system: 'US', service: 'glycol', lineC: -45, says: 'Flexible foam tube is rated down to −40 °F; this line runs at −49 °F. Choose a material rated for the line’s temperature.' },
    { system: 'SI', service: 'glycol', lineC: -45, says: 'Flexible foam tube is rated down to −40 °C; this line runs at −45 °C. Choose a material rated for the line’s temperature.' },
  ] as const;
  for (const { system, service, lineC, says } of ratings) {
    it(`estimate.runs.#.proposed.material in ${system}: a ${service} line at ${lineC} °C under flexible foam → “${says}”`, () => {
      const values = draftWith('estimate.runs.#.fluidTemperatureC', system);
      Object.assign(values.estimate.runs[0]!, { service, fluidTemperatureC: lineC, proposed: { coverFittings: true, material: 'flexible-elastomeric' } });
      const errors = fieldErrorsOf(values);
      expect(plain(errors['estimate.runs.0.proposed.material']?.message)).toBe(says);
      expect(Object.keys(errors).filter((key) => key.startsWith('estimate'))).toEqual(['estimate.runs.0.proposed.material']);
    });
  }

  it('a server refusal (SI, with its range facts) is said again in the units the person typed in', () => {
    const values = draftWith('estimate.runs.#.steamGaugePressureKPa', 'US');
    const message = fieldMessage(
      {
        path: 'estimate.runs.0.steamGaugePressureKPa',
        message: 'Steam gauge pressure must be at most 16000 kPa; 34473.8 kPa was given.',
        params: { quantity: 'pressure', limit: 'max', limitSI: 16000, givenSI: 34473.8, exclusive: false, unitSI: 'kPa' },
      },
      fieldContextOf(values),
    );
    expect(plain(message)).toBe('Steam pressure on the gauge must be at most 2,320 psig; 5,000 psig was given.');
  });
});
