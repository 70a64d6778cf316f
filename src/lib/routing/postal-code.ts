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
}

/** Formats from each postal administration's public description of its codes. */
export const postalFormats = {
  US: { name: 'United States', pattern: /^\d{5}(\d{4})?$/, example: '97214 or 97214-3302', routeLength: 5 },
  CA: { name: 'Canada', pattern: /^[ABCEGHJ-NPRSTVXY]\d[ABCEGHJ-NPRSTV-Z]\d[ABCEGHJ-NPRSTV-Z]\d$/, example: 'L2R 7K6' },
  GB: { name: 'United Kingdom', pattern: /^([A-Z]{1,2}\d[A-Z\d]?\d[A-Z]{2}|GIR0AA)$/, example: 'HG1 2QT' },
  IE: { name: 'Ireland', pattern: /^[AC-FHKNPRTV-Y]\d{2}[0-9AC-FHKNPRTV-Y]{4}$/, example: 'D02 X285' },
  AU: { name: 'Australia', pattern: /^\d{4}$/, example: '3056' },
  NZ: { name: 'New Zealand', pattern: /^\d{4}$/, example: '7010' },
  DE: { name: 'Germany', pattern: /^\d{5}$/, example: '79098' },
  FR: { name: 'France', pattern: /^\d{5}$/, example: '69002' },
  NL: { name: 'Netherlands', pattern: /^[1-9]\d{3}[A-Z]{2}$/, example: '3511 LX' },
  BE: { name: 'Belgium', pattern: /^[1-9]\d{3}$/, example: '9000' },
  DK: { name: 'Denmark', pattern: /^\d{4}$/, example: '8000' },
  SE: { name: 'Sweden', pattern: /^\d{5}$/, example: '411 06' },
  NO: { name: 'Norway', pattern: /^\d{4}$/, example: '5003' },
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
