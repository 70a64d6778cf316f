/**
 * The inventory a report starts from: one state of the lead's — the owner's answers (number 0)
 * or a site-walk revision (1, 2, …) — as the engine takes it. A new draft starts from the latest
 * (the lead's revision number); a draft keeps the state it was started from until the consultant
 * moves it to a newer walk. The one place the report reads a lead's inventory.
 */
import type { Executor } from '../../db/client';
import { findRevision, listRunSpecs } from '../../db/queries/revisions';
import type { Assessment } from '../../db/schema';
import { storedPlantInput } from '../assessments/stored-result';

/** One state of a lead's inventory: its number and the plant as the engine takes it. */
export interface InventoryBase {
  readonly number: number;
  /** The PlantInput of this state (runs included). */
  readonly plant: Record<string, unknown>;
  /** The number of the lead's latest state. */
  readonly latestNumber: number;
}

function asPlant(value: unknown): Record<string, unknown> {
  return typeof value === 'object' && value !== null ? (value as Record<string, unknown>) : { runs: [] };
}

/**
 * The state numbered `number` of the lead's inventory (left out: the latest), or null when the
 * lead has no such state.
 */
export async function loadInventory(db: Executor, lead: Assessment, number?: number): Promise<InventoryBase | null> {
  const latestNumber = latestInventoryNumber(lead);
  const wanted = number ?? latestNumber;
  if (wanted === 0) return { number: 0, plant: asPlant(storedPlantInput(lead.questionnaire, await listRunSpecs(db, lead.id))), latestNumber };
  if (wanted < 0 || wanted > latestNumber) return null;
  const revision = await findRevision(db, lead.id, wanted);
  return revision ? { number: wanted, plant: asPlant(revision.plantInput), latestNumber } : null;
}

/** The number of the lead's latest inventory state: its latest site walk, or 0 for the owner's answers. */
export function latestInventoryNumber(lead: Pick<Assessment, 'revisionNumber'>): number {
  return lead.revisionNumber;
}
