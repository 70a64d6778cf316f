/**
 * The consultant's desk in a browser: sign in from the sign-in page, find a fresh lead with no
 * contact data on show, claim it, move it to "Walk booked"; the region's second consultant, on a
 * phone, no longer finds it among open leads; the owner has the "who will contact you" mail.
 * Every desk page is checked with axe at desktop and phone widths. Screenshots of each step are
 * kept in the test state folder (screens/) for people to look at.
 */
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb } from '../../src/db/client';
import { stopSender } from '../../src/lib/jobs/queue';
import { expectAccessible, launchBrowser, signInAtDesk, watchForErrors } from '../support/browser';
import { ensureConsultant, ensureDeskRegion, submitLead, TEST_PASSWORD, type SubmittedLead } from '../support/desk';
import { waitForMessages } from '../support/fixtures';
import { stack } from '../support/stack';

const first = { email: 'browser-a@jabiru-thermal.example', name: 'Lou Jabiru', firm: 'Jabiru Thermal', phone: '+61 3 5550 3911' };
const second = { email: 'browser-b@brolga-pipe.example', name: 'Mo Brolga', firm: 'Brolga Pipe Care', phone: '+61 3 5550 3922' };

let browser: Browser;
let lead: SubmittedLead;
let screens: string;

async function shot(page: Page, name: string): Promise<void> {
  await page.screenshot({ path: path.join(screens, `${name}.png`), fullPage: true });
}

function contactOf(l: SubmittedLead): string[] {
  return [l.ownerEmail, l.company, l.contactName, l.phone];
}

describe('the desk, in a browser', () => {
  beforeAll(async () => {
    screens = path.join(stack.stateDir, 'screens');
    mkdirSync(screens, { recursive: true });
    const region = await ensureDeskRegion('test-browser-jabiru', 'Jabiru Lagoon (browser)', ['39']);
    await ensureConsultant({ ...first, regionIds: [region] });
    await ensureConsultant({ ...second, regionIds: [region] });
    lead = await submitLead('3901', { company: `Yarra Bend Tofu ${Date.now()}` });
    browser = await launchBrowser();
  });

  afterAll(async () => {
    await browser?.close();
    await stopSender();
    await closeDb();
  });

  it('a consultant claims a fresh lead and books a site walk; the region’s other consultant no longer sees it; the owner is told who will call', async () => {
    const desktop = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await signInAtDesk(desktop, first.email);
    const problems = watchForErrors(page);

    // The open list: the lead is there, the owner is not.
    const row = page.locator('tr', { hasText: lead.reference });
    await expect(row.count()).resolves.toBe(1);
    const listHtml = await page.content();
    for (const secret of contactOf(lead)) expect(listHtml).not.toContain(secret);
    await expectAccessible(page, 'open leads');
    await shot(page, 'desk-open-1280');
    // Beside the side column the list gets a narrow box even in a wide window: it fits that box and never pushes the page sideways.
    for (const width of [1280, 1024]) {
      await page.setViewportSize({ width, height: 900 });
      expect(await page.evaluate(() => document.documentElement.scrollWidth), `open list at ${width} px`).toBeLessThanOrEqual(width);
    }
    await page.setViewportSize({ width: 1280, height: 900 });

    // One lead, before the claim: no contact data either.
    await row.getByRole('link').first().click();
    await page.waitForURL(new RegExp(`/desk/leads/${lead.id}$`));
    const before = await page.content();
    for (const secret of contactOf(lead)) expect(before).not.toContain(secret);
    await expectAccessible(page, 'lead before claim');
    await shot(page, 'desk-lead-open-1280');

    // Claim it: the owner's details appear.
    await Promise.all([page.waitForURL(/\?claimed=1$/), page.getByRole('button', { name: `Claim ${lead.reference}` }).click()]);
    await expect(page.getByText(lead.ownerEmail).count()).resolves.toBeGreaterThan(0);
    await expect(page.locator('.stage-badge').first().textContent()).resolves.toBe('Taken on');

    // Along the pipeline to a booked site walk.
    await Promise.all([page.waitForLoadState('load'), page.getByRole('button', { name: 'We are talking' }).click()]);
    await page.locator('.stage-badge', { hasText: 'Talking' }).first().waitFor();
    await Promise.all([page.waitForLoadState('load'), page.getByRole('button', { name: 'Site walk booked' }).click()]);
    await page.locator('.stage-badge', { hasText: 'Walk booked' }).first().waitFor();
    await page.getByLabel('Add a note to the timeline').fill('Walk on Tuesday at 6:30, before the first batch.');
    await Promise.all([page.waitForLoadState('load'), page.getByRole('button', { name: 'Add note' }).click()]);
    await page.getByText('Walk on Tuesday at 6:30, before the first batch.').waitFor();
    const timeline = await page.locator('.timeline').textContent();
    expect(timeline).toContain('Lou Jabiru (Jabiru Thermal) moved it from “Talking” to “Walk booked”');
    expect(timeline).toContain('Lou Jabiru (Jabiru Thermal) took it on');
    await expectAccessible(page, 'held lead');
    await shot(page, 'desk-lead-held-1280');

    // My leads lists it at its stage.
    await page.goto(new URL('/desk/mine', stack.appUrl).href);
    await expect(page.locator('.held-lead', { hasText: lead.company }).locator('.stage-badge').textContent()).resolves.toBe('Walk booked');
    await expectAccessible(page, 'my leads');
    await shot(page, 'desk-mine-1280');
    expect(problems).toEqual([]);
    await desktop.close();

    // The region's second consultant, on a phone: the lead has left the open list.
    const phone = await browser.newContext({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true });
    const other = await signInAtDesk(phone, second.email);
    const otherProblems = watchForErrors(other);
    const openHtml = await other.content();
    expect(openHtml).not.toContain(lead.reference);
    await expectAccessible(other, 'open leads on a phone');
    await shot(other, 'desk-open-390');
    const width = await other.evaluate(() => document.documentElement.scrollWidth);
    expect(width).toBeLessThanOrEqual(390);
    await other.goto(new URL(`/desk/leads/${lead.id}`, stack.appUrl).href);
    const held = await other.content();
    for (const secret of contactOf(lead)) expect(held).not.toContain(secret);
    expect(held).toContain('Jabiru Thermal');
    await expectAccessible(other, 'a colleague’s lead on a phone');
    await shot(other, 'desk-lead-colleague-390');
    expect(otherProblems).toEqual([]);
    await phone.close();

    // The owner's inbox: who will contact them.
    const mail = await waitForMessages(lead.ownerEmail, (m) => m.some((x) => x.subject.includes('will contact you')));
    const introduction = mail.find((m) => m.subject.includes('will contact you'))!;
    expect(introduction.subject).toBe(`Lou Jabiru of Jabiru Thermal will contact you about ${lead.reference}`);
    for (const fact of [first.name, first.firm, first.phone, first.email]) expect(introduction.text).toContain(fact);
  });

  it('the open list pages, sorts and filters in place, and works without JavaScript too', async () => {
    await Promise.all(Array.from({ length: 3 }, () => submitLead('3902')));
    for (const javaScriptEnabled of [true, false]) {
      const context = await browser.newContext({ viewport: { width: 1280, height: 900 }, javaScriptEnabled });
      const page = await signInAtDesk(context, second.email);
      await page.getByRole('link', { name: /^Lost a year/ }).click();
      await page.waitForURL(/sort=loss/);
      await page.locator('tbody tr').first().waitFor();
      const losses = await page.locator('td.lead-col-loss .text-ember').allTextContents();
      const values = losses.map((t) => Number(t.replace(/[^\d.]/g, '')));
      expect(values).toEqual([...values].sort((a, b) => b - a));
      await page.locator('summary', { hasText: 'Narrow the list' }).click();
      await page.locator('select[name=photos]').selectOption('yes');
      await page.getByRole('button', { name: 'Show leads' }).click();
      await page.getByText('No open leads match').waitFor();
      expect(page.url()).toContain('photos=yes');
      await context.close();
    }
  });
});
