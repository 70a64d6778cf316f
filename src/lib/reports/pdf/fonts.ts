/**
 * Manrope for the PDF, embedded from the package the site ships it in. react-pdf's font reader
 * takes WOFF (not WOFF2); the latin-ext subset is a second family the text falls back to, so
 * names such as Łódź or Třebíč print rightly.
 */
import { createRequire } from 'node:module';
import { Font } from '@react-pdf/renderer';

const require = createRequire(import.meta.url);
const WEIGHTS = [400, 600, 700, 800] as const;

/** The font families a report's text is set in, in fallback order. */
export const PDF_FONT_FAMILY = ['Manrope', 'Manrope Extended'];

let registered = false;

/** Registers the fonts once per process. */
export function registerReportFonts(): void {
  if (registered) return;
  for (const [family, subset] of [
    ['Manrope', 'latin'],
    ['Manrope Extended', 'latin-ext'],
  ] as const) {
    Font.register({
      family,
      fonts: WEIGHTS.map((weight) => ({ src: require.resolve(`@fontsource/manrope/files/manrope-${subset}-${weight}-normal.woff`), fontWeight: weight })),
    });
  }
  // Words are never broken across lines: a hyphenated figure or name reads wrongly.
  Font.registerHyphenationCallback((word) => [word]);
  registered = true;
}
