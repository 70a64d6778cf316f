/**
 * The estimate draft: what the wizard's form holds (the very shape the assessment schema
 * parses), its starting values taken from the engine's own defaults, the steps it is split
 * into, and the PlantInput and assessment bodies made from it.
 */
import {
  AREA_PRESETS,
  FUELS,
  PIPE_STANDARDS,
  MARKETS,
  MARKET_IDS,
  marketForCountry,
  EXISTING_LAGGING_DEFAULTS,
  PLANT_INPUT_DEFAULTS,
  serviceDefaults,
  type FuelId,
  type FuelPriceUnit,
  type MarketId,
  type PipeStandardId,
  type PlantInput,
  type PlantRunInput,
  type ServiceId,
  type AreaPresetId,
} from '../../engine';
import type { CreateAssessmentInput } from '../../schemas/assessment';
import type { UnitSystem } from '../../lib/units-display';

/** The form's values: exactly what POST /api/assessments parses. */
export type DraftValues = CreateAssessmentInput;
export type DraftRun = PlantRunInput;
export type DraftArea = NonNullable<PlantInput['areas']>[number];

export const STEPS = [
  { id: 'plant', title: 'Plant', heading: 'Your plant' },
  { id: 'energy', title: 'Energy', heading: 'Fuel and its price' },
  { id: 'runs', title: 'Pipe runs', heading: 'Pipe runs' },
  { id: 'results', title: 'Results', heading: 'The figures for your plant' },
  { id: 'contact', title: 'Contact', heading: 'Send it to a consultant' },
] as const;

export type StepId = (typeof STEPS)[number]['id'];
export const STEP_IDS = STEPS.map((s) => s.id) as readonly StepId[];

export function stepIndex(step: StepId): number {
  return STEP_IDS.indexOf(step);
}

export function isStepId(value: unknown): value is StepId {
  return typeof value === 'string' && (STEP_IDS as readonly string[]).includes(value);
}

/** The form paths each step asks for, validated together when the person moves on. */
export const STEP_FIELDS = {
  plant: ['plant', 'estimate.unitSystem', 'estimate.operatingHoursPerYear', 'estimate.operatingHoursConfidence', 'estimate.conditions'],
  energy: ['estimate.energy', 'estimate.economics'],
  runs: ['estimate.runs', 'estimate.areas'],
  results: [],
  contact: ['contact', 'consent', 'website'],
} as const satisfies Record<StepId, readonly string[]>;

/** The step where a field (by its dotted path, as the server reports it) is asked. */
export function stepOfPath(path: string): StepId {
  for (const step of STEP_IDS) {
    if (STEP_FIELDS[step].some((prefix: string) => path === prefix || path.startsWith(`${prefix}.`))) return step;
  }
  // Anything else of the estimate (a photo of a run, a plant-wide rule) is settled on the runs step.
  return path.startsWith('contact') ? 'contact' : path.startsWith('plant') ? 'plant' : 'runs';
}

/** The engine's defaults for the plant's conditions, economics and hours (what its schema fills in). */
export const PLANT_DEFAULTS = {
  operatingHoursPerYear: PLANT_INPUT_DEFAULTS.operatingHoursPerYear,
  conditions: { ...PLANT_INPUT_DEFAULTS.conditions, design: {}, confidence: 'guessed' as const },
  economics: PLANT_INPUT_DEFAULTS.economics,
  currency: PLANT_INPUT_DEFAULTS.currency,
};

function findMarket(id: MarketId) {
  return MARKETS.find((m) => m.id === id) ?? MARKETS[0];
}

/**
 * The market a draft's catalogs and stock series follow: the plant's country. Before a
 * country is chosen, the likeliest from the display units (a first guess the country then
 * settles); switching units later never changes it.
 */
export function draftMarket(countryCode: string | undefined, system: UnitSystem): MarketId {
  return countryCode ? marketForCountry(countryCode) : system === 'US' ? 'US' : 'EU';
}

/**
 * What a damaged or insulated run starts with in the form: the service's usual material, the
 * market's 1-inch or 25 mm stock thickness, and the engine's default covering for existing lagging.
 */
export function existingInsulationDefaults(service: ServiceId, market: MarketId) {
  return {
    material: serviceDefaults(service).defaultInsulation,
    thicknessM: findMarket(market).stockSeries === 'inch' ? 0.0254 : 0.025,
    jacket: EXISTING_LAGGING_DEFAULTS.jacket,
  };
}

export function fuelById(id: string | undefined) {
  return FUELS.find((f) => f.id === id);
}

export function pipeStandard(id: string | undefined) {
  return PIPE_STANDARDS.find((s) => s.id === id);
}

/** Currencies offered, with the country each is the default of. */
export const CURRENCIES = [
  { code: 'USD', name: 'US dollar' },
  { code: 'CAD', name: 'Canadian dollar' },
  { code: 'GBP', name: 'Pound sterling' },
  { code: 'EUR', name: 'Euro' },
  { code: 'AUD', name: 'Australian dollar' },
  { code: 'NZD', name: 'New Zealand dollar' },
  { code: 'DKK', name: 'Danish krone' },
  { code: 'SEK', name: 'Swedish krona' },
  { code: 'NOK', name: 'Norwegian krone' },
] as const;

const COUNTRY_CURRENCY: Record<string, string> = {
  US: 'USD',
  CA: 'CAD',
  GB: 'GBP',
  IE: 'EUR',
  AU: 'AUD',
  NZ: 'NZD',
  DE: 'EUR',
  FR: 'EUR',
  NL: 'EUR',
  BE: 'EUR',
  DK: 'DKK',
  SE: 'SEK',
  NO: 'NOK',
};

export function currencyOfCountry(countryCode: string): string | undefined {
  return COUNTRY_CURRENCY[countryCode];
}

/** The unit a fuel is billed in by default in a market: therms and gallons in North America, metric elsewhere. */
export function defaultPriceUnit(fuelId: FuelId, market: MarketId): FuelPriceUnit {
  const fuel = fuelById(fuelId);
  if (!fuel) return 'kWh';
  const metric: readonly FuelPriceUnit[] = ['m3', 'litre', 'kWh'];
  if (findMarket(market).stockSeries === 'mm') return fuel.priceUnits.find((u) => metric.includes(u)) ?? fuel.defaultPriceUnit;
  return fuel.defaultPriceUnit;
}

/** The steam pressure or fluid temperature a run of this service starts with. */
export function serviceCondition(service: ServiceId): Pick<DraftRun, 'steamGaugePressureKPa' | 'fluidTemperatureC'> {
  const defaults = serviceDefaults(service);
  return defaults.kind === 'steam'
    ? { steamGaugePressureKPa: defaults.typicalGaugePressureKPa ?? undefined, fluidTemperatureC: undefined }
    : { steamGaugePressureKPa: undefined, fluidTemperatureC: defaults.typicalTemperatureC };
}

/** The pipe a new run starts with: the market's steel pipe at 2 inch / DN50, its usual wall (schedule 40). */
export function defaultPipe(market: MarketId, standardId?: PipeStandardId): DraftRun['pipe'] {
  const standard = pipeStandard(standardId ?? findMarket(market).pipeStandard) ?? PIPE_STANDARDS[0];
  if (!standard) throw new RangeError('The engine lists no pipe standard.');
  const entry = standard.sizes.find((s) => s.dn === 50) ?? standard.sizes[0];
  return {
    standard: standard.id,
    size: entry?.size ?? '',
    schedule: entry?.defaultSchedule,
    material: standard.defaultMaterial,
  };
}

const sameJson = (a: unknown, b: unknown) => JSON.stringify(a) === JSON.stringify(b);

/**
 * What choosing the plant's country settles: runs still on a market's starting pipe take this
 * market's, and a price unit still at a market's starting unit takes this market's. Anything
 * the person chose stays as they chose it.
 */
export function settleMarket(
  values: Pick<DraftValues, 'estimate'>,
  market: MarketId,
): { priceUnit: FuelPriceUnit | undefined; runPipes: { index: number; pipe: DraftRun['pipe'] }[] } {
  const markets = MARKET_IDS;
  const fuel = values.estimate.energy.fuel ?? 'natural-gas';
  const startingUnits = new Set(markets.map((m) => defaultPriceUnit(fuel, m)));
  const current = values.estimate.energy.priceUnit;
  const priceUnit = current === undefined || startingUnits.has(current) ? defaultPriceUnit(fuel, market) : undefined;
  const startingPipes = markets.map((m) => defaultPipe(m));
  const target = defaultPipe(market);
  const runPipes = values.estimate.runs.flatMap((run, index) =>
    startingPipes.some((pipe) => sameJson(pipe, run.pipe)) && !sameJson(run.pipe, target) ? [{ index, pipe: target }] : [],
  );
  return { priceUnit: priceUnit !== current ? priceUnit : undefined, runPipes };
}

/**
 * A run id: short, unique within the draft and safe in a form part name
 * (`photos.<runId>`). Random rather than counted so a duplicate never collides.
 */
export function newRunId(): string {
  const bytes = new Uint8Array(6);
  crypto.getRandomValues(bytes);
  return `run-${Array.from(bytes, (b) => b.toString(16).padStart(2, '0')).join('')}`;
}

/** A UUID v4 from getRandomValues, which (unlike randomUUID) works outside secure contexts too. */
export function newIdempotencyKey(): string {
  const bytes = new Uint8Array(16);
  crypto.getRandomValues(bytes);
  bytes[6] = ((bytes[6] ?? 0) & 0x0f) | 0x40;
  bytes[8] = ((bytes[8] ?? 0) & 0x3f) | 0x80;
  const hex = Array.from(bytes, (b) => b.toString(16).padStart(2, '0')).join('');
  return `${hex.slice(0, 8)}-${hex.slice(8, 12)}-${hex.slice(12, 16)}-${hex.slice(16, 20)}-${hex.slice(20)}`;
}

/**
 * Stands in for a required answer the person has not given yet (a length, a price): the
 * form holds it empty and the schema reports it in its own words until it is filled.
 */
function notYetAnswered<T>(): T {
  return undefined as T;
}

export function newRun(market: MarketId, number: number, service: ServiceId = 'steam'): DraftRun {
  return {
    id: newRunId(),
    label: `Run ${number}`,
    service,
    pipe: defaultPipe(market),
    lengthM: notYetAnswered<number>(),
    ...serviceCondition(service),
    ambient: { kind: 'indoor-still' },
    current: { state: 'bare' },
    fittings: [],
    proposed: { coverFittings: true },
  };
}

/** The preset of an area kind (the engine's typical air for it). */
export function areaPreset(id: string | undefined) {
  return AREA_PRESETS.find((p) => p.id === id);
}

/**
 * A new area of a kind, named as the kind and with an id unique in the draft
 * (`washdown-room`, then `washdown-room-2`); its air is left to the kind's typical values.
 */
export function newArea(preset: AreaPresetId, existing: readonly Pick<DraftArea, 'id' | 'label'>[]): DraftArea {
  const ids = new Set(existing.map((a) => a.id));
  let id: string = preset;
  for (let n = 2; ids.has(id); n++) id = `${preset}-${n}`;
  const name = areaPreset(preset)?.name ?? 'Area';
  const sameName = existing.filter((a) => a.label === name || a.label?.startsWith(`${name} `)).length;
  return { id, label: sameName > 0 ? `${name} ${sameName + 1}` : name, preset, average: {}, design: {} };
}

const isRecord = (value: unknown): value is Record<string, unknown> => typeof value === 'object' && value !== null && !Array.isArray(value);
const countOf = (value: unknown) => (typeof value === 'number' && Number.isInteger(value) && value > 0 ? value : 0);

/**
 * A draft kept by an older version of the form, brought to today's shape: a list of areas
 * where there was none, the air's confidence left for the person to say, and the older valve and flange-pair counts (with "its valves and
 * flanges are lagged too") moved into the run's list of fittings, which the form now offers.
 */
export function migrateDraft(stored: Partial<DraftValues>): Partial<DraftValues> {
  const estimate: unknown = stored.estimate;
  if (!isRecord(estimate)) return stored;
  const runs = Array.isArray(estimate.runs) ? estimate.runs : [];
  const migratedRuns = runs.map((run: unknown) => {
    if (!isRecord(run)) return run;
    const { valves, flangePairs, fittingsInsulated, ...rest } = run;
    const state = isRecord(run.current) ? run.current.state : 'bare';
    const covered = fittingsInsulated === true && state !== 'bare';
    const fittings = Array.isArray(run.fittings) ? [...(run.fittings as unknown[])] : [];
    if (countOf(valves) > 0) fittings.push({ type: 'valve-flanged', count: countOf(valves), covered });
    if (countOf(flangePairs) > 0) fittings.push({ type: 'flange-pair', count: countOf(flangePairs), covered });
    return { ...rest, fittings };
  });
  const older = !Array.isArray(estimate.areas);
  const areas = Array.isArray(estimate.areas) ? estimate.areas : [];
  // The older form filled in the air's confidence itself ('guessed') and never let anyone change it.
  const conditions = isRecord(estimate.conditions) && older ? (({ confidence: _filled, ...rest }) => rest)(estimate.conditions) : estimate.conditions;
  return { ...stored, estimate: { ...estimate, ...(conditions !== undefined ? { conditions } : {}), areas, runs: migratedRuns } as DraftValues['estimate'] };
}

/** A copy of a run with its own id, placed after it; photos stay with the original. */
export function duplicateRun(run: DraftRun): DraftRun {
  const copy = structuredClone(run);
  return { ...copy, id: newRunId(), label: `${run.label ?? 'Run'} (copy)`.slice(0, 120) };
}

/** The unit system a first-time visitor most likely reads. */
export function guessUnitSystem(): UnitSystem {
  const language = typeof navigator === 'undefined' ? '' : navigator.language;
  return /^(en-US|en-LR|es-US)$/i.test(language) ? 'US' : 'SI';
}

/** The plant-wide air the form fills in, without a confidence: that is said by the person or worked out when sent. */
function startingConditions(): DraftValues['estimate']['conditions'] {
  const { confidence: _unsaid, ...conditions } = PLANT_DEFAULTS.conditions;
  return conditions;
}

export function freshValues(system: UnitSystem = guessUnitSystem()): DraftValues {
  const fuel: FuelId = 'natural-gas';
  const market = draftMarket(undefined, system);
  return {
    contact: { name: '', company: '', email: '', phone: '' },
    plant: { plantName: '', plantType: notYetAnswered<DraftValues['plant']['plantType']>(), countryCode: '', postalCode: '' },
    estimate: {
      unitSystem: system,
      operatingHoursPerYear: PLANT_DEFAULTS.operatingHoursPerYear,
      conditions: startingConditions(),
      energy: {
        fuel,
        price: notYetAnswered<number>(),
        priceUnit: defaultPriceUnit(fuel, market),
        currency: PLANT_DEFAULTS.currency,
      },
      economics: {
        horizonYears: PLANT_DEFAULTS.economics.horizonYears,
        discountRatePercent: PLANT_DEFAULTS.economics.discountRatePercent,
        fuelEscalationPercent: PLANT_DEFAULTS.economics.fuelEscalationPercent,
      },
      areas: [],
      runs: [newRun(market, 1)],
    },
    consent: notYetAnswered<true>(),
    website: '',
  };
}
