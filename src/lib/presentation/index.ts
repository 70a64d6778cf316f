/**
 * Lagwise's one presentation of an estimate — the door. Pure TypeScript (no Astro, React or
 * DOM), so pages, islands, e-mails and PDF reports all show the same strings.
 *
 * - {@link presentResult}: a PlantResult → names, headline figures with ranges, run rows,
 *   hazards in the reader's units, notes and basis sentences.
 * - {@link headlineFor}: the headline figures alone (the live summary strip, lists).
 * - {@link displayFormat}: the formatters behind it, for anything a layout adds (a chart axis).
 * - ./rounding: the one rounding rule and the small formatters a form's hints need
 *   (formatNumber, formatQuantity, formatTemperature); ./money: money alone (lists).
 * - The word tables for the engine's ids, and the pick-lists every form offers (./pick-lists).
 */
export { presentResult, type PresentedHazard, type PresentedNotice, type PresentedResult, type PresentedRun } from './present';
export { headlineFor, presentHeadline, type PresentedFigure, type PresentedHeadline } from './headline';
export { displayFormat, type DisplayFormat, type DisplayOptions } from './format';
export { presentOptions, type PresentedOption } from './options';
export { formatMoney, formatMoneyRange } from './money';
export {
  formatNumber,
  formatQuantity,
  formatTemperature,
  roundToStep,
  stepFor,
  MINUS,
  NBSP,
  ROUNDING,
  type FormattedRange,
} from './rounding';
export {
  AREA_KIND_CHOICES,
  BARE_FINISH_CHOICES,
  FITTING_KIND_CHOICES,
  JACKET_CHOICES,
  JACKET_GROUPS,
  SURFACE_LABELS,
  choiceLabel,
  surfaceLabel,
  type PickChoice,
  type PickGroup,
} from './pick-lists';
export {
  HAZARD_FLAGS,
  MATERIAL_WORDS,
  OPTION_WORDS,
  PLANT_NOTE_WORDS,
  SERVICE_WORDS,
  STATE_WORDS,
  SURFACE_WORDS,
  materialWords,
  serviceWords,
  surfaceWords,
} from './words';
export type { UnitSystem } from '../units-display';
