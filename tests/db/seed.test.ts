import { execFileSync } from 'node:child_process';
import pg from 'pg';
import { describe, expect, it } from 'vitest';
import { demoSubmissions } from '../../scripts/seed/demo-assessments';
import { demoAccounts, demoRegions } from '../../scripts/seed/demo-people';
import { stack } from '../support/stack';

const slugs = demoRegions.map((r) => r.slug);
const emails = demoAccounts.map((a) => a.email);
const keys = demoSubmissions.map((s) => s.key);

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
      assessments: demoSubmissions.length,
      runs: demoSubmissions.flatMap((s) => s.input.estimate.runs).length,
    });

    execFileSync(process.execPath, ['--import', 'tsx', 'scripts/seed.ts'], { env: process.env, stdio: 'pipe' });

    expect(await demoCounts()).toEqual(before);
  });
});
