/**
 * Work on every demo consultant's desk: more invented plants in their regions, and for some of
 * them a history — claimed, talked to, a site walk booked, closed, or handed back — made with the
 * desk's own domain functions (the same claim, moves, notes and release the API calls). A lead
 * that already has any desk history is left as it is, so seeding twice changes nothing.
 */
import { and, eq, like } from 'drizzle-orm';
import { getDb } from '../../src/db/client';
import { activityLog, assessments, user } from '../../src/db/schema';
import { submitAssessment } from '../../src/lib/assessments/submit';
import { seedSubmissionContext } from './demo-assessments.ts';
import { claimLead } from '../../src/lib/leads/claim';
import type { CloseReason, ReleaseReason } from '../../src/lib/leads/pipeline';
import { addLeadNote, moveLead, releaseLead } from '../../src/lib/leads/work';
import { isRoleName } from '../../src/lib/permissions';
import type { SessionUser } from '../../src/lib/session';
import { createAssessmentSchema, type CreateAssessmentInput } from '../../src/schemas/assessment';

type Step =
  | { claim: string }
  | { move: 'in_touch' | 'site_walk_booked'; by: string; note?: string }
  | { close: CloseReason; by: string; note?: string }
  | { note: string; by: string }
  | { release: ReleaseReason; by: string; note?: string };

interface DeskDemo {
  key: string;
  input: CreateAssessmentInput;
  steps: Step[];
}

const steel = (size: string) => ({ standard: 'ASME-B36.10M', size, schedule: '40', material: 'carbon-steel' });
const stainless = (size: string) => ({ standard: 'ASME-B36.19M', size, schedule: '10S', material: 'stainless-steel' });
const copper = (size: string) => ({ standard: 'ASTM-B88-L', size, material: 'copper' });

const usEnergy = (price: number) => ({ fuel: 'natural-gas', price, priceUnit: 'therm', currency: 'USD' }) as const;

function plant(
  p: { company: string; name: string; email: string; phone?: string; type: string; country: 'US' | 'CA' | 'GB'; postal: string; plantName: string },
  estimate: CreateAssessmentInput['estimate'],
): CreateAssessmentInput {
  return {
    contact: { name: p.name, company: p.company, email: p.email, ...(p.phone ? { phone: p.phone } : {}) },
    consent: true,
    plant: { plantName: p.plantName, plantType: p.type as 'creamery', countryCode: p.country, postalCode: p.postal },
    estimate,
  };
}

const marisol = 'marisol@quintero-thermal.example';
const anders = 'anders@kvale-insulation.example';
const tobias = 'tobias@wendt-energy.example';
const declan = 'declan@hollis-lagging.example';
const priya = 'priya@raman-audits.example';
const ffion = 'ffion@baird-insulation.example';

/** New plants for the desk, by region, each with the history its consultant has made so far. */
export const deskDemoLeads: DeskDemo[] = [
  {
    key: 'demo-rook-hollow-cheese',
    input: plant(
      { company: 'Rook Hollow Cheese', name: 'Wren Adeyemi', email: 'wren@rookhollow.example', phone: '+1 503 555 0118', type: 'creamery', country: 'US', postal: '97301', plantName: 'Rook Hollow Cheese, Mallow Bend' },
      {
        unitSystem: 'US',
        operatingHoursPerYear: 5600,
        energy: usEnergy(1.05),
        runs: [
          { id: 'steam', label: 'Steam header to make room', service: 'steam', pipe: steel('2'), lengthM: 30, steamGaugePressureKPa: 620, valves: 4, flangePairs: 2 },
          { id: 'whey', label: 'Hot whey transfer', service: 'hot-water', pipe: stainless('1-1/2'), lengthM: 18, fluidTemperatureC: 72 },
          { id: 'glycol', label: 'Glycol to brine room', service: 'glycol', pipe: stainless('1'), lengthM: 24 },
        ],
      },
    ),
    steps: [
      { claim: marisol },
      { move: 'in_touch', by: marisol, note: 'Spoke with Wren; the make room steam header is the worst of it.' },
      { move: 'site_walk_booked', by: marisol, note: 'Walk on Thursday at 7:00, before the first vat is filled.' },
    ],
  },
  {
    key: 'demo-fenwick-cider',
    input: plant(
      { company: 'Fenwick Cider Press', name: 'Hollis Fenwick', email: 'hollis@fenwickcider.example', type: 'juice-plant', country: 'US', postal: '97123', plantName: 'Fenwick Cider Press' },
      {
        unitSystem: 'US',
        operatingHoursPerYear: 3000,
        energy: usEnergy(1.2),
        runs: [
          { id: 'pasteur', label: 'Hot water to the pasteurizer', service: 'hot-water', pipe: copper('1-1/2'), lengthM: 22, fluidTemperatureC: 85 },
          { id: 'chill', label: 'Chilled water to juice tanks', service: 'chilled-water', pipe: copper('2'), lengthM: 35 },
        ],
      },
    ),
    steps: [{ claim: anders }, { move: 'in_touch', by: anders, note: 'Season starts in September; they want the work done before.' }],
  },
  {
    key: 'demo-larkspur-tofu',
    input: plant(
      { company: 'Larkspur Soy Kitchen', name: 'Mei Larkspur', email: 'mei@larkspursoy.example', phone: '+1 503 555 0166', type: 'tofu-plant', country: 'US', postal: '97209', plantName: 'Larkspur Soy Kitchen' },
      {
        unitSystem: 'US',
        operatingHoursPerYear: 4800,
        energy: usEnergy(1.1),
        runs: [
          { id: 'cooker', label: 'Steam to soy cooker', service: 'steam', pipe: steel('1-1/2'), lengthM: 16, steamGaugePressureKPa: 400, valves: 3 },
          { id: 'press', label: 'Hot water to curd presses', service: 'hot-water', pipe: copper('1'), lengthM: 12 },
        ],
      },
    ),
    steps: [{ claim: marisol }],
  },
  {
    key: 'demo-bitterroot-bakery',
    input: plant(
      { company: 'Bitterroot Bread Co.', name: 'Sol Ferris', email: 'sol@bitterrootbread.example', type: 'bakery', country: 'US', postal: '97325', plantName: 'Bitterroot Bread Co., Ashwell' },
      {
        unitSystem: 'US',
        operatingHoursPerYear: 6200,
        energy: usEnergy(1.3),
        runs: [{ id: 'oven', label: 'Steam to rack-oven injectors', service: 'steam', pipe: steel('1'), lengthM: 20, steamGaugePressureKPa: 200, valves: 2 }],
      },
    ),
    steps: [{ claim: anders }, { release: 'too-far', by: anders, note: 'Two hours south of our crews; better for someone nearer.' }],
  },
  {
    key: 'demo-coldwater-smokery',
    input: plant(
      { company: 'Coldwater Smokery', name: 'Bram Okafor', email: 'bram@coldwatersmokery.example', type: 'smokehouse', country: 'US', postal: '97030', plantName: 'Coldwater Smokery' },
      {
        unitSystem: 'US',
        operatingHoursPerYear: 2500,
        energy: usEnergy(1.15),
        runs: [{ id: 'wash', label: 'Hot water to washdown hose reels', service: 'hot-water', pipe: copper('3/4'), lengthM: 10, fluidTemperatureC: 60 }],
      },
    ),
    steps: [
      { claim: marisol },
      { move: 'in_touch', by: marisol },
      { close: 'too-small', by: marisol, note: 'Ten meters of 3/4" copper; a weekend job for their own fitter.' },
    ],
  },
  {
    key: 'demo-pike-street-creamery',
    input: plant(
      { company: 'Pike Street Creamery', name: 'Juno Marsh', email: 'juno@pikestreetcreamery.example', phone: '+1 734 555 0142', type: 'creamery', country: 'US', postal: '48104', plantName: 'Pike Street Creamery' },
      {
        unitSystem: 'US',
        operatingHoursPerYear: 6000,
        energy: usEnergy(0.98),
        runs: [
          { id: 'steam', label: 'Steam to HTST pasteurizer', service: 'steam', pipe: steel('1-1/2'), lengthM: 26, steamGaugePressureKPa: 550, valves: 3 },
          { id: 'cip', label: 'CIP return loop', service: 'cip-return', pipe: stainless('2'), lengthM: 40, flangePairs: 5 },
        ],
      },
    ),
    steps: [{ claim: tobias }, { move: 'in_touch', by: tobias }, { note: 'Asked for photos of the CIP return where it runs along the cold room.', by: tobias }],
  },
  {
    key: 'demo-harrow-mill-brewing',
    input: plant(
      { company: 'Harrow Mill Brewing', name: 'Dov Castellan', email: 'dov@harrowmill.example', type: 'brewery', country: 'US', postal: '48201', plantName: 'Harrow Mill Brewing, Canal Street' },
      {
        unitSystem: 'US',
        operatingHoursPerYear: 4000,
        energy: usEnergy(0.95),
        runs: [
          { id: 'kettle', label: 'Steam to kettle jacket', service: 'steam', pipe: steel('2'), lengthM: 18, steamGaugePressureKPa: 110, valves: 3 },
          { id: 'glycol', label: 'Glycol main to cellar', service: 'glycol', pipe: copper('1-1/2'), lengthM: 50 },
        ],
      },
    ),
    steps: [{ claim: tobias }, { move: 'in_touch', by: tobias }, { move: 'site_walk_booked', by: tobias, note: 'Walk after Monday’s brew day.' }],
  },
  {
    key: 'demo-quillfeather-sauces',
    input: plant(
      { company: 'Quillfeather Sauces', name: 'Ama Quill', email: 'ama@quillfeather.example', type: 'sauce-kitchen', country: 'US', postal: '48322', plantName: 'Quillfeather Sauces' },
      {
        unitSystem: 'US',
        operatingHoursPerYear: 3500,
        energy: usEnergy(1.0),
        runs: [{ id: 'kettles', label: 'Steam to jacketed kettles', service: 'steam', pipe: steel('1-1/2'), lengthM: 22, steamGaugePressureKPa: 300, valves: 5 }],
      },
    ),
    steps: [],
  },
  {
    key: 'demo-birchknoll-dairy',
    input: plant(
      { company: 'Birchknoll Dairy', name: 'Lotte Vance', email: 'lotte@birchknoll.example', phone: '+1 802 555 0107', type: 'creamery', country: 'US', postal: '05401', plantName: 'Birchknoll Dairy, Ferrisburg Road' },
      {
        unitSystem: 'US',
        operatingHoursPerYear: 6500,
        conditions: { outdoorAirTemperatureC: -2, outdoorWindSpeedMPerS: 5 },
        energy: { fuel: 'fuel-oil-2', price: 3.6, priceUnit: 'gallon', currency: 'USD' },
        runs: [
          { id: 'yard', label: 'Steam across the yard to the barn', service: 'steam', pipe: steel('2'), lengthM: 40, steamGaugePressureKPa: 500, ambient: { kind: 'outdoor' } },
          { id: 'cond', label: 'Condensate back to the boiler house', service: 'condensate-return', pipe: steel('1'), lengthM: 40, ambient: { kind: 'outdoor' } },
        ],
      },
    ),
    steps: [{ claim: declan }, { move: 'in_touch', by: declan }, { move: 'site_walk_booked', by: declan, note: 'Bring the probe thermometer; the yard line may be waterlogged.' }],
  },
  {
    key: 'demo-tannery-brook-brewing',
    input: plant(
      { company: 'Tannery Brook Brewing', name: 'Rafe Ostrander', email: 'rafe@tannerybrook.example', type: 'brewery', country: 'US', postal: '12180', plantName: 'Tannery Brook Brewing' },
      {
        unitSystem: 'US',
        operatingHoursPerYear: 3800,
        energy: usEnergy(1.25),
        runs: [{ id: 'hlt', label: 'Hot liquor to mash tun', service: 'hot-water', pipe: stainless('2'), lengthM: 14, fluidTemperatureC: 80 }],
      },
    ),
    steps: [{ claim: declan }],
  },
  {
    key: 'demo-hollowell-bakehouse',
    input: plant(
      { company: 'Hollowell Bakehouse', name: 'Ines Grady', email: 'ines@hollowellbakehouse.example', type: 'bakery', country: 'US', postal: '12047', plantName: 'Hollowell Bakehouse' },
      {
        unitSystem: 'US',
        operatingHoursPerYear: 5200,
        energy: usEnergy(1.3),
        runs: [
          { id: 'proof', label: 'Steam to proofers', service: 'steam', pipe: steel('1'), lengthM: 15, steamGaugePressureKPa: 150, valves: 2 },
          { id: 'hw', label: 'Hot water to pan wash', service: 'hot-water', pipe: copper('1'), lengthM: 20 },
        ],
      },
    ),
    steps: [],
  },
  {
    key: 'demo-kestrel-bay-juice',
    input: plant(
      { company: 'Kestrel Bay Juice', name: 'Nadia Kestrel', email: 'nadia@kestrelbay.example', type: 'juice-plant', country: 'CA', postal: 'M5V 2T6', plantName: 'Kestrel Bay Juice' },
      {
        unitSystem: 'SI',
        operatingHoursPerYear: 4200,
        energy: { fuel: 'natural-gas', price: 0.4, priceUnit: 'm3', currency: 'CAD' },
        runs: [
          { id: 'hw', label: 'Hot water to the bottle rinser', service: 'hot-water', pipe: copper('1-1/4'), lengthM: 28 },
          { id: 'chw', label: 'Chilled water to holding tanks', service: 'chilled-water', pipe: copper('2'), lengthM: 30 },
        ],
      },
    ),
    steps: [],
  },
  {
    key: 'demo-greybeck-tofu',
    input: plant(
      { company: 'Greybeck Tofu', name: 'Ken Aldous', email: 'ken@greybecktofu.example', type: 'tofu-plant', country: 'CA', postal: 'L3C 4K1', plantName: 'Greybeck Tofu' },
      {
        unitSystem: 'SI',
        operatingHoursPerYear: 5000,
        energy: { fuel: 'natural-gas', price: 0.42, priceUnit: 'm3', currency: 'CAD' },
        runs: [{ id: 'cooker', label: 'Steam to soy cooker', service: 'steam', pipe: steel('1-1/2'), lengthM: 14, steamGaugePressureKPa: 350 }],
      },
    ),
    steps: [{ claim: priya }, { move: 'in_touch', by: priya }, { close: 'went-elsewhere', by: priya, note: 'Their mechanical contractor will do it with the boiler replacement.' }],
  },
  {
    key: 'demo-stoneferry-creamery',
    input: plant(
      { company: 'Stoneferry Creamery', name: 'Agnes Loft', email: 'agnes@stoneferry.example', type: 'creamery', country: 'CA', postal: 'L9T 3H2', plantName: 'Stoneferry Creamery' },
      {
        unitSystem: 'SI',
        operatingHoursPerYear: 6100,
        energy: { fuel: 'natural-gas', price: 0.41, priceUnit: 'm3', currency: 'CAD' },
        runs: [
          { id: 'steam', label: 'Steam to the butter churn room', service: 'steam', pipe: steel('1-1/2'), lengthM: 25, steamGaugePressureKPa: 480, valves: 2 },
          { id: 'glycol', label: 'Glycol to the cream tanks', service: 'glycol', pipe: stainless('1-1/2'), lengthM: 20 },
        ],
      },
    ),
    steps: [],
  },
  {
    key: 'demo-wensleigh-creamery',
    input: plant(
      { company: 'Wensleigh Creamery', name: 'Tamsin Hebb', email: 'tamsin@wensleigh.example', type: 'creamery', country: 'GB', postal: 'DL8 3AB', plantName: 'Wensleigh Creamery' },
      {
        unitSystem: 'SI',
        operatingHoursPerYear: 5800,
        energy: { fuel: 'natural-gas', price: 0.07, priceUnit: 'kWh', currency: 'GBP', emissionFactorSource: 'uk-desnz-2023' },
        runs: [
          { id: 'steam', label: 'Steam to curd vats', service: 'steam', pipe: { standard: 'EN-10220', size: 'DN50' }, lengthM: 24, steamGaugePressureKPa: 450, valves: 4 },
          { id: 'hw', label: 'Hot water to mold washer', service: 'hot-water', pipe: { standard: 'EN-10220', size: 'DN25' }, lengthM: 16 },
        ],
      },
    ),
    steps: [],
  },
  {
    key: 'demo-ouse-bank-brewery',
    input: plant(
      { company: 'Ouse Bank Brewery', name: 'Cal Rowntree', email: 'cal@ousebank.example', phone: '+44 1904 555 012', type: 'brewery', country: 'GB', postal: 'YO1 7HH', plantName: 'Ouse Bank Brewery' },
      {
        unitSystem: 'SI',
        operatingHoursPerYear: 3600,
        energy: { fuel: 'natural-gas', price: 0.072, priceUnit: 'kWh', currency: 'GBP', emissionFactorSource: 'uk-desnz-2023' },
        runs: [{ id: 'copper', label: 'Steam to the copper', service: 'steam', pipe: { standard: 'EN-10220', size: 'DN40' }, lengthM: 20, steamGaugePressureKPa: 200, valves: 3 }],
      },
    ),
    steps: [{ claim: ffion }],
  },
  {
    key: 'demo-keld-smokehouse',
    input: plant(
      { company: 'Keld Smokehouse', name: 'Ewan Thwaite', email: 'ewan@keldsmokehouse.example', type: 'smokehouse', country: 'GB', postal: 'BD23 4AA', plantName: 'Keld Smokehouse' },
      {
        unitSystem: 'SI',
        operatingHoursPerYear: 2800,
        energy: { fuel: 'propane', price: 0.09, priceUnit: 'kWh', currency: 'GBP' },
        runs: [{ id: 'hw', label: 'Hot water to brining room', service: 'hot-water', pipe: { standard: 'EN-10220', size: 'DN25' }, lengthM: 18 }],
      },
    ),
    steps: [],
  },
];

/** Histories for leads the first demo submissions made (their keys live in ./demo-assessments). */
export const deskDemoHistories: { key: string; steps: Step[] }[] = [
  { key: 'demo-old-kiln-smokehouse', steps: [{ claim: priya }, { move: 'in_touch', by: priya, note: 'Noor wants the yard line done before winter.' }] },
  {
    key: 'demo-saltmarsh-sauces',
    steps: [
      { claim: ffion },
      { move: 'in_touch', by: ffion },
      { move: 'site_walk_booked', by: ffion, note: 'Check the chilled return over the filling line for sweating.' },
    ],
  },
];

async function personByEmail(email: string): Promise<SessionUser> {
  const [row] = await getDb().select({ id: user.id, email: user.email, name: user.name, role: user.role }).from(user).where(eq(user.email, email));
  if (!row || !isRoleName(row.role)) throw new Error(`demo account ${email} is missing`);
  return { id: row.id, email: row.email, name: row.name, role: row.role };
}

async function hasDeskHistory(assessmentId: string): Promise<boolean> {
  const [row] = await getDb()
    .select({ id: activityLog.id })
    .from(activityLog)
    .where(and(eq(activityLog.assessmentId, assessmentId), like(activityLog.action, 'lead.%')))
    .limit(1);
  return Boolean(row);
}

async function play(assessmentId: string, steps: Step[]): Promise<boolean> {
  if (steps.length === 0 || (await hasDeskHistory(assessmentId))) return false;
  for (const step of steps) {
    if ('claim' in step) await claimLead(await personByEmail(step.claim), assessmentId);
    else if ('move' in step) await moveLead(await personByEmail(step.by), assessmentId, { to: step.move, ...(step.note ? { note: step.note } : {}) });
    else if ('close' in step) await moveLead(await personByEmail(step.by), assessmentId, { to: 'closed', reason: step.close, ...(step.note ? { note: step.note } : {}) });
    else if ('release' in step) await releaseLead(await personByEmail(step.by), assessmentId, { reason: step.release, ...(step.note ? { note: step.note } : {}) });
    else await addLeadNote(await personByEmail(step.by), assessmentId, { text: step.note });
  }
  return true;
}

/** Submits the desk's demo plants and plays each lead's history once. Answers how many histories were played. */
export async function seedDeskDemo(): Promise<{ submitted: number; histories: number }> {
  let submitted = 0;
  let histories = 0;
  for (const { key, input } of deskDemoLeads) {
    const outcome = await submitAssessment(createAssessmentSchema.parse(input), [], { ...seedSubmissionContext, idempotencyKey: key });
    if (!outcome.replayed) submitted += 1;
  }
  for (const { key, steps } of [...deskDemoLeads, ...deskDemoHistories]) {
    const [row] = await getDb().select({ id: assessments.id }).from(assessments).where(eq(assessments.idempotencyKey, key));
    if (!row) throw new Error(`demo lead ${key} was not stored`);
    if (await play(row.id, steps)) histories += 1;
  }
  return { submitted, histories };
}
