/**
 * The inventory a report starts from: the lead's latest state — the owner's answers (number 0)
 * or, once site walks are saved, the latest revision — as the engine takes it. The one place
 * the report reads a lead's inventory.
 */
import type { Executor } from '../../db/client';
import { listLeadRuns } from '../../db/queries/leads';
import type { Assessment } from '../../db/schema';

/** One state of a lead's inventory: its number and the plant as the engine takes it. */
export interface InventoryBase {
  readonly number: number;
  /** The PlantInput of this state (runs included). */
  readonly plant: Record<string, unknown>;
  /** The number of the lead's latest state. */
  readonly latestNumber: number;
}

/** The owner's answers as the engine takes them: the questionnaire's estimate answers with each run's spec. */
function originalPlant(questionnaire: unknown, runSpecs: readonly unknown[]): Record<string, unknown> {
  const estimate = (questionnaire as { estimate?: unknown } | null)?.estimate;
  const answers = typeof estimate === 'object' && estimate !== null ? (estimate as Record<string, unknown>) : {};
  return { ...answers, runs: [...runSpecs] };
}

/**
 * The state numbered `number` of the lead's inventory (left out: the latest), or null when the
 * lead has no such state.
 */
export async function loadInventory(db: Executor, lead: Assessment, number?: number): Promise<InventoryBase | null> {
  const latestNumber = 0;
  const wanted = number ?? latestNumber;
  if (wanted !== 0) return null;
  const runs = await listLeadRuns(db, lead.id);
  return { number: 0, plant: originalPlant(lead.questionnaire, runs.map((r) => r.spec)), latestNumber };
}

/** The number of the lead's latest inventory state. */
export function latestInventoryNumber(_lead: Assessment): number {
  return 0;
}
