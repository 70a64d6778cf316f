/**
 * The headline figures of an estimate — what the plant loses, what insulating saves, costs
 * and pays back — apart from the run rows, so the live summary strip needs only this module
 * (the rest of the presentation loads with the full results).
 */
import type { PlantResult } from '../../engine';
import { displayFormat, type DisplayFormat, type DisplayOptions } from './format';
import { NBSP, type FormattedRange } from './rounding';

/** One headline figure, ready to lay out. */
export interface PresentedFigure {
  /** What the figure is, in our words. */
  readonly label: string;
  /** The figure with its unit, as a sentence would carry it: "$4,230", "1,230 GJ". */
  readonly text: string;
  /** The number alone ("1,230"; money keeps its symbol: "$4,230"). */
  readonly value: string;
  /** The unit alone ("GJ"); empty for money, whose symbol is in the value. */
  readonly unit: string;
  /** Said after the figure: "a year", or empty. */
  readonly per: string;
  /** The 10th–90th percentile range, when the engine gives one. */
  readonly range: FormattedRange | null;
  /** A second line: the same in another form, or how it was reached. */
  readonly note: string | null;
}

/** The figures an estimate leads with, each with its label, unit, range and note. */
export interface PresentedHeadline {
  readonly lossCost: PresentedFigure;
  readonly lossEnergy: PresentedFigure;
  readonly co2: PresentedFigure;
  /** Steam condensed by the loss, per hour; null when no run carries steam. */
  readonly steam: PresentedFigure | null;
  readonly boilerFuel: PresentedFigure;
  /** Chiller electricity for heat gained; null without cold lines. */
  readonly chillerElectricity: PresentedFigure | null;
  readonly saving: PresentedFigure;
  readonly energySaving: PresentedFigure;
  readonly co2Saving: PresentedFigure;
  readonly installedCost: PresentedFigure;
  readonly payback: PresentedFigure;
  readonly lifeCycleNet: PresentedFigure;
}

const A_YEAR = 'a year';

function figure(
  label: string,
  parts: { value: string; unit?: string; per?: string; range?: FormattedRange | null; note?: string | null },
): PresentedFigure {
  const unit = parts.unit ?? '';
  return {
    label,
    text: unit ? `${parts.value}${NBSP}${unit}` : parts.value,
    value: parts.value,
    unit,
    per: parts.per ?? '',
    range: parts.range ?? null,
    note: parts.note ?? null,
  };
}

/** Splits "1,230 GJ" made by the formatter into number and unit at its first no-break space. */
function split(text: string): { value: string; unit: string } {
  const at = text.indexOf(NBSP);
  return at < 0 ? { value: text, unit: '' } : { value: text.slice(0, at), unit: text.slice(at + 1) };
}

/** The headline figures, written with the reader's formatters. */
export function presentHeadline(result: PlantResult, f: DisplayFormat): PresentedHeadline {
  const { totals, range, assumptions } = result;
  const hasColdLines = result.runs.some((run) => run.cold);
  const energy = (gj: number) => split(f.quantity(gj, 'energyPerYear'));
  const co2 = (kg: number) => split(f.co2(kg));
  const lossEnergy = energy(range.currentAnnualHeatGJ.likely);
  const steam = totals.current.steamKgPerHour > 0 ? split(f.quantity(totals.current.steamKgPerHour, 'steamRate')) : null;
  const fuel = energy(totals.current.annualFuelGJ);
  const payback = range.simplePaybackYears;
  const net = totals.lifeCycle.netSaving;
  const illustrative = assumptions.priceTableIllustrative;
  return {
    lossCost: figure(hasColdLines ? 'Cost of the heat lost and gained' : 'Cost of the heat lost', {
      value: f.money(range.currentAnnualCost.likely),
      per: A_YEAR,
      range: f.moneyRange(range.currentAnnualCost.low, range.currentAnnualCost.high),
    }),
    lossEnergy: figure(hasColdLines ? 'Heat lost, and gained by cold lines' : 'Heat lost', {
      ...lossEnergy,
      per: A_YEAR,
      range: f.quantityRange(range.currentAnnualHeatGJ.low, range.currentAnnualHeatGJ.high, 'energyPerYear'),
      note: `${f.quantity(totals.current.heatW, 'power')} while the plant runs`,
    }),
    co2: figure('CO₂ from the lost heat', {
      ...co2(range.currentAnnualCo2Kg.likely),
      per: A_YEAR,
      range: f.co2Range(range.currentAnnualCo2Kg.low, range.currentAnnualCo2Kg.high),
      note: assumptions.emissionFactor.label,
    }),
    steam: steam
      ? figure('Steam condensed by the loss', {
          ...steam,
          note: `${f.quantity(totals.current.steamKgPerYear, 'steamMass')} ${A_YEAR}`,
        })
      : null,
    boilerFuel: figure('Boiler fuel to make up the loss', {
      ...fuel,
      per: A_YEAR,
      note: `at ${f.percent(assumptions.boilerEfficiency)} boiler efficiency`,
    }),
    chillerElectricity:
      totals.current.annualChillerElectricityKWh > 0
        ? figure('Chiller electricity for the heat gained', {
            value: f.number(totals.current.annualChillerElectricityKWh),
            unit: 'kWh',
            per: A_YEAR,
          })
        : null,
    saving: figure('Insulating as proposed saves', {
      value: f.money(range.annualCostSaving.likely),
      per: A_YEAR,
      range: f.moneyRange(range.annualCostSaving.low, range.annualCostSaving.high),
    }),
    energySaving: figure('Energy saved', {
      ...energy(range.annualHeatSavingGJ.likely),
      per: A_YEAR,
      range: f.quantityRange(range.annualHeatSavingGJ.low, range.annualHeatSavingGJ.high, 'energyPerYear'),
    }),
    co2Saving: figure('CO₂ avoided', {
      ...co2(range.annualCo2SavingKg.likely),
      per: A_YEAR,
      range: f.co2Range(range.annualCo2SavingKg.low, range.annualCo2SavingKg.high),
    }),
    installedCost: figure(illustrative ? 'Installed cost (illustrative prices)' : 'Installed cost', {
      value: f.money(range.installedCost.likely),
      range: f.moneyRange(range.installedCost.low, range.installedCost.high),
    }),
    payback: figure('Simple payback', {
      value: f.years(totals.simplePaybackYears),
      range: payback ? f.yearsRange(payback.low, payback.high) : null,
    }),
    lifeCycleNet: figure(`${net >= 0 ? 'Ahead' : 'Behind'} after ${assumptions.horizonYears} years`, {
      value: f.money(Math.abs(net)),
      note: `${f.money(totals.lifeCycle.proposedCost)} to install and run insulated, against ${f.money(totals.lifeCycle.currentCost)} left as it is`,
    }),
  };
}

/** The headline figures alone, for a reader (see presentResult for the whole estimate). */
export function headlineFor(result: PlantResult, options: DisplayOptions): PresentedHeadline {
  return presentHeadline(result, displayFormat({ ...options, currency: result.currency }));
}
