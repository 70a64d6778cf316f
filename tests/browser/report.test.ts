/**
 * The follow-up report in a browser, from both sides: the consultant holding a lead with a saved
 * site walk composes the report from that walk, changes one run's thickness and price (and says
 * why), previews it as the owner will see it and sends it; the owner, on a phone-sized screen,
 * opens the link in the e-mail, downloads the PDF and accepts; the consultant then sees the
 * acceptance. Pages are checked with axe; screenshots are kept in the test state folder
 * (screens/) for people to look at.
 */
import { mkdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb } from '../../src/db/client';
import { stopSender } from '../../src/lib/jobs/queue';
import { expectAccessible, launchBrowser, signInAtDesk, watchForErrors } from '../support/browser';
import { asPerson, ensureConsultant, ensureDeskRegion, ownerCookie, passwordCookie, submitLead, TEST_PASSWORD, type SubmittedLead } from '../support/desk';
import { waitForMessages } from '../support/fixtures';
import { pdfText, squeeze } from '../support/reports';
import { stack } from '../support/stack';

const holder = { email: 'report-browser@currawong-insulation.example', name: 'Ada Currawong', firm: 'Currawong Insulation', phone: '+61 3 5550 4411' };

let browser: Browser;
let lead: SubmittedLead;
let screens: string;

async function shot(page: Page, name: string): Promise<void> {
  await page.screenshot({ path: path.join(screens, `${name}.png`), fullPage: true });
}

/** A `name=value; …` cookie header as the browser's cookies for the app. */
function cookiesOf(header: string): { name: string; value: string; url: string }[] {
  return header
    .split(/;\s*/)
    .filter(Boolean)
    .map((pair) => {
      const at = pair.indexOf('=');
      return { name: pair.slice(0, at), value: pair.slice(at + 1), url: stack.appUrl };
    });
}

describe('the follow-up report, in a browser', () => {
  beforeAll(async () => {
    screens = path.join(stack.stateDir, 'screens');
    mkdirSync(screens, { recursive: true });
    const region = await ensureDeskRegion('test-browser-currawong', 'Currawong Flats (report browser)', ['27']);
    await ensureConsultant({ ...holder, regionIds: [region] });
    lead = await submitLead('2701', { company: `Currawong Flats Creamery ${Date.now()}` });
    const cookie = await passwordCookie(holder.email);
    expect((await asPerson(cookie, `/api/leads/${lead.id}/claim`, { method: 'POST', body: {} })).status).toBe(200);
    // The site walk, saved as the walk's own page saves it: the header paced out longer than the owner guessed.
    const history = (await (await asPerson(cookie, `/api/leads/${lead.id}/revisions`)).json()) as { original: { plant: { runs: { id: string }[] } } };
    const runs = history.original.plant.runs.map((run) => (run.id === 'steam-1' ? { ...run, lengthM: 31 } : run));
    const walk = await asPerson(cookie, `/api/leads/${lead.id}/revisions`, { method: 'POST', body: { baseNumber: 0, reason: 'Paced the steam header on the walk', runs, areas: [] } });
    expect(walk.status, await walk.clone().text()).toBe(201);
    browser = await launchBrowser();
  });

  afterAll(async () => {
    await browser?.close();
    await stopSender();
    await closeDb();
  });

  let reportUrl: string;

  it('the consultant composes from the site walk, changes a run’s thickness and price, previews and sends', async () => {
    const desktop = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await signInAtDesk(desktop, holder.email);
    const problems = watchForErrors(page);
    await page.goto(new URL(`/desk/leads/${lead.id}/report`, stack.appUrl).href, { waitUntil: 'networkidle' });
    expect(problems).toEqual([]);
    // The composer is an island: wait until it is live (hydrated) before starting from it.
    await page.locator('astro-island:not([ssr])').first().waitFor({ state: 'attached' });
    await shot(page, 'report-start-1280');
    await page.getByRole('button', { name: 'Start the report' }).click();
    await page.locator('[data-save-state="saved"]').or(page.getByRole('alert')).first().waitFor();
    expect(problems).toEqual([]);
    await page.getByText('Starts from site walk 1.').waitFor();

    // The walk's length is what the composer works from: 31 m, not the owner's 20 m.
    const header = page.locator('fieldset[data-run="steam-1"]');
    await expect(header.textContent()).resolves.toMatch(/31\u00a0m/);

    // One run changed: the hot-water line gets 50 mm and the consultant's own price for the run.
    const water = page.locator('fieldset[data-run="hw-1"]');
    const figuresBefore = await water.locator('[data-run-figures]').textContent();
    await water.getByLabel('Thickness (mm)').fill('50');
    await water.getByLabel('Or the whole run, installed (optional)').fill('1450');
    await water.getByLabel('Why you changed the suggestion (the owner reads this)').fill('The wash bay line runs where staff brush past it: 50 mm keeps the jacket cool to the touch.');
    // Saved on the server after a pause in typing; the live figures come back with the answer.
    await water.locator('[data-run-figures]').filter({ hasText: '$1,450' }).waitFor();
    await page.locator('[data-save-state="saved"]').waitFor();
    await expect(water.locator('[data-run-figures]').textContent()).resolves.toMatch(/^Insulate: 50\u00a0mm /);
    expect(await water.locator('[data-run-figures]').textContent()).not.toBe(figuresBefore);
    await expectAccessible(page, 'composer');
    await shot(page, 'report-composer-1280');

    // The preview is the owner's page: the change, its reason and the walk it is based on.
    await page.getByRole('button', { name: 'Preview as the owner sees it' }).click();
    const preview = page.locator('[data-preview="owner"]');
    await preview.waitFor();
    const previewText = (await preview.textContent()) ?? '';
    expect(previewText).toContain('Based on site walk 1');
    expect(previewText).toMatch(/50\u00a0mm/);
    expect(previewText).toContain('$1,450');
    expect(previewText).toContain('50 mm keeps the jacket cool to the touch');
    await shot(page, 'report-preview-1280');

    await page.getByRole('button', { name: 'Send to the owner' }).click();
    await Promise.all([page.waitForURL(/\/desk\/reports\/[0-9a-f-]{36}\?sent=1$/), page.getByRole('button', { name: 'Send it now' }).click()]);
    await page.locator('[data-owner-answer="none"]').waitFor();
    expect(problems).toEqual([]);
    await desktop.close();
  });

  it('the owner opens the e-mail’s link on a phone, downloads the PDF and accepts', async () => {
    const mail = await waitForMessages(lead.ownerEmail, (all) => all.some((m) => m.subject.startsWith('Your follow-up report')));
    const message = mail.find((m) => m.subject.startsWith('Your follow-up report'))!;
    reportUrl = /href="([^"]*\/my\/reports\/[0-9a-f-]{36})"/.exec(message.html ?? '')?.[1] ?? '';
    expect(reportUrl).not.toBe('');

    const phone = await browser.newContext({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true, acceptDownloads: true });
    await phone.addCookies(cookiesOf(await ownerCookie(lead.ownerEmail)));
    const page = await phone.newPage();
    const problems = watchForErrors(page);
    await page.goto(reportUrl, { waitUntil: 'networkidle' });
    await page.getByText('Based on site walk 1').first().waitFor();
    // Reads on a phone: nothing wider than the screen but the tables that scroll in their own box.
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await expectAccessible(page, 'owner report 390');
    await shot(page, 'report-owner-390');

    const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: /PDF/ }).first().click()]);
    expect(download.suggestedFilename()).toMatch(/^Lagwise report LW-.+ v1\.pdf$/);
    const bytes = readFileSync((await download.path())!);
    expect(bytes.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    const text = squeeze(pdfText(bytes));
    expect(text).toContain('Based on site walk 1');
    expect(text).toContain('$1,450');

    await page.getByRole('button', { name: 'Go ahead: ask them to contact me' }).click();
    await page.locator('[data-answer="accepted"]').waitFor();
    await shot(page, 'report-owner-accepted-390');
    expect(problems).toEqual([]);
    await phone.close();
  });

  it('the consultant sees the acceptance, by e-mail and on the report', async () => {
    await waitForMessages(holder.email, (all) => all.some((m) => m.subject.includes('wants to go ahead')));
    const desktop = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await signInAtDesk(desktop, holder.email);
    const reportId = reportUrl.split('/').pop()!;
    await page.goto(new URL(`/desk/reports/${reportId}`, stack.appUrl).href, { waitUntil: 'networkidle' });
    const answer = page.locator('[data-owner-answer="accepted"]');
    await answer.waitFor();
    expect(await answer.textContent()).toContain('accepted this version');
    await shot(page, 'report-desk-accepted-1280');
    await desktop.close();
  });
});
