/**
 * "Measure around the pipe with a string and we work out the size": the distance around a
 * bare pipe is its outside diameter times π, and each standard lists its sizes by outside
 * diameter. The nearest sizes of the standards a plant in this market is likely to have are
 * offered, nearest first, each with how far its diameter is from the one measured.
 */
import { MARKETS, PIPE_STANDARDS, type MarketId, type PipeSizeEntry, type PipeStandard, type PipeStandardId } from '../engine';

/** One size the string could have gone round. */
export interface SizeMatch {
  readonly standard: PipeStandardId;
  readonly size: string;
  readonly entry: PipeSizeEntry;
  /** Outside diameter of the size, m. */
  readonly outerDiameterM: number;
  /** (catalog − measured) / measured diameter. */
  readonly deviation: number;
}

/** A string pulled snug is rarely off by more than this, so farther sizes are not offered. */
export const MATCH_TOLERANCE = 0.08;

/** The standards a plant in a market is likely to run: its steel pipe, copper tube and sanitary tube first, then the rest. */
export function standardsFor(market: MarketId): readonly PipeStandard[] {
  const found = MARKETS.find((m) => m.id === market);
  const preferred: readonly PipeStandardId[] = found ? [found.pipeStandard, found.tubeStandard, found.sanitaryStandard] : [];
  const rank = (id: PipeStandardId) => (preferred.includes(id) ? preferred.indexOf(id) : preferred.length);
  return [...PIPE_STANDARDS].sort((a, b) => rank(a.id) - rank(b.id));
}

/**
 * The sizes a measured circumference could be, nearest first: for each likely standard its
 * nearest size within {@link MATCH_TOLERANCE}, at most `limit` in all.
 */
export function sizesForCircumference(circumferenceM: number, market: MarketId, limit = 4): SizeMatch[] {
  if (!Number.isFinite(circumferenceM) || circumferenceM <= 0) return [];
  const measured = circumferenceM / Math.PI;
  const matches: SizeMatch[] = [];
  const preferred = new Set(standardsFor(market).slice(0, 3).map((s) => s.id));
  for (const standard of standardsFor(market)) {
    const nearest = standard.sizes.reduce<PipeSizeEntry | undefined>(
      (best, entry) => (!best || Math.abs(entry.outerDiameterM - measured) < Math.abs(best.outerDiameterM - measured) ? entry : best),
      undefined,
    );
    if (!nearest) continue;
    const deviation = (nearest.outerDiameterM - measured) / measured;
    if (Math.abs(deviation) > MATCH_TOLERANCE) continue;
    matches.push({ standard: standard.id, size: nearest.size, entry: nearest, outerDiameterM: nearest.outerDiameterM, deviation });
  }
  // The market's own standards first when they fit about as well; then by closeness.
  const score = (m: SizeMatch) => Math.abs(m.deviation) + (preferred.has(m.standard) ? 0 : 0.02);
  return matches.sort((a, b) => score(a) - score(b)).slice(0, limit);
}
