/**
 * One assessment, three places an owner reads it — the results step, the confirmation
 * e-mail, their assessment page — and the same strings in each, in the units they filled the
 * form in (US here), exactly as the shared presentation writes them.
 */
import { eq } from 'drizzle-orm';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb, getDb } from '../../src/db/client';
import { assessments, pipeRuns } from '../../src/db/schema';
import { readStoredResult, storedPlantInput } from '../../src/lib/assessments/stored-result';
import { presentResult } from '../../src/lib/presentation';
import { launchBrowser, watchForErrors } from '../support/browser';
import { ensureTestRegion, waitForMessages } from '../support/fixtures';
import { stack } from '../support/stack';

const owner = { name: 'Ines Carvalho', company: 'Larkspur Ferment Co.', email: `ines.${Date.now()}@larkspur.example` };

async function waitForStep(page: Page, heading: string): Promise<void> {
  await page.locator('#estimate-step-heading', { hasText: heading }).waitFor();
}

async function next(page: Page, heading: string): Promise<void> {
  await page.getByRole('button', { name: /^Next:/ }).click();
  await waitForStep(page, heading);
}

/** The figure on the results step whose label is `label`: its value and its range line. */
async function resultsFigure(page: Page, label: string): Promise<{ value: string; range: string | null }> {
  const figure = page.locator('.figure', { has: page.locator('.figure-label', { hasText: new RegExp(`^${label}$`) }) }).first();
  const value = (await figure.locator('.figure-value').textContent()) ?? '';
  const range = (await figure.locator('.figure-range').count()) > 0 ? await figure.locator('.figure-range').textContent() : null;
  return { value, range };
}

describe('the same figures wherever the owner reads them', () => {
  let browser: Browser;
  beforeAll(async () => {
    await ensureTestRegion();
    browser = await launchBrowser();
  });
  afterAll(async () => {
    await browser?.close();
    await closeDb();
  });

  it('results step, confirmation e-mail and the owner’s page show one assessment’s figures as the same strings, in US units', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    const problems = watchForErrors(page);
    await page.goto(new URL('/estimate', stack.appUrl).href, { waitUntil: 'networkidle' });

    await page.getByLabel(/^US/).check();
    await page.getByLabel('Plant name').fill(owner.company);
    await page.getByLabel('What the plant makes').selectOption('brewery');
    await page.getByLabel('Country').selectOption('AU');
    await page.getByLabel('Postal code').fill('3564');
    await next(page, 'Fuel and its price');
    await page.getByLabel(/^Fuel price \(/).fill('0.09');
    await next(page, 'Pipe runs');
    await page.locator('#f-estimate-runs-0-label').fill('Steam to the mash tun');
    await page.locator('#f-estimate-runs-0-service').selectOption('steam');
    await page.locator('#f-estimate-runs-0-lengthM').fill('60');
    await page.getByRole('button', { name: /Add a run/ }).click();
    await page.locator('#f-estimate-runs-1-label').fill('Glycol to the fermenters');
    await page.locator('#f-estimate-runs-1-service').selectOption('glycol');
    await page.locator('#f-estimate-runs-1-lengthM').fill('80');

    await next(page, 'The figures for your plant');
    await page.getByRole('heading', { name: 'Lost every year as things are' }).waitFor();
    const shownLoss = await resultsFigure(page, 'Money');
    const shownSaving = await resultsFigure(page, 'Saved');
    const shownPayback = await resultsFigure(page, 'Simple payback');
    const shownHazards = await page.locator('.hazard-list .hazard').allTextContents();

    await page.getByRole('button', { name: 'Ask a consultant to follow up' }).click();
    await waitForStep(page, 'Send it to a consultant');
    await page.getByLabel('Your name').fill(owner.name);
    await page.getByLabel('Company or plant').fill(owner.company);
    await page.getByLabel(/^E-mail/).fill(owner.email);
    await page.getByLabel(/may contact me about this assessment/).check();
    await page.getByRole('button', { name: 'Send my assessment' }).click();
    await page.getByRole('heading', { name: 'Your assessment is in' }).waitFor();
    const reference = (await page.locator('.confirmation-reference strong').textContent())?.trim() ?? '';
    expect(reference).toMatch(/^LW-/);

    // What the shared presentation writes for the stored assessment, in the owner's units.
    const db = getDb();
    const [row] = await db.select().from(assessments).where(eq(assessments.reference, reference));
    expect(row).toBeDefined();
    const runs = await db.select().from(pipeRuns).where(eq(pipeRuns.assessmentId, row!.id)).orderBy(pipeRuns.position);
    const reading = readStoredResult({
      resultSnapshot: row!.resultSnapshot,
      engineVersion: row!.engineVersion,
      input: storedPlantInput(row!.questionnaire, runs.map((r) => r.spec)),
    });
    expect(reading.status).toBe('as-stored');
    const expected = presentResult((reading as Extract<typeof reading, { status: 'as-stored' }>).result, { system: 'US' });
    const { lossCost, saving, payback } = expected.headline;
    expect(lossCost.range).not.toBeNull();
    expect(expected.hazards.length).toBeGreaterThan(0);
    expect(expected.hazards.some((h) => h.sentence.includes('°F'))).toBe(true);

    // The results step.
    expect(shownLoss).toEqual({ value: lossCost.text, range: `likely ${lossCost.range!.text}` });
    expect(shownSaving.value).toBe(saving.text);
    expect(shownPayback.value).toBe(payback.text);
    expect(shownHazards).toEqual(expected.hazards.map((h) => `${h.tone === 'cold' ? '❄' : '▲'}${h.flag}${h.runLabel}. ${h.sentence}`));

    // The confirmation e-mail, as HTML and as text.
    const mails = await waitForMessages(owner.email, (m) => m.some((x) => x.subject.includes(reference)));
    const mail = mails.find((m) => m.subject.includes(reference))!;
    // React's comment separators and the tags go; what a mail client shows stays.
    const html = (mail.html ?? '').replace(/<!--[\s\S]*?-->/g, '').replace(/<[^>]+>/g, '').replace(/&nbsp;/g, '\u00a0');
    for (const text of [html, mail.text ?? ''].map((t) => t.replace(/[ \t\r\n]+/g, ' '))) {
      expect(text).toContain(`about ${lossCost.value} a year`);
      expect(text).toContain(`likely between ${lossCost.range!.low} and ${lossCost.range!.high}`);
      expect(text).toContain(`save about ${saving.value} a year`);
      expect(text).toContain(`pay back in ${payback.value}`);
    }

    // The owner's page, reached from the e-mail's link.
    const signIn = /href="([^"]*\/api\/auth\/magic-link\/verify[^"]*)"/.exec(mail.html ?? '')?.[1]?.replace(/&amp;/g, '&');
    expect(signIn).toBeDefined();
    await page.goto(signIn!, { waitUntil: 'networkidle' });
    await page.getByText(`Assessment ${reference}`).waitFor();
    // Layout whitespace folded, no-break spaces kept: they are part of the figures.
    const summary = ((await page.locator('[data-estimate-summary]').textContent()) ?? '').replace(/[ \t\r\n]+/g, ' ');
    for (const figure of [lossCost, saving, payback]) expect(summary).toContain(figure.value);
    expect(summary).toContain(`likely between ${lossCost.range!.low} and ${lossCost.range!.high}`);
    for (const hazard of expected.hazards) expect(summary).toContain(hazard.sentence);
    expect(summary).not.toMatch(/°C/);
    expect(await page.locator('[data-provenance]').count()).toBe(0);

    expect(problems).toEqual([]);
    await context.close();
  });
});
