/**
 * The plain lists and limits of a submitted assessment (./assessment holds its schema): kept
 * apart so the estimate form can show its choices without loading the validation library.
 */
import { countryCodes, postalFormats } from '../lib/routing/postal-code';

export const plantTypes = [
  { id: 'creamery', name: 'Creamery or dairy' },
  { id: 'brewery', name: 'Brewery or distillery' },
  { id: 'smokehouse', name: 'Smokehouse or meat plant' },
  { id: 'bakery', name: 'Bakery' },
  { id: 'sauce-kitchen', name: 'Soup or sauce kitchen' },
  { id: 'juice-plant', name: 'Juice or beverage plant' },
  { id: 'tofu-plant', name: 'Tofu or soy plant' },
  { id: 'other-food', name: 'Other food plant' },
] as const;
export type PlantTypeId = (typeof plantTypes)[number]['id'];
export const plantTypeIds = plantTypes.map((t) => t.id) as [PlantTypeId, ...PlantTypeId[]];

export const countryOptions = countryCodes.map((code) => ({ code, name: postalFormats[code].name }));

/** Where a run's photos go in the multipart body: `photos.<runId>`; plant-wide photos as `photos`. And how many, how large. */
export const PHOTO_FIELD = 'photos';
export const MAX_PHOTOS = 12;
export const MAX_PHOTO_BYTES = 10 * 1024 * 1024;
