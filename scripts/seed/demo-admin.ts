/**
 * Something for the demo admin to act on: an assessment no region covers, an open lead that has
 * waited three days, and a consultant holding as many open leads as their cap allows. Plants are
 * invented; they go in through the same submission and claim the site uses. A lead's waiting
 * time is the only thing written directly — a seed cannot wait three days — and only when the
 * lead is first stored, so seeding twice changes nothing.
 */
import { eq, sql } from 'drizzle-orm';
import { getDb } from '../../src/db/client';
import { assessments, user } from '../../src/db/schema';
import { submitAssessment } from '../../src/lib/assessments/submit';
import { seedSubmissionContext } from './demo-assessments.ts';
import { claimLead } from '../../src/lib/leads/claim';
import { createAssessmentSchema, type CreateAssessmentInput, type PlantTypeId } from '../../src/schemas/assessment';

const steel = (size: string) => ({ standard: 'ASME-B36.10M', size, schedule: '40', material: 'carbon-steel' });

/** The demo consultant who ends up at their cap (see demo-people.ts). */
export const AT_CAP_CONSULTANT = 'ottilie@marsh-finch.example';

function plant(key: string, p: { company: string; name: string; email: string; type: PlantTypeId; postal: string; plantName: string; runLabel: string }): { key: string; input: CreateAssessmentInput } {
  return {
    key,
    input: {
      contact: { name: p.name, company: p.company, email: p.email },
      consent: true,
      plant: { plantName: p.plantName, plantType: p.type, countryCode: 'US', postalCode: p.postal },
      estimate: {
        unitSystem: 'US',
        operatingHoursPerYear: 5200,
        energy: { fuel: 'natural-gas', price: 1.05, priceUnit: 'therm', currency: 'USD' },
        runs: [{ id: 'main', label: p.runLabel, service: 'steam', pipe: steel('1-1/2'), lengthM: 26, steamGaugePressureKPa: 480, valves: 3 }],
      },
    },
  };
}

const unrouted = plant('demo-admin-kettle-butte-creamery', {
  company: 'Kettle Butte Creamery',
  name: 'Lorna Sayle',
  email: 'lorna@kettlebutte.example',
  type: 'creamery',
  postal: '59715',
  plantName: 'Kettle Butte Creamery, Sorrel Flat',
  runLabel: 'Steam to the pasteurizer',
});

const stale = plant('demo-admin-larchmere-smokehouse', {
  company: 'Larchmere Smokehouse',
  name: 'Teodor Vance',
  email: 'teodor@larchmere.example',
  type: 'smokehouse',
  postal: '48236',
  plantName: 'Larchmere Smokehouse, Wick Harbour',
  runLabel: 'Steam to the smoke generators',
});

const atCap = [
  plant('demo-admin-pellham-cider', {
    company: 'Pellham Cider Works',
    name: 'Ruth Abernathy',
    email: 'ruth@pellhamcider.example',
    type: 'juice-plant',
    postal: '05401',
    plantName: 'Pellham Cider Works, Orchard Row',
    runLabel: 'Steam to the pasteurizer tunnel',
  }),
  plant('demo-admin-greyfield-tofu', {
    company: 'Greyfield Tofu Co.',
    name: 'Minh Castell',
    email: 'minh@greyfieldtofu.example',
    type: 'tofu-plant',
    postal: '12866',
    plantName: 'Greyfield Tofu Co., Millrace Lane',
    runLabel: 'Steam to the soy-milk cooker',
  }),
];

/** Every assessment this part of the demo stores (the seed test counts them). */
export const adminDemoSubmissions = [unrouted, stale, ...atCap];
/** Claims this part of the demo makes: each of the at-cap consultant's leads. */
export const adminDemoClaims = atCap.length;

async function submit(entry: { key: string; input: CreateAssessmentInput }) {
  return submitAssessment(createAssessmentSchema.parse(entry.input), [], { ...seedSubmissionContext, idempotencyKey: entry.key });
}

/** Stores the admin's demo cases; answers how many assessments were new. */
export async function seedAdminDemo(): Promise<number> {
  let stored = 0;
  const first = await submit(unrouted);
  if (!first.replayed) stored += 1;

  const waiting = await submit(stale);
  if (!waiting.replayed) {
    stored += 1;
    await getDb()
      .update(assessments)
      .set({ createdAt: sql`now() - interval '3 days'`, updatedAt: sql`now() - interval '3 days'` })
      .where(eq(assessments.id, waiting.assessment.id));
  }

  const [consultant] = await getDb().select({ id: user.id, name: user.name, email: user.email }).from(user).where(eq(user.email, AT_CAP_CONSULTANT));
  if (!consultant) throw new Error(`the demo consultant ${AT_CAP_CONSULTANT} is missing; seed the people first`);
  for (const entry of atCap) {
    const outcome = await submit(entry);
    if (!outcome.replayed) stored += 1;
    const [lead] = await getDb().select({ claimedBy: assessments.claimedByUserId }).from(assessments).where(eq(assessments.id, outcome.assessment.id));
    if (!lead?.claimedBy) await claimLead({ id: consultant.id, name: consultant.name, email: consultant.email, role: 'consultant' }, outcome.assessment.id);
  }
  return stored;
}
