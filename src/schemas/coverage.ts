/**
 * GET /api/coverage: whether a consultant covers a postal code, asked at the plant step so an
 * owner learns it before sending, not after. The query is parsed on the server with zod; the
 * answer (`zod/mini`) is parsed by the estimate island and read by the OpenAPI document.
 */
import { z } from 'zod';
import * as zm from 'zod/mini';
import { countryCodes, isCountryCode } from '../lib/routing/postal-code';

/** The query string: the plant's country and its postal code as typed. */
export const coverageQuerySchema = z.object({
  country: z
    .string({ error: 'Give the plant’s country as a two-letter code, e.g. US.' })
    .trim()
    .toUpperCase()
    .refine(isCountryCode, { error: `Choose the country from the list (${countryCodes.join(', ')}).` }),
  postalCode: z
    .string({ error: 'Give the plant’s postal code.' })
    .trim()
    .min(1, { error: 'Give the plant’s postal code.' })
    .max(16, { error: 'A postal code is at most 16 characters.' }),
});

export type CoverageQuery = z.output<typeof coverageQuerySchema>;

/** The answer: covered or not, and by which region; never who the consultants are. */
export const coverageAnswerSchema = zm.object({
  countryCode: zm.string().check(zm.describe('The country asked about, e.g. US.')),
  postalCode: zm.string().check(zm.describe('The postal code as it is compared: upper case, no spaces or dashes.')),
  covered: zm.boolean().check(
    zm.describe('True when a region in service takes this code and at least one active consultant works it; an assessment sent from here is then routed to them.'),
  ),
  regionName: zm.nullable(zm.string()).check(zm.describe('The region that takes the code, when covered.')),
});

export type CoverageAnswer = zm.output<typeof coverageAnswerSchema>;
