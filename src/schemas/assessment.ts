/**
 * The contract of a submitted assessment, shared by the estimate form (its resolver) and
 * POST /api/assessments. The estimate itself is the engine's own PlantInput schema.
 */
import { z } from 'zod';
import { plantInputSchema } from '../engine';
import { countryCodes, isCountryCode, normalisePostalCode } from '../lib/routing/postal-code';
import { plantTypeIds } from './assessment-lists';
import { textRule } from './text';

export { countryOptions, MAX_PHOTO_BYTES, MAX_PHOTOS, PHOTO_FIELD, plantTypes, type PlantTypeId } from './assessment-lists';

/** Where the plant is and what it makes: routing reads the country and postal code. */
export const plantDetailsSchema = z
  .object({
    plantName: z.string().trim().max(120, { error: 'Keep the plant name under 120 characters.' }).superRefine(textRule).optional(),
    plantType: z.enum(plantTypeIds, { error: 'Choose the kind of plant from the list.' }),
    countryCode: z
      .string({ error: 'Choose the country the plant is in.' })
      .refine(isCountryCode, { error: `Choose the country from the list (${countryCodes.join(', ')}).` }),
    postalCode: z
      .string({ error: 'Enter the plant’s postal code.' })
      .trim()
      .min(1, { error: 'Enter the plant’s postal code.' })
      .max(16, { error: 'A postal code is at most 16 characters.' }),
  })
  .superRefine(
    (plant, ctx) => {
      if (!isCountryCode(plant.countryCode)) return;
      const normalized = normalisePostalCode(plant.countryCode, plant.postalCode);
      if (!normalized.ok) ctx.addIssue({ code: 'custom', path: ['postalCode'], message: normalized.message });
    },
    {
      // Check the code as soon as country and code are themselves fine, even while other fields are not.
      when: ({ value }) => {
        const v = value as { countryCode?: unknown; postalCode?: unknown } | undefined;
        return typeof v?.countryCode === 'string' && isCountryCode(v.countryCode) && typeof v.postalCode === 'string' && v.postalCode.trim() !== '';
      },
    },
  );

/** Who to contact; only the consultant who claims the assessment ever sees this. */
export const contactSchema = z.object({
  name: z
    .string({ error: 'Enter your name.' })
    .trim()
    .min(1, { error: 'Enter your name.' })
    .max(120, { error: 'Keep your name under 120 characters.' })
    .superRefine(textRule),
  company: z
    .string({ error: 'Enter the company or plant name.' })
    .trim()
    .min(1, { error: 'Enter the company or plant name.' })
    .max(160, { error: 'Keep the company name under 160 characters.' })
    .superRefine(textRule),
  email: z
    .string({ error: 'Enter your e-mail address.' })
    .trim()
    .toLowerCase()
    .pipe(z.email({ error: 'Enter an e-mail address like name@plant.com.' }))
    .pipe(z.string().max(254, { error: 'An e-mail address is at most 254 characters.' })),
  phone: z
    .string()
    .trim()
    .max(40, { error: 'Keep the phone number under 40 characters.' })
    .regex(/^[+()\d\s.\-]*$/, { error: 'A phone number may hold digits, spaces, + ( ) . and - only.' })
    .optional()
    .transform((value) => (value ? value : undefined)),
});

export const createAssessmentSchema = z.object({
  contact: contactSchema,
  consent: z.literal(true, { error: 'Tick the box to let a consultant covering your region contact you.' }),
  plant: plantDetailsSchema,
  estimate: plantInputSchema,
  /** A field people never see; bots fill it. Anything in it marks the submission as spam. */
  website: z.string().max(500).superRefine(textRule).optional(),
});

export type CreateAssessmentInput = z.input<typeof createAssessmentSchema>;
export type CreateAssessment = z.output<typeof createAssessmentSchema>;

