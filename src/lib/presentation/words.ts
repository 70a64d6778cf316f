/**
 * The words Lagwise shows for the engine's ids: services, insulation materials, covers
 * (jackets), the state a run is in, hazard flags and plant notes. Our own wording, in US
 * spelling, kept here once; the engine's catalog names stay the engine's.
 *
 * Each table is typed by the engine's id union, so a new service, material or cover in the
 * engine fails the typecheck until it has its words here.
 */
import type { OptionKind, PlantWarning, RunEstimate, RunWarningCode, ServiceId, SurfaceId } from '../../engine';

/** What a line carries, as an owner says it. */
export const SERVICE_WORDS: Readonly<Record<ServiceId, string>> = {
  steam: 'Steam',
  'condensate-return': 'Condensate return',
  'hot-water': 'Hot water',
  'cip-supply': 'Clean-in-place supply',
  'cip-return': 'Clean-in-place return',
  'chilled-water': 'Chilled water',
  glycol: 'Glycol (30 % propylene)',
};

export { MATERIAL_WORDS } from './material-words';

/** What the outside of a run is: a bare pipe's metal, or the cover over its insulation. */
export const SURFACE_WORDS: Readonly<Record<SurfaceId, string>> = {
  'rust-or-scale': 'rusty or scaled steel',
  painted: 'paint',
  'dark-tarnish': 'dark, tarnished metal',
  'dull-metal': 'dull gray metal',
  'bright-metal': 'shiny metal',
  'bare-carbon-steel': 'bare steel',
  'bare-stainless-steel': 'bare stainless steel',
  'bare-copper': 'bare copper',
  'painted-metal': 'a painted or mastic finish',
  'all-service-jacket': 'a white paper-faced wrap',
  'pvc-jacket': 'a PVC cover',
  'aluminium-jacket': 'shiny aluminum sheeting',
  'aluminium-jacket-dull': 'weathered aluminum sheeting',
  'stainless-steel-jacket': 'stainless steel sheeting',
  'galvanised-steel-jacket': 'galvanized steel sheeting',
  'elastomeric-skin': 'no cover (the foam’s own skin)',
};

/** The state a run is in today. */
export const STATE_WORDS: Readonly<Record<RunEstimate['current']['state'], string>> = {
  bare: 'Bare',
  damaged: 'Partly bare',
  insulated: 'Insulated',
};

/** A hazard's short flag (always words, never color alone) and its tone. */
export const HAZARD_FLAGS: Readonly<Record<RunWarningCode, { readonly flag: string; readonly tone: 'heat' | 'cold' | 'plain' }>> = {
  SURFACE_ABOVE_TOUCH_LIMIT: { flag: 'Burns on touch', tone: 'heat' },
  SURFACE_BELOW_DEW_POINT: { flag: 'Sweats: below the dew point', tone: 'cold' },
  MATERIAL_ABOVE_SERVICE_LIMIT: { flag: 'Insulation too hot for its rating', tone: 'plain' },
  MATERIAL_BELOW_SERVICE_LIMIT: { flag: 'Insulation too cold for its rating', tone: 'plain' },
  INSULATION_BELOW_CRITICAL_RADIUS: { flag: 'Thin layer adds heat flow', tone: 'plain' },
  RAYLEIGH_BEYOND_CORRELATION: { flag: 'Approximate: very large line', tone: 'plain' },
  BARE_FITTINGS_ABOVE_TOUCH_LIMIT: { flag: 'Bare fittings burn', tone: 'heat' },
  BARE_FITTINGS_BELOW_DEW_POINT: { flag: 'Bare fittings drip', tone: 'cold' },
};

/** The choices weighed for a run: as a label, and as what doing it is called in a sentence. */
export const OPTION_WORDS: Readonly<Record<OptionKind, { readonly label: string; readonly doing: string }>> = {
  leave: { label: 'Leave as it is', doing: 'Leaving it as it is' },
  repair: { label: 'Repair the bare parts', doing: 'Repairing only the bare parts' },
  insulate: { label: 'Insulate', doing: 'Insulating it' },
  'add-layer': { label: 'Add a layer', doing: 'Adding a layer over the old insulation' },
  replace: { label: 'Replace the insulation', doing: 'Replacing the insulation' },
};

/** Plant-wide notes that need no run to be said (the others are worded with their run). */
export const PLANT_NOTE_WORDS: Readonly<Record<Exclude<PlantWarning['code'], 'NO_STOCK_MEETS_NEED' | 'INPUT_NOTICE'>, string>> = {
  ILLUSTRATIVE_PRICES:
    'Installed costs are Lagwise’s illustrative prices, not a quotation; a consultant prices the real work with their own.',
  COLD_LINES_NOT_PRICED: 'Heat gained by the cold lines is not priced: give an electricity price for the chillers to include it.',
  NO_SAVING: 'Insulating as proposed saves nothing on these answers.',
};

function lookup<K extends string>(table: Readonly<Record<K, string>>, id: string): string | undefined {
  return Object.hasOwn(table, id) ? table[id as K] : undefined;
}

/** The words for a service id; an id we have no words for is shown as given. */
export function serviceWords(id: string): string {
  return lookup(SERVICE_WORDS, id) ?? id;
}

export { materialWords } from './material-words';

/** The words for a surface or cover id, lower case to sit inside a sentence. */
export function surfaceWords(id: string): string {
  return lookup(SURFACE_WORDS, id) ?? id;
}
