/**
 * The admin area in a browser: the admin makes a region (checking it first) and invites a
 * consultant; the consultant chooses a password from the e-mail and sees the region's open lead;
 * the admin sees the lead in the coverage view and the claim in the activity log. Every admin page
 * is checked with axe at desktop and phone widths. Australian prefix 48, which no other test uses.
 */
import AxeBuilder from '@axe-core/playwright';
import { randomUUID } from 'node:crypto';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb } from '../../src/db/client';
import { stopSender } from '../../src/lib/jobs/queue';
import { adminCookie, invitationTokens } from '../admin/support';
import { launchBrowser, watchForErrors } from '../support/browser';
import { submitLead } from '../support/desk';
import { stack } from '../support/stack';

const stamp = randomUUID().slice(0, 6);
const regionName = `Mallee Reach ${stamp}`;
const consultant = { email: `ines.${stamp}@saltbush-lagging.example`, name: 'Ines Saltbush', firm: `Saltbush Lagging ${stamp}`, phone: '+61 3 5550 4411' };
const desktop = { width: 1280, height: 900 };
const phone = { width: 390, height: 844 };

async function seriousViolations(page: Page): Promise<string[]> {
  const results = await new AxeBuilder({ page }).analyze();
  return results.violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map((v) => `${v.id}: ${v.help} (${v.nodes.map((n) => n.target.join(' ')).join(', ')})`);
}

/** A browser context signed in as the demo admin (the sign-in form has tests of its own). */
async function adminContext(browser: Browser, viewport = desktop): Promise<BrowserContext> {
  const context = await browser.newContext({ viewport });
  const url = new URL(stack.appUrl);
  const cookies = (await adminCookie()).split('; ').map((pair) => {
    const [name, ...value] = pair.split('=');
    return { name: name!, value: value.join('='), domain: url.hostname, path: '/', httpOnly: true, sameSite: 'Lax' as const };
  });
  await context.addCookies(cookies);
  return context;
}

const at = (path: string) => new URL(path, stack.appUrl).href;

describe('the admin area, in a browser', () => {
  let browser: Browser;
  beforeAll(async () => {
    browser = await launchBrowser();
  });
  afterAll(async () => {
    await browser?.close();
    await stopSender();
    await closeDb();
  });

  it('the admin makes a region and invites a consultant, who joins from the e-mail and claims the region’s lead; the admin sees it all', async () => {
    // An owner in a place no region covers yet.
    const lead = await submitLead('4810', { email: `owner.${stamp}@mallee-dairy.example`, company: `Mallee Dairy ${stamp}` });

    const admin = await adminContext(browser);
    const page = await admin.newPage();
    const problems = watchForErrors(page);

    // The region, checked before saving: the dry run says the unrouted lead would come to it.
    await page.goto(at('/admin/regions'), { waitUntil: 'networkidle' });
    await page.getByLabel('Name').fill(regionName);
    await page.getByLabel('Country').selectOption('AU');
    await page.getByLabel('Postal-code prefixes it covers').fill('48X');
    await page.getByRole('button', { name: 'Check before saving' }).click();
    await expect.poll(() => page.getByText(/"48X" is not the start of a postal code of Australia/).count()).toBe(1);
    // That 400 was asked for; only what comes after it counts as a problem.
    problems.splice(0);
    await page.getByLabel('Postal-code prefixes it covers').fill('48');
    await page.getByRole('button', { name: 'Check before saving' }).click();
    await page.getByRole('heading', { name: 'If you save' }).waitFor();
    await expect.poll(() => page.getByText(/1 assessment with no region would be routed here/).count()).toBe(1);
    await page.getByRole('button', { name: 'Save the region' }).click();
    await page.getByText(`${regionName} is saved.`).waitFor();

    // The consultant, invited to the new region.
    await page.goto(at('/admin/consultants'), { waitUntil: 'networkidle' });
    await page.getByLabel('E-mail address').fill(consultant.email);
    await page.getByLabel('Name', { exact: true }).fill(consultant.name);
    await page.getByLabel('Firm (owners are told it)').fill(consultant.firm);
    await page.getByLabel('Phone (owners are told it)').fill(consultant.phone);
    await page.getByLabel(regionName).check();
    await page.getByRole('button', { name: 'Send the invitation' }).click();
    await page.getByText(`Invitation sent to ${consultant.email}`).waitFor();
    await page.getByRole('listitem', { name: consultant.name }).getByText('Invited, not joined yet').waitFor();
    expect(problems).toEqual([]);

    // The consultant, on a phone, from the link in the e-mail.
    const [token] = await invitationTokens(consultant.email, 1);
    const consultantContext = await browser.newContext({ viewport: phone });
    const desk = await consultantContext.newPage();
    const deskProblems = watchForErrors(desk);
    await desk.goto(at(`/join?token=${token}`), { waitUntil: 'networkidle' });
    await desk.getByRole('heading', { name: `Welcome, ${consultant.name}` }).waitFor();
    expect(await seriousViolations(desk)).toEqual([]);
    await desk.getByLabel('Password').fill('saltbush and mallee 48');
    await desk.getByRole('button', { name: 'Set my password and open my desk' }).click();
    await desk.waitForURL(/\/desk$/);
    // The open list is an island: wait until it is live (hydrated) before claiming from it.
    await desk.waitForLoadState('networkidle');
    await desk.locator('astro-island:not([ssr])').first().waitFor({ state: 'attached' });
    await desk.getByText(lead.reference).first().waitFor();
    expect(await desk.content()).not.toContain(lead.ownerEmail);
    await desk.getByRole('button', { name: new RegExp(`^Claim ${lead.reference}`) }).click();
    await desk.waitForURL(new RegExp(`/desk/leads/${lead.id}`));
    expect(deskProblems).toEqual([]);
    // The link worked once.
    const reused = await desk.goto(at(`/join?token=${token}`));
    expect(reused?.status()).toBe(410);

    // The admin sees the lead, now held, in the coverage view, and the claim in the log.
    await page.goto(at('/admin/coverage'), { waitUntil: 'networkidle' });
    const board = page.getByRole('article').filter({ hasText: regionName });
    await board.getByRole('link', { name: new RegExp(`${lead.reference} · Taken on · ${consultant.name}`) }).waitFor();
    await board.getByText(/1 of 5 open/).waitFor();
    await page.goto(at(`/admin/activity?lead=${lead.reference}`), { waitUntil: 'networkidle' });
    await page.getByRole('cell', { name: `${consultant.name} (${consultant.firm}) took it on` }).waitFor();
    await page.getByRole('cell', { name: 'A region change routed the lead to a region' }).waitFor();
    expect(problems).toEqual([]);
    await consultantContext.close();
    await admin.close();
  });

  it.each(['/admin', '/admin/attention', '/admin/consultants', '/admin/regions', '/admin/coverage', '/admin/activity'])(
    '%s has no serious or critical accessibility violations, at desktop and phone widths',
    async (path) => {
      for (const viewport of [desktop, phone]) {
        const context = await adminContext(browser, viewport);
        const page = await context.newPage();
        const problems = watchForErrors(page);
        const response = await page.goto(at(path), { waitUntil: 'networkidle' });
        expect(response?.status()).toBe(200);
        expect(await seriousViolations(page)).toEqual([]);
        // Nothing pushes the page sideways on a phone.
        const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
        expect(overflow, `${path} at ${viewport.width} px`).toBeLessThanOrEqual(1);
        expect(problems).toEqual([]);
        await context.close();
      }
    },
  );

  it.each(['/forgot-password', '/set-password?token=abcdefghijklmnopqrstuvwxyz'])('%s has no serious or critical accessibility violations', async (path) => {
    for (const viewport of [desktop, phone]) {
      const context = await browser.newContext({ viewport });
      const page = await context.newPage();
      await page.goto(at(path), { waitUntil: 'networkidle' });
      expect(await seriousViolations(page)).toEqual([]);
      await context.close();
    }
  });
});
