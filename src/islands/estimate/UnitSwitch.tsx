/**
 * US customary ⇄ SI. Only the display changes: values stay in SI at full precision, and the
 * plant's country (its market) keeps deciding catalogs, stock series and so every money figure.
 */
import { useFormContext } from 'react-hook-form';
import type { DraftValues } from './draft';
import { useUnitSystem } from './fields';

const SYSTEMS = [
  { value: 'US', label: 'US', note: 'ft, in, °F, psi' },
  { value: 'SI', label: 'SI', note: 'm, mm, °C, bar' },
] as const;

export function UnitSwitch() {
  const { setValue } = useFormContext<DraftValues>();
  const system = useUnitSystem();
  return (
    <fieldset className="unit-switch">
      <legend className="unit-switch-legend">Units</legend>
      <div className="unit-switch-options">
        {SYSTEMS.map((option) => (
          <label key={option.value} className="unit-option" htmlFor={`unit-system-${option.value}`}>
            <input
              type="radio"
              id={`unit-system-${option.value}`}
              name="unit-system"
              value={option.value}
              className="unit-option-input"
              checked={system === option.value}
              onChange={() => setValue('estimate.unitSystem', option.value, { shouldDirty: true })}
            />
            <span className="unit-option-text">
              <span className="font-extrabold">{option.label}</span>
              <span className="unit-option-note">{option.note}</span>
            </span>
          </label>
        ))}
      </div>
    </fieldset>
  );
}
