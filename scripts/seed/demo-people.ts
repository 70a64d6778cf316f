/**
 * The demo's people and territories: an invented scenario of our own (no real firms or
 * persons). Postal-code prefixes follow each country's real format so routing can be tried.
 */
export const DEMO_PASSWORD = 'lagwise-demo-2026';

export interface DemoRegion {
  slug: string;
  name: string;
  countryCode: string;
  prefixes: string[];
}

export const demoRegions: DemoRegion[] = [
  { slug: 'cascade-foothills', name: 'Cascade Foothills', countryCode: 'US', prefixes: ['970', '971', '972', '973'] },
  { slug: 'lakeshore-north', name: 'Lakeshore North', countryCode: 'US', prefixes: ['480', '481', '482', '483', '484'] },
  { slug: 'green-mountain-upper-hudson', name: 'Green Mountain & Upper Hudson', countryCode: 'US', prefixes: ['05', '120', '121', '122', '128'] },
  { slug: 'lake-ontario-west', name: 'Lake Ontario West', countryCode: 'CA', prefixes: ['L', 'M'] },
  { slug: 'niagara-bench', name: 'Niagara Bench', countryCode: 'CA', prefixes: ['L2', 'L3'] },
  { slug: 'dales-and-moors', name: 'Dales and Moors', countryCode: 'GB', prefixes: ['HG', 'YO', 'DL', 'BD'] },
];

export interface DemoAccount {
  email: string;
  name: string;
  role: 'admin' | 'consultant' | 'owner';
  company?: string;
  /** The consultant's phone, told to owners when they claim a lead. */
  phone?: string;
  regions?: string[];
  /** Open leads they may hold at once (the default otherwise). */
  cap?: number;
}

export const demoAccounts: DemoAccount[] = [
  { email: 'admin@lagwise.example', name: 'Rosa Delacroix', role: 'admin' },
  {
    email: 'marisol@quintero-thermal.example',
    name: 'Marisol Quintero',
    role: 'consultant',
    company: 'Quintero Thermal Works',
    phone: '+1 503 555 0191',
    regions: ['cascade-foothills'],
  },
  {
    email: 'anders@kvale-insulation.example',
    name: 'Anders Kvale',
    role: 'consultant',
    company: 'Kvale Mechanical Insulation',
    phone: '+1 503 555 0177',
    regions: ['cascade-foothills'],
  },
  {
    email: 'tobias@wendt-energy.example',
    name: 'Tobias Wendt',
    role: 'consultant',
    company: 'Wendt Pipe & Energy',
    phone: '+1 248 555 0133',
    regions: ['lakeshore-north'],
  },
  {
    email: 'declan@hollis-lagging.example',
    name: 'Declan Hollis',
    role: 'consultant',
    company: 'Hollis Lagging Co.',
    phone: '+1 518 555 0164',
    regions: ['green-mountain-upper-hudson'],
  },
  {
    email: 'priya@raman-audits.example',
    name: 'Priya Raman',
    role: 'consultant',
    company: 'Raman Energy Audits',
    phone: '+1 905 555 0120',
    regions: ['lake-ontario-west', 'niagara-bench'],
  },
  {
    email: 'ffion@baird-insulation.example',
    name: 'Ffion Baird',
    role: 'consultant',
    company: 'Baird Insulation Services',
    phone: '+44 1423 555 019',
    regions: ['dales-and-moors'],
  },
  {
    email: 'ottilie@marsh-finch.example',
    name: 'Ottilie Marsh',
    role: 'consultant',
    company: 'Marsh & Finch Insulation',
    phone: '+1 802 555 0148',
    regions: ['green-mountain-upper-hudson'],
    cap: 2,
  },
];

/** Lines for the start command's banner. */
export function demoSignInLines(): string[] {
  return demoAccounts.map((a) => `${a.role.padEnd(11)} ${a.email.padEnd(36)} ${a.name}${a.company ? `, ${a.company}` : ''}`);
}
