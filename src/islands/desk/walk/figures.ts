/**
 * The figures the site-walk form shows beside each run and for the plant — the starting
 * revision's, handed over by the page, and the draft's, worked out live by POST /api/estimate
 * a moment after the consultant stops typing (only when the draft passes the engine's own
 * checks, which run here first so their sentences appear at once, without a connection).
 */
import { useEffect, useRef, useState } from 'react';
import { plantInputSchema, type InputNotice, type MeasurementUse, type PlantInput, type PlantResult, type RunWarningCode } from '../../../engine';
import { send, type ApiFailure } from '../../../lib/api-client';
import type { RangeIssueParams } from '../../../engine';

/** One run's figures, as the form shows them. */
export interface RunFigures {
  readonly cold: boolean;
  /** Signed per meter: positive out of the line. */
  readonly heatLossWPerM: number;
  readonly annualCost: number;
  readonly annualSaving: number;
  readonly paybackYears: number | null;
  readonly surfaceTemperatureC: number;
  readonly fluidTemperatureC: number;
  readonly hazards: readonly { code: RunWarningCode; message: string }[];
  readonly notices: readonly InputNotice[];
  readonly measurements: MeasurementUse | null;
}

/** The plant's figures and each run's, by run id. */
export interface PlantFigures {
  readonly currency: string;
  readonly lossCost: { readonly low: number; readonly likely: number; readonly high: number };
  readonly saving: number;
  readonly installedCost: number;
  readonly paybackYears: number | null;
  readonly runs: Readonly<Record<string, RunFigures>>;
}

/** The figures of a result, small enough to hand from the page to the island. */
export function figuresOf(result: PlantResult): PlantFigures {
  return {
    currency: result.currency,
    lossCost: { ...result.range.currentAnnualCost },
    saving: result.range.annualCostSaving.likely,
    installedCost: result.totals.installedCost,
    paybackYears: result.totals.simplePaybackYears,
    runs: Object.fromEntries(
      result.runs.map((run) => [
        run.id,
        {
          cold: run.cold,
          heatLossWPerM: run.current.heatLossWPerM,
          annualCost: run.current.annualCost,
          annualSaving: run.savings.annualCost,
          paybackYears: run.simplePaybackYears,
          surfaceTemperatureC: run.current.surfaceTemperatureC,
          fluidTemperatureC: run.fluidTemperatureC,
          hazards: run.hazards.map((h) => ({ code: h.code, message: h.message })),
          notices: run.notices,
          measurements: run.measurements,
        },
      ]),
    ),
  };
}

/** A problem with the draft, by the field path the engine reports (`runs.2.lengthM`). */
export interface DraftIssue {
  readonly path: string;
  readonly message: string;
  readonly params?: RangeIssueParams | undefined;
}

/** The engine's own checks on the whole plant, here in the browser. */
export function checkPlant(plant: PlantInput): DraftIssue[] {
  const parsed = plantInputSchema.safeParse(plant);
  if (parsed.success) return [];
  return parsed.error.issues.map((issue) => ({
    path: issue.path.map(String).join('.'),
    message: issue.message,
    params: issue.code === 'custom' ? (issue.params as RangeIssueParams | undefined) : undefined,
  }));
}

/** The estimate's answer schema, loaded with the first answer (the form needs nothing of it before). */
const estimateAnswer = () => import('../../../schemas/answers').then((m) => m.estimateAnswerSchema);

export type LiveState =
  | { readonly kind: 'ready'; readonly figures: PlantFigures }
  | { readonly kind: 'working'; readonly figures: PlantFigures | null }
  | { readonly kind: 'offline'; readonly figures: PlantFigures | null }
  | { readonly kind: 'invalid'; readonly figures: PlantFigures | null; readonly issues: readonly DraftIssue[] }
  | { readonly kind: 'failed'; readonly figures: PlantFigures | null; readonly message: string };

/** How long after the last keystroke the figures are worked out again, ms. */
const PAUSE_MS = 600;

/**
 * The draft's figures, worked out again a moment after each change. Offline, the last figures
 * stay and the state says so; they are worked out again when the connection returns.
 */
export function useLiveFigures(plant: PlantInput, online: boolean): LiveState {
  const [state, setState] = useState<LiveState>({ kind: 'working', figures: null });
  const key = JSON.stringify(plant);
  const last = useRef<PlantFigures | null>(null);
  useEffect(() => {
    const issues = checkPlant(plant);
    if (issues.length) {
      setState({ kind: 'invalid', figures: last.current, issues });
      return;
    }
    if (!online) {
      setState({ kind: 'offline', figures: last.current });
      return;
    }
    setState({ kind: 'working', figures: last.current });
    const controller = new AbortController();
    const timer = setTimeout(async () => {
      const answer = await send(
        '/api/estimate?detail=summary',
        { method: 'POST', headers: { 'content-type': 'application/json', accept: 'application/json' }, body: key, signal: controller.signal },
        estimateAnswer,
      );
      if (controller.signal.aborted) return;
      if (answer.ok) {
        last.current = figuresOf(answer.data.result);
        setState({ kind: 'ready', figures: last.current });
      } else if ((answer as ApiFailure).code === 'NETWORK') {
        setState({ kind: 'offline', figures: last.current });
      } else if (answer.status === 400) {
        setState({ kind: 'invalid', figures: last.current, issues: answer.issues.map((i) => ({ path: i.path, message: i.message })) });
      } else {
        setState({ kind: 'failed', figures: last.current, message: answer.message });
      }
    }, PAUSE_MS);
    return () => {
      controller.abort();
      clearTimeout(timer);
    };
    // Keyed on the plant's JSON: a new object with the same answers must not ask again.
  }, [key, online]);
  return state;
}
