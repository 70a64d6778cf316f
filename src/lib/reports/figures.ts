/**
 * The report's own figures, worked out from the engine's result and the consultant's composition:
 * the incentives set against the installed cost, payback and life-cycle on what the owner pays,
 * and the recommended actions ranked with quick wins first. Pure: the same frozen version always
 * gives the same figures.
 */
import type { OptionKind, PlantResult, Range } from '../../engine';
import type { ReportComposition } from '../../schemas/reports';

/** An action that pays back within this many years is a quick win — common practice. */
export const QUICK_WIN_YEARS = 1;

/** One recommended action (a run where work is recommended), in the report's order. */
export interface RankedAction {
  readonly rank: number;
  readonly runId: string;
  readonly runLabel: string;
  readonly option: OptionKind;
  readonly installedCost: number;
  readonly annualSaving: number;
  readonly paybackYears: number | null;
  /** Pays back within {@link QUICK_WIN_YEARS}. */
  readonly quickWin: boolean;
  /** Done for safety (burns, sweating); saves little or nothing. */
  readonly forSafety: boolean;
}

export interface ReportFigures {
  readonly currency: string;
  readonly horizonYears: number;
  readonly annualSaving: Range;
  readonly annualHeatSavingGJ: Range;
  readonly annualCo2SavingKg: Range;
  readonly steamSavedKgPerHour: number;
  readonly steamSavedKgPerYear: number;
  readonly installedCost: Range;
  readonly incentivesTotal: number;
  /** Installed cost less incentives, never below zero. */
  readonly netCost: number;
  /** Net cost over the likely yearly saving; null when nothing is saved. */
  readonly paybackYears: number | null;
  readonly paybackRange: { readonly low: number; readonly high: number } | null;
  /** Over the horizon, discounted: ahead (positive) or behind, incentives counted in year 0. */
  readonly lifeCycleNetSaving: number;
  readonly lifeCycleCurrentCost: number;
  readonly lifeCycleProposedCost: number;
  /** Year 0 to the horizon: savings so far less the net cost, undiscounted and discounted. */
  readonly cashFlow: readonly { readonly year: number; readonly cumulative: number; readonly cumulativePresentValue: number }[];
  readonly actions: readonly RankedAction[];
  readonly runsWithWork: number;
  readonly runCount: number;
}

/** Orders actions: quick wins by payback, then the others that pay by payback, then those done for safety. */
function rankActions(result: PlantResult): RankedAction[] {
  const actions = result.runs
    .filter((run) => run.proposed.option !== 'leave')
    .map((run) => {
      const payback = run.simplePaybackYears;
      const forSafety = run.choice.code === 'SAFETY_ONLY' || payback === null;
      return {
        rank: 0,
        runId: run.id,
        runLabel: run.label,
        option: run.proposed.option,
        installedCost: run.installedCost,
        annualSaving: run.savings.annualCost,
        paybackYears: payback,
        quickWin: !forSafety && payback !== null && payback <= QUICK_WIN_YEARS,
        forSafety,
      };
    });
  const group = (a: RankedAction) => (a.quickWin ? 0 : a.forSafety ? 2 : 1);
  return actions
    .sort((a, b) => group(a) - group(b) || (a.paybackYears ?? Infinity) - (b.paybackYears ?? Infinity) || b.annualSaving - a.annualSaving || a.runLabel.localeCompare(b.runLabel))
    .map((action, index) => ({ ...action, rank: index + 1 }));
}

export function reportFigures(result: PlantResult, composition: Pick<ReportComposition, 'incentives'>): ReportFigures {
  const { totals, range } = result;
  const incentivesTotal = composition.incentives.reduce((sum, line) => sum + line.amount, 0);
  const netCost = Math.max(0, totals.installedCost - incentivesTotal);
  const saving = totals.savings.annualCost;
  const paybackYears = saving > 0 ? netCost / saving : null;
  // The engine's payback range is on the installed cost; incentives scale it by what is left to pay.
  const share = totals.installedCost > 0 ? netCost / totals.installedCost : 0;
  const paybackRange = paybackYears !== null && range.simplePaybackYears ? { low: range.simplePaybackYears.low * share, high: range.simplePaybackYears.high * share } : null;
  const credit = Math.min(incentivesTotal, totals.installedCost);
  return {
    currency: result.currency,
    horizonYears: result.assumptions.horizonYears,
    annualSaving: range.annualCostSaving,
    annualHeatSavingGJ: range.annualHeatSavingGJ,
    annualCo2SavingKg: range.annualCo2SavingKg,
    steamSavedKgPerHour: totals.savings.steamKgPerHour,
    steamSavedKgPerYear: totals.savings.steamKgPerYear,
    installedCost: range.installedCost,
    incentivesTotal,
    netCost,
    paybackYears,
    paybackRange,
    lifeCycleNetSaving: totals.lifeCycle.netSaving + credit,
    lifeCycleCurrentCost: totals.lifeCycle.currentCost,
    lifeCycleProposedCost: totals.lifeCycle.proposedCost - credit,
    cashFlow: totals.cashFlow.map((year) => ({ year: year.year, cumulative: year.cumulative + credit, cumulativePresentValue: year.cumulativePresentValue + credit })),
    actions: rankActions(result),
    runsWithWork: totals.runsWithWork,
    runCount: result.runs.length,
  };
}
