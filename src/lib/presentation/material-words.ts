/**
 * Insulation materials in our words, on their own so a form's refusal can name a material
 * without loading the rest of the presentation's tables (the estimate page's first load).
 */
import type { InsulationMaterialId } from '../../engine';

/** Insulation materials by what an installer would call them on site. */
export const MATERIAL_WORDS: Readonly<Record<InsulationMaterialId, string>> = {
  'glass-fibre': 'Fiberglass',
  'mineral-wool': 'Mineral wool',
  'calcium-silicate': 'Calcium silicate',
  'cellular-glass': 'Cellular glass',
  'flexible-elastomeric': 'Flexible foam tube',
  polyisocyanurate: 'Rigid PIR foam',
};

/** The words for an insulation material id; an id we have no words for is shown as given. */
export function materialWords(id: string): string {
  return Object.hasOwn(MATERIAL_WORDS, id) ? MATERIAL_WORDS[id as InsulationMaterialId] : id;
}
