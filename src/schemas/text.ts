/**
 * The one rule for text that comes from outside: no NUL, no lone UTF-16 surrogate (PostgreSQL
 * refuses both, and they are never typed by a person), no control characters other than tab
 * and line breaks, and no bidirectional overrides (which make text display in a different order
 * than it is stored — a way to disguise a name or a link). Every text field of every request
 * schema uses `safeText()`; `findUnsafeText` checks a whole parsed body at once.
 */
import { z } from 'zod';

/** C0 controls except tab/LF/CR, DEL, C1 controls, bidi marks, embeddings, overrides and isolates, BOM. */
const CONTROL_OR_BIDI = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F-\u009F\u061C\u200E\u200F\u202A-\u202E\u2066-\u2069\uFEFF]/u;
const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

/** The sentence for a refused text, or undefined when the text is fine. */
export function unsafeTextReason(text: string): string | undefined {
  if (text.includes('\u0000')) return 'This text contains a NUL character, which cannot be stored; retype it rather than pasting it.';
  if (LONE_SURROGATE.test(text)) {
    return 'This text contains a broken character (half of an emoji or symbol); retype it rather than pasting it.';
  }
  const found = CONTROL_OR_BIDI.exec(text);
  if (found) {
    const code = found[0].codePointAt(0)!.toString(16).toUpperCase().padStart(4, '0');
    return `This text contains an invisible control or direction character (U+${code}); retype it rather than pasting it.`;
  }
  return undefined;
}

/** The rule as a zod refinement, to append to an existing string schema: `.superRefine(textRule)`. */
export function textRule(text: string, ctx: z.RefinementCtx): void {
  const reason = unsafeTextReason(text);
  if (reason) ctx.addIssue({ code: 'custom', message: reason });
}

/** A string with the rule above; `max` bounds its length in characters. */
export function safeText({ max = 2000 }: { max?: number } = {}) {
  return z
    .string()
    .max(max, { error: `Keep this under ${max} characters.` })
    .superRefine((text, ctx) => {
      const reason = unsafeTextReason(text);
      if (reason) ctx.addIssue({ code: 'custom', message: reason });
    });
}

/**
 * Every string (and object key) in a parsed JSON value that breaks the rule, with its path, so
 * a request is refused whole with each field named — whatever schema reads it next.
 */
export function findUnsafeText(value: unknown, path: (string | number)[] = [], found: { path: string; message: string }[] = []) {
  if (found.length >= 20) return found;
  if (typeof value === 'string') {
    const reason = unsafeTextReason(value);
    if (reason) found.push({ path: path.map(String).join('.') || '(body)', message: reason });
  } else if (Array.isArray(value)) {
    value.forEach((item, index) => findUnsafeText(item, [...path, index], found));
  } else if (value && typeof value === 'object') {
    for (const [key, item] of Object.entries(value)) {
      const reason = unsafeTextReason(key);
      if (reason) found.push({ path: [...path, key.replace(/[^\x20-\x7E]/g, '?')].map(String).join('.'), message: `A field name is not valid: ${reason}` });
      else findUnsafeText(item, [...path, key], found);
    }
  }
  return found;
}
