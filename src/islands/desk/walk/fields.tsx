/**
 * Controls of the site-walk form, sized for a phone in a gloved hand (every target at least
 * 48 px): a number typed in the reader's unit and kept in SI, a pick-list, a row of big
 * choices, a counter with − and +. Each has its label (naming the unit), an optional hint and
 * its problem in a sentence, tied together with aria-describedby.
 */
import { useId, useState, type ReactNode } from 'react';
import { displayUnit, formatForInput, parseTyped, type DisplayQuantity, type UnitSystem } from '../../../lib/units-display';
import { PickOptions } from '../../../components/PickOptions';

function describedBy(...ids: (string | false | undefined | null)[]): string | undefined {
  const present = ids.filter((id): id is string => typeof id === 'string' && id !== '');
  return present.length ? present.join(' ') : undefined;
}

interface FrameProps {
  id: string;
  label: ReactNode;
  hint?: ReactNode | undefined;
  error?: string | undefined;
  children: ReactNode;
}

function Frame({ id, label, hint, error, children }: FrameProps) {
  return (
    <div className="walk-field">
      <label htmlFor={id} className="walk-label">
        {label}
      </label>
      {hint ? (
        <p id={`${id}-hint`} className="walk-hint">
          {hint}
        </p>
      ) : null}
      {children}
      {error ? (
        <p id={`${id}-error`} className="walk-error">
          {error}
        </p>
      ) : null}
    </div>
  );
}

export interface NumberInputProps {
  id: string;
  label: string;
  /** A physical quantity, shown in the reader's unit and kept in SI. */
  quantity?: DisplayQuantity;
  /** Unit text of a figure that does not convert (a count, a plain ratio). */
  unitText?: string;
  system: UnitSystem;
  value: unknown;
  onChange: (value: number | string | undefined) => void;
  hint?: ReactNode;
  error?: string | undefined;
  /** Temperatures can be below zero: the phone then offers a keyboard with a minus sign. */
  signed?: boolean;
}

/**
 * A number in the reader's unit. What the person types stays in the box while they type; on
 * leaving it (or on a unit switch) the box shows the kept value in the current unit, so
 * switching back and forth never drifts. Text that is not a number is kept as text, so the
 * check can say what was typed.
 */
export function NumberInput({ id, label, quantity, unitText, system, value, onChange, hint, error, signed }: NumberInputProps) {
  const [typing, setTyping] = useState<string | null>(null);
  const unit = quantity ? displayUnit(quantity, system) : undefined;
  const symbol = unit?.symbol ?? unitText;
  const shown = typing ?? (quantity ? formatForInput(value, quantity, system) : value === undefined || value === null ? '' : String(value));
  return (
    <Frame id={id} label={symbol ? `${label} (${symbol})` : label} hint={hint} error={error}>
      <div className="walk-number">
        <input
          id={id}
          type="text"
          inputMode={signed ? 'text' : 'decimal'}
          autoComplete="off"
          spellCheck={false}
          className="walk-input"
          value={shown}
          aria-invalid={error ? true : undefined}
          aria-describedby={describedBy(hint ? `${id}-hint` : null, error ? `${id}-error` : null)}
          onChange={(event) => {
            setTyping(event.target.value);
            const typed = parseTyped(event.target.value);
            onChange(typeof typed === 'number' && unit ? unit.toBase(typed) : typed);
          }}
          onBlur={() => setTyping(null)}
        />
        {symbol ? (
          <span className="walk-unit" aria-hidden="true">
            {symbol}
          </span>
        ) : null}
      </div>
    </Frame>
  );
}

export interface Option {
  value: string;
  label: string;
}

/** Options under a heading, drawn as an <optgroup>. */
export interface OptionGroup {
  readonly label: string;
  readonly options: readonly Option[];
}

export function SelectInput({
  id,
  label,
  value,
  options,
  groups = [],
  onChange,
  hint,
  error,
}: {
  id: string;
  label: string;
  value: string | undefined;
  options: readonly Option[];
  /** Options under headings (<optgroup>), after any ungrouped `options`. */
  groups?: readonly OptionGroup[];
  onChange: (value: string) => void;
  hint?: ReactNode;
  error?: string | undefined;
}) {
  const all = [...options, ...groups.flatMap((group) => group.options)];
  return (
    <Frame id={id} label={label} hint={hint} error={error}>
      <select
        id={id}
        className="walk-input walk-select"
        value={value ?? ''}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy(hint ? `${id}-hint` : null, error ? `${id}-error` : null)}
        onChange={(event) => onChange(event.target.value)}
      >
        {value === undefined || !all.some((o) => o.value === value) ? <option value="">Choose…</option> : null}
        <PickOptions options={options} groups={groups} />
      </select>
    </Frame>
  );
}

export function TextInput({ id, label, value, onChange, hint, error, maxLength = 120 }: { id: string; label: string; value: string; onChange: (value: string) => void; hint?: ReactNode; error?: string | undefined; maxLength?: number }) {
  return (
    <Frame id={id} label={label} hint={hint} error={error}>
      <input
        id={id}
        type="text"
        className="walk-input"
        value={value}
        maxLength={maxLength}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy(hint ? `${id}-hint` : null, error ? `${id}-error` : null)}
        onChange={(event) => onChange(event.target.value)}
      />
    </Frame>
  );
}

/** A row of big choices (radio buttons drawn as tiles), for a few options read at a glance. */
export function Choices<T extends string>({
  legend,
  name,
  value,
  options,
  onChange,
  error,
}: {
  legend: string;
  name: string;
  value: T;
  options: readonly { value: T; label: string }[];
  onChange: (value: T) => void;
  error?: string | undefined;
}) {
  const errorId = useId();
  return (
    <fieldset className="walk-choices" aria-describedby={error ? errorId : undefined}>
      <legend className="walk-label">{legend}</legend>
      <div className="walk-choice-row">
        {options.map((option) => (
          <label key={option.value} className="walk-choice">
            <input type="radio" name={name} value={option.value} checked={value === option.value} onChange={() => onChange(option.value)} />
            <span>{option.label}</span>
          </label>
        ))}
      </div>
      {error ? (
        <p id={errorId} className="walk-error">
          {error}
        </p>
      ) : null}
    </fieldset>
  );
}

/** A whole number with − and + beside it, for counting valves and flanges on site. */
export function Counter({ id, label, value, onChange, error, max = 500 }: { id: string; label: string; value: number; onChange: (value: number | string) => void; error?: string | undefined; max?: number }) {
  const [typing, setTyping] = useState<string | null>(null);
  const step = (by: number) => onChange(Math.min(max, Math.max(0, value + by)));
  return (
    <Frame id={id} label={label} error={error}>
      <div className="walk-counter">
        <button type="button" className="walk-step" aria-label={`One fewer: ${label.toLowerCase()}`} disabled={value <= 0} onClick={() => step(-1)}>
          −
        </button>
        <input
          id={id}
          type="text"
          inputMode="numeric"
          className="walk-input walk-count"
          value={typing ?? String(value)}
          aria-invalid={error ? true : undefined}
          aria-describedby={error ? `${id}-error` : undefined}
          onChange={(event) => {
            setTyping(event.target.value);
            const typed = parseTyped(event.target.value);
            onChange(typed === undefined ? 0 : typed);
          }}
          onBlur={() => setTyping(null)}
        />
        <button type="button" className="walk-step" aria-label={`One more: ${label.toLowerCase()}`} disabled={value >= max} onClick={() => step(1)}>
          +
        </button>
      </div>
    </Frame>
  );
}

export function CheckInput({ id, label, checked, onChange }: { id: string; label: string; checked: boolean; onChange: (checked: boolean) => void }) {
  return (
    <label className="walk-check" htmlFor={id}>
      <input id={id} type="checkbox" checked={checked} onChange={(event) => onChange(event.target.checked)} />
      <span>{label}</span>
    </label>
  );
}
