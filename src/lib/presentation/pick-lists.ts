/**
 * The pick-lists Lagwise offers for the engine's choices, worded once in our own way and US
 * spelling: the kinds of area a line runs through, what bare metal looks like, the covers
 * over insulation grouped by what a person sees on the pipe, and the kinds of fitting. The
 * owner's estimate form, the consultant's site-walk form and the presentation read them here.
 *
 * Each table is typed by the engine's id union, so a new id in the engine fails the
 * typecheck until it has its words here.
 */
import type { AreaPresetId, BareFinishId, FittingTypeId, SurfaceId } from '../../engine';

/** One choice in a list: the engine's id, our words for it, and a few words more if they help. */
export interface PickChoice<Id extends string = string> {
  readonly value: Id;
  readonly label: string;
  readonly note?: string;
}

/** A group of choices under a heading (an <optgroup>). */
export interface PickGroup<Id extends string = string> {
  readonly label: string;
  readonly choices: readonly PickChoice<Id>[];
}

/** The kinds of place a line runs through, as an owner would name them. */
export const AREA_KIND_CHOICES: readonly PickChoice<AreaPresetId>[] = [
  { value: 'process-room', label: 'Process room', note: 'where the product is made' },
  { value: 'boiler-room', label: 'Boiler room', note: 'warm and dry' },
  { value: 'washdown-room', label: 'Washdown room', note: 'hosed down, damp air' },
  { value: 'cold-store', label: 'Cold store', note: 'chilled, fans blowing' },
  { value: 'plant-room', label: 'Plant room or corridor', note: 'machinery, passageways' },
  { value: 'outdoors', label: 'Outdoors', note: 'sun, rain and wind' },
];

/** What the metal of a bare pipe looks like (it sets how much heat it gives off by radiation). */
export const BARE_FINISH_CHOICES: readonly PickChoice<BareFinishId>[] = [
  { value: 'rust-or-scale', label: 'Rusty or scaly steel' },
  { value: 'painted', label: 'Painted, any color' },
  { value: 'dark-tarnish', label: 'Dark, tarnished copper or brass' },
  { value: 'dull-metal', label: 'Dull gray metal', note: 'weathered galvanized, mill-finish stainless' },
  { value: 'bright-metal', label: 'Shiny metal', note: 'new copper, polished stainless, new galvanized' },
];

type JacketId = Exclude<SurfaceId, BareFinishId | 'bare-carbon-steel' | 'bare-stainless-steel' | 'bare-copper'>;

/** The cover over insulation, grouped by what a person sees on the pipe. */
export const JACKET_GROUPS: readonly PickGroup<JacketId>[] = [
  {
    label: 'Metal sheet wrapped round it',
    choices: [
      { value: 'aluminium-jacket', label: 'Shiny aluminum sheet' },
      { value: 'aluminium-jacket-dull', label: 'Aluminum sheet, dulled by weather' },
      { value: 'stainless-steel-jacket', label: 'Stainless steel sheet' },
      { value: 'galvanised-steel-jacket', label: 'New galvanized steel sheet' },
    ],
  },
  {
    label: 'Plastic, paper or cloth',
    choices: [
      { value: 'pvc-jacket', label: 'Smooth plastic cover (PVC)' },
      { value: 'all-service-jacket', label: 'White paper or cloth facing' },
    ],
  },
  {
    label: 'Paint or a hard coating',
    choices: [{ value: 'painted-metal', label: 'Painted or coated with mastic' }],
  },
  {
    label: 'Nothing over the insulation',
    choices: [{ value: 'elastomeric-skin', label: 'Bare rubbery foam, its own skin' }],
  },
];

/** The same covers as one flat list, in the groups' order. */
export const JACKET_CHOICES: readonly PickChoice<JacketId>[] = JACKET_GROUPS.flatMap((group) => group.choices);

/** The kinds of fitting counted on a run. */
export const FITTING_KIND_CHOICES: readonly PickChoice<FittingTypeId>[] = [
  { value: 'valve-flanged', label: 'Flanged valve', note: 'bolted to the pipe' },
  { value: 'valve-screwed', label: 'Screwed valve', note: 'threaded onto the pipe' },
  { value: 'flange-pair', label: 'Flange joint', note: 'two flanges bolted together' },
  { value: 'strainer', label: 'Strainer' },
  { value: 'steam-trap', label: 'Steam trap' },
];

/** Surfaces the engine still reads in older runs (named by the pipe's material) but no list offers. */
const OLDER_SURFACE_LABELS = {
  'bare-carbon-steel': 'Bare steel, as it weathers',
  'bare-stainless-steel': 'Bare stainless steel',
  'bare-copper': 'Bare copper, tarnished',
} as const;

/** Every surface's label, bare finishes and covers alike: the one name a form, a report or a change list shows. */
export const SURFACE_LABELS: Readonly<Record<SurfaceId, string>> = {
  ...(Object.fromEntries([...BARE_FINISH_CHOICES, ...JACKET_CHOICES].map((c) => [c.value, c.label])) as Record<BareFinishId | JacketId, string>),
  ...OLDER_SURFACE_LABELS,
};

/** The label of a surface or cover id; an id we have no words for is shown as given. */
export function surfaceLabel(id: string): string {
  return Object.hasOwn(SURFACE_LABELS, id) ? SURFACE_LABELS[id as SurfaceId] : id;
}

/** The label of a choice by its id, or the id itself when the list has no such choice. */
export function choiceLabel(choices: readonly PickChoice[], id: string | undefined): string {
  return choices.find((choice) => choice.value === id)?.label ?? id ?? '';
}
