/**
 * Follow-up reports for the demo, made through the same domain functions the API calls: a
 * consultant's own price table, a draft composed from the lead's site walk with one change of
 * the engine's suggestion (and its reason), findings and terms, then sent as version 1 — the
 * worker renders its PDF and mails the owner when it runs. One owner has accepted. A lead that
 * has a sent version already is left as it is, so seeding twice changes nothing. The leads are
 * the invented plants of ./demo-desk.ts, walked in ./demo-revisions.ts.
 */
import { eq } from 'drizzle-orm';
import { getDb } from '../../src/db/client';
import { latestVersionNumber } from '../../src/db/queries/reports';
import { assessments, user } from '../../src/db/schema';
import { isRoleName } from '../../src/lib/permissions';
import { answerReport } from '../../src/lib/reports/answer';
import { openDraft, saveDraft } from '../../src/lib/reports/drafts';
import { getMyPrices, putMyPrices } from '../../src/lib/reports/prices';
import { sendReport } from '../../src/lib/reports/send';
import type { SessionUser } from '../../src/lib/session';
import { reportPatchSchema, type PriceTableRequest } from '../../src/schemas/reports';

interface DemoReport {
  /** The lead's submission key. */
  key: string;
  by: string;
  /** The consultant's own installed prices, in the plant's currency. */
  prices: PriceTableRequest;
  patch: unknown;
  /** The owner's answer, when they have given one. */
  answer?: { accept: boolean; reason?: string };
}

const INCH = 0.0254;

export const demoReports: DemoReport[] = [
  {
    key: 'demo-rook-hollow-cheese',
    by: 'marisol@quintero-thermal.example',
    prices: {
      currency: 'USD',
      priceTable: {
        label: 'Quintero Thermal 2026 installed rates',
        pipeOuterDiametersM: [0.0334, 0.0483, 0.0603, 0.0889],
        thicknessesM: [1 * INCH, 1.5 * INCH, 2 * INCH, 3 * INCH],
        costPerMetre: [
          [58, 66, 77, 98],
          [63, 72, 84, 107],
          [69, 79, 91, 116],
          [82, 93, 108, 137],
        ],
        fittingCoverCostEach: [165, 180, 195, 230],
      },
    },
    patch: {
      introduction: 'Thank you for walking the make room with me before the first vat. This is what I would do, in the order I would do it.',
      runs: [
        {
          runId: 'steam',
          option: 'insulate',
          material: 'mineral-wool',
          thicknessM: 2 * INCH,
          reason: 'The header passes the operators’ walkway by the vats: 2 in keeps the jacket cool to a hand on the hottest day.',
        },
      ],
      incentives: [{ text: 'Mallow Bend gas utility insulation rebate (pre-approved)', amount: 450 }],
      exclusions: ['Access above 4 m (the plant’s own lift is used)', 'The brine-room glycol: replaced under a separate quote once the room is dry'],
      findings: [
        { kind: 'burn-point', runId: 'steam', place: 'Header by the second valve, at shoulder height', surfaceTemperatureC: 158 },
        { kind: 'sweating', runId: 'glycol', place: 'Brine room, over the salting tables', note: 'Foam soaked through; drips onto the tables.' },
      ],
      notes: 'Work fits in two mornings before production; the make room stays open.',
    },
  },
  {
    key: 'demo-birchknoll-dairy',
    by: 'declan@hollis-lagging.example',
    prices: {
      currency: 'USD',
      priceTable: {
        label: 'Hollis Lagging outdoor rates 2026',
        pipeOuterDiametersM: [0.0334, 0.0603],
        thicknessesM: [1.5 * INCH, 2 * INCH, 3 * INCH],
        costPerMetre: [
          [88, 101, 126],
          [104, 118, 147],
        ],
        fittingCoverCostEach: [210, 250],
      },
    },
    patch: {
      introduction: 'As we saw on the walk, the yard line is the one costing you; here is the plan for both lines across the yard.',
      findings: [
        { kind: 'corrosion', runId: 'cond', place: 'Tractor crossing', note: 'Lagging crushed; the pipe under it is rusting.' },
        { kind: 'burn-point', runId: 'yard', place: 'Yard line where the lagging is gone', surfaceTemperatureC: 121 },
      ],
      exclusions: ['Trenching or re-routing the yard line'],
    },
    answer: { accept: true, reason: 'Go ahead before the first frost, please. Call Lotte on the office line.' },
  },
];

async function personByEmail(email: string): Promise<SessionUser> {
  const [row] = await getDb().select({ id: user.id, email: user.email, name: user.name, role: user.role }).from(user).where(eq(user.email, email));
  if (!row || !isRoleName(row.role)) throw new Error(`demo account ${email} is missing`);
  return { id: row.id, email: row.email, name: row.name, role: row.role };
}

/** Sends each demo report not sent yet (and records the owner's answer); answers how many were sent now. */
export async function seedDemoReports(): Promise<number> {
  let sent = 0;
  for (const demo of demoReports) {
    const [lead] = await getDb().select({ id: assessments.id, contactEmail: assessments.contactEmail }).from(assessments).where(eq(assessments.idempotencyKey, demo.key));
    if (!lead) throw new Error(`demo lead ${demo.key} is missing; the desk's demo comes first`);
    if ((await latestVersionNumber(getDb(), lead.id)) > 0) continue;
    const consultant = await personByEmail(demo.by);
    if ((await getMyPrices(consultant)).prices === null) await putMyPrices(consultant, demo.prices);
    const { report: draft } = await openDraft(consultant, lead.id, {});
    await saveDraft(consultant, draft.id, reportPatchSchema.parse(demo.patch));
    const { report } = await sendReport(consultant, draft.id);
    sent += 1;
    if (demo.answer) await answerReport(await personByEmail(lead.contactEmail), report.id, demo.answer);
  }
  return sent;
}
