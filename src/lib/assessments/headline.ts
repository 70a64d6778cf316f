/**
 * The headline figures of a stored estimate that the desk's lists sort and filter on, copied out
 * of the engine's result into plain columns. Written together with the result snapshot: on
 * submission, and by every recompute (site-walk revisions call this too). The migration
 * `0002_backfill-lead-figures` reads the same places of the snapshot for rows stored before.
 */
import type { PlantResult } from '../../engine';
import type { NewAssessment } from '../../db/schema';

export type HeadlineColumns = Required<
  Pick<
    NewAssessment,
    | 'currency'
    | 'annualLossCost'
    | 'annualLossCostLow'
    | 'annualLossCostHigh'
    | 'annualSavingCost'
    | 'runCount'
    | 'photoCount'
    | 'hazardRunCount'
    | 'services'
  >
>;

/** Whether a stored attachment counts as a photo (the lists' "photos" filter). */
export function isPhoto(contentType: string): boolean {
  return contentType.startsWith('image/');
}

export function headlineColumnsOf(result: PlantResult, photoCount: number): HeadlineColumns {
  return {
    currency: result.currency,
    annualLossCost: result.range.currentAnnualCost.likely,
    annualLossCostLow: result.range.currentAnnualCost.low,
    annualLossCostHigh: result.range.currentAnnualCost.high,
    annualSavingCost: result.range.annualCostSaving.likely,
    runCount: result.runs.length,
    photoCount,
    hazardRunCount: result.runs.filter((run) => run.hazards.length > 0).length,
    services: [...new Set(result.runs.map((run) => run.service))].sort(),
  };
}
