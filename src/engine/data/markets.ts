import type { PipeStandardId } from './pipe-dimensions';

/**
 * Markets: what a plant's country decides for the estimate's money — which stock thickness
 * series insulation is sold in (inch series per ASTM C585 in North America, millimeters
 * elsewhere) — and the catalog defaults a form offers there. Display units never change
 * these; they only convert. Common practice (our own reading of each market).
 */
export const MARKETS = [
  { id: 'US', name: 'United States', stockSeries: 'inch', pipeStandard: 'ASME-B36.10M', tubeStandard: 'ASTM-B88-L', sanitaryStandard: 'ASTM-A270-SANITARY', currency: 'USD' },
  { id: 'CA', name: 'Canada', stockSeries: 'inch', pipeStandard: 'ASME-B36.10M', tubeStandard: 'ASTM-B88-L', sanitaryStandard: 'ASTM-A270-SANITARY', currency: 'CAD' },
  { id: 'GB', name: 'United Kingdom', stockSeries: 'mm', pipeStandard: 'EN-10220', tubeStandard: 'ASTM-B88-L', sanitaryStandard: 'DIN-11850-2', currency: 'GBP' },
  { id: 'IE', name: 'Ireland', stockSeries: 'mm', pipeStandard: 'EN-10220', tubeStandard: 'ASTM-B88-L', sanitaryStandard: 'DIN-11850-2', currency: 'EUR' },
  { id: 'EU', name: 'Continental Europe', stockSeries: 'mm', pipeStandard: 'EN-10220', tubeStandard: 'ASTM-B88-L', sanitaryStandard: 'DIN-11850-2', currency: 'EUR' },
  { id: 'AU', name: 'Australia', stockSeries: 'mm', pipeStandard: 'ASME-B36.10M', tubeStandard: 'ASTM-B88-L', sanitaryStandard: 'ASTM-A270-SANITARY', currency: 'AUD' },
  { id: 'NZ', name: 'New Zealand', stockSeries: 'mm', pipeStandard: 'ASME-B36.10M', tubeStandard: 'ASTM-B88-L', sanitaryStandard: 'ASTM-A270-SANITARY', currency: 'NZD' },
] as const satisfies readonly {
  id: string;
  name: string;
  stockSeries: 'inch' | 'mm';
  pipeStandard: PipeStandardId;
  tubeStandard: PipeStandardId;
  sanitaryStandard: PipeStandardId;
  currency: string;
}[];

export type MarketId = (typeof MARKETS)[number]['id'];
export type Market = (typeof MARKETS)[number];
export const MARKET_IDS = MARKETS.map((m) => m.id) as [MarketId, ...MarketId[]];



/** The market of a plant's country (ISO 3166 alpha-2); unknown countries get the millimeter market of Europe. */
export function marketForCountry(countryCode: string): MarketId {
  const code = countryCode.trim().toUpperCase();
  const direct = MARKETS.find((m) => m.id === code);
  if (direct) return direct.id;
  return 'EU';
}

/** A market by id. */
export function findMarket(id: MarketId): Market {
  return MARKETS.find((m) => m.id === id) as Market;
}
