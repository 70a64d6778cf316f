/**
 * The desk's headline columns: written on submission from the engine's result, and filled by
 * the backfill migration for assessments stored before the columns existed — both the same as
 * headlineColumnsOf reads them.
 */
import { cpSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { drizzle } from 'drizzle-orm/node-postgres';
import { migrate } from 'drizzle-orm/node-postgres/migrator';
import pg from 'pg';
import { afterAll, describe, expect, it } from 'vitest';
import { closeDb, getDb } from '../../src/db/client';
import { assessments, attachments } from '../../src/db/schema';
import { estimatePlant, type PlantResult } from '../../src/engine';
import { headlineColumnsOf, isPhoto } from '../../src/lib/assessments/headline';
import { stopSender } from '../../src/lib/jobs/queue';
import { submitLead } from '../support/desk';
import { ensureTestRegion } from '../support/fixtures';
import { stack } from '../support/stack';

const columns = (row: typeof assessments.$inferSelect) => ({
  currency: row.currency,
  annualLossCost: row.annualLossCost,
  annualLossCostLow: row.annualLossCostLow,
  annualLossCostHigh: row.annualLossCostHigh,
  annualSavingCost: row.annualSavingCost,
  runCount: row.runCount,
  photoCount: row.photoCount,
  hazardRunCount: row.hazardRunCount,
  services: row.services,
});

describe('headline figures in their own columns', () => {
  afterAll(async () => {
    await stopSender();
    await closeDb();
  });

  it('are written on submission, equal to what the stored result says', async () => {
    await ensureTestRegion();
    const lead = await submitLead('3564');
    const [row] = await getDb().select().from(assessments).where(eq(assessments.id, lead.id));
    const files = await getDb().select().from(attachments).where(eq(attachments.assessmentId, lead.id));
    const result = row!.resultSnapshot as PlantResult;
    expect(columns(row!)).toEqual(headlineColumnsOf(result, files.filter((f) => isPhoto(f.contentType)).length));
    expect(row!.runCount).toBe(2);
    expect(row!.services).toEqual(['hot-water', 'steam']);
    expect(row!.annualLossCostLow).toBeLessThanOrEqual(row!.annualLossCost);
    expect(row!.annualLossCostHigh).toBeGreaterThanOrEqual(row!.annualLossCost);
  });

  it('are filled by the backfill migration for assessments stored before the columns existed', async () => {
    const name = `lagwise_backfill_${randomUUID().slice(0, 8)}`;
    const admin = new pg.Client({ connectionString: stack.databaseUrl });
    await admin.connect();
    await admin.query(`CREATE DATABASE ${name}`);
    const url = new URL(stack.databaseUrl);
    url.pathname = `/${name}`;
    const pool = new pg.Pool({ connectionString: url.href, max: 2 });
    const folder = mkdtempSync(path.join(tmpdir(), 'lagwise-migrations-'));
    try {
      // The migrations up to the one that added the columns, as a database stood before the backfill.
      cpSync('drizzle', folder, { recursive: true });
      const journalFile = path.join(folder, 'meta', '_journal.json');
      const journal = JSON.parse(readFileSync(journalFile, 'utf8')) as { entries: { tag: string }[] };
      const upTo = journal.entries.findIndex((e) => e.tag.endsWith('_lead-figures'));
      expect(upTo).toBeGreaterThan(0);
      writeFileSync(journalFile, JSON.stringify({ ...journal, entries: journal.entries.slice(0, upTo + 1) }));
      await migrate(drizzle(pool), { migrationsFolder: folder });

      // An assessment as submission stored it then: result snapshot, runs, a photo and a PDF.
      const result = estimatePlant({
        operatingHoursPerYear: 5000,
        energy: { fuel: 'natural-gas', price: 0.09, priceUnit: 'kWh', currency: 'AUD' },
        runs: [
          { id: 'a', label: 'Steam to retort', service: 'steam', pipe: { standard: 'ASME-B36.10M', size: '2' }, lengthM: 25, steamGaugePressureKPa: 500 },
          { id: 'b', label: 'Glycol to chiller', service: 'glycol', pipe: { standard: 'ASME-B36.10M', size: '1' }, lengthM: 12 },
          { id: 'c', label: 'Second steam drop', service: 'steam', pipe: { standard: 'ASME-B36.10M', size: '1' }, lengthM: 6, steamGaugePressureKPa: 500 },
        ],
      });
      const id = randomUUID();
      await pool.query(
        `insert into assessments (id, reference, status, contact_name, company_name, contact_email, consented_at, plant_type, country_code,
           postal_code, postal_code_normalised, questionnaire, result_snapshot, engine_version)
         values ($1, 'LW-TEST-BF', 'fresh', 'Lea Ronde', 'Ronde Ferments', 'lea@ronde.example', now(), 'other-food', 'AU', '3999', '3999', '{}', $2, $3)`,
        [id, JSON.stringify(result), result.engineVersion],
      );
      for (const [position, run] of ['a', 'b', 'c'].entries()) {
        await pool.query(`insert into pipe_runs (assessment_id, position, label, service, length_m, spec) values ($1, $2, $3, 'steam', 5, '{}')`, [id, position, run]);
      }
      await pool.query(
        `insert into attachments (assessment_id, object_key, content_type, byte_size) values ($1, $2, 'image/jpeg', 10), ($1, $3, 'application/pdf', 10)`,
        [id, `assessments/${id}/a.jpg`, `assessments/${id}/b.pdf`],
      );

      // The rest of the migrations: the backfill, then the columns become required.
      await migrate(drizzle(pool), { migrationsFolder: 'drizzle' });
      const [row] = await drizzle(pool).select().from(assessments).where(eq(assessments.id, id));
      expect(columns(row!)).toEqual(headlineColumnsOf(result, 1));
      expect(row!.services).toEqual(['glycol', 'steam']);
    } finally {
      await pool.end();
      rmSync(folder, { recursive: true, force: true });
      await admin.query(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`);
      await admin.end();
    }
  });
});
