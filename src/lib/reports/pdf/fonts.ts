/**
 * Manrope for the PDF, embedded from the package the site ships it in. react-pdf's font reader
 * takes WOFF (not WOFF2); the latin-ext subset is a second family the text falls back to, so
 * names such as Łódź or Třebíč print rightly. Manrope has no subscript digits, so the "₂" of
 * CO₂ (and any other sign it lacks) falls back to DejaVu Sans, which the PDF embeds for those
 * glyphs alone; without it the PDF would print a wrong sign where the web page prints CO₂.
 */
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { Font } from '@react-pdf/renderer';
import { sfntFromWoff } from './woff';

const require = createRequire(import.meta.url);
const WEIGHTS = [400, 600, 700, 800] as const;

/** The font families a report's text is set in, in fallback order. */
export const PDF_FONT_FAMILY = ['Manrope', 'Manrope Extended', 'Lagwise Signs'];

let registered = false;

/** A packaged WOFF file as react-pdf takes it: the TrueType inside (see ./woff), as a data URL. */
function fontSource(file: string): string {
  return `data:font/ttf;base64,${sfntFromWoff(readFileSync(require.resolve(file))).toString('base64')}`;
}

/** Registers the fonts once per process. */
export function registerReportFonts(): void {
  if (registered) return;
  for (const [family, subset] of [
    ['Manrope', 'latin'],
    ['Manrope Extended', 'latin-ext'],
  ] as const) {
    Font.register({
      family,
      fonts: WEIGHTS.map((weight) => ({ src: fontSource(`@fontsource/manrope/files/manrope-${subset}-${weight}-normal.woff`), fontWeight: weight })),
    });
  }
  Font.register({
    family: 'Lagwise Signs',
    fonts: ([400, 700] as const).map((weight) => ({ src: fontSource(`@fontsource/dejavu-sans/files/dejavu-sans-latin-${weight}-normal.woff`), fontWeight: weight })),
  });
  // Words are never broken across lines: a hyphenated figure or name reads wrongly.
  Font.registerHyphenationCallback((word) => [word]);
  registered = true;
}
