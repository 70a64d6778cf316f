/**
 * The one reader of a stored estimate. An assessment (and, later, a site-walk revision)
 * keeps the engine's PlantResult as JSON with the engine version that made it; pages,
 * e-mails and reports read it here, never by casting the JSON.
 */
import { ENGINE_VERSION, estimateParsedPlant, isEngineError, plantInputSchema, type PlantResult } from '../../engine';
import { plantResultSchema } from '../../schemas/estimate';

/** What was stored: the result, the version that made it, and the plant as the engine took it. */
export interface StoredEstimate {
  readonly resultSnapshot: unknown;
  readonly engineVersion: string;
  /** The PlantInput the result was computed from (see {@link storedPlantInput}). */
  readonly input: unknown;
}

/** What the reader made of a stored estimate. */
export type StoredResultReading =
  /** The snapshot as stored, made by this engine. */
  | { readonly status: 'as-stored'; readonly result: PlantResult; readonly computedBy: string }
  /** Worked out again from the stored inputs by this engine; the stored figures came from `storedVersion`. */
  | { readonly status: 'recomputed'; readonly result: PlantResult; readonly computedBy: string; readonly storedVersion: string }
  /** The snapshot as stored, made by another engine version, because today's engine refuses the stored inputs. */
  | { readonly status: 'other-version'; readonly result: PlantResult; readonly computedBy: string }
  /** Neither the snapshot nor the inputs can be read any more. */
  | { readonly status: 'unreadable'; readonly storedVersion: string; readonly reason: string };

/**
 * The PlantInput of an assessment as stored: the questionnaire's estimate answers (saved
 * without the runs) with each run's spec, in the owner's order.
 */
export function storedPlantInput(questionnaire: unknown, runSpecs: readonly unknown[]): unknown {
  const estimate = (questionnaire as { estimate?: unknown } | null)?.estimate;
  return typeof estimate === 'object' && estimate !== null ? { ...estimate, runs: [...runSpecs] } : undefined;
}

function recompute(input: unknown): PlantResult | null {
  const parsed = plantInputSchema.safeParse(input);
  if (!parsed.success) return null;
  try {
    return estimateParsedPlant(parsed.data);
  } catch (error) {
    if (isEngineError(error)) return null;
    throw error;
  }
}

/**
 * Reads a stored estimate, checking its engine version and its shape (with the same zod
 * schema that declares the API's estimate answer).
 *
 * - Made by this engine and of today's shape: shown as stored (`as-stored`), so the owner's
 *   page reads exactly what their confirmation e-mail said.
 * - Made by another engine version (or of a shape today's schema refuses): worked out again
 *   from the stored inputs with today's engine (`recomputed`). We recompute rather than show
 *   the old figures with a mark because a version bump means a published check or a
 *   catalog entry changed the method's answer, and because the result's shape follows the
 *   engine — old snapshots need not carry what today's screens show, and keeping a schema
 *   per past version would be a second engine history to maintain. The engine is
 *   deterministic (seeded ranges), so a recompute gives the same figures every time; callers
 *   say that the figures were worked out again (the reading names both versions).
 * - If today's engine refuses the stored inputs (a rule tightened since), the stored
 *   snapshot is still shown when today's schema reads it (`other-version`, named as such).
 * - Otherwise `unreadable`, with the reason for the log; the page says the figures will be
 *   worked out again by the consultant.
 */
export function readStoredResult(stored: StoredEstimate): StoredResultReading {
  const snapshot = plantResultSchema.safeParse(stored.resultSnapshot);
  if (stored.engineVersion === ENGINE_VERSION && snapshot.success) {
    return { status: 'as-stored', result: snapshot.data, computedBy: ENGINE_VERSION };
  }
  const fresh = recompute(stored.input);
  if (fresh) return { status: 'recomputed', result: fresh, computedBy: ENGINE_VERSION, storedVersion: stored.engineVersion };
  if (snapshot.success) return { status: 'other-version', result: snapshot.data, computedBy: stored.engineVersion };
  const where = snapshot.error.issues[0]?.path.join('.') || '(root)';
  return {
    status: 'unreadable',
    storedVersion: stored.engineVersion,
    reason: `snapshot of engine ${stored.engineVersion} does not match today's result at ${where}, and its inputs are refused by engine ${ENGINE_VERSION}`,
  };
}

/** A sentence for the reader about where the figures come from, or null when nothing needs saying. */
export function readingNote(reading: StoredResultReading): string | null {
  switch (reading.status) {
    case 'as-stored':
      return null;
    case 'recomputed':
      return `These figures were worked out again with the current method (engine ${reading.computedBy}); the ones sent at the time came from engine ${reading.storedVersion}.`;
    case 'other-version':
      return `These figures were worked out by an earlier version of the method (engine ${reading.computedBy}) and are shown as they were sent.`;
    case 'unreadable':
      return 'The stored figures of this assessment can no longer be shown; they will be worked out again from its answers.';
  }
}
