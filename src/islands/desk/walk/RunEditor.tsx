/**
 * One run on the site walk: its figures before and now at the top, and — opened — every
 * correction a consultant makes standing beside it: the length measured, the pipe, what it
 * runs at, the lagging as found, valves and flanges, the air around it, and a surface reading.
 */
import { serviceDefaults, type ServiceId } from '../../../engine';
import { displayFormat, formatQuantity, type UnitSystem } from '../../../lib/presentation';
import { getIn, presetOf, setIn, setRoom, updateRun, walkRoomOf, type RunInput, type WalkBase, type WalkDraft } from './draft';
import { CheckInput, Choices, Counter, NumberInput, SelectInput, TextInput } from './fields';
import type { RunFigures } from './figures';
import {
  INSULATION_OPTIONS,
  JACKET_OPTION_GROUPS,
  LAGGING_CONDITION_WORDS,
  LAGGING_STATES,
  PIPE_MATERIAL_OPTIONS,
  ROOM_OPTIONS,
  SERVICE_OPTIONS,
  STANDARD_OPTIONS,
  THERMOMETERS,
  nameOf,
  scheduleOptions,
  sizeOptions,
  standardOf,
  temperatureDifference,
} from './words';

export interface RunEditorProps {
  run: RunInput;
  draft: WalkDraft;
  base: WalkBase;
  status: 'added' | 'changed' | 'unchanged';
  removed: boolean;
  open: boolean;
  system: UnitSystem;
  currency: string;
  before: RunFigures | undefined;
  now: RunFigures | undefined;
  /** Problems by the field's path inside the run (`measurements.surfaceTemperatureC`), or `room.<path>`. */
  problems: Readonly<Record<string, string>>;
  onChange: (next: (draft: WalkDraft) => WalkDraft) => void;
  onToggle: (open: boolean) => void;
  onRemove: () => void;
  onRestore: () => void;
  onResetRoom: () => void;
}

function fieldId(runId: string, path: string): string {
  return `walk-${runId.replace(/[^A-Za-z0-9_-]/g, '-')}-${path.replace(/\./g, '-')}`;
}

function loss(figures: RunFigures, system: UnitSystem): string {
  return `${formatQuantity(Math.abs(figures.heatLossWPerM), 'heatPerLength', system)} ${figures.cold ? 'gained' : 'lost'}`;
}

function FigureLine({ label, figures, system, currency }: { label: string; figures: RunFigures; system: UnitSystem; currency: string }) {
  const f = displayFormat({ system, currency });
  return (
    <p className="walk-figure-line">
      <span className="walk-figure-label">{label}</span> {loss(figures, system)} · {f.money(figures.annualCost)} a year · saves{' '}
      {f.money(figures.annualSaving)} · pays back {f.years(figures.paybackYears)}
    </p>
  );
}

const STATUS_WORDS = { added: 'Found on the walk', changed: 'Corrected', unchanged: 'As it was' } as const;

export function RunEditor(props: RunEditorProps) {
  const { run, draft, base, status, removed, open, system, currency, before, now, problems, onChange, onToggle } = props;
  const id = (path: string) => fieldId(run.id, path);
  const set = (path: string, value: unknown) => onChange((d) => updateRun(d, run.id, (r) => setIn(r, path, value)));
  const value = (path: string) => getIn(run, path);
  const number = (path: string) => {
    const v = value(path);
    return typeof v === 'number' ? v : 0;
  };
  const service = serviceDefaults(run.service as ServiceId);
  const pipe = (run.pipe ?? {}) as { standard?: string; size?: string; schedule?: string; material?: string };
  const standard = standardOf(pipe.standard);
  const baseRun = base.runs.find((r) => r.id === run.id);
  const state = (run.current?.state ?? 'bare') as 'bare' | 'damaged' | 'insulated';
  const measurements = run.measurements ?? {};
  const infrared = measurements.surfaceMethod === 'infrared';
  const room = walkRoomOf(draft, run.id);
  const headingId = id('heading');
  const reading = now?.measurements;

  function chooseStandard(standardId: string) {
    const chosen = standardOf(standardId);
    if (!chosen) return;
    const size = chosen.sizes.find((s) => s.size === pipe.size) ?? chosen.sizes[Math.min(3, chosen.sizes.length - 1)];
    set('pipe', { standard: chosen.id, size: size?.size ?? '', schedule: size?.defaultSchedule, material: chosen.defaultMaterial });
  }

  function chooseSize(size: string) {
    const entry = standard?.sizes.find((s) => s.size === size);
    set('pipe', { ...pipe, size, schedule: entry && pipe.schedule && pipe.schedule in entry.wallsM ? pipe.schedule : entry?.defaultSchedule });
  }

  function chooseService(serviceId: string) {
    const chosen = serviceDefaults(serviceId as ServiceId);
    onChange((d) =>
      updateRun(d, run.id, (r) => {
        // What it runs at belongs to the old service; empty means the new one's usual figure.
        const { steamGaugePressureKPa: _p, fluidTemperatureC: _t, ...rest } = r;
        return { ...rest, service: chosen.id };
      }),
    );
  }

  function chooseState(next: 'bare' | 'damaged' | 'insulated') {
    const current = (run.current ?? { state: 'bare' }) as Record<string, unknown>;
    if (next === 'bare') return set('current', { state: 'bare' });
    const lagging = {
      material: (current.material as string | undefined) ?? service.defaultInsulation,
      thicknessM: (current.thicknessM as number | undefined) ?? (system === 'US' ? 0.0254 : 0.025),
      jacket: (current.jacket as string | undefined) ?? 'all-service-jacket',
      condition: (current.condition as string | undefined) ?? 'sound',
    };
    set('current', next === 'damaged' ? { state: 'damaged', bareFraction: (current.bareFraction as number | undefined) ?? 0.5, ...lagging } : { state: 'insulated', ...lagging });
  }

  function setReading(path: string, v: unknown) {
    onChange((d) =>
      updateRun(d, run.id, (r) => {
        let next = setIn(r, `measurements.${path}`, v);
        // The time of the reading goes with its first figure.
        if (path === 'surfaceTemperatureC' && v !== undefined && !getIn(next, 'measurements.takenAt')) next = setIn(next, 'measurements.takenAt', new Date().toISOString());
        return next;
      }),
    );
  }

  const lineProblem = problems.steamGaugePressureKPa ?? problems.fluidTemperatureC;

  return (
    <article className="walk-run" data-status={removed ? 'removed' : status} aria-labelledby={headingId}>
      <header className="walk-run-head">
        <div>
          <h3 id={headingId} className="walk-run-title">
            {run.label || 'Unnamed run'}
          </h3>
          <p className="walk-run-meta">
            {service.name} · {pipe.size ?? '?'} {standard ? nameOf(STANDARD_OPTIONS, standard.id).split(' (')[0]?.toLowerCase() : ''} ·{' '}
            {formatQuantity((measurements.lengthM as number | undefined) ?? run.lengthM, 'length', system)}
          </p>
        </div>
        <span className="walk-badge" data-status={removed ? 'removed' : status}>
          {removed ? 'To be removed' : STATUS_WORDS[status]}
        </span>
      </header>

      {!removed && (before || now) ? (
        <div className="walk-figures">
          {before && status !== 'added' ? <FigureLine label="Before:" figures={before} system={system} currency={currency} /> : null}
          {now ? <FigureLine label="Now:" figures={now} system={system} currency={currency} /> : <p className="walk-figure-line">Figures follow once the run’s answers are complete.</p>}
          {now?.hazards.length ? (
            <ul className="walk-hazards">
              {now.hazards.map((h) => (
                <li key={h.code}>{h.message}</li>
              ))}
            </ul>
          ) : null}
        </div>
      ) : null}

      {removed ? (
        <div className="walk-run-actions">
          <p>This run leaves the inventory when the revision is saved.</p>
          <button type="button" className="btn btn-quiet" onClick={props.onRestore}>
            Keep this run
          </button>
        </div>
      ) : (
        <details className="walk-edit" open={open} onToggle={(event) => onToggle((event.currentTarget as HTMLDetailsElement).open)}>
          <summary className="btn btn-quiet walk-summary">{open ? 'Done with this run' : 'Correct this run'}</summary>

          <fieldset className="walk-group">
            <legend>Name and length</legend>
            <TextInput id={id('label')} label="Name" value={run.label} onChange={(v) => set('label', v)} error={problems.label} />
            <NumberInput
              id={id('measurements.lengthM')}
              label="Length measured on site"
              quantity="length"
              system={system}
              value={measurements.lengthM}
              onChange={(v) => setReading('lengthM', v)}
              hint={baseRun ? `Given before: ${formatQuantity(baseRun.lengthM, 'length', system)}. Leave empty to keep it.` : 'Leave empty to keep the length below.'}
              error={problems['measurements.lengthM']}
            />
            {status === 'added' ? (
              <NumberInput id={id('lengthM')} label="Length" quantity="length" system={system} value={run.lengthM} onChange={(v) => set('lengthM', v)} error={problems.lengthM} />
            ) : null}
          </fieldset>

          <fieldset className="walk-group">
            <legend>The pipe</legend>
            <SelectInput id={id('service')} label="What it carries" value={run.service} options={SERVICE_OPTIONS} onChange={chooseService} error={problems.service} />
            <SelectInput id={id('pipe.standard')} label="Kind of pipe" value={pipe.standard} options={STANDARD_OPTIONS} onChange={chooseStandard} error={problems['pipe.standard'] ?? problems.pipe} />
            <SelectInput id={id('pipe.size')} label="Size" value={pipe.size} options={sizeOptions(standard, system)} onChange={chooseSize} error={problems['pipe.size']} />
            {scheduleOptions(standard, pipe.size, system).length > 1 ? (
              <SelectInput
                id={id('pipe.schedule')}
                label="Wall"
                value={pipe.schedule}
                options={scheduleOptions(standard, pipe.size, system)}
                onChange={(v) => set('pipe', { ...pipe, schedule: v })}
                error={problems['pipe.schedule']}
              />
            ) : null}
            <SelectInput id={id('pipe.material')} label="Pipe material" value={pipe.material} options={PIPE_MATERIAL_OPTIONS} onChange={(v) => set('pipe', { ...pipe, material: v })} error={problems['pipe.material']} />
          </fieldset>

          <fieldset className="walk-group">
            <legend>What it runs at</legend>
            {service.kind === 'steam' ? (
              <NumberInput
                id={id('steamGaugePressureKPa')}
                label="Pressure on the gauge"
                quantity="gaugePressure"
                system={system}
                value={run.steamGaugePressureKPa}
                onChange={(v) => set('steamGaugePressureKPa', v)}
                hint={`Empty: the usual ${formatQuantity(service.typicalGaugePressureKPa ?? 0, 'gaugePressure', system)} for process steam.`}
                error={lineProblem}
              />
            ) : (
              <NumberInput
                id={id('fluidTemperatureC')}
                label="Temperature of what it carries"
                quantity="temperature"
                system={system}
                signed
                value={run.fluidTemperatureC}
                onChange={(v) => set('fluidTemperatureC', v)}
                hint={`Empty: the usual ${formatQuantity(service.typicalTemperatureC, 'temperature', system)} for ${service.name.toLowerCase()}.`}
                error={lineProblem}
              />
            )}
          </fieldset>

          <fieldset className="walk-group">
            <legend>Lagging as found</legend>
            <Choices legend="On the pipe today" name={id('current.state')} value={state} options={LAGGING_STATES} onChange={chooseState} error={problems['current.state'] ?? problems.current} />
            {state === 'damaged' ? (
              <NumberInput
                id={id('current.bareFraction')}
                label="Share left bare"
                quantity="fraction"
                system={system}
                value={run.current && 'bareFraction' in run.current ? run.current.bareFraction : undefined}
                onChange={(v) => set('current.bareFraction', v)}
                error={problems['current.bareFraction']}
              />
            ) : null}
            {state !== 'bare' ? (
              <>
                <SelectInput id={id('current.material')} label="Lagging material" value={value('current.material') as string | undefined} options={INSULATION_OPTIONS} onChange={(v) => set('current.material', v)} error={problems['current.material']} />
                <NumberInput id={id('current.thicknessM')} label="Lagging thickness" quantity="thickness" system={system} value={value('current.thicknessM')} onChange={(v) => set('current.thicknessM', v)} error={problems['current.thicknessM']} />
                <Choices
                  legend="Condition of the lagging"
                  name={id('current.condition')}
                  value={((value('current.condition') as string | undefined) ?? 'sound') as 'sound' | 'wet' | 'crushed'}
                  options={LAGGING_CONDITION_WORDS}
                  onChange={(v) => set('current.condition', v)}
                  error={problems['current.condition']}
                />
                <SelectInput id={id('current.jacket')} label="Cover over the lagging" value={value('current.jacket') as string | undefined} options={[]} groups={JACKET_OPTION_GROUPS} onChange={(v) => set('current.jacket', v)} error={problems['current.jacket']} />
              </>
            ) : null}
          </fieldset>

          <fieldset className="walk-group">
            <legend>Valves and flanges</legend>
            <div className="walk-pair">
              <Counter id={id('valves')} label="Valves" value={number('valves')} onChange={(v) => set('valves', v)} error={problems.valves} />
              <Counter id={id('flangePairs')} label="Flange pairs" value={number('flangePairs')} onChange={(v) => set('flangePairs', v)} error={problems.flangePairs} />
            </div>
            <CheckInput id={id('fittingsInsulated')} label="They are under removable covers already" checked={run.fittingsInsulated === true} onChange={(v) => set('fittingsInsulated', v)} />
          </fieldset>

          <fieldset className="walk-group">
            <legend>Air around it</legend>
            <p className="walk-hint">
              {room ? 'Measured on this walk; the yearly figures use it.' : 'Leave these empty to keep the room the owner described. Anything you enter gives this run a room of its own.'}
            </p>
            <SelectInput
              id={id('room.preset')}
              label="Kind of room"
              value={presetOf(draft, run)}
              options={ROOM_OPTIONS}
              onChange={(v) => onChange((d) => setRoom(d, run.id, 'preset', v))}
              error={problems['room.preset']}
            />
            <div className="walk-pair">
              <NumberInput
                id={id('room.average.airTemperatureC')}
                label="Air temperature"
                quantity="temperature"
                signed
                system={system}
                value={room?.average?.airTemperatureC}
                onChange={(v) => onChange((d) => setRoom(d, run.id, 'average.airTemperatureC', v))}
                error={problems['room.average.airTemperatureC']}
              />
              <NumberInput
                id={id('room.average.relativeHumidityPercent')}
                label="Humidity"
                quantity="percent"
                system={system}
                value={room?.average?.relativeHumidityPercent}
                onChange={(v) => onChange((d) => setRoom(d, run.id, 'average.relativeHumidityPercent', v))}
                error={problems['room.average.relativeHumidityPercent']}
              />
            </div>
            <NumberInput
              id={id('room.average.airSpeedMPerS')}
              label="Air speed"
              quantity="speed"
              system={system}
              value={room?.average?.airSpeedMPerS}
              onChange={(v) => onChange((d) => setRoom(d, run.id, 'average.airSpeedMPerS', v))}
              hint="Still air is 0; a draft you can feel is about 1 m/s (2 mph)."
              error={problems['room.average.airSpeedMPerS']}
            />
            {room ? (
              <button type="button" className="btn btn-quiet" onClick={props.onResetRoom}>
                Use the room the owner described
              </button>
            ) : null}
          </fieldset>

          <fieldset className="walk-group">
            <legend>Surface reading</legend>
            <Choices
              legend="Thermometer"
              name={id('measurements.surfaceMethod')}
              value={infrared ? 'infrared' : 'contact'}
              options={THERMOMETERS}
              onChange={(v) => setReading('surfaceMethod', v)}
              error={problems['measurements.surfaceMethod']}
            />
            {infrared ? (
              <NumberInput
                id={id('measurements.infraredEmittanceSetting')}
                label="Emittance set on the thermometer"
                system={system}
                value={measurements.infraredEmittanceSetting}
                onChange={(v) => setReading('infraredEmittanceSetting', v)}
                hint="Usually 0.95. The reading is corrected to the surface’s own emittance."
                error={problems['measurements.infraredEmittanceSetting']}
              />
            ) : null}
            <div className="walk-pair">
              <NumberInput
                id={id('measurements.surfaceTemperatureC')}
                label="Surface reading"
                quantity="temperature"
                signed
                system={system}
                value={measurements.surfaceTemperatureC}
                onChange={(v) => setReading('surfaceTemperatureC', v)}
                error={problems['measurements.surfaceTemperatureC']}
              />
              <NumberInput
                id={id('measurements.airTemperatureC')}
                label="Air beside the pipe"
                quantity="temperature"
                signed
                system={system}
                value={measurements.airTemperatureC}
                onChange={(v) => setReading('airTemperatureC', v)}
                error={problems['measurements.airTemperatureC']}
              />
            </div>
            {reading?.measuredHeatLossWPerM != null ? (
              <p className="walk-reading">
                From the reading: {formatQuantity(Math.abs(reading.measuredHeatLossWPerM), 'heatPerLength', system)}
                {reading.lineTemperatureC != null ? `, the line at about ${formatQuantity(reading.lineTemperatureC, 'temperature', system)}` : ''}
                {reading.conditionFactor != null ? `; the lagging lets through ${reading.conditionFactor.toFixed(1)} times what sound lagging would` : ''}.
              </p>
            ) : null}
            {now?.notices
              .filter((n) => n.code === 'MEASURED_BELOW_SATURATION' || n.code === 'MEASURED_CLOSE_TO_AIR')
              .map((notice) => (
                <p key={notice.code} className="walk-notice">
                  {notice.code === 'MEASURED_BELOW_SATURATION' && notice.params?.givenSI !== undefined && notice.params.limitSI !== undefined
                    ? `Check this reading: it puts the line at about ${formatQuantity(notice.params.givenSI, 'temperature', system)}, more than ${temperatureDifference(5, system)} under saturated steam at the stated pressure. The line may run only part of the time or hold condensate, the gauge may be wrong, or a shiny surface may have fooled an infrared reading.`
                    : `The lagged surface reads within ${temperatureDifference(10, system)} of the air, too close to judge the lagging by; its catalog figure is kept.`}
                </p>
              ))}
          </fieldset>

          <div className="walk-run-actions">
            <button type="button" className="btn btn-quiet" onClick={props.onRemove}>
              {status === 'added' ? 'Delete this run' : 'Remove this run'}
            </button>
          </div>
        </details>
      )}
    </article>
  );
}
