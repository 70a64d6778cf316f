/**
 * Lagwise calculation engine — the one public door.
 *
 * Heat loss (and gain) of insulated and bare pipe runs by the standard method for
 * insulated cylinders (method.md), with the money, carbon and safety figures built
 * on it. Pure TypeScript, SI inside; convert units at the edges with the helpers
 * exported here.
 */

export { ENGINE_VERSION } from './version';
export { EngineError, isEngineError, engineIssuesOf, type EngineErrorCode, type EngineIssue } from './errors';

// One run.
export { solveRun, type RunResult, type RunWarning, type RunWarningCode, type RunResistances } from './run';
export {
  runInputSchema,
  MAX_INSULATION_THICKNESS_M,
  MIN_FLUID_TEMPERATURE_C,
  MAX_FLUID_TEMPERATURE_C,
  type RunInput,
  type ParsedRunInput,
  type InsulationLayerInput,
  type CataloguePipeInput,
  type ExplicitPipeInput,
} from './run-input';
export {
  personnelProtectionThickness,
  condensationControlThickness,
  type ThicknessSearchResult,
  type ThicknessCandidate,
} from './thickness';

// A plant.
export {
  estimatePlant,
  estimateParsedPlant,
  marketOf,
  type EstimateOptions,
  type PlantResult,
  type RunEstimate,
  type RunOption,
  type ChoiceReason,
  type InputNotice,
  type MeasurementUse,
  type ResultDetail,
  type AnnualFigures,
  type Range,
  type ThicknessOption,
  type PlantWarning,
  type FaceProfile,
  type CashFlowYear,
} from './plant';
export {
  plantInputSchema,
  areaSchema,
  measurementsSchema,
  fittingInputSchema,
  runPriceSchema,
  priceTableSchema,
  OPTION_KINDS,
  type OptionKind,
  type PlantInput,
  type ParsedPlantInput,
  type PlantRunInput,
} from './plant-input';
export { PLANT_INPUT_DEFAULTS, EXISTING_LAGGING_DEFAULTS } from './input-defaults';
export { AREA_PRESETS, AREA_PRESET_IDS, DEFAULT_DESIGN, type AreaPreset, type AreaPresetId } from './data/areas';
export { MARKETS, MARKET_IDS, marketForCountry, type Market, type MarketId } from './data/markets';
export { c585ActualThicknessM, c585OuterDiameterM } from './data/c585';
export { infraredCorrectedC } from './measurements';
export { type QuantityKind, type RangeIssueParams } from './schema-helpers';
export { SERVICE_DEFAULTS, SERVICE_IDS, serviceDefaults, type ServiceDefaults, type ServiceId } from './services';
export { CONFIDENCE_SPREADS, type Confidence } from './uncertainty';

// Properties.
export {
  saturationTemperatureC,
  saturationPressureKPa,
  saturatedSteam,
  saturatedSteamAtGauge,
  SATURATION_MIN_ABSOLUTE_PRESSURE_KPA,
  SATURATION_MAX_ABSOLUTE_PRESSURE_KPA,
  STEAM_MAX_ABSOLUTE_PRESSURE_KPA,
  type SteamState,
} from './steam-properties';
export { dewPointC, atmosphericPressureKPaAtAltitude, saturationVapourPressureKPa, vapourPressureKPa } from './psychrometrics';
export { condensationFluxKgPerM2S, latentHeatOfDepositionJPerKg, vapourDiffusivityM2PerS } from './latent-gain';
export { popielSlenderFactor } from './convection';
export { laminarEntryNusselt, tubeNusselt } from './inside-film';
export { criticalInsulationRadiusM } from './radiation';
export { equivalentThicknessM } from './geometry';

// Money.
export {
  annualEnergyJ,
  fuelEnergyJ,
  fuelQuantity,
  fuelCostPerJoule,
  emissionKgPerJoule,
  presentWorthFactor,
  cashFlowByYear,
  simplePaybackYears,
  installedCostPerMetre,
  fittingCoverCost,
} from './economics';

// Catalogs for the form's drop-downs.
export { PIPE_STANDARDS, PIPE_STANDARD_IDS, type PipeStandard, type PipeSizeEntry, type PipeStandardId } from './data/pipe-dimensions';
export { PIPE_MATERIALS, PIPE_MATERIAL_IDS, type PipeMaterialId } from './data/pipe-materials';
export {
  INSULATION_MATERIALS,
  INSULATION_MATERIAL_IDS,
  type InsulationMaterial,
  type InsulationMaterialId,
} from './data/insulation-materials';
export { SURFACES, SURFACE_IDS, JACKET_IDS, BARE_FINISH_IDS, type SurfaceId, type BareFinishId, type SurfaceLook } from './data/surfaces';
export {
  FUELS,
  FUEL_IDS,
  FUEL_PRICE_UNITS,
  EMISSION_SOURCE_IDS,
  type Fuel,
  type FuelId,
  type FuelPriceUnit,
  type EmissionFactor,
  type EmissionSourceId,
} from './data/fuels';
export { FITTING_TYPES, FITTING_TYPE_IDS, fittingAreaM2, fittingEquivalentLengthM, type FittingTypeId } from './data/fittings';
export { DEMO_INSTALLED_COST_TABLE, type InstalledCostTable } from './data/installed-cost-demo';
export { lookupPipe, type PipeDimensions } from './catalogue';
export { conductivityAt, meanConductivity, type ConductivityCurve } from './conductivity';

// Units.
export * from './units';
export { STEFAN_BOLTZMANN_W_PER_M2K4, STANDARD_GRAVITY_M_PER_S2, STANDARD_ATMOSPHERE_KPA, HOURS_PER_YEAR } from './physical-constants';
