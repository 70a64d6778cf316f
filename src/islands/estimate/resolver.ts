/**
 * The form's checks: the very schema the server parses with (./validation, loaded with the
 * first check rather than with the page), each refusal worded with the field's own label and
 * in the unit the person typed in (src/lib/field-messages.ts).
 */
import { toNestErrors, validateFieldsNatively } from '@hookform/resolvers';
import type { Resolver } from 'react-hook-form';
import type { FieldContext } from '../../lib/form-fields';
import { fuelById, type DraftValues } from './draft';
import { PRICE_UNIT_NAMES } from './price-units';

/** The unit system, currency and price unit the form's values are typed in. */
export function fieldContextOf(values: unknown): FieldContext {
  const estimate = (values as Partial<DraftValues> | undefined)?.estimate;
  return fieldContextFrom(estimate?.unitSystem, estimate?.energy?.currency, estimate?.energy?.priceUnit, estimate?.energy?.fuel);
}

/** The same from the four values it depends on (what a field watches). */
export function fieldContextFrom(system: unknown, currency: unknown, priceUnit: unknown, fuelId: unknown): FieldContext {
  const fuel = fuelById(typeof fuelId === 'string' ? fuelId : undefined);
  const unit = (typeof priceUnit === 'string' && priceUnit in PRICE_UNIT_NAMES ? priceUnit : undefined) ?? fuel?.defaultPriceUnit ?? 'kWh';
  return {
    system: system === 'US' ? 'US' : 'SI',
    currency: typeof currency === 'string' && currency ? currency : 'USD',
    priceUnitName: PRICE_UNIT_NAMES[unit as keyof typeof PRICE_UNIT_NAMES],
  };
}

/** The schema-reading checks: fetched once, when the first check is asked for. */
export const loadValidation = () => import('./validation');

/** react-hook-form's resolver over the assessment schema, messages in the field's words. */
export const wordedResolver: Resolver<DraftValues> = async (values, _context, options) => {
  const { fieldErrorsOf } = await loadValidation();
  const errors = fieldErrorsOf(values);
  if (Object.keys(errors).length === 0) {
    if (options.shouldUseNativeValidation) validateFieldsNatively({}, options);
    // The values as typed: the draft keeps what the person gave, the server fills the defaults.
    return { values, errors: {} };
  }
  return { values: {}, errors: toNestErrors(errors, options) };
};
