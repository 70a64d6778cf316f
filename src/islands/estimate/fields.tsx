/**
 * Form controls of the estimate: each with a label that names its unit, an optional hint,
 * and its error in a sentence beside it, tied together with aria-describedby.
 */
import { useState, type ReactNode } from 'react';
import {
  get,
  useController,
  useFormContext,
  useFormState,
  useWatch,
  type FieldPath,
  type RegisterOptions,
} from 'react-hook-form';
import {
  displayUnit,
  formatConverted,
  parseTyped,
  type UnitSystem,
} from '../../lib/units-display';
import { formFieldAt, type FormField } from '../../lib/form-fields';
import type { DraftValues } from './draft';
import type { Confidence } from './confidence';
import { fieldContextFrom } from './resolver';
import { rememberTyped, typedFigure } from './store';
import { PickOptions } from '../../components/PickOptions';

export type Name = FieldPath<DraftValues>;

/** The id of the control for a form path: `estimate.runs.0.lengthM` → `f-estimate-runs-0-lengthM`. */
export function fieldId(name: string): string {
  return `f-${name.replace(/\./g, '-')}`;
}

/** The message of the error at a path, whether it sits on the field or on a list as a whole. */
export function errorMessageAt(errors: unknown, name: string): string | undefined {
  const error: unknown = get(errors, name);
  if (typeof error !== 'object' || error === null) return undefined;
  const own = (error as { message?: unknown }).message;
  if (typeof own === 'string' && own) return own;
  const root = (error as { root?: { message?: unknown } }).root?.message;
  return typeof root === 'string' && root ? root : undefined;
}

export function useFieldError(name: string): string | undefined {
  const { errors } = useFormState<DraftValues>({ name: name as Name });
  return errorMessageAt(errors, name);
}

/** Dotted paths in the order their controls stand on the page (paths with no control last). */
export function inPageOrder(paths: readonly string[]): string[] {
  if (typeof document === 'undefined') return [...paths];
  const element = (path: string) => document.getElementById(fieldId(path));
  return [...paths].sort((a, b) => {
    const first = element(a);
    const second = element(b);
    if (!first || !second) return first ? -1 : second ? 1 : 0;
    return first.compareDocumentPosition(second) & Node.DOCUMENT_POSITION_FOLLOWING ? -1 : 1;
  });
}

/** Whether anything under a path (a run's proposal, say) has an error. */
export function useHasErrorUnder(name: string): boolean {
  const { errors } = useFormState<DraftValues>({ name: name as Name });
  return get(errors, name) !== undefined;
}

export function useUnitSystem(): UnitSystem {
  const system = useWatch<DraftValues, 'estimate.unitSystem'>({ name: 'estimate.unitSystem' });
  return system === 'US' ? 'US' : 'SI';
}

function describedBy(...ids: (string | false | undefined)[]): string | undefined {
  const present = ids.filter((id): id is string => typeof id === 'string');
  return present.length > 0 ? present.join(' ') : undefined;
}

export function FieldError({ id, message }: { id: string; message: string | undefined }) {
  if (!message) return null;
  return (
    <p id={id} className="field-error">
      <span aria-hidden="true" className="field-error-mark">
        !
      </span>
      {message}
    </p>
  );
}

interface FieldFrameProps {
  id: string;
  label: ReactNode;
  hint?: ReactNode | undefined;
  error: string | undefined;
  optional?: boolean | undefined;
  children: ReactNode;
  className?: string | undefined;
}

function FieldFrame({ id, label, hint, error, optional, children, className }: FieldFrameProps) {
  return (
    <div className={`field ${className ?? ''}`}>
      <label htmlFor={id} className="field-label">
        {label}
        {optional && <span className="field-optional"> (optional)</span>}
      </label>
      {hint && (
        <p id={`${id}-hint`} className="field-hint">
          {hint}
        </p>
      )}
      {children}
      <FieldError id={`${id}-error`} message={error} />
    </div>
  );
}

interface NumberFieldProps {
  /** One of the form's number fields (src/lib/form-fields.ts), which gives its label and unit. */
  name: Name;
  hint?: ReactNode;
  optional?: boolean;
  placeholder?: string;
  /** Negative values are possible (temperatures): phones then show a keyboard with a minus. */
  signed?: boolean;
  /** Whole numbers only (counts). */
  whole?: boolean;
  className?: string;
}

/** The form's number field at a path; a path the table does not list is a mistake in the form. */
function numberFieldAt(name: string): FormField {
  const field = formFieldAt(name);
  if (!field) throw new Error(`${name} is not one of the form's number fields (src/lib/form-fields.ts).`);
  return field;
}

export function NumberField({ name, hint, optional, placeholder, signed, whole, className }: NumberFieldProps) {
  const { label, quantity, unitText } = numberFieldAt(name);
  const [systemValue, currency, priceUnit, fuel] = useWatch<DraftValues>({
    name: ['estimate.unitSystem', 'estimate.energy.currency', 'estimate.energy.priceUnit', 'estimate.energy.fuel'],
  });
  const { field, fieldState } = useController<DraftValues>({ name });
  const [typing, setTyping] = useState<string | null>(null);
  const context = fieldContextFrom(systemValue, currency, priceUnit, fuel);
  const system = context.system;
  const unit = quantity ? displayUnit(quantity, system) : undefined;
  const symbol = unit?.symbol ?? (unitText?.(context) || undefined);
  const id = fieldId(name);
  const error = fieldState.error?.message;
  // What was typed, while it still stands for the stored value in these units; else the value converted.
  const remembered = typedFigure(name, system, field.value);
  const shown =
    typing ??
    remembered ??
    (quantity ? formatConverted(field.value, quantity, system) : field.value === undefined || field.value === null ? '' : String(field.value));
  return (
    <FieldFrame
      id={id}
      label={symbol ? `${label} (${symbol})` : label}
      hint={hint}
      error={error}
      optional={optional}
      className={className}
    >
      <div className="number-box">
        <input
          ref={field.ref}
          id={id}
          name={name}
          type="text"
          inputMode={signed ? 'text' : whole ? 'numeric' : 'decimal'}
          autoComplete="off"
          spellCheck={false}
          className="input number-input"
          value={shown}
          placeholder={placeholder}
          aria-invalid={error ? true : undefined}
          aria-describedby={describedBy(hint !== undefined && `${id}-hint`, error && `${id}-error`)}
          onChange={(event) => {
            setTyping(event.target.value);
            const typed = parseTyped(event.target.value);
            if (typeof typed === 'number') {
              const valueSI = unit ? unit.toBase(typed) : typed;
              rememberTyped(name, system, valueSI, event.target.value.trim());
              field.onChange(valueSI);
            } else field.onChange(typed);
          }}
          onBlur={() => {
            setTyping(null);
            field.onBlur();
          }}
        />
        {symbol && (
          <span className="number-unit" aria-hidden="true">
            {symbol}
          </span>
        )}
      </div>
    </FieldFrame>
  );
}

interface TextFieldProps {
  name: Name;
  label: string;
  hint?: ReactNode;
  optional?: boolean;
  type?: 'text' | 'email' | 'tel';
  autoComplete?: string;
  className?: string;
  inputClassName?: string;
}

export function TextField({ name, label, hint, optional, type = 'text', autoComplete, className, inputClassName }: TextFieldProps) {
  const { register } = useFormContext<DraftValues>();
  const error = useFieldError(name);
  const id = fieldId(name);
  return (
    <FieldFrame id={id} label={label} hint={hint} error={error} optional={optional} className={className}>
      <input
        id={id}
        type={type}
        autoComplete={autoComplete ?? 'off'}
        className={`input ${inputClassName ?? ''}`}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy(hint !== undefined && `${id}-hint`, error && `${id}-error`)}
        {...register(name)}
      />
    </FieldFrame>
  );
}

export interface Option {
  readonly value: string;
  readonly label: string;
}

/** Options under a heading, drawn as an <optgroup>. */
export interface OptionGroup {
  readonly label: string;
  readonly options: readonly Option[];
}

interface SelectFieldProps {
  name: Name;
  label: string;
  options?: readonly Option[];
  /** Options in groups (after any ungrouped `options`). */
  groups?: readonly OptionGroup[];
  hint?: ReactNode;
  optional?: boolean;
  /** First option with an empty value: nothing chosen yet, or "leave it to the engine". */
  emptyLabel?: string;
  /** Work that follows a choice (defaults of a service, units of a fuel). */
  onChosen?: (value: string) => void;
  className?: string;
}

/**
 * A drop-down bound to the form's value (not only to the DOM), so a value set in code — the
 * usual schedule after a change of standard — shows at once, even when its option is new.
 */
export function SelectField({ name, label, options = [], groups = [], hint, optional, emptyLabel, onChosen, className }: SelectFieldProps) {
  const { field } = useController<DraftValues>({ name });
  const error = useFieldError(name);
  const id = fieldId(name);
  const value = typeof field.value === 'string' ? field.value : '';
  return (
    <FieldFrame id={id} label={label} hint={hint} error={error} optional={optional} className={className}>
      <select
        ref={field.ref}
        id={id}
        name={name}
        className="input select-input"
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy(hint !== undefined && `${id}-hint`, error && `${id}-error`)}
        value={value}
        onChange={(event) => {
          const chosen = event.target.value;
          field.onChange(chosen === '' ? undefined : chosen);
          onChosen?.(chosen);
        }}
        onBlur={field.onBlur}
      >
        {emptyLabel !== undefined && <option value="">{emptyLabel}</option>}
        <PickOptions options={options} groups={groups} />
      </select>
    </FieldFrame>
  );
}

interface ChoiceFieldProps {
  name: Name;
  legend: string;
  options: readonly (Option & { readonly note?: string })[];
  hint?: ReactNode;
  onChosen?: (value: string) => void;
  /** Side by side on wide screens. */
  inline?: boolean;
}

/** A group of radio buttons in a fieldset; arrow keys move between them, as with any radio group. */
export function ChoiceField({ name, legend, options, hint, onChosen, inline }: ChoiceFieldProps) {
  const { register } = useFormContext<DraftValues>();
  const error = useFieldError(name);
  const id = fieldId(name);
  const registered = register(name, {
    onChange: (event: { target: { value: string } }) => onChosen?.(event.target.value),
  } as RegisterOptions<DraftValues, Name>);
  return (
    <fieldset
      className="field choice-group"
      aria-describedby={describedBy(hint !== undefined && `${id}-hint`, error && `${id}-error`)}
    >
      <legend className="field-label">{legend}</legend>
      {hint && (
        <p id={`${id}-hint`} className="field-hint">
          {hint}
        </p>
      )}
      <div className={inline ? 'choice-row' : 'choice-column'}>
        {options.map((option) => (
          <label key={option.value} className="choice" htmlFor={`${id}-${option.value}`}>
            <input
              type="radio"
              id={`${id}-${option.value}`}
              value={option.value}
              className="choice-input"
              {...registered}
            />
            <span>
              <span className="choice-label">{option.label}</span>
              {option.note && <span className="choice-note">{option.note}</span>}
            </span>
          </label>
        ))}
      </div>
      <FieldError id={`${id}-error`} message={error} />
    </fieldset>
  );
}

const SURE_OPTIONS = [
  { value: 'guessed', label: 'A guess' },
  { value: 'estimated', label: 'Near enough' },
  { value: 'measured', label: 'Known', note: 'measured, metered or from a bill' },
] as const satisfies readonly { value: Confidence; label: string; note?: string }[];

interface SureChoiceProps {
  /** A `...confidence` field of the engine. */
  name: Name;
  /** What it is about, inside a question: "the hours". */
  about: string;
  /** What the form sends while the person has not said: a guess for an untouched usual value, near enough for a typed one. */
  auto: Confidence;
}

/**
 * "How sure are you?": a guess, near enough or known. Until the person says, the choice
 * shown is what the form sends on its own (`auto`); the engine widens the range by it.
 */
export function SureChoice({ name, about, auto }: SureChoiceProps) {
  const { field } = useController<DraftValues>({ name });
  const id = fieldId(name);
  const said = typeof field.value === 'string' ? (field.value as Confidence) : undefined;
  const shown = said ?? auto;
  return (
    <fieldset className="sure" aria-describedby={said === undefined && auto === 'guessed' ? `${id}-note` : undefined}>
      <legend className="sure-legend">How sure are you of {about}?</legend>
      <div className="sure-row">
        {SURE_OPTIONS.map((option) => (
          <label key={option.value} className="sure-option" htmlFor={`${id}-${option.value}`} title={'note' in option ? option.note : undefined}>
            <input
              ref={option.value === shown ? field.ref : undefined}
              type="radio"
              id={`${id}-${option.value}`}
              name={id}
              value={option.value}
              className="choice-input"
              checked={shown === option.value}
              onChange={() => field.onChange(option.value)}
              onBlur={field.onBlur}
            />
            <span>{option.label}</span>
          </label>
        ))}
      </div>
      {said === undefined && auto === 'guessed' && (
        <p id={`${id}-note`} className="sure-note">
          A usual figure: counted as a guess until you type your own.
        </p>
      )}
    </fieldset>
  );
}

interface CheckFieldProps {
  name: Name;
  label: ReactNode;
  hint?: ReactNode;
}

export function CheckField({ name, label, hint }: CheckFieldProps) {
  const { register } = useFormContext<DraftValues>();
  const error = useFieldError(name);
  const id = fieldId(name);
  return (
    <div className="field">
      <label className="check" htmlFor={id}>
        <input
          id={id}
          type="checkbox"
          className="check-input"
          aria-invalid={error ? true : undefined}
          aria-describedby={describedBy(hint !== undefined && `${id}-hint`, error && `${id}-error`)}
          {...register(name)}
        />
        <span>{label}</span>
      </label>
      {hint && (
        <p id={`${id}-hint`} className="field-hint check-hint">
          {hint}
        </p>
      )}
      <FieldError id={`${id}-error`} message={error} />
    </div>
  );
}
