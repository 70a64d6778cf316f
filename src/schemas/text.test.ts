import { describe, expect, it } from 'vitest';
import { findUnsafeText, safeText, unsafeTextReason } from './text';

describe('the shared text rule', () => {
  it.each([
    ['NUL', 'a\u0000b', /NUL character/],
    ['a lone high surrogate', 'a\uD83Db', /broken character/],
    ['a lone low surrogate', 'a\uDE00b', /broken character/],
    ['a bell', 'a\u0007b', /U\+0007/],
    ['a right-to-left override', 'invoice\u202Etxt.exe', /U\+202E/],
    ['an isolate', 'a\u2067b', /U\+2067/],
    ['a C1 control', 'a\u0085b', /U\+0085/],
  ])('refuses %s with a sentence', (_what, text, pattern) => {
    expect(unsafeTextReason(text)).toMatch(pattern);
    expect(safeText().safeParse(text).success).toBe(false);
  });

  it.each(['Łódź Dairy', 'Ölmühle Grün', '東京ベーカリー', 'Smokehouse 🔥', 'line one\nline two\ttabbed\r\n', 'שלום'])('keeps %s', (text) => {
    expect(unsafeTextReason(text)).toBeUndefined();
    expect(safeText().parse(text)).toBe(text);
  });

  it('finds every bad string and key in a parsed body, with its path', () => {
    expect(findUnsafeText({ contact: { name: 'ok', company: 'x\u0000' }, runs: [{ label: '\uD800' }], ['k\u0000']: 1 })).toEqual([
      { path: 'contact.company', message: expect.stringMatching(/NUL/) },
      { path: 'runs.0.label', message: expect.stringMatching(/broken/) },
      { path: 'k?', message: expect.stringMatching(/field name/) },
    ]);
  });
});
