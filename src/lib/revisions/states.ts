/**
 * The states of a lead's inventory as stored: the owner's original (number 0, on the assessment
 * and its runs) and each site-walk revision, read into one shape with their results.
 */
import type { Executor } from '../../db/client';
import { listRevisions, listRunSpecs, type RevisionRow } from '../../db/queries/revisions';
import type { Assessment } from '../../db/schema';
import { ENGINE_VERSION, estimatePlant, isEngineError, type PlantResult } from '../../engine';
import type { RevisionView } from '../../schemas/revisions';
import type { InventoryState } from './diff';

/** One stored state with who saved it, when and why. */
export interface StoredState extends InventoryState {
  readonly baseNumber: number | null;
  readonly savedAt: Date;
  readonly author: { name: string; firm: string | null } | null;
  readonly reason: string | null;
  /** The engine version of `result` (today's when the stored figures were worked out again). */
  readonly engineVersion: string;
  readonly clientKey: string | null;
}

/**
 * The owner's answers as the engine takes them: the questionnaire's estimate answers (stored
 * without the runs) with each run's spec, in the owner's order.
 */
export function originalPlantInput(questionnaire: unknown, runSpecs: readonly unknown[]): Record<string, unknown> {
  const estimate = (questionnaire as { estimate?: unknown } | null)?.estimate;
  const answers = typeof estimate === 'object' && estimate !== null ? (estimate as Record<string, unknown>) : {};
  return { ...answers, runs: [...runSpecs] };
}

/**
 * A stored result made by this engine is read as stored; one made by another version is worked
 * out again from its inputs (the engine is deterministic), so a diff shows what the answers
 * changed and not what the method did. If today's engine refuses the old inputs, the stored
 * figures stand.
 */
function readResult(snapshot: unknown, engineVersion: string, plant: unknown): { result: PlantResult; engineVersion: string } {
  if (engineVersion !== ENGINE_VERSION) {
    try {
      return { result: estimatePlant(plant as never), engineVersion: ENGINE_VERSION };
    } catch (error) {
      if (!isEngineError(error)) throw error;
    }
  }
  return { result: snapshot as PlantResult, engineVersion };
}

/** The owner's original state of a lead. */
export async function loadOriginal(db: Executor, lead: Assessment): Promise<StoredState> {
  const plant = originalPlantInput(lead.questionnaire, await listRunSpecs(db, lead.id));
  const read = readResult(lead.resultSnapshot, lead.engineVersion, plant);
  return {
    number: 0,
    baseNumber: null,
    plant,
    result: read.result,
    engineVersion: read.engineVersion,
    savedAt: lead.createdAt,
    author: null,
    reason: null,
    clientKey: null,
  };
}

export function revisionState(row: RevisionRow): StoredState {
  const read = readResult(row.resultSnapshot, row.engineVersion, row.plantInput);
  return {
    number: row.number,
    baseNumber: row.baseNumber,
    plant: row.plantInput,
    result: read.result,
    engineVersion: read.engineVersion,
    savedAt: row.createdAt,
    author: row.authorName ? { name: row.authorName, firm: row.authorFirm ?? null } : null,
    reason: row.reason,
    clientKey: row.clientKey,
  };
}

/** Every state of a lead's inventory, the owner's first, then the revisions in order. */
export async function loadHistory(db: Executor, lead: Assessment): Promise<StoredState[]> {
  const [original, rows] = await Promise.all([loadOriginal(db, lead), listRevisions(db, lead.id)]);
  return [original, ...rows.map(revisionState)];
}

/** A state as the API shows it; the reason only to those who see the lead's history. */
export function revisionView(state: StoredState, showReason: boolean): RevisionView {
  return {
    number: state.number,
    baseNumber: state.baseNumber,
    savedAt: state.savedAt.toISOString(),
    author: state.author,
    reason: showReason ? state.reason : null,
    engineVersion: state.engineVersion,
    plant: state.plant as Record<string, unknown>,
    result: state.result as unknown as Record<string, unknown>,
  };
}
