import { execFileSync } from 'node:child_process';
import pg from 'pg';
import { describe, expect, it } from 'vitest';
import { demoSubmissions } from '../../scripts/seed/demo-assessments';
import { deskDemoHistories, deskDemoLeads } from '../../scripts/seed/demo-desk';
import { demoWalks } from '../../scripts/seed/demo-revisions';
import { demoReports } from '../../scripts/seed/demo-reports';
import { demoAccounts, demoRegions } from '../../scripts/seed/demo-people';
import { adminDemoClaims, adminDemoSubmissions, AT_CAP_CONSULTANT } from '../../scripts/seed/demo-admin';
import { stack } from '../support/stack';

const slugs = demoRegions.map((r) => r.slug);
const emails = demoAccounts.map((a) => a.email);
const keys = [...demoSubmissions, ...deskDemoLeads, ...adminDemoSubmissions].map((s) => s.key);

/** Counts only the demo's own rows, so other tests writing at the same time cannot disturb it. */
async function demoCounts(): Promise<Record<string, number>> {
  const client = new pg.Client({ connectionString: stack.databaseUrl });
  await client.connect();
  const count = async (query: string, values: unknown[]) => Number((await client.query<{ n: string }>(query, values)).rows[0]?.n);
  try {
    return {
      regions: await count('select count(*) as n from regions where slug = any($1)', [slugs]),
      prefixes: await count('select count(*) as n from region_postal_prefixes p join regions r on r.id = p.region_id where r.slug = any($1)', [slugs]),
      coverage: await count('select count(*) as n from region_consultants c join regions r on r.id = c.region_id where r.slug = any($1)', [slugs]),
      accounts: await count('select count(*) as n from "user" where email = any($1)', [emails]),
      passwords: await count('select count(*) as n from account a join "user" u on u.id = a.user_id where u.email = any($1)', [emails]),
      assessments: await count('select count(*) as n from assessments where idempotency_key = any($1)', [keys]),
      runs: await count('select count(*) as n from pipe_runs r join assessments a on a.id = r.assessment_id where a.idempotency_key = any($1)', [keys]),
      activity: await count('select count(*) as n from activity_log l join assessments a on a.id = l.assessment_id where a.idempotency_key = any($1)', [keys]),
      profiles: await count('select count(*) as n from consultant_profiles p join "user" u on u.id = p.user_id where u.email = any($1)', [emails]),
      revisions: await count('select count(*) as n from lead_revisions r join assessments a on a.id = r.assessment_id where a.idempotency_key = any($1)', [keys]),
      reports: await count('select count(*) as n from reports r join assessments a on a.id = r.assessment_id where a.idempotency_key = any($1)', [keys]),
      priceTables: await count('select count(*) as n from consultant_price_tables p join "user" u on u.id = p.user_id where u.email = any($1)', [emails]),
    };
  } finally {
    await client.end();
  }
}

describe('demo data', () => {
  it('is loaded whole, and loading it again changes nothing', async () => {
    const before = await demoCounts();
    expect(before).toEqual({
      regions: demoRegions.length,
      prefixes: demoRegions.flatMap((r) => r.prefixes).length,
      coverage: demoAccounts.flatMap((a) => a.regions ?? []).length,
      accounts: demoAccounts.length,
      passwords: demoAccounts.length,
      assessments: demoSubmissions.length + deskDemoLeads.length + adminDemoSubmissions.length,
      runs: [...demoSubmissions, ...deskDemoLeads, ...adminDemoSubmissions].flatMap((s) => s.input.estimate.runs).length,
      // One entry per submission, one per step of each desk history, one per claim of the consultant at their cap, one per site walk,
      // one per report sent and one per owner's answer.
      activity:
        keys.length +
        [...deskDemoLeads, ...deskDemoHistories].reduce((n, d) => n + d.steps.length, 0) +
        adminDemoClaims +
        demoWalks.length +
        demoReports.length +
        demoReports.filter((r) => r.answer).length,
      profiles: demoAccounts.filter((a) => a.role === 'consultant').length,
      revisions: demoWalks.length,
      reports: demoReports.length,
      priceTables: new Set(demoReports.map((r) => r.by)).size,
    });

    execFileSync(process.execPath, ['--import', 'tsx', 'scripts/seed.ts'], { env: process.env, stdio: 'pipe' });

    expect(await demoCounts()).toEqual(before);
  });

  it('gives the admin something to act on: an unrouted assessment, a stale open lead, a consultant at their cap', async () => {
    const client = new pg.Client({ connectionString: stack.databaseUrl });
    await client.connect();
    try {
      const status = async (key: string) =>
        (await client.query<{ status: string; waited: boolean }>(`select status, updated_at < now() - interval '48 hours' as waited from assessments where idempotency_key = $1`, [key])).rows[0];
      expect(await status('demo-admin-kettle-butte-creamery')).toEqual({ status: 'unrouted', waited: false });
      expect(await status('demo-admin-larchmere-smokehouse')).toEqual({ status: 'fresh', waited: true });
      const load = await client.query<{ held: string; cap: number }>(
        `select (select count(*) from assessments a where a.claimed_by_user_id = u.id and a.status in ('claimed','in_touch','site_walk_booked')) as held, p.open_claim_cap as cap
         from "user" u join consultant_profiles p on p.user_id = u.id where u.email = $1`,
        [AT_CAP_CONSULTANT],
      );
      expect(Number(load.rows[0]!.held)).toBe(load.rows[0]!.cap);
      expect(load.rows[0]!.cap).toBe(2);
    } finally {
      await client.end();
    }
  });
});

describe('the demo desk', () => {
  it('gives every demo consultant open leads in their regions and leads of their own at several stages', async () => {
    const client = new pg.Client({ connectionString: stack.databaseUrl });
    await client.connect();
    try {
      const stagesSeen = new Set<string>();
      for (const consultant of demoAccounts.filter((a) => a.role === 'consultant')) {
        const open = await client.query<{ n: string }>(
          `select count(*) as n from assessments a join region_consultants rc on rc.region_id = a.region_id join "user" u on u.id = rc.user_id
           where u.email = $1 and a.status = 'fresh' and a.idempotency_key = any($2)`,
          [consultant.email, keys],
        );
        const held = await client.query<{ status: string }>(
          `select a.status from assessments a join "user" u on u.id = a.claimed_by_user_id where u.email = $1 and a.idempotency_key = any($2)`,
          [consultant.email, keys],
        );
        expect(Number(open.rows[0]!.n), `${consultant.email} open`).toBeGreaterThan(0);
        expect(held.rows.length, `${consultant.email} held`).toBeGreaterThan(0);
        for (const row of held.rows) stagesSeen.add(row.status);
      }
      expect([...stagesSeen].sort()).toEqual(['claimed', 'closed', 'in_touch', 'report_sent', 'site_walk_booked']);
      const released = await client.query<{ n: string }>(
        `select count(*) as n from activity_log l join assessments a on a.id = l.assessment_id where l.action = 'lead.released' and a.status = 'fresh' and a.idempotency_key = any($1)`,
        [keys],
      );
      expect(Number(released.rows[0]!.n)).toBe(1);
    } finally {
      await client.end();
    }
  });
});

describe('the demo site walks', () => {
  it('give every demo consultant one lead of their own with a site-walk revision, its figures on the lead', async () => {
    const client = new pg.Client({ connectionString: stack.databaseUrl });
    await client.connect();
    try {
      for (const consultant of demoAccounts.filter((a) => a.role === 'consultant')) {
        const walked = await client.query<{ key: string; revision_number: number; author: string; annual_loss_cost: number; likely: number; runs: number }>(
          `select a.idempotency_key as key, a.revision_number, u.email as author, a.annual_loss_cost,
                  (r.result_snapshot #>> '{range,currentAnnualCost,likely}')::float8 as likely, jsonb_array_length(r.plant_input -> 'runs') as runs
           from lead_revisions r join assessments a on a.id = r.assessment_id join "user" u on u.id = r.author_user_id
           where a.claimed_by_user_id = u.id and u.email = $1 and a.idempotency_key = any($2)`,
          [consultant.email, keys],
        );
        expect(walked.rows, consultant.email).toHaveLength(1);
        const row = walked.rows[0]!;
        expect(row.revision_number).toBe(1);
        expect(row.annual_loss_cost).toBe(row.likely);
        expect(demoWalks.find((w) => w.key === row.key)?.by).toBe(consultant.email);
      }
    } finally {
      await client.end();
    }
  });
});

describe('the demo reports', () => {
  it('send version 1 of a report from each walked demo lead named, the owner’s answer recorded where one was given', async () => {
    const client = new pg.Client({ connectionString: stack.databaseUrl });
    await client.connect();
    try {
      for (const demo of demoReports) {
        const { rows } = await client.query<{ status: string; version: number; base: number; answer: string | null; author: string; lead_status: string }>(
          `select r.status, r.version, r.base_revision_number as base, r.answer, u.email as author, a.status as lead_status
           from reports r join assessments a on a.id = r.assessment_id join "user" u on u.id = r.author_user_id where a.idempotency_key = $1`,
          [demo.key],
        );
        expect(rows, demo.key).toEqual([
          { status: 'sent', version: 1, base: 1, answer: demo.answer ? (demo.answer.accept ? 'accepted' : 'declined') : null, author: demo.by, lead_status: 'report_sent' },
        ]);
      }
    } finally {
      await client.end();
    }
  });
});
