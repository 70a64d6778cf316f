/** How a fuel's price units read in a sentence and a drop-down. */
import type { FuelPriceUnit } from '../../engine';

/** How each price unit reads in a sentence. */
export const PRICE_UNIT_NAMES: Record<FuelPriceUnit, string> = {
  therm: 'therm',
  MMBtu: 'MMBtu',
  GJ: 'GJ',
  kWh: 'kWh',
  m3: 'cubic meter (m³)',
  gallon: 'US gallon',
  litre: 'liter',
  kg: 'kg',
};
