/**
 * "Where is this run?": one plain pick among the plant's areas, or a new area of a kind
 * (made with the usual air for that kind), or none — the plant's own air from the first step.
 */
import { useController, useFormContext, useWatch } from 'react-hook-form';
import { AREA_PRESET_IDS, type AreaPresetId } from '../../engine';
import { AREA_KIND_CHOICES } from '../../lib/presentation/pick-lists';
import { newArea, type DraftValues } from './draft';
import { FieldError, fieldId, useFieldError } from './fields';

const NEW = 'new:';

interface Props {
  base: `estimate.runs.${number}`;
  /** The run's own air when it is in no area (the older "where it runs" choice). */
  ambient: string;
}

const PLANT_AIR: Record<string, string> = {
  'indoor-still': 'Indoors, the plant’s usual air',
  'indoor-draughty': 'Indoors in a draft, the plant’s usual air',
  outdoor: 'Outdoors, the plant’s usual outdoor air',
};

function isPreset(value: string): value is AreaPresetId {
  return (AREA_PRESET_IDS as readonly string[]).includes(value);
}

export function WherePick({ base, ambient }: Props) {
  const { getValues, setValue } = useFormContext<DraftValues>();
  const { field } = useController<DraftValues, `estimate.runs.${number}.areaId`>({ name: `${base}.areaId` });
  const areas = useWatch<DraftValues, 'estimate.areas'>({ name: 'estimate.areas' }) ?? [];
  const error = useFieldError(`${base}.areaId`);
  const id = fieldId(`${base}.areaId`);
  const hintId = `${id}-hint`;
  const value = typeof field.value === 'string' && areas.some((a) => a.id === field.value) ? field.value : '';
  const kindsInUse = new Set(areas.map((a) => a.preset));
  const newKinds = AREA_KIND_CHOICES.filter((c) => !kindsInUse.has(c.value));

  function choose(chosen: string) {
    if (chosen.startsWith(NEW)) {
      const kind = chosen.slice(NEW.length);
      if (!isPreset(kind)) return;
      const existing = getValues('estimate.areas') ?? [];
      const area = newArea(kind, existing);
      setValue('estimate.areas', [...existing, area], { shouldDirty: true });
      field.onChange(area.id);
      return;
    }
    field.onChange(chosen === '' ? undefined : chosen);
  }

  return (
    <div className="field where-pick">
      <label htmlFor={id} className="field-label">
        Where is this run?
      </label>
      <p id={hintId} className="field-hint">
        The air around a line sets how much it loses, and whether it burns or drips.
      </p>
      <select
        ref={field.ref}
        id={id}
        name={field.name}
        className="input select-input"
        value={value}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${hintId} ${id}-error` : hintId}
        onChange={(event) => choose(event.target.value)}
        onBlur={field.onBlur}
      >
        <option value="">{PLANT_AIR[ambient] ?? PLANT_AIR['indoor-still']}</option>
        {areas.length > 0 && (
          <optgroup label="Your areas">
            {areas.map((area) => (
              <option key={area.id} value={area.id}>
                {area.label?.trim() || area.id}
              </option>
            ))}
          </optgroup>
        )}
        {newKinds.length > 0 && (
          <optgroup label={areas.length > 0 ? 'Another kind of place' : 'A kind of place'}>
            {newKinds.map((c) => (
              <option key={c.value} value={`${NEW}${c.value}`}>
                {c.label} ({c.note})
              </option>
            ))}
          </optgroup>
        )}
      </select>
      <FieldError id={`${id}-error`} message={error} />
    </div>
  );
}
