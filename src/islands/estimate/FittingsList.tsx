/**
 * The fittings on one run, by kind (valves, flange joints, strainers, steam traps): how many
 * of each, and whether they already have removable covers or lagging. They are taken at the
 * run's own pipe size.
 */
import { useFieldArray, useFormContext } from 'react-hook-form';
import { FITTING_KIND_CHOICES } from '../../lib/presentation/pick-lists';
import type { DraftValues } from './draft';
import { CheckField, NumberField, SelectField } from './fields';

interface Props {
  /** `estimate.runs.<n>` */
  base: `estimate.runs.${number}`;
  /** Whether the run has lagging today (a bare run's fittings cannot be lagged with it). */
  lagged: boolean;
  runTitle: string;
}

const KIND_OPTIONS = FITTING_KIND_CHOICES.map((c) => ({ value: c.value, label: c.label }));

export function FittingsList({ base, lagged, runTitle }: Props) {
  const { control } = useFormContext<DraftValues>();
  const { fields, append, remove } = useFieldArray({ control, name: `${base}.fittings`, keyName: 'key' });

  return (
    <fieldset className="group fittings">
      <legend className="group-legend">Valves, flanges and traps on the run</legend>
      <p className="field-hint">
        {fields.length === 0
          ? 'None counted yet. Bare valves and flanges lose as much heat as a stretch of bare pipe several times their length.'
          : 'Each kind at the run’s own pipe size.'}
      </p>
      {fields.length > 0 && (
        <ol className="fitting-list" aria-label={`Fittings on ${runTitle}`}>
          {fields.map((field, index) => (
            <li key={field.key} className="fitting-row">
              <SelectField name={`${base}.fittings.${index}.type`} label="Kind" options={KIND_OPTIONS} />
              <NumberField name={`${base}.fittings.${index}.count`} whole className="fitting-count" />
              {lagged && <CheckField name={`${base}.fittings.${index}.covered`} label="They have removable covers or are lagged" />}
              <button type="button" className="btn btn-quiet btn-small fitting-remove" onClick={() => remove(index)}>
                Remove<span className="sr-only"> this kind of fitting</span>
              </button>
            </li>
          ))}
        </ol>
      )}
      <button
        type="button"
        className="btn btn-quiet btn-small"
        onClick={() => append({ type: 'valve-flanged', count: 1, covered: false }, { focusName: `${base}.fittings.${fields.length}.type` })}
      >
        <span aria-hidden="true">+</span> Add valves, flanges or traps
      </button>
    </fieldset>
  );
}
