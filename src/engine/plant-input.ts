import { z } from 'zod';
import { findFuel, findInsulationMaterial } from './catalogue';
import { atmosphericPressureKPaAtAltitude } from './psychrometrics';
import { SATURATION_MIN_ABSOLUTE_PRESSURE_KPA, STEAM_MAX_ABSOLUTE_PRESSURE_KPA, saturationTemperatureC } from './steam-properties';
import { EMISSION_SOURCE_IDS, FUEL_IDS, FUEL_PRICE_UNITS } from './data/fuels';
import { INSULATION_MATERIAL_IDS } from './data/insulation-materials';
import { JACKET_IDS } from './data/surfaces';
import { cataloguePipeSchema, explicitPipeSchema, fluidTemperatureSchema, MAX_INSULATION_THICKNESS_M } from './run-input';
import { formatNumber, oneOf, quantity, text } from './schema-helpers';
import { SERVICE_IDS, serviceDefaults } from './services';

const confidence = (label: string) => oneOf(label, ['measured', 'estimated', 'guessed'] as const);

const thickness = (label: string) =>
  quantity(label, 'm', { min: 0, minExclusive: true, max: MAX_INSULATION_THICKNESS_M, maxExclusive: true });

/** Where a run sits: the form offers these three. */
export const ambientSchema = z.discriminatedUnion(
  'kind',
  [
    z.object({ kind: z.literal('indoor-still') }),
    z.object({
      kind: z.literal('indoor-draughty'),
      airSpeedMPerS: quantity('Draught air speed', 'm/s', { min: 0, max: 10 }).optional(),
    }),
    z.object({
      kind: z.literal('outdoor'),
      windSpeedMPerS: quantity('Wind speed', 'm/s', { min: 0, max: 40 }).optional(),
    }),
  ],
  { error: 'Ambient must be one of indoor-still, indoor-draughty or outdoor.' },
);

/** The run's insulation today. */
export const currentStateSchema = z.discriminatedUnion(
  'state',
  [
    z.object({ state: z.literal('bare') }),
    z.object({
      state: z.literal('damaged'),
      bareFraction: quantity('Damaged (bare) fraction', '', { min: 0, max: 1 }),
      bareFractionConfidence: confidence('Damaged fraction confidence').default('estimated'),
      material: oneOf('Existing insulation material', INSULATION_MATERIAL_IDS).default('mineral-wool'),
      thicknessM: thickness('Existing insulation thickness').default(0.025),
      jacket: oneOf('Existing jacket', JACKET_IDS).default('all-service-jacket'),
    }),
    z.object({
      state: z.literal('insulated'),
      material: oneOf('Existing insulation material', INSULATION_MATERIAL_IDS),
      thicknessM: thickness('Existing insulation thickness'),
      jacket: oneOf('Existing jacket', JACKET_IDS).default('all-service-jacket'),
    }),
  ],
  { error: 'Current state must be one of bare, damaged or insulated.' },
);

/** The insulation proposed for a run; anything left out is chosen by the engine. */
export const proposalSchema = z.object({
  material: oneOf('Proposed insulation material', INSULATION_MATERIAL_IDS).optional(),
  /** Left out: the economic thickness, raised where personnel protection or condensation control need more. */
  thicknessM: thickness('Proposed insulation thickness').optional(),
  jacket: oneOf('Proposed jacket', JACKET_IDS).optional(),
  coverFittings: z.boolean({ error: 'Cover fittings must be true or false.' }).default(true),
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
    operatingHoursPerYear: quantity('Operating hours', 'h/yr', { min: 0, max: 8784 }).optional(),
    steamGaugePressureKPa: quantity('Steam gauge pressure', 'kPa', { min: -101.325, max: 16000 }).optional(),
    fluidTemperatureC: fluidTemperatureSchema().optional(),
    velocityMPerS: quantity('Fluid velocity', 'm/s', { min: 0, max: 10 }).optional(),
    ambient: ambientSchema.default({ kind: 'indoor-still' }),
    orientation: oneOf('Orientation', ['horizontal', 'vertical'] as const).default('horizontal'),
    runHeightM: quantity('Height of a vertical run', 'm', { min: 0, minExclusive: true, max: 200 }).optional(),
    current: currentStateSchema.default({ state: 'bare' }),
    valves: z
      .number({ error: 'Valves must be a whole number.' })
      .int({ error: 'Valves must be a whole number.' })
      .min(0, { error: 'Valves cannot be negative.' })
      .max(500, { error: 'At most 500 valves per run.' })
      .default(0),
    flangePairs: z
      .number({ error: 'Flange pairs must be a whole number.' })
      .int({ error: 'Flange pairs must be a whole number.' })
      .min(0, { error: 'Flange pairs cannot be negative.' })
      .max(500, { error: 'At most 500 flange pairs per run.' })
      .default(0),
    fittingsInsulated: z.boolean({ error: 'Fittings insulated must be true or false.' }).default(false),
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

const priceTableSchema = z
  .object({
    label: text('Price table label', 120),
    pipeOuterDiametersM: z
      .array(quantity('Price table pipe diameter', 'm', { min: 0.003, max: 2.5 }))
      .min(1, { error: 'The price table needs at least one pipe diameter.' }),
    thicknessesM: z
      .array(thickness('Price table thickness'))
      .min(1, { error: 'The price table needs at least one thickness.' }),
    costPerMetre: z.array(z.array(quantity('Price per metre', '', { min: 0, max: 1e6 }))),
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
    /** Selects the stock thickness series (mm or inch) for the thickness searches. */
    unitSystem: oneOf('Unit system', ['SI', 'US'] as const).default('SI'),
    operatingHoursPerYear: quantity('Operating hours', 'h/yr', { min: 0, max: 8784 }).default(6000),
    operatingHoursConfidence: confidence('Operating hours confidence').default('estimated'),
    conditions: z
      .object({
        indoorAirTemperatureC: quantity('Indoor air temperature', '°C', { min: -20, max: 50 }).default(20),
        indoorRelativeHumidityPercent: quantity('Indoor relative humidity', '%', { min: 1, max: 100 }).default(60),
        outdoorAirTemperatureC: quantity('Outdoor air temperature', '°C', { min: -50, max: 50 }).default(10),
        outdoorRelativeHumidityPercent: quantity('Outdoor relative humidity', '%', { min: 1, max: 100 }).default(75),
        outdoorWindSpeedMPerS: quantity('Outdoor wind speed', 'm/s', { min: 0, max: 40 }).default(3),
        draughtyAirSpeedMPerS: quantity('Draught air speed', 'm/s', { min: 0, max: 10 }).default(1),
        altitudeM: quantity('Altitude', 'm', { min: -500, max: 5000 }).default(0),
      })
      .prefault({}),
    energy: z
      .object({
        fuel: oneOf('Fuel', FUEL_IDS).default('natural-gas'),
        price: quantity('Fuel price', '', { min: 0, minExclusive: true, max: 1e6 }),
        priceUnit: oneOf('Fuel price unit', FUEL_PRICE_UNITS).optional(),
        priceConfidence: confidence('Fuel price confidence').default('measured'),
        currency: z.string().trim().min(1).max(8).default('USD'),
        boilerEfficiency: quantity('Boiler efficiency', '', { min: 0.3, max: 1 }).optional(),
        boilerEfficiencyConfidence: confidence('Boiler efficiency confidence').default('estimated'),
        emissionFactorSource: oneOf('Emission factor source', EMISSION_SOURCE_IDS).optional(),
        /** For the chillers that absorb heat gained by cold lines. */
        electricityPricePerKWh: quantity('Electricity price', 'per kWh', { min: 0, max: 100 }).optional(),
        chillerCoefficientOfPerformance: quantity('Chiller COP', '', { min: 0.5, max: 10 }).default(3),
      }),
    economics: z
      .object({
        horizonYears: quantity('Life-cycle horizon', 'years', { min: 1, max: 50 }).default(10),
        discountRatePercent: quantity('Discount rate', '%', { min: 0, max: 30 }).default(5),
        fuelEscalationPercent: quantity('Fuel price escalation', '%', { min: -10, max: 30 }).default(2),
        touchLimitC: quantity('Touch limit', '°C', { min: 30, max: 100 }).default(60),
        condensationMarginK: quantity('Condensation margin', 'K', { min: 0, max: 10 }).default(1),
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
    const ids = new Set<string>();
    plant.runs.forEach((run, index) => {
      if (ids.has(run.id)) {
        ctx.addIssue({ code: 'custom', path: ['runs', index, 'id'], message: `Run id "${run.id}" is used twice; each run needs its own id.` });
      }
      ids.add(run.id);
      const service = serviceDefaults(run.service);
      let lineC = run.fluidTemperatureC ?? service.typicalTemperatureC;
      if (service.kind === 'steam') {
        const absolute = (run.steamGaugePressureKPa ?? (service.typicalGaugePressureKPa as number)) + atmosphere;
        if (absolute < SATURATION_MIN_ABSOLUTE_PRESSURE_KPA || absolute > STEAM_MAX_ABSOLUTE_PRESSURE_KPA) {
          ctx.addIssue({
            code: 'custom',
            path: ['runs', index, 'steamGaugePressureKPa'],
            message: `Steam pressure must give an absolute pressure between ${formatNumber(SATURATION_MIN_ABSOLUTE_PRESSURE_KPA)} kPa and ${Math.round(STEAM_MAX_ABSOLUTE_PRESSURE_KPA)} kPa; ${formatNumber(absolute)} kPa absolute was given.`,
          });
          return;
        }
        lineC = saturationTemperatureC(absolute);
      }
      const proposedId = run.proposed.material ?? service.defaultInsulation;
      const material = findInsulationMaterial(proposedId);
      if (material && (lineC > material.serviceMaxC || lineC < material.serviceMinC)) {
        ctx.addIssue({
          code: 'custom',
          path: ['runs', index, 'proposed', 'material'],
          message: `${material.name} is rated for ${material.serviceMinC} °C to ${material.serviceMaxC} °C; run "${run.label}" runs at ${formatNumber(Math.round(lineC))} °C. Propose a material rated for the line temperature.`,
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
