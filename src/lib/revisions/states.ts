/**
 * The states of a lead's inventory as stored: the owner's original (number 0, on the assessment
 * and its runs) and each site-walk revision, read into one shape with their results.
 */
import type { Executor } from '../../db/client';
import { listRevisions, listRunSpecs, type RevisionRow } from '../../db/queries/revisions';
import type { Assessment } from '../../db/schema';
import { readStoredResult, storedPlantInput, type StoredResultReading } from '../assessments/stored-result';
import type { RevisionView } from '../../schemas/revisions';
import type { InventoryState } from './diff';

type ReadableReading = Exclude<StoredResultReading, { status: 'unreadable' }>;

/** One stored state with who saved it, when and why. */
export interface StoredState extends InventoryState {
  readonly baseNumber: number | null;
  readonly savedAt: Date;
  readonly author: { name: string; firm: string | null } | null;
  readonly reason: string | null;
  /** The engine version of `result` (today's when the stored figures were worked out again). */
  readonly engineVersion: string;
  /** How the figures were read (as stored, or worked out again), for the page's provenance line. */
  readonly reading: ReadableReading;
  readonly clientKey: string | null;
}

/** A stored state's figures can no longer be read: neither its snapshot nor its inputs are taken today. */
export class UnreadableStateError extends Error {}

/**
 * Each state's figures come through the one reader of stored results, so a revision made by an
 * older engine is worked out again from its inputs (a diff then shows what the answers changed,
 * not what the method did) and the page says so.
 */
function readState(snapshot: unknown, engineVersion: string, plant: unknown): ReadableReading {
  const reading = readStoredResult({ resultSnapshot: snapshot, engineVersion, input: plant });
  if (reading.status === 'unreadable') throw new UnreadableStateError(reading.reason);
  return reading;
}

/** The owner's original state of a lead. */
export async function loadOriginal(db: Executor, lead: Assessment): Promise<StoredState> {
  const plant = storedPlantInput(lead.questionnaire, await listRunSpecs(db, lead.id));
  const read = readState(lead.resultSnapshot, lead.engineVersion, plant);
  return {
    number: 0,
    baseNumber: null,
    plant,
    result: read.result,
    engineVersion: read.computedBy,
    reading: read,
    savedAt: lead.createdAt,
    author: null,
    reason: null,
    clientKey: null,
  };
}

export function revisionState(row: RevisionRow): StoredState {
  const read = readState(row.resultSnapshot, row.engineVersion, row.plantInput);
  return {
    number: row.number,
    baseNumber: row.baseNumber,
    plant: row.plantInput,
    result: read.result,
    engineVersion: read.computedBy,
    reading: read,
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
