/**
 * A site walk on one lead of each demo consultant: the corrections they made on site, saved
 * through the same domain function the API calls (saveRevision), so the revision, the lead's
 * figures and the timeline entry are made exactly as a walk makes them. A lead that has any
 * revision already is left as it is, so seeding twice changes nothing. The walks belong to the
 * invented plants of ./demo-desk.ts, ./demo-admin.ts and ./demo-assessments.ts, found by their
 * submission keys.
 */
import { eq } from 'drizzle-orm';
import { getDb } from '../../src/db/client';
import { assessments, user } from '../../src/db/schema';
import type { PlantInput, PlantRunInput } from '../../src/engine';
import { isRoleName } from '../../src/lib/permissions';
import { getRevisionHistoryFor } from '../../src/lib/revisions/read';
import { saveRevision } from '../../src/lib/revisions/save';
import type { SessionUser } from '../../src/lib/session';
import { revisionRequestSchema } from '../../src/schemas/revisions';

type Areas = NonNullable<PlantInput['areas']>;

interface DemoWalk {
  /** The lead's submission key. */
  key: string;
  by: string;
  reason: string;
  /** The corrected runs and rooms, from the runs as they stand. */
  walk: (runs: PlantRunInput[]) => { runs: PlantRunInput[]; areas?: Areas };
}

const edit = (runs: PlantRunInput[], id: string, change: (run: PlantRunInput) => PlantRunInput) => runs.map((run) => (run.id === id ? change(run) : run));

export const demoWalks: DemoWalk[] = [
  {
    key: 'demo-rook-hollow-cheese',
    by: 'marisol@quintero-thermal.example',
    reason: 'Walked it with Wren before the first vat: the make-room header is 34.5 m door to door, probe reading by the second valve; the brine-room glycol has foam on it, soaked through.',
    walk: (runs) => ({
      runs: edit(
        edit(runs, 'steam', (run) => ({ ...run, measurements: { lengthM: 34.5, surfaceTemperatureC: 158, airTemperatureC: 27, surfaceMethod: 'contact', takenAt: '2026-03-12T07:10:00Z' } })),
        'glycol',
        (run) => ({ ...run, current: { state: 'insulated', material: 'flexible-elastomeric', thicknessM: 0.019, jacket: 'elastomeric-skin', condition: 'wet' } }),
      ),
    }),
  },
  {
    key: 'demo-fenwick-cider',
    by: 'anders@kvale-insulation.example',
    reason: 'Looked over the press hall before the season: the pasteurizer line is shorter than drawn and has two valves; the hall runs cold and damp.',
    walk: (runs) => ({
      runs: edit(
        edit(runs, 'pasteur', (run) => ({ ...run, valves: 2, measurements: { lengthM: 19.8 }, areaId: 'walk-room-pasteur' })),
        'chill',
        (run) => ({ ...run, areaId: 'walk-room-pasteur' }),
      ),
      areas: [{ id: 'walk-room-pasteur', label: 'Press hall', preset: 'washdown-room', average: { airTemperatureC: 14, relativeHumidityPercent: 82, airSpeedMPerS: 0.3 }, confidence: 'measured' }],
    }),
  },
  {
    key: 'demo-harrow-mill-brewing',
    by: 'tobias@wendt-energy.example',
    reason: 'After Monday’s brew: the kettle steam runs at 14 psig on the gauge, not 16; infrared on the bare jacket feed; the cellar glycol main is lagged for most of its run.',
    walk: (runs) => ({
      runs: edit(
        edit(runs, 'kettle', (run) => ({
          ...run,
          steamGaugePressureKPa: 96.5,
          measurements: { surfaceTemperatureC: 114, surfaceMethod: 'infrared', infraredEmittanceSetting: 0.95, airTemperatureC: 24 },
        })),
        'glycol',
        (run) => ({ ...run, current: { state: 'damaged', bareFraction: 0.25, material: 'flexible-elastomeric', thicknessM: 0.025, jacket: 'pvc-jacket', condition: 'sound' } }),
      ),
    }),
  },
  {
    key: 'demo-birchknoll-dairy',
    by: 'declan@hollis-lagging.example',
    reason: 'Probe on the yard line where the lagging is gone: far below steam temperature, so the line holds water; the condensate return is lagged but crushed under the tractor crossing.',
    walk: (runs) => ({
      runs: edit(
        edit(runs, 'yard', (run) => ({ ...run, measurements: { lengthM: 43, surfaceTemperatureC: 121, airTemperatureC: 2, surfaceMethod: 'contact' } })),
        'cond',
        (run) => ({ ...run, current: { state: 'insulated', material: 'mineral-wool', thicknessM: 0.038, jacket: 'aluminium-jacket-dull', condition: 'crushed' } }),
      ),
    }),
  },
  {
    key: 'demo-old-kiln-smokehouse',
    by: 'priya@raman-audits.example',
    reason: 'Yard walk with Noor: the steam line is 52 m with the loop at the gate, and a condensate return runs beside it that was not on the list.',
    walk: (runs) => ({
      runs: [
        ...edit(runs, 'yard-steam', (run) => ({ ...run, measurements: { lengthM: 52 } })),
        {
          id: 'walk-yard-condensate',
          label: 'Condensate return across the yard',
          service: 'condensate-return',
          pipe: { standard: 'ASME-B36.10M', size: '1-1/2', schedule: '40', material: 'carbon-steel' },
          lengthM: 50,
          lengthConfidence: 'measured',
          ambient: { kind: 'outdoor' },
          current: { state: 'bare' },
        },
      ],
    }),
  },
  {
    key: 'demo-admin-pellham-cider',
    by: 'ottilie@marsh-finch.example',
    reason: 'Walked the tunnel line with Ruth: 23.5 m, four valves not three, probe reading at the tunnel end.',
    walk: (runs) => ({
      runs: edit(runs, 'main', (run) => ({ ...run, valves: 4, measurements: { lengthM: 23.5, surfaceTemperatureC: 149, airTemperatureC: 21, surfaceMethod: 'contact' } })),
    }),
  },
  {
    key: 'demo-saltmarsh-sauces',
    by: 'ffion@baird-insulation.example',
    reason: 'Kettle steam read by infrared at 0.95; the chilled return over the filling line is lagged after all, but crushed where it crosses the walkway.',
    walk: (runs) => ({
      runs: edit(
        edit(runs, 'kettle-steam', (run) => ({ ...run, measurements: { surfaceTemperatureC: 139, surfaceMethod: 'infrared', infraredEmittanceSetting: 0.95, airTemperatureC: 22 } })),
        'chilled-return',
        (run) => ({ ...run, current: { state: 'insulated', material: 'flexible-elastomeric', thicknessM: 0.025, jacket: 'elastomeric-skin', condition: 'crushed' } }),
      ),
    }),
  },
];

async function personByEmail(email: string): Promise<SessionUser> {
  const [row] = await getDb().select({ id: user.id, email: user.email, name: user.name, role: user.role }).from(user).where(eq(user.email, email));
  if (!row || !isRoleName(row.role)) throw new Error(`demo account ${email} is missing`);
  return { id: row.id, email: row.email, name: row.name, role: row.role };
}

/** Saves each demo walk not saved yet; answers how many were saved now. */
export async function seedDemoRevisions(): Promise<number> {
  let saved = 0;
  for (const demo of demoWalks) {
    const [lead] = await getDb().select({ id: assessments.id, revisionNumber: assessments.revisionNumber }).from(assessments).where(eq(assessments.idempotencyKey, demo.key));
    if (!lead) throw new Error(`demo lead ${demo.key} is missing; the desk's demo comes first`);
    if (lead.revisionNumber > 0) continue;
    const person = await personByEmail(demo.by);
    const { response } = await getRevisionHistoryFor(person, lead.id);
    if (!response.allowed.revise) throw new Error(`${demo.by} may not revise ${demo.key}; is it theirs?`);
    const plant = response.original.plant as unknown as PlantInput;
    const walked = demo.walk(plant.runs);
    const request = revisionRequestSchema.parse({
      baseNumber: 0,
      reason: demo.reason,
      clientKey: `${demo.key}-walk-1`,
      areas: [...(plant.areas ?? []), ...(walked.areas ?? [])],
      runs: walked.runs,
    });
    await saveRevision(person, lead.id, request);
    saved += 1;
  }
  return saved;
}
