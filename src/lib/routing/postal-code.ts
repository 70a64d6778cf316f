/**
 * Postal codes as people type them → one canonical form per country (upper case, no spaces
 * or dashes), checked against that country's published format, so prefixes compare simply.
 */

export interface CountryPostalFormat {
  name: string;
  /** Matches the canonical form (after upper-casing and removing spaces and dashes). */
  pattern: RegExp;
  /** What a person sees when their code does not fit. */
  example: string;
  /** Keep only this many leading characters (US ZIP+4 routes on the 5-digit ZIP). */
  routeLength?: number;
  /**
   * The routed part of a code as character classes, one per position, once per shape the
   * country's codes take: a region prefix must be the start of one of them.
   */
  shapes: readonly (readonly string[])[];
  /** How a region prefix of this country looks, said to the admin who typed a wrong one. */
  prefixHint: string;
}

const D = '[0-9]';
const L = '[A-Z]';
function repeat(cls: string, times: number): string[] {
  return Array.from({ length: times }, () => cls);
}

/** Formats from each postal administration's public description of its codes. */
export const postalFormats = {
  US: {
    name: 'United States',
    pattern: /^\d{5}(\d{4})?$/,
    example: '97214 or 97214-3302',
    routeLength: 5,
    shapes: [repeat(D, 5)],
    prefixHint: '1 to 5 digits of a ZIP code, like 972 or 97214',
  },
  CA: {
    name: 'Canada',
    pattern: /^[ABCEGHJ-NPRSTVXY]\d[ABCEGHJ-NPRSTV-Z]\d[ABCEGHJ-NPRSTV-Z]\d$/,
    example: 'L2R 7K6',
    shapes: [['[ABCEGHJ-NPRSTVXY]', D, '[ABCEGHJ-NPRSTV-Z]', D, '[ABCEGHJ-NPRSTV-Z]', D]],
    prefixHint: 'the start of a postal code, letter then digit then letter, like L, L2 or L2R',
  },
  GB: {
    name: 'United Kingdom',
    pattern: /^([A-Z]{1,2}\d[A-Z\d]?\d[A-Z]{2}|GIR0AA)$/,
    example: 'HG1 2QT',
    // Outward code (area letters, district) then the inward code (sector digit, two letters).
    shapes: [
      [L, D, D, L, L],
      [L, D, D, D, L, L],
      [L, D, L, D, L, L],
      [L, L, D, D, L, L],
      [L, L, D, D, D, L, L],
      [L, L, D, L, D, L, L],
      ['G', 'I', 'R', '0', 'A', 'A'],
    ],
    prefixHint: 'a postcode area or district, like HG, HG1 or SW1A',
  },
  IE: {
    name: 'Ireland',
    pattern: /^[AC-FHKNPRTV-Y]\d{2}[0-9AC-FHKNPRTV-Y]{4}$/,
    example: 'D02 X285',
    shapes: [['[AC-FHKNPRTV-Y]', D, D, ...repeat('[0-9AC-FHKNPRTV-Y]', 4)]],
    prefixHint: 'the start of an Eircode, like D or D02',
  },
  AU: { name: 'Australia', pattern: /^\d{4}$/, example: '3056', shapes: [repeat(D, 4)], prefixHint: '1 to 4 digits, like 30 or 3056' },
  NZ: { name: 'New Zealand', pattern: /^\d{4}$/, example: '7010', shapes: [repeat(D, 4)], prefixHint: '1 to 4 digits, like 70 or 7010' },
  DE: { name: 'Germany', pattern: /^\d{5}$/, example: '79098', shapes: [repeat(D, 5)], prefixHint: '1 to 5 digits, like 79 or 790' },
  FR: { name: 'France', pattern: /^\d{5}$/, example: '69002', shapes: [repeat(D, 5)], prefixHint: '1 to 5 digits, like 69 or 690' },
  NL: {
    name: 'Netherlands',
    pattern: /^[1-9]\d{3}[A-Z]{2}$/,
    example: '3511 LX',
    shapes: [['[1-9]', D, D, D, L, L]],
    prefixHint: '1 to 4 digits (the first not 0), then up to two letters, like 35 or 3511',
  },
  BE: { name: 'Belgium', pattern: /^[1-9]\d{3}$/, example: '9000', shapes: [['[1-9]', D, D, D]], prefixHint: '1 to 4 digits, the first not 0, like 90' },
  DK: { name: 'Denmark', pattern: /^\d{4}$/, example: '8000', shapes: [repeat(D, 4)], prefixHint: '1 to 4 digits, like 80' },
  SE: { name: 'Sweden', pattern: /^\d{5}$/, example: '411 06', shapes: [repeat(D, 5)], prefixHint: '1 to 5 digits, like 41 or 411' },
  NO: { name: 'Norway', pattern: /^\d{4}$/, example: '5003', shapes: [repeat(D, 4)], prefixHint: '1 to 4 digits, like 50' },
} as const satisfies Record<string, CountryPostalFormat>;

export type CountryCode = keyof typeof postalFormats;
export const countryCodes = Object.keys(postalFormats) as CountryCode[];

export function isCountryCode(value: string): value is CountryCode {
  return Object.hasOwn(postalFormats, value);
}

export type NormalisedPostalCode =
  | { ok: true; canonical: string; routingKey: string }
  | { ok: false; message: string };

/** The canonical code, and the part of it that routing compares with region prefixes. */
export function normalisePostalCode(countryCode: CountryCode, typed: string): NormalisedPostalCode {
  const format: CountryPostalFormat = postalFormats[countryCode];
  const canonical = typed.toUpperCase().replace(/[\s\-.]/g, '');
  if (!format.pattern.test(canonical)) {
    return {
      ok: false,
      message: `"${typed.trim()}" is not a postal code of ${format.name}; it should look like ${format.example}.`,
    };
  }
  return { ok: true, canonical, routingKey: format.routeLength ? canonical.slice(0, format.routeLength) : canonical };
}

/** Every leading part of a routing key, longest first: the candidates a region prefix can equal. */
export function prefixCandidates(routingKey: string): string[] {
  const candidates: string[] = [];
  for (let length = Math.min(routingKey.length, 10); length >= 1; length -= 1) candidates.push(routingKey.slice(0, length));
  return candidates;
}

export type CheckedPrefix = { ok: true; prefix: string } | { ok: false; message: string };

/** A prefix as typed, in the canonical form codes are compared in (upper case, no spaces or dashes). */
export function canonicalPrefix(typed: string): string {
  return typed.toUpperCase().replace(/[\s\-.]/g, '');
}

function fitsShape(prefix: string, shape: readonly string[]): boolean {
  if (prefix.length === 0 || prefix.length > shape.length) return false;
  return [...prefix].every((char, index) => new RegExp(`^${shape[index]}$`).test(char));
}

/**
 * Whether `typed` can be the start of a routed postal code of the country: a region prefix the
 * routing can ever match. A refusal names the prefix and the country's format.
 */
export function checkRegionPrefix(countryCode: CountryCode, typed: string): CheckedPrefix {
  const format: CountryPostalFormat = postalFormats[countryCode];
  const prefix = canonicalPrefix(typed);
  if (format.shapes.some((shape) => fitsShape(prefix, shape))) return { ok: true, prefix };
  const shown = typed.trim() || '(empty)';
  return { ok: false, message: `"${shown}" is not the start of a postal code of ${format.name}; a prefix there is ${format.prefixHint}.` };
}
