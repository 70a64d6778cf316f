/**
 * How a diff of two inventory states reads: each changed input as a short phrase in the
 * reader's units, each figure by its name, each hazard by its flag. Pure: the lead page and
 * the site-walk island write the same phrases. Figures are written by the formatter handed in
 * (the shared presentation's), never rounded here.
 */
import { INSULATION_MATERIALS, PIPE_MATERIALS, SERVICE_DEFAULTS, type RunWarningCode } from '../../engine';
import { AREA_KIND_CHOICES, displayFormat, surfaceLabel, type DisplayFormat, type UnitSystem } from '../presentation';
import type { InputChange, InputField, RunFigureChange, TotalFigureChange } from '../../schemas/revisions';

/** The formatters a diff is written with: the shared presentation's, so a diff rounds as every other page. */
export type DiffFormat = Pick<DisplayFormat, 'system' | 'quantity' | 'temperature' | 'thickness' | 'money' | 'years' | 'percent' | 'co2'>;

/** The shared presentation's formatters for a reader in `system` and a plant paying in `currency`. */
export function diffFormat(system: UnitSystem, currency: string): DiffFormat {
  return displayFormat({ system, currency });
}

/** What each compared input is called. */
export const INPUT_WORDS: Readonly<Record<InputField, string>> = {
  label: 'Name',
  service: 'What it carries',
  length: 'Length',
  pipe: 'Pipe',
  line: 'Runs at',
  lagging: 'Lagging',
  bareFraction: 'Left bare',
  laggingCondition: 'Condition of the lagging',
  jacket: 'Cover over the lagging',
  fittings: 'Valves and flanges',
  room: 'Air around it',
  surfaceReading: 'Surface reading',
};

/** What each compared figure of a run is called. */
export const RUN_FIGURE_WORDS: Readonly<Record<RunFigureChange['figure'], string>> = {
  heatLossWPerM: 'Heat through each length',
  annualHeatGJ: 'Heat a year',
  annualCost: 'Cost a year',
  annualSaving: 'Saving a year',
  installedCost: 'Installed cost',
  paybackYears: 'Pays back in',
  surfaceTemperatureC: 'Surface',
};

/** What each compared plant figure is called. */
export const TOTAL_FIGURE_WORDS: Readonly<Record<TotalFigureChange['figure'], string>> = {
  annualCost: 'Lost a year',
  annualHeatGJ: 'Energy lost a year',
  annualCo2Kg: 'CO₂ a year',
  annualSaving: 'Saving a year',
  installedCost: 'Installed cost',
  paybackYears: 'Pays back in',
  runsWithHazards: 'Runs with a hazard',
};

/** A hazard's short flag: always words, never color alone. */
export const HAZARD_WORDS: Readonly<Record<RunWarningCode, string>> = {
  SURFACE_ABOVE_TOUCH_LIMIT: 'Burns on touch',
  SURFACE_BELOW_DEW_POINT: 'Sweats below the dew point',
  MATERIAL_ABOVE_SERVICE_LIMIT: 'Lagging too hot for its rating',
  MATERIAL_BELOW_SERVICE_LIMIT: 'Lagging too cold for its rating',
  INSULATION_BELOW_CRITICAL_RADIUS: 'Layer too thin to help',
  RAYLEIGH_BEYOND_CORRELATION: 'Approximate: very large line',
  BARE_FITTINGS_ABOVE_TOUCH_LIMIT: 'Bare fittings burn',
  BARE_FITTINGS_BELOW_DEW_POINT: 'Bare fittings drip',
};

export function hazardWords(code: string): string {
  return Object.hasOwn(HAZARD_WORDS, code) ? HAZARD_WORDS[code as RunWarningCode] : code;
}

const name = (list: readonly { id: string; name: string }[], id: string | null | undefined, fallback = '—') =>
  (id && list.find((item) => item.id === id)?.name) || id || fallback;

const PIPE_KIND: Readonly<Record<string, string>> = {
  'ASME-B36.10M': 'steel pipe',
  'ASME-B36.19M': 'stainless pipe',
  'ASTM-B88-L': 'copper tube, type L',
  'ASTM-B88-K': 'copper tube, type K',
  'EN-10220': 'metric steel tube',
  'ASTM-A270-SANITARY': 'sanitary tube',
  'DIN-11850-2': 'metric sanitary tube',
};

/** A pipe as a fitter says it: "2 in steel pipe, schedule 40, carbon steel". */
export function pipeWords(pipe: { standard: string | null; size: string | null; schedule: string | null; material: string | null; outerDiameterM: number | null }, f: DiffFormat): string {
  if (pipe.outerDiameterM !== null) return `${f.quantity(pipe.outerDiameterM, 'diameter')} across`;
  const size = pipe.size ? `${pipe.size}${/^\d/.test(pipe.size) ? ' in' : ''}` : '';
  const kind = (pipe.standard && PIPE_KIND[pipe.standard]) ?? pipe.standard ?? 'pipe';
  const schedule = pipe.schedule ? (/^\d/.test(pipe.schedule) ? `schedule ${pipe.schedule}` : pipe.schedule) : null;
  const material = pipe.material ? name(PIPE_MATERIALS, pipe.material).toLowerCase() : null;
  return [`${size} ${kind}`.trim(), schedule, material].filter(Boolean).join(', ');
}

/** One side of a changed input, in the reader's units; "—" where it was not given. */
export function inputWords(change: InputChange, side: 'before' | 'after', f: DiffFormat): string {
  const none = '—';
  switch (change.field) {
    case 'label':
      return change[side] ?? none;
    case 'service': {
      const id = change[side];
      return id ? name(SERVICE_DEFAULTS.map((s) => ({ id: s.id, name: s.name })), id) : none;
    }
    case 'length': {
      const v = change[side];
      return v ? `${f.quantity(v.lengthM, 'length')}${v.measured ? ', measured' : ''}` : none;
    }
    case 'pipe': {
      const v = change[side];
      return v ? pipeWords(v, f) : none;
    }
    case 'line': {
      const v = change[side];
      if (!v) return none;
      if (v.steamGaugePressureKPa !== null) return `${f.quantity(v.steamGaugePressureKPa, 'gaugePressure')}`;
      if (v.fluidTemperatureC !== null) return f.temperature(v.fluidTemperatureC);
      return 'the usual for its service';
    }
    case 'lagging': {
      const v = change[side];
      if (!v) return none;
      if (v.state === 'bare') return 'Bare';
      const what = `${v.thicknessM !== null ? `${f.thickness(v.thicknessM)} of ` : ''}${name(INSULATION_MATERIALS, v.material, 'lagging').toLowerCase()}`;
      return v.state === 'damaged' ? `Partly bare: ${what}` : `Lagged: ${what}`;
    }
    case 'bareFraction': {
      const v = change[side];
      return v === null ? none : `${f.percent(v)} of it`;
    }
    case 'laggingCondition': {
      const v = change[side];
      return v === null ? none : v === 'wet' ? 'Wet through' : v === 'crushed' ? 'Crushed' : 'Sound';
    }
    case 'jacket':
      return change[side] === null ? none : surfaceLabel(change[side]);
    case 'fittings': {
      const v = change[side];
      if (!v) return none;
      const count = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;
      const parts = [count(v.valves, 'valve', 'valves'), count(v.flangePairs, 'flange pair', 'flange pairs'), ...v.others.map((o) => `${o.count} × ${o.type.replace(/-/g, ' ')}`)];
      return `${parts.join(', ')}${v.covered ? ', under covers' : ''}`;
    }
    case 'room': {
      const v = change[side];
      if (!v) return none;
      const preset = AREA_KIND_CHOICES.find((c) => v.areaId === c.value)?.label;
      const where = v.areaId.startsWith('walk-room-') ? 'measured on the walk' : v.areaId === 'indoor' ? 'indoors' : v.areaId === 'outdoor' ? 'outdoors' : (preset ?? v.areaId);
      return `${f.temperature(v.airTemperatureC)}, ${Math.round(v.relativeHumidityPercent)} % humidity, air at ${f.quantity(v.airSpeedMPerS, 'speed')} (${where})`;
    }
    case 'surfaceReading': {
      const v = change[side];
      if (!v) return 'none taken';
      const how = v.method === 'infrared' ? `infrared${v.infraredEmittanceSetting !== null ? ` set to ${v.infraredEmittanceSetting}` : ''}` : 'contact probe';
      return `${f.temperature(v.surfaceTemperatureC)} by ${how}${v.airTemperatureC !== null ? `, air ${f.temperature(v.airTemperatureC)}` : ''}`;
    }
  }
}

/** A run's figure in the reader's units; "—" where the run did not exist. */
export function runFigureWords(figure: RunFigureChange['figure'], value: number | null, cold: boolean, f: DiffFormat): string {
  if (value === null) return figure === 'paybackYears' ? f.years(null) : '—';
  switch (figure) {
    case 'heatLossWPerM':
      return `${f.quantity(Math.abs(value), 'heatPerLength')} ${cold ? 'gained' : 'lost'}`;
    case 'annualHeatGJ':
      return f.quantity(value, 'energyPerYear');
    case 'annualCost':
    case 'annualSaving':
    case 'installedCost':
      return f.money(value);
    case 'paybackYears':
      return f.years(value);
    case 'surfaceTemperatureC':
      return f.temperature(value);
  }
}

/** A plant figure in the reader's units. */
export function totalFigureWords(figure: TotalFigureChange['figure'], value: number | null, f: DiffFormat): string {
  if (value === null) return figure === 'paybackYears' ? f.years(null) : '—';
  switch (figure) {
    case 'annualCost':
    case 'annualSaving':
    case 'installedCost':
      return f.money(value);
    case 'annualHeatGJ':
      return f.quantity(value, 'energyPerYear');
    case 'annualCo2Kg':
      return f.co2(value);
    case 'paybackYears':
      return f.years(value);
    case 'runsWithHazards':
      return String(value);
  }
}
