import type { UnitSystem } from '../units-display';

/** The unit system the owner filled the form in, from the stored questionnaire. */
export function unitSystemOf(questionnaire: unknown): UnitSystem {
  const system = (questionnaire as { estimate?: { unitSystem?: unknown } } | null)?.estimate?.unitSystem;
  return system === 'US' ? 'US' : 'SI';
}
