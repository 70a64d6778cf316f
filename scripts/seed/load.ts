/**
 * Loads the demo scenario idempotently: running it again changes nothing that is there.
 * Accounts go through better-auth so passwords are hashed the way sign-in expects.
 */
import { eq } from 'drizzle-orm';
import { closeDb, getDb } from '../../src/db/client';
import { upsertConsultantProfile } from '../../src/db/queries/leads';
import { regionConsultants, regionPostalPrefixes, regions, user } from '../../src/db/schema';
import { getAuth } from '../../src/lib/auth';
import { stopSender } from '../../src/lib/jobs/queue';
import { DEMO_PASSWORD, demoAccounts, demoRegions } from './demo-people.ts';
import { seedDemoAssessments } from './demo-assessments.ts';
import { seedDeskDemo } from './demo-desk.ts';
import { seedAdminDemo } from './demo-admin.ts';
import { seedDemoRevisions } from './demo-revisions.ts';
import { seedDemoReports } from './demo-reports.ts';

async function seedRegions(): Promise<Map<string, string>> {
  const db = getDb();
  const ids = new Map<string, string>();
  for (const region of demoRegions) {
    const [row] = await db
      .insert(regions)
      .values({ slug: region.slug, name: region.name, countryCode: region.countryCode })
      .onConflictDoUpdate({ target: regions.slug, set: { slug: region.slug } })
      .returning({ id: regions.id });
    if (!row) throw new Error(`could not store region ${region.slug}`);
    ids.set(region.slug, row.id);
    await db
      .insert(regionPostalPrefixes)
      .values(region.prefixes.map((prefix) => ({ regionId: row.id, countryCode: region.countryCode, prefix })))
      .onConflictDoNothing();
  }
  return ids;
}

async function seedAccounts(regionIds: Map<string, string>): Promise<number> {
  const db = getDb();
  let created = 0;
  for (const account of demoAccounts) {
    let [existing] = await db.select({ id: user.id }).from(user).where(eq(user.email, account.email));
    if (!existing) {
      const made = await getAuth().api.createUser({
        body: { email: account.email, password: DEMO_PASSWORD, name: account.name, role: account.role },
      });
      existing = { id: made.user.id };
      await db.update(user).set({ emailVerified: true }).where(eq(user.id, made.user.id));
      created += 1;
    }
    if (account.role === 'consultant' && account.company) {
      await upsertConsultantProfile(db, { userId: existing.id, firm: account.company, phone: account.phone ?? null, ...(account.cap ? { openClaimCap: account.cap } : {}) });
    }
    for (const slug of account.regions ?? []) {
      const regionId = regionIds.get(slug);
      if (!regionId) throw new Error(`account ${account.email} names unknown region ${slug}`);
      await db.insert(regionConsultants).values({ regionId, userId: existing.id }).onConflictDoNothing();
    }
  }
  return created;
}

export async function seedDemo(): Promise<void> {
  try {
    const regionIds = await seedRegions();
    const accounts = await seedAccounts(regionIds);
    const assessments = (await seedDemoAssessments()) + (await seedAdminDemo());
    const desk = await seedDeskDemo();
    const walks = await seedDemoRevisions();
    const reports = await seedDemoReports();
    console.log(
      `[seed] demo data ready: ${regionIds.size} regions, ${accounts} new accounts, ${assessments + desk.submitted} new assessments, ${desk.histories} desk histories played, ${walks} site walks saved, ${reports} reports sent`,
    );
  } finally {
    await stopSender();
    await closeDb();
  }
}
