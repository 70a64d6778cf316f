/**
 * The cautions Lagwise shows wherever it shows figures — pages, the estimate's results,
 * e-mails and reports — worded once, here.
 */
export type CautionGlyph = 'design' | 'burn' | 'fibre' | 'drop' | 'jacket' | 'ladder' | 'code';

export interface Caution {
  glyph: CautionGlyph;
  tone: 'heat' | 'cold' | 'plain';
  title: string;
  text: string;
}

export const cautions: readonly Caution[] = [
  {
    glyph: 'design',
    tone: 'plain',
    title: 'An estimate, not an engineering design',
    text: 'The figures come from your own inputs and published methods. A consultant measures before anything is specified, priced or installed.',
  },
  {
    glyph: 'burn',
    tone: 'heat',
    title: 'Hot surfaces burn',
    text: 'Bare steam, condensate and hot-water lines can burn skin in a moment. Treat every bare pipe as hot until it is shown to be cool.',
  },
  {
    glyph: 'fibre',
    tone: 'heat',
    title: 'Old lagging may contain asbestos',
    text: 'Do not cut, break, strip or sweep up old lagging. Have it surveyed, and removed if need be, by licensed abatement.',
  },
  {
    glyph: 'drop',
    tone: 'cold',
    title: 'Cold lines need a vapor retarder',
    text: 'Chilled-water and glycol lines need a continuous, sealed vapor retarder, or they sweat, drip and soak their insulation.',
  },
  {
    glyph: 'jacket',
    tone: 'plain',
    title: 'Food zones need cleanable, jacketed insulation',
    text: 'Over or near product, insulation must sit in a smooth, sealed jacket that stands up to washdown, with no fiber exposed.',
  },
  {
    glyph: 'ladder',
    tone: 'plain',
    title: 'Work at height with proper access',
    text: 'Most runs are overhead. Use a platform or a ladder set up properly, never the pipe or the rack, and never work up there alone.',
  },
  {
    glyph: 'code',
    tone: 'plain',
    title: 'Follow local codes and licensed practice',
    text: 'Building, fire, food-safety and workplace rules where you are come first, and licensed trades do the work they require.',
  },
];
