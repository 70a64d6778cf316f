import { solveLean, startAtOtherAir, type ResolvedRun } from './run-solver';

/** One stock thickness tried: its heat flow and surface at average air, and at design air where a need applies. */
export interface SeriesPoint {
  readonly thicknessM: number;
  /** Signed W/m at the average air. */
  readonly heatLossWPerM: number;
  readonly surfaceTemperatureC: number;
  /** The surface at design air, or null where it was not needed (no need, or an earlier thickness already met it). */
  readonly designSurfaceTemperatureC: number | null;
  /** Meets the surface need (a thicker stock than the first that meets it meets it too). */
  readonly meets: boolean;
}

/** How to walk a stock series. */
export interface SeriesWalk {
  /** Ascending stock thicknesses, m. */
  readonly thicknessesM: readonly number[];
  /** The run with this thickness on, at average air. */
  readonly runAt: (thicknessM: number) => ResolvedRun;
  /** The same at design air, or null when no surface need applies. */
  readonly designRunAt: ((thicknessM: number) => ResolvedRun) | null;
  /** The surface need, judged at design air (or at average air without one). */
  readonly meets: (surfaceC: number) => boolean;
  /**
   * When given, the walk stops once the need is met and this cost has risen: past its
   * least, a life-cycle cost only climbs (it is convex in the stock series), so the rest need
   * no solve.
   */
  readonly lifeCycleCost?: (thicknessM: number, heatLossWPerM: number) => number;
  /** Where the first thickness's solve starts, when something close is known (the lagging in place, say). */
  readonly firstGuessC?: number;
}

/**
 * The warm start of a thickness: the surface carried on along the line through the last two
 * thicknesses walked (a start only — the solve ends within its own tolerance wherever it begins).
 */
function onwardGuess(points: readonly SeriesPoint[], thicknessM: number, lastSurfaceC: number): number {
  const n = points.length;
  if (n < 2) return lastSurfaceC;
  const last = points[n - 1] as SeriesPoint;
  const before = points[n - 2] as SeriesPoint;
  const span = last.thicknessM - before.thicknessM;
  if (!(span > 0)) return lastSurfaceC;
  return lastSurfaceC + ((lastSurfaceC - before.surfaceTemperatureC) * (thicknessM - last.thicknessM)) / span;
}

/**
 * The one least-thickness search of the engine, shared by the plant estimate and
 * thickness.ts: lean solves up a stock series, warm-started from the thickness before, with
 * the design solve only until the need is first met (the surface only gets safer with
 * thickness).
 */
export function walkStockSeries(walk: SeriesWalk): SeriesPoint[] {
  const points: SeriesPoint[] = [];
  let guess: number | undefined;
  let met = false;
  let best = Number.POSITIVE_INFINITY;
  let rises = 0;
  for (const t of walk.thicknessesM) {
    const avgRun = walk.runAt(t);
    const avg = solveLean(avgRun, guess === undefined ? walk.firstGuessC : onwardGuess(points, t, guess));
    const wPerM = avg.heatLossWPerM;
    const surfaceC = avg.surfaceTemperatureC;
    guess = surfaceC;
    let designC: number | null = null;
    let meets: boolean;
    if (walk.designRunAt) {
      if (met) meets = true;
      else {
        const designRun = walk.designRunAt(t);
        designC = solveLean(designRun, startAtOtherAir(surfaceC, avgRun.fluidTemperatureC, avgRun.ambientTemperatureC, designRun.ambientTemperatureC)).surfaceTemperatureC;
        meets = walk.meets(designC);
      }
    } else {
      meets = walk.meets(surfaceC);
    }
    met = met || meets;
    points.push({ thicknessM: t, heatLossWPerM: wPerM, surfaceTemperatureC: surfaceC, designSurfaceTemperatureC: designC, meets });
    if (walk.lifeCycleCost) {
      const cost = walk.lifeCycleCost(t, wPerM);
      if (cost < best) {
        best = cost;
        rises = 0;
      } else rises++;
      if (met && rises >= 1) break;
    }
  }
  return points;
}
