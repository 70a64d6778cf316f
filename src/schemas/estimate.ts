/**
 * The answer of POST /api/estimate: the engine's PlantResult, declared once as a zod schema.
 * The island's client parses answers with it and the OpenAPI document is generated from it.
 * (The request is the engine's own `plantInputSchema`.)
 *
 * Written with `zod/mini`, which tree-shakes to a few kB, because the browser parses with it.
 * `mirrorOf<PlantResult>()` makes any drift between this schema and the engine's type a
 * typecheck failure: when the engine's result changes, this file changes with it.
 */
import * as z from 'zod/mini';
import { OPTION_KINDS, SERVICE_IDS, type InputNotice, type PlantResult, type PlantWarning, type RunEstimate, type RunWarningCode } from '../engine';
import { rangeIssueParamsSchema } from './api-error';
import { mirrorOf } from './mirror';

const figure = z.number();

const RUN_WARNING_CODES = [
  'MATERIAL_ABOVE_SERVICE_LIMIT',
  'MATERIAL_BELOW_SERVICE_LIMIT',
  'SURFACE_ABOVE_TOUCH_LIMIT',
  'SURFACE_BELOW_DEW_POINT',
  'INSULATION_BELOW_CRITICAL_RADIUS',
  'RAYLEIGH_BEYOND_CORRELATION',
  'BARE_FITTINGS_ABOVE_TOUCH_LIMIT',
  'BARE_FITTINGS_BELOW_DEW_POINT',
] as const satisfies readonly RunWarningCode[];

const PLANT_WARNING_CODES = [
  'ILLUSTRATIVE_PRICES',
  'COLD_LINES_NOT_PRICED',
  'NO_SAVING',
  'NO_STOCK_MEETS_NEED',
  'INPUT_NOTICE',
] as const satisfies readonly PlantWarning['code'][];

const CHOICE_CODES = [
  'LEAST_LIFE_CYCLE_COST',
  'NOTHING_PAYS',
  'SAFETY_ONLY',
  'FORCED',
  'NO_OPTION_MEETS_SAFETY',
] as const satisfies readonly RunEstimate['choice']['code'][];

const NOTICE_CODES = [
  'RUN_LONGER_THAN_1_KM',
  'MANY_VALVES',
  'HOT_WATER_ABOVE_BOILING',
  'GLYCOL_ABOVE_60C',
  'STEAM_BELOW_ATMOSPHERIC',
  'MEASURED_BELOW_SATURATION',
  'MEASURED_CLOSE_TO_AIR',
] as const satisfies readonly InputNotice['code'][];

const annualFiguresShape = {
  heatW: figure,
  annualHeatGJ: figure,
  annualFuelGJ: figure,
  annualFuelQuantity: figure,
  annualChillerElectricityKWh: figure,
  annualCost: figure,
  annualCo2Kg: figure,
  steamKgPerHour: figure,
  steamKgPerYear: figure,
};

const annualFigures = z.object(annualFiguresShape);
const faceProfile = z.object({ faceDiametersM: z.array(figure), faceTemperaturesC: z.array(figure) });
const lifeCycle = z.object({ currentCost: figure, proposedCost: figure, netSaving: figure });
const range = z.object({ low: figure, likely: figure, high: figure });

const runOption = z.object({
  kind: z.enum(OPTION_KINDS),
  thicknessM: z.nullable(figure),
  installedCost: figure,
  annualCost: figure,
  simplePaybackYears: z.nullable(figure),
  lifeCycleCost: figure,
  meetsTouchLimit: z.boolean(),
  meetsDewPoint: z.boolean(),
  // Full detail only.
  material: z.optional(z.nullable(z.string())),
  jacket: z.optional(z.nullable(z.string())),
  lengthInsulatedM: z.optional(figure),
  fittingCovers: z.optional(figure),
  annualHeatGJ: z.optional(figure),
  annualCo2Kg: z.optional(figure),
  annualCostSaving: z.optional(figure),
  designSurfaceTemperatureC: z.optional(figure),
});

const runEstimate = z.object({
  id: z.string(),
  label: z.string(),
  service: z.enum(SERVICE_IDS),
  cold: z.boolean(),
  lengthM: figure,
  operatingHoursPerYear: figure,
  fluidTemperatureC: figure,
  steamAbsolutePressureKPa: z.nullable(figure),
  latentHeatJPerKg: z.nullable(figure),
  areaId: z.string(),
  air: z.object({ temperatureC: figure, speedMPerS: figure, relativeHumidityPercent: figure, dewPointC: figure }),
  designAir: z.object({ hotTemperatureC: figure, wetTemperatureC: figure, wetRelativeHumidityPercent: figure, wetDewPointC: figure }),
  pipeOuterDiameterM: figure,
  fittings: z.object({ valves: figure, flangePairs: figure, equivalentLengthM: figure, bareEquivalentLengthM: figure, uncoveredCount: figure }),
  bare: z.object({ heatLossWPerM: figure, surfaceTemperatureC: figure }),
  current: z.object({
    ...annualFiguresShape,
    state: z.enum(['bare', 'damaged', 'insulated']),
    heatLossWPerM: figure,
    surfaceTemperatureC: figure,
    designSurfaceTemperatureC: figure,
    latentGainW: figure,
    wrongWayHeatW: figure,
    profile: z.optional(faceProfile),
  }),
  proposed: z.object({
    ...annualFiguresShape,
    option: z.enum(OPTION_KINDS),
    material: z.string(),
    thicknessM: figure,
    jacket: z.string(),
    heatLossWPerM: figure,
    surfaceTemperatureC: figure,
    designSurfaceTemperatureC: figure,
    coverFittings: z.boolean(),
    profile: z.optional(faceProfile),
  }),
  savings: annualFigures,
  installedCost: figure,
  simplePaybackYears: z.nullable(figure),
  lifeCycle,
  choice: z.object({ code: z.enum(CHOICE_CODES), message: z.string() }),
  options: z.array(runOption),
  economicThickness: z.nullable(z.object({ thicknessM: figure, lifeCycleCost: figure })),
  thicknessSeries: z.optional(
    z.array(
      z.object({
        thicknessM: figure,
        actualThicknessM: figure,
        heatLossWPerM: figure,
        surfaceTemperatureC: figure,
        installedCost: figure,
        lifeCycleCost: figure,
      }),
    ),
  ),
  personnelProtection: z.object({ applies: z.boolean(), touchLimitC: figure, designAirTemperatureC: figure, leastThicknessM: z.nullable(figure) }),
  condensationControl: z.object({ applies: z.boolean(), dewPointC: figure, marginK: figure, leastThicknessM: z.nullable(figure) }),
  measurements: z.nullable(
    z.object({
      measuredHeatLossWPerM: z.nullable(figure),
      surfaceTemperatureC: z.nullable(figure),
      lineTemperatureC: z.nullable(figure),
      conditionFactor: z.nullable(figure),
    }),
  ),
  hazards: z.array(z.object({ code: z.enum(RUN_WARNING_CODES), message: z.string(), layer: z.optional(figure) })),
  notices: z.array(
    z.object({
      code: z.enum(NOTICE_CODES),
      path: z.string(),
      message: z.string(),
      params: z.optional(z.extend(z.partial(rangeIssueParamsSchema), { quantity: rangeIssueParamsSchema.shape.quantity })),
    }),
  ),
});

/** The engine's PlantResult, field for field. */
export const plantResultSchema = mirrorOf<PlantResult>()(
  z.object({
    engineVersion: z.string(),
    currency: z.string(),
    detail: z.enum(['summary', 'full']),
    market: z.string(),
    runs: z.array(runEstimate),
    totals: z.object({
      current: annualFigures,
      proposed: annualFigures,
      savings: annualFigures,
      installedCost: figure,
      simplePaybackYears: z.nullable(figure),
      lifeCycle,
      cashFlow: z.array(z.object({ year: figure, cumulative: figure, cumulativePresentValue: figure })),
      runsWithWork: figure,
    }),
    range: z.object({
      samples: figure,
      seed: figure,
      currentAnnualCost: range,
      currentAnnualHeatGJ: range,
      currentAnnualCo2Kg: range,
      annualCostSaving: range,
      annualHeatSavingGJ: range,
      annualCo2SavingKg: range,
      installedCost: range,
      simplePaybackYears: z.nullable(range),
      sampled: z.array(z.string()),
    }),
    assumptions: z.object({
      fuel: z.string(),
      fuelQuantityUnit: z.string(),
      fuelCostPerGJ: figure,
      boilerEfficiency: figure,
      emissionFactor: z.object({ source: z.string(), label: z.string(), kgCo2PerGJ: figure }),
      chillerCoefficientOfPerformance: figure,
      electricityPricePerKWh: z.nullable(figure),
      atmosphericPressureKPa: figure,
      presentWorthFactor: figure,
      priceTable: z.string(),
      priceTableIllustrative: z.boolean(),
      stockSeries: z.enum(['inch', 'mm']),
      horizonYears: figure,
      discountRatePercent: figure,
      fuelEscalationPercent: figure,
    }),
    warnings: z.array(
      z.object({ code: z.enum(PLANT_WARNING_CODES), message: z.string(), runId: z.optional(z.string()), path: z.optional(z.string()) }),
    ),
  }),
);

/** The answer of POST /api/estimate. */
export const estimateAnswerSchema = z.object({
  engineVersion: z.string(),
  result: plantResultSchema,
});

export type EstimateAnswer = z.output<typeof estimateAnswerSchema>;
