/**
 * Lagwise speaks one English — US spelling, fitting its US-first default — on every page,
 * e-mail, PDF and message. Scans the product's source for British forms used as words (in
 * text, labels, messages and comments). Ids that keep an older spelling for compatibility
 * (\`glass-fibre\`, \`aluminium-jacket\`, \`litre\` and the like, quoted whole or joined by hyphens)
 * and names inside identifiers are not words a person reads, and are left alone.
 */
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';

/** British form → the US form the product uses. */
const US_FORM: Record<string, string> = {
  aluminium: 'aluminum',
  analyse: 'analyze',
  analysed: 'analyzed',
  anonymise: 'anonymize',
  anonymised: 'anonymized',
  anonymises: 'anonymizes',
  anonymising: 'anonymizing',
  anticlockwise: 'counterclockwise',
  apologise: 'apologize',
  authorisation: 'authorization',
  authorised: 'authorized',
  behaviour: 'behavior',
  cancelled: 'canceled',
  catalogue: 'catalog',
  catalogues: 'catalogs',
  centimetre: 'centimeter',
  centimetres: 'centimeters',
  centre: 'center',
  centres: 'centers',
  characterise: 'characterize',
  characterised: 'characterized',
  cheque: 'check',
  colour: 'color',
  coloured: 'colored',
  colours: 'colors',
  customise: 'customize',
  defence: 'defense',
  deoxidised: 'deoxidized',
  draught: 'draft',
  draughts: 'drafts',
  draughty: 'drafty',
  emphasise: 'emphasize',
  enquiries: 'inquiries',
  enquiry: 'inquiry',
  favour: 'favor',
  fibre: 'fiber',
  fibreglass: 'fiberglass',
  fibres: 'fibers',
  fuelled: 'fueled',
  galvanise: 'galvanize',
  galvanised: 'galvanized',
  galvanising: 'galvanizing',
  grey: 'gray',
  honour: 'honor',
  judgement: 'judgment',
  kerb: 'curb',
  kilometre: 'kilometer',
  kilometres: 'kilometers',
  labelled: 'labeled',
  labour: 'labor',
  licence: 'license',
  linearised: 'linearized',
  litre: 'liter',
  litres: 'liters',
  manoeuvre: 'maneuver',
  metre: 'meter',
  metred: 'metered',
  metres: 'meters',
  millimetre: 'millimeter',
  millimetres: 'millimeters',
  minimise: 'minimize',
  minimised: 'minimized',
  modelled: 'modeled',
  modelling: 'modeling',
  mould: 'mold',
  moulds: 'molds',
  neighbour: 'neighbor',
  neighbouring: 'neighboring',
  neighbours: 'neighbors',
  normalise: 'normalize',
  normalised: 'normalized',
  normalises: 'normalizes',
  normalising: 'normalizing',
  odour: 'odor',
  odours: 'odors',
  optimise: 'optimize',
  optimised: 'optimized',
  organise: 'organize',
  organised: 'organized',
  oxidise: 'oxidize',
  oxidised: 'oxidized',
  pasteurised: 'pasteurized',
  pasteuriser: 'pasteurizer',
  pasteurisers: 'pasteurizers',
  pasteurising: 'pasteurizing',
  plough: 'plow',
  prioritise: 'prioritize',
  programme: 'program',
  realise: 'realize',
  realised: 'realized',
  recognise: 'recognize',
  recognised: 'recognized',
  sanitise: 'sanitize',
  sanitised: 'sanitized',
  savoury: 'savory',
  serialises: 'serializes',
  standardised: 'standardized',
  storey: 'story',
  sulphur: 'sulfur',
  summarise: 'summarize',
  summarised: 'summarized',
  summarises: 'summarizes',
  tonne: 'metric ton',
  tonnes: 'metric tons',
  travelled: 'traveled',
  tyre: 'tire',
  unoptimised: 'unoptimized',
  utilise: 'utilize',
  vaporisation: 'vaporization',
  vapour: 'vapor',
  vapours: 'vapors',
  whilst: 'while',
};

const WORD = new RegExp(`(?<![A-Za-z0-9_\\-/.])(${Object.keys(US_FORM).join('|')})(?![A-Za-z0-9_\\-])`, 'gi');

function sourceFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const full = path.join(dir, entry.name);
    // Tests are not read by anyone using the product, and some name the British forms to forbid them.
    if (entry.isDirectory()) return entry.name === '__tests__' ? [] : sourceFiles(full);
    return /\.(ts|tsx|astro|mdx?)$/.test(entry.name) && !/\.test\.tsx?$/.test(entry.name) ? [full] : [];
  });
}

/** Each British word in a file, with its line, except a whole quoted id or the price unit's key. */
function britishWords(file: string): string[] {
  const text = readFileSync(file, 'utf8');
  const found: string[] = [];
  for (const match of text.matchAll(WORD)) {
    const start = match.index ?? 0;
    const before = text[start - 1] ?? '';
    const after = text[start + match[0].length] ?? '';
    if (/['"`]/.test(before) && after === before) continue;
    if (match[0] === 'litre' && after === ':') continue;
    const line = text.slice(0, start).split('\n').length;
    found.push(`${path.relative(process.cwd(), file)}:${line} "${match[0]}" → "${US_FORM[match[0].toLowerCase()]}"`);
  }
  return found;
}

describe('one English', () => {
  it('the product speaks US spelling everywhere a person reads it (pages, islands, e-mails, PDFs, messages)', () => {
    const files = ['src', 'scripts/seed'].flatMap((dir) => sourceFiles(path.resolve(dir)));
    expect(files.length).toBeGreaterThan(100);
    expect(files.flatMap(britishWords)).toEqual([]);
  });

  it('finds a British word where there is one (the check itself works)', () => {
    const sample = 'A draughty room; the \'glass-fibre\' id stays; Colour of the jacket.';
    expect([...sample.matchAll(WORD)].map((m) => m[0])).toEqual(['draughty', 'Colour']);
  });
});
