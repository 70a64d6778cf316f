/** One pipe run: what it carries, its pipe, length, condition, surroundings, state today, fittings, proposal, photos. */
import { useFormContext, useWatch } from 'react-hook-form';
import {
  INSULATION_MATERIALS,
  PIPE_MATERIALS,
  PIPE_STANDARDS,
  SERVICE_DEFAULTS,
  serviceDefaults,
  type PipeSizeEntry,
  type PipeStandard,
  type ServiceId,
} from '../../engine';
import { formatQuantity, formatTemperature } from '../../lib/presentation/rounding';
import { BARE_FINISH_CHOICES, FITTING_KIND_CHOICES, JACKET_GROUPS, surfaceLabel } from '../../lib/presentation/pick-lists';
import { displayUnit, formatForInput, type DisplayQuantity, type UnitSystem } from '../../lib/units-display';
import { draftMarket, existingInsulationDefaults, pipeStandard, serviceCondition, type DraftValues } from './draft';
import { ChoiceField, CheckField, NumberField, SureChoice, SelectField, TextField, useHasErrorUnder, useUnitSystem, type Option } from './fields';
import { PhotoPicker } from './PhotoPicker';
import { FittingsList } from './FittingsList';
import { WherePick } from './WherePick';
import { SizeFinder } from './SizeFinder';

interface Props {
  index: number;
  count: number;
  headingRef: (element: HTMLHeadingElement | null) => void;
  onDuplicate: () => void;
  onRemove: () => void;
}

/** The covers, grouped by what a person sees on the pipe. */
const JACKET_OPTION_GROUPS = JACKET_GROUPS.map((group) => ({ label: group.label, options: group.choices.map((c) => ({ value: c.value, label: c.label })) }));

function materialName(id: string | undefined): string {
  return INSULATION_MATERIALS.find((m) => m.id === id)?.name ?? 'the usual material';
}

function jacketName(id: string | undefined): string {
  return id ? surfaceLabel(id) : 'the usual cover';
}

/** Short names for the drop-down: what the pipe is first, its standard after. */
const STANDARD_NAMES: Record<string, string> = {
  'ASME-B36.10M': 'Steel pipe, NPS (ASME B36.10M)',
  'ASME-B36.19M': 'Stainless pipe, NPS (ASME B36.19M)',
  'ASTM-B88-L': 'Copper tube, Type L (ASTM B88)',
  'ASTM-B88-K': 'Copper tube, Type K (ASTM B88)',
  'EN-10220': 'Metric steel tube, DN (EN 10220)',
  'ASTM-A270-SANITARY': 'Food-grade stainless tube, OD (ASTM A270)',
  'DIN-11850-2': 'Metric food-grade stainless tube (DIN 11850)',
};

/** "NPS 2 · 2.375 in OD", "DN50 · 60.3 mm OD", "3/4 in · 0.875 in OD". */
function sizeLabel(standard: PipeStandard, entry: PipeSizeEntry, system: UnitSystem): string {
  // Four figures: people match the catalog's own dimension ("2.375 in").
  const od = formatQuantity(entry.outerDiameterM, 'diameter', system, 4);
  if (standard.id.startsWith('ASME')) return `NPS ${entry.size} · ${od} OD`;
  if (standard.id.startsWith('ASTM')) return `${entry.size} in · ${od} OD`;
  return `${entry.size} · ${od} OD`;
}

function scheduleLabel(standard: PipeStandard, key: string, wallM: number, system: UnitSystem): string {
  const wall = formatQuantity(wallM, 'thickness', system);
  if (standard.id === 'EN-10220') return `${wall} wall`;
  if (standard.id.startsWith('ASTM')) return `Type ${key} · ${wall} wall`;
  const named: Record<string, string> = { STD: 'STD (standard weight)', XS: 'XS (extra strong)' };
  return `${named[key] ?? `Schedule ${key}`} · ${wall} wall`;
}

/** A typical value written exactly as the input would show it, so hint and box agree. */
function typical(value: number, quantity: DisplayQuantity, system: UnitSystem): string {
  return `${formatForInput(value, quantity, system)} ${displayUnit(quantity, system).symbol}`;
}

/** What the usual wall is, said for the standard chosen (it is what a change of standard sets). */
function scheduleHint(standard: PipeStandard, entry: PipeSizeEntry | undefined): string | undefined {
  if (!entry || standard.id === 'EN-10220') return undefined;
  if (standard.id.startsWith('ASTM-B88')) return 'Type L is the usual copper tube for hot and cold water.';
  return `Schedule ${entry.defaultSchedule} is the usual wall for ${standard.id === 'ASME-B36.19M' ? 'stainless lines' : 'steam and water lines'}.`;
}

/** "schedule 40", "Type L", "2.0 mm wall": the chosen wall in a few words. */
function scheduleWords(standard: PipeStandard, key: string): string {
  if (standard.id === 'EN-10220' || standard.id.startsWith('DIN')) return `${key} mm wall`;
  if (standard.id.startsWith('ASTM-B88')) return `Type ${key}`;
  return /^\d/.test(key) ? `schedule ${key}` : key;
}

function pipeMaterialName(id: string | undefined): string {
  const name = PIPE_MATERIALS.find((m) => m.id === id)?.name ?? 'steel';
  return `for ${name.replace(/ tube$/i, '').replace(/ \(.*\)$/, '')}`;
}

/** "2 valves with bolted flanges, 1 steam trap" or "no valves or flanges counted". */
function fittingsWords(fittings: readonly { type?: string; count?: unknown }[] | undefined): string {
  const counted = (fittings ?? []).filter((f) => typeof f.count === 'number' && f.count > 0);
  if (counted.length === 0) return 'no valves or flanges counted';
  return counted
    .map((f) => `${String(f.count)} × ${(FITTING_KIND_CHOICES.find((c) => c.value === f.type)?.label ?? String(f.type)).toLowerCase()}`)
    .join(', ');
}

function closestSize(standard: PipeStandard, nominalInch: number | undefined): PipeSizeEntry | undefined {
  if (nominalInch === undefined) return standard.sizes[0];
  return standard.sizes.reduce<PipeSizeEntry | undefined>(
    (best, entry) => (!best || Math.abs(entry.nominalInch - nominalInch) < Math.abs(best.nominalInch - nominalInch) ? entry : best),
    undefined,
  );
}

export function RunCard({ index, count, headingRef, onDuplicate, onRemove }: Props) {
  const { setValue, getValues } = useFormContext<DraftValues>();
  const system = useUnitSystem();
  const base = `estimate.runs.${index}` as const;
  const run = useWatch<DraftValues, `estimate.runs.${number}`>({ name: base });
  const service = serviceDefaults((run?.service ?? 'steam') as ServiceId);
  const pipe = run?.pipe && 'standard' in run.pipe ? run.pipe : undefined;
  const standard = pipeStandard(pipe?.standard) ?? PIPE_STANDARDS[0];
  const entry = standard?.sizes.find((s) => s.size === pipe?.size);
  const schedules = entry ? Object.entries(entry.wallsM) : [];
  const state = run?.current?.state ?? 'bare';
  const ambient = run?.ambient?.kind ?? 'indoor-still';
  const cold = service.cold;
  const runId = run?.id ?? '';
  const title = run?.label?.trim() ? run.label : `Run ${index + 1}`;
  const headingId = `run-${index}-heading`;

  const dirty = { shouldDirty: true, shouldValidate: false } as const;

  function chooseService(id: string) {
    const chosen = SERVICE_DEFAULTS.find((s) => s.id === id);
    if (!chosen) return;
    const condition = serviceCondition(chosen.id);
    setValue(`${base}.steamGaugePressureKPa`, condition.steamGaugePressureKPa, dirty);
    setValue(`${base}.fluidTemperatureC`, condition.fluidTemperatureC, dirty);
    // A proposal chosen for the old service may not be rated for the new one; fall back to the new service's usual.
    setValue(`${base}.proposed.material`, undefined, dirty);
    setValue(`${base}.proposed.jacket`, undefined, dirty);
  }

  function chooseStandard(id: string) {
    const chosen = pipeStandard(id);
    if (!chosen) return;
    const size = closestSize(chosen, entry?.nominalInch);
    setValue(`${base}.pipe.size`, size?.size ?? '', dirty);
    setValue(`${base}.pipe.schedule`, size?.defaultSchedule, dirty);
    setValue(`${base}.pipe.material`, chosen.defaultMaterial, dirty);
  }

  function chooseSize(size: string) {
    const chosen = standard?.sizes.find((s) => s.size === size);
    const schedule = getValues(`${base}.pipe.schedule`);
    if (chosen && (!schedule || !(schedule in chosen.wallsM))) {
      setValue(`${base}.pipe.schedule`, chosen.defaultSchedule, dirty);
    }
  }

  function chooseState(next: string) {
    if (next === 'bare') return;
    const current = getValues(`${base}.current`);
    const defaults = existingInsulationDefaults(service.id, draftMarket(getValues('plant.countryCode'), system));
    const has = (key: 'material' | 'thicknessM' | 'jacket') =>
      current && current.state !== 'bare' && (current as Record<string, unknown>)[key] !== undefined;
    if (!has('material')) setValue(`${base}.current.material`, defaults.material, dirty);
    if (!has('thicknessM')) setValue(`${base}.current.thicknessM`, defaults.thicknessM, dirty);
    if (!has('jacket')) setValue(`${base}.current.jacket`, defaults.jacket, dirty);
  }

  const insulationOptions: Option[] = INSULATION_MATERIALS.map((m) => ({
    value: m.id,
    label: `${m.name} (${formatTemperature(m.serviceMinC, system)} to ${formatTemperature(m.serviceMaxC, system)})`,
  }));
  const proposalHasError = useHasErrorUnder(`${base}.proposed`);

  const market = draftMarket(getValues('plant.countryCode'), system);
  const detailHasError = useHasErrorUnder(`${base}.pipe`);
  const pipeNow = entry && standard ? `${sizeLabel(standard, entry, system)}${pipe?.schedule && schedules.length > 1 ? `, ${scheduleWords(standard, pipe.schedule)}` : ''}` : 'not chosen yet';
  const areas = useWatch<DraftValues, 'estimate.areas'>({ name: 'estimate.areas' });
  const areaName = run?.areaId ? areas?.find((a) => a.id === run.areaId)?.label?.trim() || undefined : undefined;
  const fittingsNow = fittingsWords(run?.fittings);
  const lineNow =
    service.kind === 'steam'
      ? `${formatQuantity(run?.steamGaugePressureKPa ?? service.typicalGaugePressureKPa ?? 0, 'gaugePressure', system)} steam`
      : formatTemperature(run?.fluidTemperatureC ?? service.typicalTemperatureC, system);

  return (
    <section className={`run-card ${cold ? 'run-card-cold' : 'run-card-hot'}`} aria-labelledby={headingId}>
      <div className="run-card-head">
        <h3 id={headingId} ref={headingRef} tabIndex={-1} className="run-title">
          <span className="run-number">Run {index + 1}</span>
          <span className="run-name">{title}</span>
        </h3>
        <div className="run-actions">
          <button type="button" className="btn btn-quiet btn-small" onClick={onDuplicate} aria-describedby={headingId}>
            Duplicate
          </button>
          {count > 1 && (
            <button type="button" className="btn btn-quiet btn-small" onClick={onRemove} aria-describedby={headingId}>
              Remove
            </button>
          )}
        </div>
      </div>

      <div className="field-grid">
        <TextField name={`${base}.label`} label="Name of the run" hint="What you call it on site, such as “Boiler to kettle 2”." />
        <SelectField
          name={`${base}.service`}
          label="What it carries"
          options={SERVICE_DEFAULTS.map((s) => ({ value: s.id, label: s.name }))}
          onChosen={chooseService}
        />
      </div>

      <fieldset className="group">
        <legend className="group-legend">How big is the pipe?</legend>
        <p className="field-hint run-now">
          Now: <strong>{pipeNow}</strong>. Know the size? Choose it under “More about this run”.
        </p>
        <SizeFinder base={base} market={market} system={system} />
      </fieldset>

      <div className="field-with-guess">
        <NumberField name={`${base}.lengthM`} hint="End to end, bends included. Pacing it out is fine." />
        <SureChoice name={`${base}.lengthConfidence`} about="the length" auto="estimated" />
      </div>

      <WherePick base={base} ambient={ambient} />

      <fieldset className="group">
        <legend className="group-legend">What it looks like today</legend>
        <ChoiceField
          name={`${base}.current.state`}
          legend="The pipe today"
          inline
          onChosen={chooseState}
          options={[
            { value: 'bare', label: 'Bare metal', note: 'no lagging at all' },
            { value: 'damaged', label: 'Lagged, with gaps', note: 'torn, missing or wet in places' },
            { value: 'insulated', label: 'Lagged all along', note: 'whole and dry' },
          ]}
        />
        {state !== 'insulated' && (
          <SelectField
            name={`${base}.finish`}
            label={state === 'bare' ? 'What the bare metal looks like' : 'What the bare parts look like'}
            emptyLabel={`Not sure: usual ${pipeMaterialName(pipe?.material).toLowerCase()}`}
            options={BARE_FINISH_CHOICES.map((c) => ({ value: c.value, label: c.label }))}
            hint={`Shiny metal gives off less heat than rusty or painted metal. ${BARE_FINISH_CHOICES.filter((c) => c.note)
              .map((c) => `${c.label}: ${c.note ?? ''}.`)
              .join(' ')}`}
            optional
          />
        )}
        {state === 'damaged' && (
          <div className="field-with-guess">
            <NumberField name={`${base}.current.bareFraction`} hint="Roughly how much of it is bare: half the lagging missing is 50 %." />
            <SureChoice name={`${base}.current.bareFractionConfidence`} about="the share" auto="estimated" />
          </div>
        )}
        {state !== 'insulated' && (
          <p className="field-hint caution-inline">
            Old lagging can contain asbestos. Leave it as it is: do not strip, cut or sweep it up.
          </p>
        )}
      </fieldset>

      <details className="group run-more" open={detailHasError || undefined}>
        <summary className="group-legend">More about this run</summary>
        <p className="field-hint">
          Usual values are filled in for you: {pipeNow}; {lineNow}; {fittingsNow}. Change what you know.
        </p>

        <fieldset className="group">
          <legend className="group-legend">Pipe</legend>
          <div className="field-grid">
            <SelectField
              name={`${base}.pipe.standard`}
              label="Pipe or tube standard"
              options={PIPE_STANDARDS.map((s) => ({ value: s.id, label: STANDARD_NAMES[s.id] ?? s.name }))}
              onChosen={chooseStandard}
              hint="Steel pipe goes by its NPS, a nominal size in inches that is not its real diameter; copper and food-grade tube by their outside diameter."
            />
            {standard && (
              <SelectField
                name={`${base}.pipe.size`}
                label="Size"
                options={standard.sizes.map((s) => ({ value: s.size, label: sizeLabel(standard, s, system) }))}
                onChosen={chooseSize}
              />
            )}
            {standard && schedules.length > 1 && (
              <SelectField
                name={`${base}.pipe.schedule`}
                label={standard.id === 'EN-10220' ? 'Wall thickness' : 'Schedule (wall thickness)'}
                options={schedules.map(([key, wall]) => ({ value: key, label: scheduleLabel(standard, key, wall, system) }))}
                hint={scheduleHint(standard, entry)}
              />
            )}
            <SelectField
              name={`${base}.pipe.material`}
              label="Pipe material"
              options={PIPE_MATERIALS.map((m) => ({ value: m.id, label: m.name }))}
            />
          </div>
        </fieldset>

        {service.kind === 'steam' ? (
          <NumberField
            key="steam"
            name={`${base}.steamGaugePressureKPa`}
            className="max-w-sm"
            hint={`What the gauge on the line reads. Usual for process steam: ${typical(service.typicalGaugePressureKPa ?? 0, 'gaugePressure', system)}.`}
          />
        ) : (
          <NumberField
            key="liquid"
            name={`${base}.fluidTemperatureC`}
            signed
            className="max-w-sm"
            hint={`Usual for ${service.name.toLowerCase()}: ${typical(service.typicalTemperatureC, 'temperature', system)}.`}
          />
        )}

        {areaName ? (
          <p className="field-hint run-air-note">
            It runs in “{areaName}”: its air is set there, under “Areas of your plant” below the runs.
          </p>
        ) : (
          <>
            <ChoiceField
              name={`${base}.ambient.kind`}
              legend="The air right at this run"
              hint="The plant’s air from the first step, unless the run is in one of your areas."
              inline
              options={[
                { value: 'indoor-still', label: 'Indoors, still air' },
                { value: 'indoor-draughty', label: 'Indoors, in a draft', note: 'near doors or fans' },
                { value: 'outdoor', label: 'Outdoors', note: 'in the wind' },
              ]}
            />
            {ambient === 'outdoor' && (
              <NumberField
                name={`${base}.ambient.windSpeedMPerS`}
                optional
                hint="Leave it empty to use the plant’s typical wind speed."
                className="max-w-sm"
              />
            )}
          </>
        )}

        {state !== 'bare' && (
          <fieldset className="group">
            <legend className="group-legend">The lagging on it</legend>
            <div className="field-grid">
              <SelectField name={`${base}.current.material`} label="Insulation on it" options={insulationOptions} />
              <NumberField name={`${base}.current.thicknessM`} />
              <SelectField name={`${base}.current.jacket`} label="Its outer covering" groups={JACKET_OPTION_GROUPS} />
            </div>
          </fieldset>
        )}

        <FittingsList base={base} lagged={state !== 'bare'} runTitle={title} />

        <details className="group proposal" open={proposalHasError || undefined}>
          <summary className="group-legend">
            Proposed insulation <span className="field-optional">(optional)</span>
          </summary>
          <p className="field-hint">
            Left as they are, Lagwise proposes {materialName(service.defaultInsulation).toLowerCase()} in{' '}
            {jacketName(service.defaultJacket).toLowerCase()}, at the thickness that costs least over the years counted
            {cold ? ', and never thinner than keeps the surface above the dew point' : ', and never thinner than keeps the surface safe to touch'}.
          </p>
          <div className="field-grid">
            <SelectField
              name={`${base}.proposed.material`}
              label="Material"
              emptyLabel={`Usual for ${service.name.toLowerCase()}: ${materialName(service.defaultInsulation)}`}
              options={insulationOptions}
            />
            <NumberField
              name={`${base}.proposed.thicknessM`}
              optional
              hint="Leave it empty and Lagwise picks the thickness that costs least over the years counted."
            />
            <SelectField
              name={`${base}.proposed.jacket`}
              label="Outer covering"
              emptyLabel={`Usual: ${jacketName(service.defaultJacket)}`}
              groups={JACKET_OPTION_GROUPS}
            />
            <CheckField name={`${base}.proposed.coverFittings`} label="Fit removable covers on valves and flanges" />
          </div>
        </details>
      </details>

      <PhotoPicker runId={runId} runTitle={title} />
    </section>
  );
}
