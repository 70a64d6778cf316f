/**
 * The paper a report is printed on, by the plant's country: US Letter where that is the office
 * paper (the United States and Canada, Mexico and most of Central America, the Philippines,
 * Chile, Colombia and Venezuela — common practice), A4 everywhere else.
 */
const LETTER_COUNTRIES = new Set(['US', 'CA', 'MX', 'GT', 'BZ', 'SV', 'HN', 'NI', 'CR', 'PA', 'DO', 'PR', 'PH', 'CL', 'CO', 'VE']);

export type PaperSize = 'A4' | 'LETTER';

export function paperSizeFor(countryCode: string): PaperSize {
  return LETTER_COUNTRIES.has(countryCode.toUpperCase()) ? 'LETTER' : 'A4';
}
