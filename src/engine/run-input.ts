import { z } from 'zod';
import { findInsulationMaterial, findPipeMaterial, findPipeStandard, findPipeSize, lookupPipe } from './catalogue';
import { INSULATION_MATERIAL_IDS } from './data/insulation-materials';
import { PIPE_MATERIAL_IDS } from './data/pipe-materials';
import { PIPE_STANDARD_IDS } from './data/pipe-dimensions';
import { SURFACE_IDS } from './data/surfaces';
import { isEngineError } from './errors';
import { formatNumber, oneOf, quantity, ratingIssueParams, type RangeIssueParams } from './schema-helpers';
import {
  SATURATION_MIN_ABSOLUTE_PRESSURE_KPA,
  STEAM_MAX_ABSOLUTE_PRESSURE_KPA,
  saturationTemperatureC,
} from './steam-properties';
import { STANDARD_ATMOSPHERE_KPA } from './physical-constants';

/** Largest thickness of one layer, and of all layers together, m. */
export const MAX_INSULATION_THICKNESS_M = 0.5;
/** Fluid temperatures the engine covers, °C. */
export const MIN_FLUID_TEMPERATURE_C = -100;
export const MAX_FLUID_TEMPERATURE_C = 650;

/** A fluid temperature: refuses absolute zero and below with its own sentence. */
export function fluidTemperatureSchema(label = 'Fluid temperature') {
  return z
    .number({
      error: (issue) => (issue.input === undefined ? `${label} is required.` : `${label} must be a number in °C.`),
    })
    .superRefine((value, ctx) => {
      if (value <= -273.15) {
        ctx.addIssue({
          code: 'custom',
          message: `${label} cannot be at or below absolute zero (−273.15 °C); ${formatNumber(value)} °C was given.`,
          params: { quantity: 'temperature', limit: 'min', limitSI: MIN_FLUID_TEMPERATURE_C, givenSI: value, exclusive: false, unitSI: '°C' } satisfies RangeIssueParams,
        });
      } else if (value < MIN_FLUID_TEMPERATURE_C || value > MAX_FLUID_TEMPERATURE_C) {
        const low = value < MIN_FLUID_TEMPERATURE_C;
        ctx.addIssue({
          code: 'custom',
          message: `${label} must be between ${MIN_FLUID_TEMPERATURE_C} °C and ${MAX_FLUID_TEMPERATURE_C} °C for this estimate; ${formatNumber(value)} °C was given.`,
          params: {
            quantity: 'temperature',
            limit: low ? 'min' : 'max',
            limitSI: low ? MIN_FLUID_TEMPERATURE_C : MAX_FLUID_TEMPERATURE_C,
            givenSI: value,
            exclusive: false,
            unitSI: '°C',
          } satisfies RangeIssueParams,
        });
      }
    });
}

export const explicitPipeSchema = z
  .object({
    outerDiameterM: quantity('Pipe outside diameter', 'm', { min: 0.003, max: 2.5 }),
    wallThicknessM: quantity('Pipe wall thickness', 'm', { min: 0, max: 0.2 }),
    conductivityWPerMK: quantity('Pipe wall conductivity', 'W/(m·K)', { min: 0.1, max: 1000 }),
  })
  .superRefine((pipe, ctx) => {
    if (pipe.wallThicknessM >= pipe.outerDiameterM / 2) {
      ctx.addIssue({
        code: 'custom',
        path: ['wallThicknessM'],
        message: `Pipe wall thickness must be less than half the outside diameter (${formatNumber(pipe.outerDiameterM / 2)} m); ${formatNumber(pipe.wallThicknessM)} m was given.`,
      });
    }
  });

export const cataloguePipeSchema = z
  .object({
    standard: z.string({ error: 'Pipe standard must be text, e.g. "ASME-B36.10M".' }),
    size: z.string({ error: 'Pipe size must be text, e.g. "2" or "1-1/2" or "DN50".' }),
    schedule: z.string({ error: 'Pipe schedule must be text, e.g. "40".' }).optional(),
    material: z.string({ error: 'Pipe material must be text, e.g. "carbon-steel".' }).optional(),
  })
  .superRefine((pipe, ctx) => {
    const standard = findPipeStandard(pipe.standard);
    if (!standard) {
      ctx.addIssue({
        code: 'custom',
        path: ['standard'],
        message: `Pipe standard must be one of ${PIPE_STANDARD_IDS.join(', ')}; "${pipe.standard}" was given.`,
      });
      return;
    }
    if (!findPipeSize(standard, pipe.size)) {
      ctx.addIssue({
        code: 'custom',
        path: ['size'],
        message: `${standard.name} has no size "${pipe.size}"; sizes run from ${standard.sizes[0]?.size} to ${standard.sizes[standard.sizes.length - 1]?.size}.`,
      });
      return;
    }
    try {
      lookupPipe(pipe.standard, pipe.size, pipe.schedule);
    } catch (error) {
      if (!isEngineError(error)) throw error;
      ctx.addIssue({ code: 'custom', path: ['schedule'], message: error.message });
    }
    if (pipe.material !== undefined && !findPipeMaterial(pipe.material)) {
      ctx.addIssue({
        code: 'custom',
        path: ['material'],
        message: `Pipe material must be one of ${PIPE_MATERIAL_IDS.join(', ')}; "${pipe.material}" was given.`,
      });
    }
  });

export const insulationLayerSchema = z
  .object({
    thicknessM: quantity('Insulation thickness', 'm', {
      min: 0,
      minExclusive: true,
      max: MAX_INSULATION_THICKNESS_M,
      maxExclusive: true,
    }),
    conductivityWPerMK: quantity('Insulation conductivity', 'W/(m·K)', { min: 0.005, max: 5 }).optional(),
    material: z.string({ error: 'Insulation material must be text, e.g. "mineral-wool".' }).optional(),
  })
  .superRefine((layer, ctx) => {
    if ((layer.conductivityWPerMK === undefined) === (layer.material === undefined)) {
      ctx.addIssue({
        code: 'custom',
        message: 'Give each insulation layer either a catalog material or a conductivity in W/(m·K), not both.',
      });
    } else if (layer.material !== undefined && !findInsulationMaterial(layer.material)) {
      ctx.addIssue({
        code: 'custom',
        path: ['material'],
        message: `Insulation material must be one of ${INSULATION_MATERIAL_IDS.join(', ')}; "${layer.material}" was given.`,
      });
    }
  });

export const steamConditionSchema = z
  .object({
    gaugePressureKPa: quantity('Steam gauge pressure', 'kPa', { min: -101.325, max: 20000 }),
    atmosphericPressureKPa: quantity('Atmospheric pressure', 'kPa', { min: 50, max: 110 }).optional(),
  })
  .superRefine((steam, ctx) => {
    const atmosphere = steam.atmosphericPressureKPa ?? STANDARD_ATMOSPHERE_KPA;
    const absolute = steam.gaugePressureKPa + atmosphere;
    if (absolute < SATURATION_MIN_ABSOLUTE_PRESSURE_KPA || absolute > STEAM_MAX_ABSOLUTE_PRESSURE_KPA) {
      ctx.addIssue({
        code: 'custom',
        path: ['gaugePressureKPa'],
        message: `Steam pressure must give an absolute pressure between ${formatNumber(SATURATION_MIN_ABSOLUTE_PRESSURE_KPA)} kPa and ${Math.round(STEAM_MAX_ABSOLUTE_PRESSURE_KPA)} kPa (the IAPWS-IF97 saturation range this estimate covers); ${formatNumber(steam.gaugePressureKPa)} kPa gauge over ${formatNumber(atmosphere)} kPa atmosphere was given.`,
      });
    }
  });

export const fluidFlowSchema = z.object({
  kind: oneOf('Fluid', ['water', 'propylene-glycol-30'] as const).default('water'),
  velocityMPerS: quantity('Fluid velocity', 'm/s', { min: 0, max: 10 }).default(1),
});

/**
 * Input of one straight run, per meter, steady state. Explicit geometry and
 * properties reproduce a published case exactly; catalog look-ups are the
 * alternative. Parse with `.safeParse` to get every issue with its path.
 */
export const runInputSchema = z
  .object({
    pipe: z.union([explicitPipeSchema, cataloguePipeSchema], {
      error:
        'Describe the pipe either by outerDiameterM, wallThicknessM and conductivityWPerMK, or by standard, size (and schedule, material).',
    }),
    fluidTemperatureC: fluidTemperatureSchema().optional(),
    steam: steamConditionSchema.optional(),
    fluid: fluidFlowSchema.optional(),
    ambientTemperatureC: quantity('Air temperature', '°C', { min: -50, max: 60 }).default(20),
    surroundingsTemperatureC: quantity('Surroundings temperature', '°C', { min: -80, max: 150 }).optional(),
    windSpeedMPerS: quantity('Wind speed', 'm/s', { min: 0, max: 40 }).default(0),
    orientation: oneOf('Orientation', ['horizontal', 'vertical'] as const).default('horizontal'),
    runHeightM: quantity('Height of a vertical run', 'm', { min: 0, minExclusive: true, max: 200 }).default(3),
    /** Length of the run, m; sets the entry length of a laminar inside film (left out: a long run). */
    runLengthM: quantity('Run length', 'm', { min: 0, minExclusive: true, max: 10000 }).optional(),
    relativeHumidityPercent: quantity('Relative humidity', '%', { min: 0, minExclusive: true, max: 100 }).optional(),
    surfaceEmittance: quantity('Surface emittance', '', { min: 0.02, max: 1 }).optional(),
    surface: oneOf('Surface', SURFACE_IDS).optional(),
    insideFilmWPerM2K: quantity('Inside film coefficient', 'W/(m²·K)', { min: 1, max: 1e7 }).optional(),
    surfaceCoefficientWPerM2K: quantity('Combined surface coefficient', 'W/(m²·K)', { min: 0.5, max: 1000 }).optional(),
    convectionCoefficientWPerM2K: quantity('Convection coefficient', 'W/(m²·K)', { min: 0.1, max: 1000 }).optional(),
    insulation: z
      .array(insulationLayerSchema, { error: 'Insulation must be a list of layers (empty for bare pipe).' })
      .max(5, { error: 'At most 5 insulation layers can be given.' })
      .default([]),
    touchLimitC: quantity('Touch limit', '°C', { min: 30, max: 100 }).default(60),
  })
  .superRefine((run, ctx) => {
    if ((run.fluidTemperatureC === undefined) === (run.steam === undefined)) {
      ctx.addIssue({
        code: 'custom',
        path: ['fluidTemperatureC'],
        message:
          run.steam === undefined
            ? "Give the line's fluid temperature or its steam pressure."
            : 'Give either a fluid temperature or a steam pressure, not both.',
      });
      return;
    }
    if (run.surfaceCoefficientWPerM2K !== undefined && run.convectionCoefficientWPerM2K !== undefined) {
      ctx.addIssue({
        code: 'custom',
        path: ['convectionCoefficientWPerM2K'],
        message: 'Give either a combined surface coefficient or a convection coefficient, not both.',
      });
    }
    const total = run.insulation.reduce((sum, layer) => sum + layer.thicknessM, 0);
    if (run.insulation.length > 1 && total >= MAX_INSULATION_THICKNESS_M) {
      ctx.addIssue({
        code: 'custom',
        path: ['insulation'],
        message: `Total insulation thickness must be under ${MAX_INSULATION_THICKNESS_M} m; ${formatNumber(total)} m was given across ${run.insulation.length} layers.`,
      });
    }
    const lineC =
      run.fluidTemperatureC ??
      (run.steam ? steamSaturation(run.steam.gaugePressureKPa, run.steam.atmosphericPressureKPa) : undefined);
    const innermost = run.insulation[0];
    if (lineC !== undefined && innermost?.material !== undefined) {
      const material = findInsulationMaterial(innermost.material);
      if (material && (lineC > material.serviceMaxC || lineC < material.serviceMinC)) {
        ctx.addIssue({
          code: 'custom',
          path: ['insulation', 0, 'material'],
          message: `${material.name} is rated for ${material.serviceMinC} °C to ${material.serviceMaxC} °C; this line runs at ${formatNumber(lineC)} °C. Choose a material rated for the line temperature.`,
          params: ratingIssueParams(material, lineC),
        });
      }
    }
  });

function steamSaturation(gaugeKPa: number, atmosphereKPa: number | undefined): number | undefined {
  const absolute = gaugeKPa + (atmosphereKPa ?? STANDARD_ATMOSPHERE_KPA);
  if (absolute < SATURATION_MIN_ABSOLUTE_PRESSURE_KPA || absolute > STEAM_MAX_ABSOLUTE_PRESSURE_KPA) return undefined;
  return saturationTemperatureC(absolute);
}

/** What a caller sends for one run (defaults may be left out). */
export type RunInput = z.input<typeof runInputSchema>;
/** A run after parsing, with defaults filled in. */
export type ParsedRunInput = z.output<typeof runInputSchema>;
/** One insulation layer as a caller sends it. */
export type InsulationLayerInput = z.input<typeof insulationLayerSchema>;
/** A pipe given by its standard and size. */
export type CataloguePipeInput = z.input<typeof cataloguePipeSchema>;
/** A pipe given by its dimensions and wall conductivity. */
export type ExplicitPipeInput = z.input<typeof explicitPipeSchema>;
