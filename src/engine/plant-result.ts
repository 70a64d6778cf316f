import type { AnnualFigures } from './annual-figures';
import type { OptionKind } from './plant-input';
import type { RangeIssueParams } from './schema-helpers';
import type { RunWarning } from './run';
import type { ServiceId } from './services';

export type { AnnualFigures } from './annual-figures';

/**
 * Temperatures of the faces heat crosses, from the inside of the pipe wall outward (inner
 * wall, outer wall, the outer face of each layer; the last is the surface), with their
 * diameters. The fluid is inside the first face, the air outside the last.
 */
export interface FaceProfile {
  readonly faceDiametersM: readonly number[];
  readonly faceTemperaturesC: readonly number[];
}

/** One year of the plan's cash flow: the installed cost is paid in year 0. */
export interface CashFlowYear {
  readonly year: number;
  /** Savings so far less the installed cost, with the fuel price escalating. */
  readonly cumulative: number;
  /** The same discounted to today; the last year equals the life-cycle net saving. */
  readonly cumulativePresentValue: number;
}

/** One point of the thickness series of a run's proposed material (insulating or replacing). */
export interface ThicknessOption {
  /** Nominal (stock) thickness, m. */
  readonly thicknessM: number;
  /** The thickness on the pipe (ASTM C585 actual for the inch series), m. */
  readonly actualThicknessM: number;
  /** Signed per meter: positive out of the line, negative into it. */
  readonly heatLossWPerM: number;
  /** At the year's average air. */
  readonly surfaceTemperatureC: number;
  readonly installedCost: number;
  readonly lifeCycleCost: number;
}

/** Why a run's option was chosen: a stable code and a sentence. */
export interface ChoiceReason {
  readonly code: 'LEAST_LIFE_CYCLE_COST' | 'NOTHING_PAYS' | 'SAFETY_ONLY' | 'FORCED' | 'NO_OPTION_MEETS_SAFETY';
  readonly message: string;
}

/** One option weighed for a run, with the figures that decided it (the rest in full detail only). */
export interface RunOption {
  readonly kind: OptionKind;
  /** Nominal thickness put on, m (for add-layer, the added layer); null for leave. */
  readonly thicknessM: number | null;
  readonly installedCost: number;
  /** The year's cost of the run after this option (what the system pays for). */
  readonly annualCost: number;
  readonly simplePaybackYears: number | null;
  /** Installed cost plus the present worth of the yearly cost over the horizon. */
  readonly lifeCycleCost: number;
  readonly meetsTouchLimit: boolean;
  readonly meetsDewPoint: boolean;
  /** Full detail only: insulation put on (null for leave). */
  readonly material?: string | null;
  /** Full detail only. */
  readonly jacket?: string | null;
  /** Full detail only: meters of pipe the work covers. */
  readonly lengthInsulatedM?: number;
  /** Full detail only. */
  readonly fittingCovers?: number;
  /** Full detail only. */
  readonly annualHeatGJ?: number;
  /** Full detail only. */
  readonly annualCo2Kg?: number;
  /** Full detail only. */
  readonly annualCostSaving?: number;
  /** Full detail only: hottest (hot lines) or coldest (cold lines) exposed surface at design air, °C. */
  readonly designSurfaceTemperatureC?: number;
}

/** Plausible-but-unlikely input, said at the field (not a refusal). */
export interface InputNotice {
  readonly code:
    | 'RUN_LONGER_THAN_1_KM'
    | 'MANY_VALVES'
    | 'HOT_WATER_ABOVE_BOILING'
    | 'GLYCOL_ABOVE_60C'
    | 'STEAM_BELOW_ATMOSPHERIC'
    | 'MEASURED_BELOW_SATURATION'
    | 'MEASURED_CLOSE_TO_AIR';
  readonly path: string;
  readonly message: string;
  readonly params?: Partial<RangeIssueParams> & { readonly quantity: RangeIssueParams['quantity'] };
}

/** What the engine made of a run's site measurements. */
export interface MeasurementUse {
  /** Loss per meter from the measured surface and air, W/m (positive out of the line). */
  readonly measuredHeatLossWPerM: number | null;
  /** The surface temperature after correcting an infrared reading for emittance, °C. */
  readonly surfaceTemperatureC: number | null;
  /** Line temperature implied by a bare-pipe reading, °C (used for the estimate). */
  readonly lineTemperatureC: number | null;
  /** Measured ÷ modeled loss of existing insulation (used where the surface is > 10 K from the air). */
  readonly conditionFactor: number | null;
}

/** The estimate of one run. */
export interface RunEstimate {
  readonly id: string;
  readonly label: string;
  readonly service: ServiceId;
  /** The service is a cold one (chilled water, glycol): heat gained is the chiller's load. */
  readonly cold: boolean;
  readonly lengthM: number;
  readonly operatingHoursPerYear: number;
  readonly fluidTemperatureC: number;
  readonly steamAbsolutePressureKPa: number | null;
  readonly latentHeatJPerKg: number | null;
  readonly areaId: string;
  /** The year's average air around the run. */
  readonly air: {
    readonly temperatureC: number;
    readonly speedMPerS: number;
    readonly relativeHumidityPercent: number;
    readonly dewPointC: number;
  };
  /** Design air: the hot still hour for burns, the wettest hour for sweating. */
  readonly designAir: {
    readonly hotTemperatureC: number;
    readonly wetTemperatureC: number;
    readonly wetRelativeHumidityPercent: number;
    readonly wetDewPointC: number;
  };
  readonly pipeOuterDiameterM: number;
  readonly fittings: {
    readonly valves: number;
    readonly flangePairs: number;
    /** Equivalent length of bare pipe of all fittings, m. */
    readonly equivalentLengthM: number;
    /** Of which uncovered today, m. */
    readonly bareEquivalentLengthM: number;
    readonly uncoveredCount: number;
  };
  readonly bare: { readonly heatLossWPerM: number; readonly surfaceTemperatureC: number };
  readonly current: AnnualFigures & {
    readonly state: 'bare' | 'damaged' | 'insulated';
    /** Mean over the run (a damaged run mixes bare and insulated lengths), signed, W/m. */
    readonly heatLossWPerM: number;
    /** Hottest (or, cold lines, coldest) exposed surface at the average air, °C. */
    readonly surfaceTemperatureC: number;
    /** The same at design air (hot still hour or wettest hour), °C. */
    readonly designSurfaceTemperatureC: number;
    /** Latent heat of vapor condensing on it, W (cold lines below the dew point). */
    readonly latentGainW: number;
    /** Heat flowing the way the service does not pay for (a cold line losing heat), W; reported, not billed. */
    readonly wrongWayHeatW: number;
    /** Through the bare part of a damaged run; through the insulation of an insulated one. Full detail only. */
    readonly profile?: FaceProfile;
  };
  /** The chosen option's result (equal to current when leaving the run as it is). */
  readonly proposed: AnnualFigures & {
    readonly option: OptionKind;
    readonly material: string;
    readonly thicknessM: number;
    readonly jacket: string;
    readonly heatLossWPerM: number;
    readonly surfaceTemperatureC: number;
    readonly designSurfaceTemperatureC: number;
    readonly coverFittings: boolean;
    /** Full detail only. */
    readonly profile?: FaceProfile;
  };
  readonly savings: AnnualFigures;
  readonly installedCost: number;
  readonly simplePaybackYears: number | null;
  readonly lifeCycle: { readonly currentCost: number; readonly proposedCost: number; readonly netSaving: number };
  /** Which option was chosen, and why. */
  readonly choice: ChoiceReason;
  /** Every option weighed, the chosen one among them. */
  readonly options: readonly RunOption[];
  readonly economicThickness: { readonly thicknessM: number; readonly lifeCycleCost: number } | null;
  /** Full detail only: the proposed material's stock series. */
  readonly thicknessSeries?: readonly ThicknessOption[];
  readonly personnelProtection: {
    readonly applies: boolean;
    readonly touchLimitC: number;
    readonly designAirTemperatureC: number;
    readonly leastThicknessM: number | null;
  };
  readonly condensationControl: {
    readonly applies: boolean;
    /** Dew point of the wettest hour. */
    readonly dewPointC: number;
    readonly marginK: number;
    readonly leastThicknessM: number | null;
  };
  readonly measurements: MeasurementUse | null;
  /** Cautions about the run as it is today (touch burns, sweating, bare fittings, materials). */
  readonly hazards: readonly RunWarning[];
  /** Things about the run's answers worth a second look (not refusals). */
  readonly notices: readonly InputNotice[];
}

/** Low / likely / high of one figure. */
export interface Range {
  readonly low: number;
  readonly likely: number;
  readonly high: number;
}

/** Plant-level caution. */
export interface PlantWarning {
  readonly code: 'ILLUSTRATIVE_PRICES' | 'COLD_LINES_NOT_PRICED' | 'NO_SAVING' | 'NO_STOCK_MEETS_NEED' | 'INPUT_NOTICE';
  readonly message: string;
  /** The run concerned, when there is one. */
  readonly runId?: string;
  /** The field concerned (dotted path), when there is one. */
  readonly path?: string;
}

/** How much of a result to return: the figures screens show, or everything a detail view opens. */
export type ResultDetail = 'summary' | 'full';

/** The estimate of a whole plant. */
export interface PlantResult {
  readonly engineVersion: string;
  readonly currency: string;
  /** `summary`: no thickness series or face profiles; `full`: everything. */
  readonly detail: ResultDetail;
  readonly market: string;
  readonly runs: readonly RunEstimate[];
  /** Totals over the recommended actions only (a run left as it is adds no cost and no saving). */
  readonly totals: {
    readonly current: AnnualFigures;
    readonly proposed: AnnualFigures;
    readonly savings: AnnualFigures;
    readonly installedCost: number;
    readonly simplePaybackYears: number | null;
    readonly lifeCycle: { readonly currentCost: number; readonly proposedCost: number; readonly netSaving: number };
    /** Year 0 (the installed cost) to the horizon. */
    readonly cashFlow: readonly CashFlowYear[];
    /** Runs where work is recommended. */
    readonly runsWithWork: number;
  };
  /** Percentiles 10 / 90 of seeded Monte Carlo samples over the uncertain inputs; likely = point estimate. */
  readonly range: {
    readonly samples: number;
    readonly seed: number;
    readonly currentAnnualCost: Range;
    readonly currentAnnualHeatGJ: Range;
    readonly currentAnnualCo2Kg: Range;
    readonly annualCostSaving: Range;
    readonly annualHeatSavingGJ: Range;
    readonly annualCo2SavingKg: Range;
    readonly installedCost: Range;
    readonly simplePaybackYears: Range | null;
    /** The inputs sampled, each with its spread. */
    readonly sampled: readonly string[];
  };
  readonly assumptions: {
    readonly fuel: string;
    readonly fuelQuantityUnit: string;
    readonly fuelCostPerGJ: number;
    readonly boilerEfficiency: number;
    readonly emissionFactor: { readonly source: string; readonly label: string; readonly kgCo2PerGJ: number };
    readonly chillerCoefficientOfPerformance: number;
    readonly electricityPricePerKWh: number | null;
    readonly atmosphericPressureKPa: number;
    readonly presentWorthFactor: number;
    readonly priceTable: string;
    readonly priceTableIllustrative: boolean;
    readonly stockSeries: 'inch' | 'mm';
    readonly horizonYears: number;
    readonly discountRatePercent: number;
    readonly fuelEscalationPercent: number;
  };
  readonly warnings: readonly PlantWarning[];
}
