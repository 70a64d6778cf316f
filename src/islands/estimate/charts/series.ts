/**
 * The four result charts as plain series: what each chart draws and what its table
 * alternative lists. Everything physical comes from the engine's PlantResult; the cash
 * flow only arranges the engine's yearly saving, installed cost and the plant's own
 * discount and escalation rates by year.
 */
import type { PlantResult, RunEstimate } from '../../../lib/engine';
import { displayUnit, formatFigure, formatMoney, formatQuantity, type UnitSystem } from '../../../lib/units-display';

/** Colours are our tokens, named here and resolved from the stylesheet where the chart is drawn. */
export type Tone = 'ember' | 'frost' | 'mineral' | 'graphite' | 'graphite-soft';

export interface ChartSeries {
  readonly label: string;
  readonly values: readonly (number | null)[];
  readonly tone: Tone;
  /** One tone per bar (hot runs ember, cold runs frost). */
  readonly tones?: readonly Tone[];
  readonly dashed?: boolean;
  /** Drawn as marked points only, no line (the economic thickness). */
  readonly pointsOnly?: boolean;
}

export interface ChartSpec {
  readonly kind: 'bar' | 'line';
  /** The chart's accessible name; the table below it carries the same numbers. */
  readonly name: string;
  readonly labels: readonly string[];
  readonly series: readonly ChartSeries[];
  readonly xTitle: string;
  readonly yTitle: string;
  readonly format: (value: number) => string;
}

/** Heat lost (or gained, cold lines) a year by run, now and with the proposal. */
export function lossByRun(result: PlantResult, system: UnitSystem): ChartSpec {
  const unit = displayUnit('energyPerYear', system);
  return {
    kind: 'bar',
    name: `Bar chart: heat lost or gained a year by run, now and with the proposed insulation, in ${unit.symbol}.`,
    labels: result.runs.map((run) => run.label),
    series: [
      {
        label: 'Now',
        values: result.runs.map((run) => unit.fromBase(run.current.annualHeatGJ)),
        tone: 'ember',
        tones: result.runs.map((run) => (run.cold ? 'frost' : 'ember')),
      },
      {
        label: 'With the proposed insulation',
        values: result.runs.map((run) => unit.fromBase(run.proposed.annualHeatGJ)),
        tone: 'mineral',
      },
    ],
    xTitle: 'Run',
    yTitle: `Heat a year (${unit.symbol})`,
    format: (value) => `${formatFigure(value)} ${unit.symbol}`,
  };
}

/**
 * Temperatures from the fluid out to the air for one run, now and with the proposal. The
 * engine reports the fluid, surface and air temperatures of a run; the faces between pipe
 * wall and layers are not in its result yet, so the profile joins those three.
 */
export function temperatureProfile(run: RunEstimate, system: UnitSystem, touchLimitC: number): ChartSpec {
  const unit = displayUnit('temperature', system);
  const air = run.air.temperatureC;
  const labels = ['In the pipe', 'Outer surface', 'Surrounding air'];
  const limit = run.cold
    ? { label: `Dew point of the air (${formatQuantity(run.air.dewPointC, 'temperature', system)})`, valueC: run.air.dewPointC, tone: 'frost' as const }
    : { label: `Touch limit (${formatQuantity(touchLimitC, 'temperature', system)})`, valueC: touchLimitC, tone: 'ember' as const };
  return {
    kind: 'line',
    name: `Line chart: temperature from the ${run.cold ? 'cold line' : 'fluid'} out to the air for ${run.label}, now and with the proposed insulation, in ${unit.symbol}.`,
    labels,
    series: [
      {
        label: 'Now',
        values: [run.fluidTemperatureC, run.current.surfaceTemperatureC, air].map(unit.fromBase),
        tone: run.cold ? 'frost' : 'ember',
      },
      {
        label: 'With the proposed insulation',
        values: [run.fluidTemperatureC, run.proposed.surfaceTemperatureC, air].map(unit.fromBase),
        tone: 'mineral',
      },
      { label: limit.label, values: labels.map(() => unit.fromBase(limit.valueC)), tone: limit.tone, dashed: true },
    ],
    xTitle: 'From the inside out',
    yTitle: `Temperature (${unit.symbol})`,
    format: (value) => `${formatFigure(value, { significant: 3, maxDecimals: 1 })} ${unit.symbol}`,
  };
}

/** Life-cycle cost against thickness for one run's proposed material, the economic thickness marked. */
export function lifeCycleByThickness(run: RunEstimate, system: UnitSystem, currency: string, horizonYears: number): ChartSpec {
  const thickness = displayUnit('thickness', system);
  const economic = run.economicThickness?.thicknessM;
  return {
    kind: 'line',
    name: `Line chart: cost over ${horizonYears} years against insulation thickness for ${run.label}, with the economic thickness marked.`,
    labels: run.thicknessSeries.map((option) => `${formatFigure(thickness.fromBase(option.thicknessM), { significant: 3, maxDecimals: system === 'US' ? 3 : 0 })} ${thickness.symbol}`),
    series: [
      { label: `Life-cycle cost (installed + ${horizonYears} years of heat)`, values: run.thicknessSeries.map((o) => o.lifeCycleCost), tone: 'graphite' },
      { label: 'Installed cost alone', values: run.thicknessSeries.map((o) => o.installedCost), tone: 'graphite-soft', dashed: true },
      {
        label: 'Economic thickness',
        values: run.thicknessSeries.map((o) => (economic !== undefined && Math.abs(o.thicknessM - economic) < 1e-9 ? o.lifeCycleCost : null)),
        tone: 'mineral',
        pointsOnly: true,
      },
    ],
    xTitle: `Insulation thickness (${thickness.symbol})`,
    yTitle: `Cost (${currency})`,
    format: (value) => formatMoney(value, currency),
  };
}

/** One year of the proposal's cash flow. */
export interface CashFlowYear {
  readonly year: number;
  readonly cumulative: number;
  readonly cumulativePresentValue: number;
}

/**
 * Cumulative cash flow of the whole proposal: the installed cost paid in year 0, then each
 * year's saving growing with fuel escalation; the present value discounts it at the plant's
 * rate (end-of-year amounts, as the engine's present-worth factor counts them), so its last
 * year equals the engine's life-cycle net saving.
 */
export function cashFlowByYear(result: PlantResult): CashFlowYear[] {
  const { horizonYears, discountRatePercent, fuelEscalationPercent } = result.assumptions;
  const saving = result.totals.savings.annualCost;
  const escalation = fuelEscalationPercent / 100;
  const discount = discountRatePercent / 100;
  let cumulative = -result.totals.installedCost;
  let presentValue = cumulative;
  const years: CashFlowYear[] = [{ year: 0, cumulative, cumulativePresentValue: presentValue }];
  for (let year = 1; year <= horizonYears; year++) {
    const cash = saving * (1 + escalation) ** (year - 1);
    cumulative += cash;
    presentValue += cash / (1 + discount) ** year;
    years.push({ year, cumulative, cumulativePresentValue: presentValue });
  }
  return years;
}

export function cashFlow(result: PlantResult): ChartSpec {
  const years = cashFlowByYear(result);
  const { horizonYears, discountRatePercent, fuelEscalationPercent } = result.assumptions;
  return {
    kind: 'line',
    name: `Line chart: cumulative cash flow of insulating over ${horizonYears} years, starting from the installed cost.`,
    labels: years.map((y) => `Year ${y.year}`),
    series: [
      {
        label: `Cash, fuel price rising ${formatFigure(fuelEscalationPercent)} % a year`,
        values: years.map((y) => y.cumulative),
        tone: 'mineral',
      },
      {
        label: `Present value at ${formatFigure(discountRatePercent)} % a year`,
        values: years.map((y) => y.cumulativePresentValue),
        tone: 'graphite',
        dashed: true,
      },
    ],
    xTitle: 'Year',
    yTitle: `Cumulative (${result.currency})`,
    format: (value) => formatMoney(value, result.currency),
  };
}
