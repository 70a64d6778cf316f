/**
 * A few submitted assessments from invented plants, entered through the same submission
 * path the site uses (routing, engine snapshot, owner account, mail jobs). Each carries a
 * fixed idempotency key, so seeding twice stores each once.
 */
import { createAssessmentSchema, type CreateAssessmentInput } from '../../src/schemas/assessment';
import { submitAssessment } from '../../src/lib/assessments/submit';

const steel = (size: string) => ({ standard: 'ASME-B36.10M', size, schedule: '40', material: 'carbon-steel' });
const stainless = (size: string) => ({ standard: 'ASME-B36.19M', size, schedule: '10S', material: 'stainless-steel' });
const copper = (size: string) => ({ standard: 'ASTM-B88-L', size, material: 'copper' });

export const demoSubmissions: { key: string; input: CreateAssessmentInput }[] = [
  {
    key: 'demo-tamsin-creek-creamery',
    input: {
      contact: { name: 'Ines Barrow', company: 'Tamsin Creek Creamery', email: 'ines@tamsincreek.example', phone: '+1 503 555 0142' },
      consent: true,
      plant: { plantName: 'Tamsin Creek Creamery, Alder Ford', plantType: 'creamery', countryCode: 'US', postalCode: '97214' },
      estimate: {
        unitSystem: 'US',
        operatingHoursPerYear: 6200,
        energy: { fuel: 'natural-gas', price: 1.1, priceUnit: 'therm', currency: 'USD', boilerEfficiency: 0.8 },
        runs: [
          { id: 'steam-main', label: 'Boiler room steam main', service: 'steam', pipe: steel('2'), lengthM: 36, steamGaugePressureKPa: 690, valves: 3, flangePairs: 4 },
          { id: 'vat-feed', label: 'Cheese vat steam feed', service: 'steam', pipe: steel('1'), lengthM: 22, lengthConfidence: 'guessed', steamGaugePressureKPa: 410, valves: 2 },
          {
            id: 'condensate',
            label: 'Condensate return to feed tank',
            service: 'condensate-return',
            pipe: steel('1-1/2'),
            lengthM: 28,
            current: { state: 'damaged', bareFraction: 0.4, material: 'glass-fibre', thicknessM: 0.025 },
          },
          { id: 'cip-supply', label: 'CIP supply loop', service: 'cip-supply', pipe: stainless('2'), lengthM: 30, flangePairs: 6 },
          { id: 'glycol-vat', label: 'Glycol to cheese vats', service: 'glycol', pipe: stainless('1-1/2'), lengthM: 18 },
        ],
      },
    },
  },
  {
    key: 'demo-bramblecote-brewing',
    input: {
      contact: { name: 'Otto Fairweather', company: 'Bramblecote Brewing Co.', email: 'otto@bramblecote.example' },
      consent: true,
      plant: { plantName: 'Bramblecote brewhouse, Wicker Falls', plantType: 'brewery', countryCode: 'US', postalCode: '48307-1120' },
      estimate: {
        unitSystem: 'US',
        operatingHoursPerYear: 4200,
        operatingHoursConfidence: 'guessed',
        energy: { fuel: 'natural-gas', price: 0.95, priceUnit: 'therm', currency: 'USD' },
        runs: [
          { id: 'kettle-steam', label: 'Steam to brew kettle jacket', service: 'steam', pipe: steel('1-1/2'), lengthM: 24, steamGaugePressureKPa: 100, valves: 4 },
          { id: 'hot-liquor', label: 'Hot liquor tank to mash tun', service: 'hot-water', pipe: stainless('2'), lengthM: 15, fluidTemperatureC: 78 },
          { id: 'glycol-main', label: 'Glycol main to fermenters', service: 'glycol', pipe: copper('1-1/4'), lengthM: 42, ambient: { kind: 'indoor-draughty' } },
        ],
      },
    },
  },
  {
    key: 'demo-old-kiln-smokehouse',
    input: {
      contact: { name: 'Noor Haddad', company: 'Old Kiln Smokehouse', email: 'noor@oldkiln.example', phone: '+1 905 555 0187' },
      consent: true,
      plant: { plantName: 'Old Kiln Smokehouse, Pellow Cross', plantType: 'smokehouse', countryCode: 'CA', postalCode: 'L2R 7K6' },
      estimate: {
        unitSystem: 'SI',
        operatingHoursPerYear: 5000,
        conditions: { outdoorAirTemperatureC: 4, outdoorWindSpeedMPerS: 4 },
        energy: { fuel: 'natural-gas', price: 0.42, priceUnit: 'm3', currency: 'CAD' },
        runs: [
          { id: 'yard-steam', label: 'Steam line across the yard', service: 'steam', pipe: steel('3'), lengthM: 48, steamGaugePressureKPa: 520, ambient: { kind: 'outdoor' } },
          { id: 'smoke-room-hw', label: 'Hot water to smoke-room washdown', service: 'hot-water', pipe: copper('1'), lengthM: 26, fluidTemperatureC: 65 },
        ],
      },
    },
  },
  {
    key: 'demo-saltmarsh-sauces',
    input: {
      contact: { name: 'Gwen Tallis', company: 'Saltmarsh & Sons Sauces', email: 'gwen@saltmarshsauces.example' },
      consent: true,
      plant: { plantName: 'Saltmarsh & Sons, Kettlewick', plantType: 'sauce-kitchen', countryCode: 'GB', postalCode: 'HG1 2QT' },
      estimate: {
        unitSystem: 'SI',
        operatingHoursPerYear: 3900,
        energy: { fuel: 'natural-gas', price: 0.068, priceUnit: 'kWh', currency: 'GBP', emissionFactorSource: 'uk-desnz-2023' },
        runs: [
          { id: 'kettle-steam', label: 'Steam to jacketed kettles', service: 'steam', pipe: { standard: 'EN-10220', size: 'DN40' }, lengthM: 20, steamGaugePressureKPa: 300, valves: 5 },
          { id: 'chilled-return', label: 'Chilled water to blast chiller', service: 'chilled-water', pipe: { standard: 'EN-10220', size: 'DN50' }, lengthM: 16 },
        ],
      },
    },
  },
  {
    key: 'demo-morrow-lane-bakery',
    input: {
      contact: { name: 'Dario Pell', company: 'Morrow Lane Bakery', email: 'dario@morrowlane.example' },
      consent: true,
      plant: { plantName: 'Morrow Lane Bakery', plantType: 'bakery', countryCode: 'US', postalCode: '10013' },
      estimate: {
        unitSystem: 'US',
        operatingHoursPerYear: 5800,
        energy: { fuel: 'natural-gas', price: 1.35, priceUnit: 'therm', currency: 'USD' },
        runs: [{ id: 'oven-steam', label: 'Steam to deck-oven injectors', service: 'steam', pipe: steel('3/4'), lengthM: 14, steamGaugePressureKPa: 140, valves: 2 }],
      },
    },
  },
];

/**
 * How the seed submits: from its own address, past the per-address limit meant for visitors
 * (ten an hour) — the demo stores a few dozen plants at once, and a fresh `npm start` must load
 * them all.
 */
export const seedSubmissionContext = {
  clientAddress: 'demo-seed',
  limits: { perAddressPerHour: 10_000, perEmailPerHour: 10_000 },
} as const;

export async function seedDemoAssessments(): Promise<number> {
  let stored = 0;
  for (const { key, input } of demoSubmissions) {
    const outcome = await submitAssessment(createAssessmentSchema.parse(input), [], { ...seedSubmissionContext, idempotencyKey: key });
    if (!outcome.replayed) stored += 1;
  }
  return stored;
}
