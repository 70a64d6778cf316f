/**
 * The plant's areas: the places its lines run through (a boiler room, a washdown room,
 * outdoors…), each with its own air. An area starts with the usual air for its kind, shown
 * in the boxes' placeholders and left to the engine until the person types what they know.
 */
import { useFieldArray, useFormContext, useWatch } from 'react-hook-form';
import type { AreaPresetId } from '../../engine';
import { AREA_KIND_CHOICES } from '../../lib/presentation/pick-lists';
import { displayUnit, formatForInput, type DisplayQuantity, type UnitSystem } from '../../lib/units-display';
import { areaPreset, newArea, type DraftValues } from './draft';
import { NumberField, SelectField, SureChoice, TextField, useUnitSystem } from './fields';
import { areaConfidence } from './confidence';

/** A typical value as the box would show it: "86" (°F), "40" (%). */
function usual(value: number, quantity: DisplayQuantity, system: UnitSystem): string {
  return formatForInput(value, quantity, system);
}

function withUnit(value: number, quantity: DisplayQuantity, system: UnitSystem): string {
  // A no-break space: a number never parts from its unit at a line's end.
  return `${usual(value, quantity, system)}\u00a0${displayUnit(quantity, system).symbol}`;
}

/** "Usual for a boiler room: 86 °F at 40 % humidity, air moving at 0.7 mph; …" */
export function usualAirWords(presetId: string | undefined, system: UnitSystem): string {
  const preset = areaPreset(presetId);
  if (!preset) return '';
  const a = preset.average;
  const d = preset.design;
  return (
    `Usual for a ${preset.name.toLowerCase()}: ${withUnit(a.airTemperatureC, 'temperature', system)} at ${withUnit(a.relativeHumidityPercent, 'percent', system)} humidity, ` +
    `air moving at ${withUnit(a.airSpeedMPerS, 'speed', system)}; ${withUnit(d.hotAirTemperatureC, 'temperature', system)} on the hottest day; ` +
    `${withUnit(d.wetAirTemperatureC, 'temperature', system)} at ${withUnit(d.wetRelativeHumidityPercent, 'percent', system)} when it is dampest.`
  );
}

function AreaCard({ index, onRemove }: { index: number; onRemove: () => void }) {
  const system = useUnitSystem();
  const base = `estimate.areas.${index}` as const;
  const area = useWatch<DraftValues, `estimate.areas.${number}`>({ name: base });
  const preset = areaPreset(area?.preset);
  const headingId = `area-${index}-heading`;
  const title = area?.label?.trim() || `Area ${index + 1}`;
  const placeholder = (value: number | undefined, quantity: DisplayQuantity) => (value === undefined ? undefined : usual(value, quantity, system));
  return (
    <section className="area-card" aria-labelledby={headingId}>
      <div className="run-card-head">
        <h4 id={headingId} className="area-title">
          {title}
        </h4>
        <button type="button" className="btn btn-quiet btn-small" onClick={onRemove} aria-describedby={headingId}>
          Remove
        </button>
      </div>
      <div className="field-grid">
        <TextField name={`${base}.label`} label="Name of the area" hint="What you call it, such as “Cheese room”." />
        <SelectField
          name={`${base}.preset`}
          label="Kind of place"
          options={AREA_KIND_CHOICES.map((c) => ({ value: c.value, label: c.label }))}
        />
      </div>
      <details className="group area-air">
        <summary className="group-legend">Its air</summary>
        <p className="field-hint">{usualAirWords(area?.preset, system)} Leave a box empty to keep the usual figure.</p>
        <div className="field-grid">
          <NumberField name={`${base}.average.airTemperatureC`} signed optional placeholder={placeholder(preset?.average.airTemperatureC, 'temperature')} />
          <NumberField name={`${base}.average.relativeHumidityPercent`} optional placeholder={placeholder(preset?.average.relativeHumidityPercent, 'percent')} />
          <NumberField
            name={`${base}.average.airSpeedMPerS`}
            optional
            placeholder={placeholder(preset?.average.airSpeedMPerS, 'speed')}
            hint="Fans, doors and wind all move the air."
          />
          <NumberField
            name={`${base}.design.hotAirTemperatureC`}
            signed
            optional
            placeholder={placeholder(preset?.design.hotAirTemperatureC, 'temperature')}
            hint="Burns are checked at this air."
          />
          <NumberField
            name={`${base}.design.wetAirTemperatureC`}
            signed
            optional
            placeholder={placeholder(preset?.design.wetAirTemperatureC, 'temperature')}
            hint="Sweating on cold lines is checked at this air."
          />
          <NumberField
            name={`${base}.design.wetRelativeHumidityPercent`}
            optional
            placeholder={placeholder(preset?.design.wetRelativeHumidityPercent, 'percent')}
          />
        </div>
        <SureChoice
          name={`${base}.confidence`}
          about="this area’s air"
          auto={areaConfidence(area as { average?: Record<string, unknown>; design?: Record<string, unknown> } | undefined)}
        />
      </details>
    </section>
  );
}

export function AreasPanel() {
  const { control, getValues, setValue } = useFormContext<DraftValues>();
  const { fields, append, remove } = useFieldArray({ control, name: 'estimate.areas', keyName: 'key' });

  function add(kind: AreaPresetId = 'process-room') {
    append(newArea(kind, getValues('estimate.areas') ?? []), { focusName: `estimate.areas.${fields.length}.label` });
  }

  function removeAt(index: number) {
    const id = getValues(`estimate.areas.${index}.id`);
    // Its runs go back to the plant's own air rather than pointing at nothing.
    (getValues('estimate.runs') ?? []).forEach((run, runIndex) => {
      if (run.areaId === id) setValue(`estimate.runs.${runIndex}.areaId`, undefined, { shouldDirty: true });
    });
    remove(index);
  }

  return (
    <section className="areas" aria-labelledby="areas-heading">
      <h3 id="areas-heading" className="block-title">
        Areas of your plant
      </h3>
      <p className="field-hint">
        {fields.length === 0
          ? 'Runs use the plant’s air from the first step. Put a run in a boiler room, a washdown room or outdoors under “Where is this run?” and the area appears here with the usual air for its kind.'
          : 'Each area starts with the usual air for its kind. Change what you know; the rest stays a guess and widens the range.'}
      </p>
      {fields.length > 0 && (
        <ol className="area-list" aria-label="Areas">
          {fields.map((field, index) => (
            <li key={field.key}>
              <AreaCard index={index} onRemove={() => removeAt(index)} />
            </li>
          ))}
        </ol>
      )}
      <button type="button" className="btn btn-quiet btn-small" onClick={() => add()}>
        <span aria-hidden="true">+</span> Add an area
      </button>
    </section>
  );
}
