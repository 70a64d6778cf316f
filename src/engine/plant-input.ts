import { z } from 'zod';
import { findFuel, findInsulationMaterial } from './catalogue';
import { atmosphericPressureKPaAtAltitude } from './psychrometrics';
import { SATURATION_MIN_ABSOLUTE_PRESSURE_KPA, STEAM_MAX_ABSOLUTE_PRESSURE_KPA, saturationTemperatureC } from './steam-properties';
import { EMISSION_SOURCE_IDS, FUEL_IDS, FUEL_PRICE_UNITS } from './data/fuels';
import { INSULATION_MATERIAL_IDS } from './data/insulation-materials';
import { AREA_PRESET_IDS } from './data/areas';
import { FITTING_TYPE_IDS } from './data/fittings';
import { EXISTING_LAGGING_DEFAULTS, PLANT_INPUT_DEFAULTS } from './input-defaults';
import { MARKET_IDS } from './data/markets';
import { LAGGING_CONDITION_IDS } from './data/lagging-condition';
import { BARE_FINISH_IDS, JACKET_IDS } from './data/surfaces';
import { HOURS_PER_YEAR } from './physical-constants';
import {
  cataloguePipeSchema,
  explicitPipeSchema,
  fluidTemperatureSchema,
  MAX_FLUID_TEMPERATURE_C,
  MAX_INSULATION_THICKNESS_M,
  MIN_FLUID_TEMPERATURE_C,
} from './run-input';
import { formatNumber, oneOf, quantity, ratingIssueParams, text, type RangeIssueParams } from './schema-helpers';
import { SERVICE_IDS, serviceDefaults } from './services';

const confidence = (label: string) => oneOf(label, ['measured', 'estimated', 'guessed'] as const);

/** Hours in a year: a common year's 8 760 h (a leap year's 8 784 h adds 0.3 %, well inside any estimate). */
const operatingHours = (label: string) =>
  quantity(label, 'h/yr', {
    min: 0,
    max: HOURS_PER_YEAR,
    hint: 'A year has 8760 hours (a leap year 8784); running all year round is 8760.',
  });

const count = (label: string, max: number) =>
  z
    .number({ error: `${label} must be a whole number.` })
    .int({ error: `${label} must be a whole number.` })
    .min(0, { error: `${label} cannot be negative.` })
    .max(max, { error: `At most ${max} ${label.toLowerCase()} per run.` });

const thickness = (label: string) =>
  quantity(label, 'm', { min: 0, minExclusive: true, max: MAX_INSULATION_THICKNESS_M, maxExclusive: true });

/** Where a run sits: the form offers these three. */
export const ambientSchema = z.discriminatedUnion(
  'kind',
  [
    z.object({ kind: z.literal('indoor-still') }),
    z.object({
      kind: z.literal('indoor-draughty'),
      airSpeedMPerS: quantity('Draft air speed', 'm/s', { min: 0, max: 10 }).optional(),
    }),
    z.object({
      kind: z.literal('outdoor'),
      windSpeedMPerS: quantity('Wind speed', 'm/s', { min: 0, max: 40 }).optional(),
    }),
  ],
  { error: 'Ambient must be one of indoor-still, indoor-draughty or outdoor.' },
);

/** How the lagging in place looks (see data/lagging-condition): sound, wet through or crushed. */
const laggingCondition = oneOf('Condition of the existing insulation', LAGGING_CONDITION_IDS).default('sound');

/** The run's insulation today. */
export const currentStateSchema = z.discriminatedUnion(
  'state',
  [
    z.object({ state: z.literal('bare') }),
    z.object({
      state: z.literal('damaged'),
      bareFraction: quantity('Damaged (bare) fraction', '', { min: 0, max: 1 }),
      bareFractionConfidence: confidence('Damaged fraction confidence').default('estimated'),
      material: oneOf('Existing insulation material', INSULATION_MATERIAL_IDS).default(EXISTING_LAGGING_DEFAULTS.material),
      thicknessM: thickness('Existing insulation thickness').default(EXISTING_LAGGING_DEFAULTS.thicknessM),
      jacket: oneOf('Existing jacket', JACKET_IDS).default(EXISTING_LAGGING_DEFAULTS.jacket),
      condition: laggingCondition,
    }),
    z.object({
      state: z.literal('insulated'),
      material: oneOf('Existing insulation material', INSULATION_MATERIAL_IDS),
      thicknessM: thickness('Existing insulation thickness'),
      jacket: oneOf('Existing jacket', JACKET_IDS).default(EXISTING_LAGGING_DEFAULTS.jacket),
      condition: laggingCondition,
    }),
  ],
  { error: 'Current state must be one of bare, damaged or insulated.' },
);

/** The kinds of action weighed for each run. */
export const OPTION_KINDS = ['leave', 'repair', 'insulate', 'add-layer', 'replace'] as const;
export type OptionKind = (typeof OPTION_KINDS)[number];

/**
 * A typed installed price for one run, overriding the price table (a consultant's quote).
 * Give a price per meter of pipe (and per fitting cover), or a lump sum for the whole job.
 */
export const runPriceSchema = z
  .object({
    /** Installed price per meter of pipe insulated, in the plant's currency. */
    perMetre: quantity('Installed price per meter', '', { min: 0, max: 1e6, kind: 'money' }).optional(),
    /** Price of one removable fitting cover. */
    coverEach: quantity('Price of one fitting cover', '', { min: 0, max: 1e6, kind: 'money' }).optional(),
    /** The whole job on this run, in place of the per-metre figures. */
    lumpSum: quantity('Installed price of the job', '', { min: 0, max: 1e8, kind: 'money' }).optional(),
  })
  .superRefine((price, ctx) => {
    if (price.lumpSum !== undefined && (price.perMetre !== undefined || price.coverEach !== undefined)) {
      ctx.addIssue({ code: 'custom', path: ['lumpSum'], message: 'Give either a lump sum or prices per meter and per cover, not both.' });
    }
  });

/** The insulation proposed for a run; anything left out is chosen by the engine. */
export const proposalSchema = z.object({
  /**
   * Force the action taken on the run (a consultant's choice); the engine still reports the
   * other options beside it. Left out: the option with the least life-cycle cost that meets
   * the safety needs.
   */
  option: oneOf('Chosen option', OPTION_KINDS).optional(),
  material: oneOf('Proposed insulation material', INSULATION_MATERIAL_IDS).optional(),
  /** Left out: the economic thickness, raised where personnel protection or condensation control need more. */
  thicknessM: thickness('Proposed insulation thickness').optional(),
  jacket: oneOf('Proposed jacket', JACKET_IDS).optional(),
  coverFittings: z.boolean({ error: 'Cover fittings must be true or false.' }).default(true),
  /** A typed price for this run, overriding the price table. */
  price: runPriceSchema.optional(),
});

/** One kind of fitting on a run, at the run's own pipe size. */
export const fittingInputSchema = z.object({
  type: oneOf('Fitting type', FITTING_TYPE_IDS),
  count: count('Fittings', 500).refine((n) => n > 0, { error: 'Give at least one fitting of each kind listed.' }),
  /** Already under a removable insulated cover today. */
  covered: z.boolean({ error: 'Covered must be true or false.' }).default(false),
});

/**
 * Site measurements of one run (a consultant's walk-round or an owner's thermometer). A
 * measured bare surface temperature with the measured air gives the loss per meter directly;
 * on an insulated run, measured ÷ modeled loss becomes the insulation's condition factor
 * where the surface is more than 10 K from the air.
 */
export const measurementsSchema = z
  .object({
    /** Outer surface temperature read on the run, °C. */
    surfaceTemperatureC: quantity('Measured surface temperature', '°C', { min: -60, max: 400 }).optional(),
    /** How it was read: a contact probe, or an infrared thermometer (give the emittance it was set to). */
    surfaceMethod: oneOf('Surface reading method', ['contact', 'infrared'] as const).default('contact'),
    /** The emittance set on the infrared thermometer when reading; the reading is corrected to the surface's own. */
    infraredEmittanceSetting: quantity('Infrared emittance setting', '', { min: 0.1, max: 1, kind: 'fraction' }).optional(),
    /** Air beside the run at the time of the reading, °C. */
    airTemperatureC: quantity('Measured air temperature', '°C', { min: -50, max: 60 }).optional(),
    relativeHumidityPercent: quantity('Measured relative humidity', '%', { min: 1, max: 100 }).optional(),
    airSpeedMPerS: quantity('Measured air speed', 'm/s', { min: 0, max: 40 }).optional(),
    /** Length measured on site, m; replaces the run's length and counts as measured. */
    lengthM: quantity('Measured length', 'm', { min: 0, minExclusive: true, max: 10000 }).optional(),
    /** When the readings were taken (ISO 8601). */
    takenAt: z.string().max(40).optional(),
    note: z.string().max(500).optional(),
  })
  .superRefine((m, ctx) => {
    if (m.surfaceTemperatureC !== undefined && m.airTemperatureC === undefined) {
      ctx.addIssue({
        code: 'custom',
        path: ['airTemperatureC'],
        message: 'A measured surface temperature needs the air temperature measured beside it at the same time.',
      });
    }
    if (m.surfaceMethod === 'infrared' && m.surfaceTemperatureC !== undefined && m.infraredEmittanceSetting === undefined) {
      ctx.addIssue({
        code: 'custom',
        path: ['infraredEmittanceSetting'],
        message: 'Give the emittance the infrared thermometer was set to (often 0.95), so the reading can be corrected to the surface.',
      });
    }
  });

export const plantRunSchema = z
  .object({
    id: text('Run id', 64),
    label: text('Run label', 120),
    service: oneOf('Service', SERVICE_IDS),
    pipe: z.union([explicitPipeSchema, cataloguePipeSchema], {
      error:
        'Describe the pipe either by outerDiameterM, wallThicknessM and conductivityWPerMK, or by standard, size (and schedule, material).',
    }),
    lengthM: quantity('Run length', 'm', { min: 0, minExclusive: true, max: 10000 }),
    lengthConfidence: confidence('Length confidence').default('estimated'),
    operatingHoursPerYear: operatingHours('Operating hours').optional(),
    steamGaugePressureKPa: quantity('Steam gauge pressure', 'kPa', { min: -101.325, max: 16000 }).optional(),
    fluidTemperatureC: fluidTemperatureSchema().optional(),
    velocityMPerS: quantity('Fluid velocity', 'm/s', { min: 0, max: 10 }).optional(),
    /** Gauge pressure of a liquid line, kPa; only used to tell whether hot water could be boiling. */
    liquidGaugePressureKPa: quantity('Line pressure', 'kPa', { min: -100, max: 5000 }).optional(),
    /** What the bare pipe looks like (sets its emittance); by default the pipe material's usual finish. */
    finish: oneOf('Bare pipe finish', BARE_FINISH_IDS).optional(),
    /** The plant area the run sits in (see the plant's `areas`); without it, `ambient` and the plant's `conditions` apply. */
    areaId: z.string().trim().min(1).max(64).optional(),
    ambient: ambientSchema.default({ kind: 'indoor-still' }),
    orientation: oneOf('Orientation', ['horizontal', 'vertical'] as const).default('horizontal'),
    runHeightM: quantity('Height of a vertical run', 'm', { min: 0, minExclusive: true, max: 200 }).optional(),
    current: currentStateSchema.default({ state: 'bare' }),
    /** Flanged valves (older form of `fittings`: counted as `valve-flanged`). */
    valves: count('Valves', 500).default(0),
    /** Flange pairs (older form of `fittings`: counted as `flange-pair`). */
    flangePairs: count('Flange pairs', 500).default(0),
    /** Whether the `valves` and `flangePairs` are already under covers. */
    fittingsInsulated: z.boolean({ error: 'Fittings insulated must be true or false.' }).default(false),
    /** Fittings by type at the run's size, each with whether it is covered today. */
    fittings: z.array(fittingInputSchema, { error: 'Fittings must be a list.' }).max(20).default([]),
    /** Site readings that sharpen the estimate (see {@link measurementsSchema}). */
    measurements: measurementsSchema.optional(),
    proposed: proposalSchema.prefault({}),
  })
  .superRefine((run, ctx) => {
    const service = serviceDefaults(run.service);
    if (service.kind === 'steam' && run.fluidTemperatureC !== undefined) {
      ctx.addIssue({
        code: 'custom',
        path: ['fluidTemperatureC'],
        message: 'A steam run is described by its gauge pressure, not a fluid temperature.',
      });
    }
    if (service.kind === 'liquid' && run.steamGaugePressureKPa !== undefined) {
      ctx.addIssue({
        code: 'custom',
        path: ['steamGaugePressureKPa'],
        message: `A ${service.name.toLowerCase()} run is described by its fluid temperature, not a steam pressure.`,
      });
    }
  });

/** The year's average air of an area (energy is figured on it). */
export const areaAverageSchema = z.object({
  airTemperatureC: quantity('Average air temperature', '°C', { min: -50, max: 60 }).optional(),
  relativeHumidityPercent: quantity('Average relative humidity', '%', { min: 1, max: 100 }).optional(),
  airSpeedMPerS: quantity('Average air speed', 'm/s', { min: 0, max: 40 }).optional(),
});

/** The design air of an area: the hot still hour (burns) and the wettest hour (sweating). */
export const areaDesignSchema = z.object({
  hotAirTemperatureC: quantity('Hottest air temperature', '°C', { min: -50, max: 60 }).optional(),
  wetAirTemperatureC: quantity('Air temperature in the wettest hour', '°C', { min: -50, max: 60 }).optional(),
  wetRelativeHumidityPercent: quantity('Relative humidity in the wettest hour', '%', { min: 1, max: 100 }).optional(),
});

/**
 * One area of the plant with its own air: a preset (boiler room, washdown room, cold store,
 * outdoors…) fills what is left out. Energy uses the averages; burn and sweat checks use the
 * design air, never milder than the average.
 */
export const areaSchema = z.object({
  id: text('Area id', 64),
  label: text('Area name', 120),
  preset: oneOf('Kind of area', AREA_PRESET_IDS).default('process-room'),
  average: areaAverageSchema.prefault({}),
  design: areaDesignSchema.prefault({}),
  /** How well the air figures are known; typical values the user never changed count as guessed. */
  confidence: confidence('Area conditions confidence').default('guessed'),
});

/** A price table of installed costs in place of the demo one (a consultant's own prices). */
export const priceTableSchema = z
  .object({
    label: text('Price table label', 120),
    pipeOuterDiametersM: z
      .array(quantity('Price table pipe diameter', 'm', { min: 0.003, max: 2.5 }))
      .min(1, { error: 'The price table needs at least one pipe diameter.' }),
    thicknessesM: z
      .array(thickness('Price table thickness'))
      .min(1, { error: 'The price table needs at least one thickness.' }),
    costPerMetre: z.array(z.array(quantity('Price per meter', '', { min: 0, max: 1e6 }))),
    fittingCoverCostEach: z.array(quantity('Fitting cover price', '', { min: 0, max: 1e6 })),
  })
  .superRefine((table, ctx) => {
    const ascending = (values: readonly number[]) => values.every((v, i) => i === 0 || v > (values[i - 1] as number));
    if (!ascending(table.pipeOuterDiametersM)) {
      ctx.addIssue({ code: 'custom', path: ['pipeOuterDiametersM'], message: 'Price table diameters must rise from row to row.' });
    }
    if (!ascending(table.thicknessesM)) {
      ctx.addIssue({ code: 'custom', path: ['thicknessesM'], message: 'Price table thicknesses must rise from column to column.' });
    }
    if (
      table.costPerMetre.length !== table.pipeOuterDiametersM.length ||
      table.costPerMetre.some((row) => row.length !== table.thicknessesM.length)
    ) {
      ctx.addIssue({
        code: 'custom',
        path: ['costPerMetre'],
        message: `The price table needs one row per diameter (${table.pipeOuterDiametersM.length}) and one price per thickness (${table.thicknessesM.length}) in each row.`,
      });
    }
    if (table.fittingCoverCostEach.length !== table.pipeOuterDiametersM.length) {
      ctx.addIssue({
        code: 'custom',
        path: ['fittingCoverCostEach'],
        message: `The price table needs one fitting-cover price per diameter (${table.pipeOuterDiametersM.length}).`,
      });
    }
  });

/**
 * Input of a plant estimate, JSON as the web form posts it. Trade-usual values are
 * defaults; the fuel price has none and must be given.
 */
export const plantInputSchema = z
  .object({
    label: z.string().max(200).optional(),
    /**
     * Display units of the form that sent it. Not used for any figure; kept so older requests
     * parse. Without `market`, an older request's `US` still means the inch stock series.
     * @deprecated send `market`
     */
    unitSystem: oneOf('Unit system', ['SI', 'US'] as const).default('SI'),
    /**
     * The market the plant buys insulation in (from its country, see `marketForCountry`): it
     * picks the stock thickness series (inch per ASTM C585, or mm). Display units never do.
     */
    market: oneOf('Market', MARKET_IDS).optional(),
    operatingHoursPerYear: operatingHours('Operating hours').default(PLANT_INPUT_DEFAULTS.operatingHoursPerYear),
    /** Pre-filled hours the user never changed count as guessed. */
    operatingHoursConfidence: confidence('Operating hours confidence').default('guessed'),
    conditions: z
      .object({
        indoorAirTemperatureC: quantity('Indoor air temperature', '°C', { min: -20, max: 50 }).default(PLANT_INPUT_DEFAULTS.conditions.indoorAirTemperatureC),
        indoorRelativeHumidityPercent: quantity('Indoor relative humidity', '%', { min: 1, max: 100 }).default(PLANT_INPUT_DEFAULTS.conditions.indoorRelativeHumidityPercent),
        outdoorAirTemperatureC: quantity('Outdoor air temperature', '°C', { min: -50, max: 50 }).default(PLANT_INPUT_DEFAULTS.conditions.outdoorAirTemperatureC),
        outdoorRelativeHumidityPercent: quantity('Outdoor relative humidity', '%', { min: 1, max: 100 }).default(PLANT_INPUT_DEFAULTS.conditions.outdoorRelativeHumidityPercent),
        outdoorWindSpeedMPerS: quantity('Outdoor wind speed', 'm/s', { min: 0, max: 40 }).default(PLANT_INPUT_DEFAULTS.conditions.outdoorWindSpeedMPerS),
        draughtyAirSpeedMPerS: quantity('Draft air speed', 'm/s', { min: 0, max: 10 }).default(PLANT_INPUT_DEFAULTS.conditions.draughtyAirSpeedMPerS),
        altitudeM: quantity('Altitude', 'm', { min: -500, max: 5000 }).default(PLANT_INPUT_DEFAULTS.conditions.altitudeM),
        /** Design air of the plant-wide rooms (used by runs without an area); never milder than the averages. */
        design: z
          .object({
            indoorHotAirTemperatureC: quantity('Hottest indoor air temperature', '°C', { min: -20, max: 60 }).optional(),
            outdoorHotAirTemperatureC: quantity('Hottest outdoor air temperature', '°C', { min: -50, max: 60 }).optional(),
            indoorWetRelativeHumidityPercent: quantity('Indoor relative humidity in the wettest hour', '%', { min: 1, max: 100 }).optional(),
            outdoorWetAirTemperatureC: quantity('Outdoor air temperature in the wettest hour', '°C', { min: -50, max: 60 }).optional(),
            outdoorWetRelativeHumidityPercent: quantity('Outdoor relative humidity in the wettest hour', '%', { min: 1, max: 100 }).optional(),
          })
          .prefault({}),
        /** How well these air figures are known; pre-filled values count as guessed. */
        confidence: confidence('Conditions confidence').default('guessed'),
      })
      .prefault({}),
    /** Areas of the plant with their own air; runs name theirs by `areaId`. */
    areas: z.array(areaSchema, { error: 'Areas must be a list.' }).max(30, { error: 'At most 30 areas per plant.' }).default([]),
    energy: z
      .object({
        fuel: oneOf('Fuel', FUEL_IDS).default('natural-gas'),
        price: quantity('Fuel price', '', { min: 0, minExclusive: true, max: 1e6 }),
        priceUnit: oneOf('Fuel price unit', FUEL_PRICE_UNITS).optional(),
        priceConfidence: confidence('Fuel price confidence').default('measured'),
        currency: z.string().trim().min(1).max(8).default(PLANT_INPUT_DEFAULTS.currency),
        boilerEfficiency: quantity('Boiler efficiency', '', { min: 0.3, max: 1 }).optional(),
        /** Left out: estimated when an efficiency is given, guessed when the fuel's default is used. */
        boilerEfficiencyConfidence: confidence('Boiler efficiency confidence').optional(),
        emissionFactorSource: oneOf('Emission factor source', EMISSION_SOURCE_IDS).optional(),
        /** For the chillers that absorb heat gained by cold lines. */
        electricityPricePerKWh: quantity('Electricity price', 'per kWh', { min: 0, max: 100 }).optional(),
        chillerCoefficientOfPerformance: quantity('Chiller COP', '', { min: 0.5, max: 10 }).default(3),
      }),
    economics: z
      .object({
        horizonYears: quantity('Life-cycle horizon', 'years', { min: 1, max: 50 }).default(PLANT_INPUT_DEFAULTS.economics.horizonYears),
        discountRatePercent: quantity('Discount rate', '%', { min: 0, max: 30 }).default(PLANT_INPUT_DEFAULTS.economics.discountRatePercent),
        fuelEscalationPercent: quantity('Fuel price escalation', '%', { min: -10, max: 30 }).default(PLANT_INPUT_DEFAULTS.economics.fuelEscalationPercent),
        touchLimitC: quantity('Touch limit', '°C', { min: 30, max: 100 }).default(PLANT_INPUT_DEFAULTS.economics.touchLimitC),
        condensationMarginK: quantity('Condensation margin', 'K', { min: 0, max: 10 }).default(PLANT_INPUT_DEFAULTS.economics.condensationMarginK),
      })
      .prefault({}),
    range: z
      .object({
        samples: z
          .number({ error: 'Range samples must be a whole number.' })
          .int({ error: 'Range samples must be a whole number.' })
          .min(50, { error: 'Range samples must be at least 50.' })
          .max(5000, { error: 'Range samples must be at most 5000.' })
          .default(400),
        seed: z.number({ error: 'Range seed must be a whole number.' }).int().min(0).max(4294967295).default(20240601),
      })
      .prefault({}),
    priceTable: priceTableSchema.optional(),
    runs: z
      .array(plantRunSchema, { error: 'Runs must be a list.' })
      .min(1, { error: 'Add at least one pipe run.' })
      .max(500, { error: 'At most 500 pipe runs per assessment.' }),
  })
  .superRefine((plant, ctx) => {
    const fuel = findFuel(plant.energy.fuel);
    if (!fuel) return;
    const unit = plant.energy.priceUnit ?? fuel.defaultPriceUnit;
    if (!fuel.priceUnits.includes(unit)) {
      ctx.addIssue({
        code: 'custom',
        path: ['energy', 'priceUnit'],
        message: `${fuel.name} cannot be priced per ${unit}; use one of ${fuel.priceUnits.join(', ')}.`,
      });
    }
    const source = plant.energy.emissionFactorSource;
    if (source !== undefined && !fuel.emissionFactors.some((f) => f.source === source)) {
      ctx.addIssue({
        code: 'custom',
        path: ['energy', 'emissionFactorSource'],
        message: `${source} gives no emission factor for ${fuel.name}; choose ${fuel.emissionFactors.map((f) => f.source).join(' or ')}.`,
      });
    }
    const atmosphere = atmosphericPressureKPaAtAltitude(plant.conditions.altitudeM);
    const areaIds = new Set<string>();
    plant.areas.forEach((area, index) => {
      if (areaIds.has(area.id)) {
        ctx.addIssue({ code: 'custom', path: ['areas', index, 'id'], message: `Area id "${area.id}" is used twice; each area needs its own id.` });
      }
      areaIds.add(area.id);
    });
    const ids = new Set<string>();
    plant.runs.forEach((run, index) => {
      if (ids.has(run.id)) {
        ctx.addIssue({ code: 'custom', path: ['runs', index, 'id'], message: `Run id "${run.id}" is used twice; each run needs its own id.` });
      }
      ids.add(run.id);
      if (run.areaId !== undefined && !areaIds.has(run.areaId)) {
        ctx.addIssue({
          code: 'custom',
          path: ['runs', index, 'areaId'],
          message: `Run "${run.label}" sits in area "${run.areaId}", which the plant does not list; add the area or choose one of ${[...areaIds].join(', ') || 'none yet'}.`,
        });
      }
      const service = serviceDefaults(run.service);
      let lineC = run.fluidTemperatureC ?? service.typicalTemperatureC;
      // An altitude out of range is refused on its own field; no pressure can be read from it.
      if (service.kind === 'steam' && !Number.isFinite(atmosphere)) return;
      if (service.kind === 'steam') {
        const absolute = (run.steamGaugePressureKPa ?? (service.typicalGaugePressureKPa as number)) + atmosphere;
        if (absolute < SATURATION_MIN_ABSOLUTE_PRESSURE_KPA || absolute > STEAM_MAX_ABSOLUTE_PRESSURE_KPA) {
          const low = absolute < SATURATION_MIN_ABSOLUTE_PRESSURE_KPA;
          ctx.addIssue({
            code: 'custom',
            path: ['runs', index, 'steamGaugePressureKPa'],
            message: `Steam pressure must give an absolute pressure between ${formatNumber(SATURATION_MIN_ABSOLUTE_PRESSURE_KPA)} kPa and ${Math.round(STEAM_MAX_ABSOLUTE_PRESSURE_KPA)} kPa; ${formatNumber(absolute)} kPa absolute was given.`,
            // As a gauge reading at the plant's altitude, the way the field is typed.
            params: {
              quantity: 'pressure',
              limit: low ? 'min' : 'max',
              limitSI: (low ? SATURATION_MIN_ABSOLUTE_PRESSURE_KPA : STEAM_MAX_ABSOLUTE_PRESSURE_KPA) - atmosphere,
              givenSI: absolute - atmosphere,
              exclusive: false,
              unitSI: 'kPa',
            } satisfies RangeIssueParams,
          });
          return;
        }
        lineC = saturationTemperatureC(absolute);
      }
      // A line temperature out of the engine's range is refused on its own field; no material is weighed against it.
      if (lineC < MIN_FLUID_TEMPERATURE_C || lineC > MAX_FLUID_TEMPERATURE_C) return;
      const proposedId = run.proposed.material ?? service.defaultInsulation;
      const material = findInsulationMaterial(proposedId);
      if (material && (lineC > material.serviceMaxC || lineC < material.serviceMinC)) {
        ctx.addIssue({
          code: 'custom',
          path: ['runs', index, 'proposed', 'material'],
          message: `${material.name} is rated for ${material.serviceMinC} °C to ${material.serviceMaxC} °C; run "${run.label}" runs at ${formatNumber(Math.round(lineC))} °C. Propose a material rated for the line temperature.`,
          // The rating crossed and the line's temperature, so a form can say it in the units it shows.
          params: ratingIssueParams(material, lineC),
        });
      }
    });
  });

/** What the form posts. */
export type PlantInput = z.input<typeof plantInputSchema>;
/** A plant after parsing, defaults filled in. */
export type ParsedPlantInput = z.output<typeof plantInputSchema>;
/** One run as the form posts it. */
export type PlantRunInput = z.input<typeof plantRunSchema>;
export type ParsedPlantRun = z.output<typeof plantRunSchema>;
