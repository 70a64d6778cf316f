/**
 * Text the report's composer and the owner's answer accept: a length limit and no characters a
 * person never types (NUL, other control characters, lone surrogates, direction overrides),
 * which PostgreSQL refuses or which make text read in another order than it is stored.
 */
import { z } from 'zod';

const CONTROL_OR_BIDI = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F-\u009F\u061C\u200E\u200F\u202A-\u202E\u2066-\u2069\uFEFF]/u;
const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

/** A text field named `label`, trimmed, at most `max` characters. */
export function reportText(label: string, max: number) {
  return z
    .string({ error: `${label} must be text.` })
    .trim()
    .max(max, { error: `${label}: keep it under ${max} characters.` })
    .superRefine((text, ctx) => {
      if (LONE_SURROGATE.test(text) || CONTROL_OR_BIDI.test(text)) {
        ctx.addIssue({ code: 'custom', message: `${label} contains an invisible control or broken character; retype it rather than pasting it.` });
      }
    });
}
