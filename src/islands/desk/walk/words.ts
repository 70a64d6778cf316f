/**
 * The site-walk form's words for the engine's choices and for its own problems: catalog
 * names as a consultant says them on site, and range problems said again in the reader's own
 * units with the field's own label.
 */
import {
  INSULATION_MATERIALS,
  PIPE_MATERIALS,
  PIPE_STANDARDS,
  SERVICE_DEFAULTS,
  type PipeSizeEntry,
  type PipeStandard,
  type RangeIssueParams,
} from '../../../engine';
import { displayUnit, type DisplayQuantity } from '../../../lib/units-display';
import { formatNumber, formatQuantity, type UnitSystem } from '../../../lib/presentation';
import type { Option, OptionGroup } from './fields';
import { AREA_KIND_CHOICES, JACKET_GROUPS } from '../../../lib/presentation/pick-lists';

export const SERVICE_OPTIONS: Option[] = SERVICE_DEFAULTS.map((s) => ({ value: s.id, label: s.name }));

const STANDARD_WORDS: Record<string, string> = {
  'ASME-B36.10M': 'Steel pipe, NPS',
  'ASME-B36.19M': 'Stainless pipe, NPS',
  'ASTM-B88-L': 'Copper tube, type L',
  'ASTM-B88-K': 'Copper tube, type K',
  'EN-10220': 'Metric steel tube, DN',
  'ASTM-A270-SANITARY': 'Sanitary stainless tube',
  'DIN-11850-2': 'Metric sanitary tube, DN',
};

export const STANDARD_OPTIONS: Option[] = PIPE_STANDARDS.map((s) => ({ value: s.id, label: `${STANDARD_WORDS[s.id] ?? s.name} (${s.id.replace(/-/g, ' ')})` }));

export function standardOf(id: string | undefined): PipeStandard | undefined {
  return PIPE_STANDARDS.find((s) => s.id === id);
}

export function sizeOptions(standard: PipeStandard | undefined, system: UnitSystem): Option[] {
  if (!standard) return [];
  return standard.sizes.map((entry: PipeSizeEntry) => ({
    value: entry.size,
    label: `${entry.size}${/^\d/.test(entry.size) ? ' in' : ''} · ${formatQuantity(entry.outerDiameterM, 'diameter', system, 4)} across`,
  }));
}

export function scheduleOptions(standard: PipeStandard | undefined, size: string | undefined, system: UnitSystem): Option[] {
  const entry = standard?.sizes.find((s) => s.size === size);
  if (!entry) return [];
  return Object.entries(entry.wallsM).map(([key, wallM]) => ({
    value: key,
    label: `${/^\d/.test(key) ? `Schedule ${key}` : key} · wall ${formatQuantity(wallM, 'thickness', system, 3)}`,
  }));
}

export const PIPE_MATERIAL_OPTIONS: Option[] = PIPE_MATERIALS.map((m) => ({ value: m.id, label: m.name }));
export const INSULATION_OPTIONS: Option[] = INSULATION_MATERIALS.map((m) => ({ value: m.id, label: m.name }));
/** Covers over the lagging, grouped by what one sees on the pipe (the estimate form's very list). */
export const JACKET_OPTION_GROUPS: readonly OptionGroup[] = JACKET_GROUPS.map((group) => ({
  label: group.label,
  options: group.choices.map((c) => ({ value: c.value, label: c.label })),
}));
export const ROOM_OPTIONS: Option[] = AREA_KIND_CHOICES.map((c) => ({ value: c.value, label: c.label }));

export const LAGGING_STATES = [
  { value: 'bare', label: 'Bare' },
  { value: 'damaged', label: 'Partly bare' },
  { value: 'insulated', label: 'Lagged' },
] as const;

export const LAGGING_CONDITION_WORDS = [
  { value: 'sound', label: 'Sound' },
  { value: 'wet', label: 'Wet through' },
  { value: 'crushed', label: 'Crushed' },
] as const;

export const THERMOMETERS = [
  { value: 'contact', label: 'Contact probe' },
  { value: 'infrared', label: 'Infrared' },
] as const;

export function nameOf(options: readonly Option[], id: unknown): string {
  return options.find((o) => o.value === id)?.label ?? (typeof id === 'string' ? id : '—');
}

/** A temperature difference in the reader's unit: "5 K" or "9 °F". */
export function temperatureDifference(kelvin: number, system: UnitSystem): string {
  return system === 'US' ? `${formatNumber(kelvin * 1.8)} °F` : `${formatNumber(kelvin)} K`;
}

/** A field's label and the quantity its number is, for saying a problem again in the reader's units. */
export interface FieldWords {
  readonly label: string;
  readonly quantity?: DisplayQuantity;
}

function limitWords(params: RangeIssueParams): string {
  if (params.limit === 'min') return params.exclusive ? 'more than' : 'at least';
  return params.exclusive ? 'under' : 'at most';
}

/**
 * A range problem in the reader's units: "Measured length must be more than 0 ft; −3 ft was
 * given." Anything else keeps the engine's sentence.
 */
export function problemInUnits(message: string, params: RangeIssueParams | undefined, field: FieldWords | undefined, system: UnitSystem): string {
  if (!params || !field?.quantity) return message;
  const unit = displayUnit(field.quantity, system);
  const say = (si: number) => `${formatNumber(unit.fromBase(si), 4)} ${unit.symbol}`;
  return `${field.label} must be ${limitWords(params)} ${say(params.limitSI)}; ${say(params.givenSI)} was given.`;
}

/** The words of each field of a run the form asks for, by its path inside the run. */
export const RUN_FIELD_WORDS: Readonly<Record<string, FieldWords>> = {
  label: { label: 'Name' },
  lengthM: { label: 'Length', quantity: 'length' },
  'measurements.lengthM': { label: 'Measured length', quantity: 'length' },
  steamGaugePressureKPa: { label: 'Gauge pressure', quantity: 'gaugePressure' },
  fluidTemperatureC: { label: 'Fluid temperature', quantity: 'temperature' },
  'current.bareFraction': { label: 'Share left bare', quantity: 'fraction' },
  'current.thicknessM': { label: 'Lagging thickness', quantity: 'thickness' },
  valves: { label: 'Valves' },
  flangePairs: { label: 'Flange pairs' },
  'measurements.surfaceTemperatureC': { label: 'Surface reading', quantity: 'temperature' },
  'measurements.airTemperatureC': { label: 'Air beside the pipe', quantity: 'temperature' },
  'measurements.infraredEmittanceSetting': { label: 'Emittance set on the thermometer' },
};

/** The words of the air fields of a run's own room, by path inside the area. */
export const ROOM_FIELD_WORDS: Readonly<Record<string, FieldWords>> = {
  'average.airTemperatureC': { label: 'Room air temperature', quantity: 'temperature' },
  'average.relativeHumidityPercent': { label: 'Humidity', quantity: 'percent' },
  'average.airSpeedMPerS': { label: 'Air speed', quantity: 'speed' },
};
