/**
 * The site walk in a browser: the desk's journey from an open lead to a saved revision shown
 * beside the owner's answers (issue 7's browser test), and a walk made without a connection —
 * edited offline, reloaded, saved on the phone, sent when the connection returns. axe finds no
 * serious or critical problem on the walk or the comparison at 1280 and 390 px.
 */
import AxeBuilder from '@axe-core/playwright';
import { eq } from 'drizzle-orm';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb, getDb } from '../../src/db/client';
import { leadRevisions } from '../../src/db/schema';
import { stopSender } from '../../src/lib/jobs/queue';
import { launchBrowser, watchForErrors } from '../support/browser';
import { asPerson, ensureConsultant, ensureDeskRegion, passwordCookie, submitLead, TEST_PASSWORD } from '../support/desk';
import { waitForMessages } from '../support/fixtures';
import { stack } from '../support/stack';

const walker = { email: 'walk-one@banksia-lagging.example', name: 'Nell Banksia', firm: 'Banksia Lagging', phone: '+61 2 5550 2601' };
const second = { email: 'walk-two@grevillea-thermal.example', name: 'Ravi Grevillea', firm: 'Grevillea Thermal' };
const url = (path: string) => new URL(path, stack.appUrl).href;

/**
 * Signs in through the sign-in page, as a person does. The server lets one address sign in a
 * few times in ten seconds, and every test comes from 127.0.0.1: when it says so, wait and try again.
 */
async function signIn(page: Page, email: string): Promise<void> {
  for (let attempt = 0; attempt < 4; attempt++) {
    await page.goto(url('/sign-in'));
    const form = page.locator('form[action="/api/sign-in/password"]');
    await form.getByLabel(/e-mail/i).fill(email);
    await form.getByLabel(/password/i).fill(TEST_PASSWORD);
    await form.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL((to) => to.pathname.startsWith('/desk') || to.searchParams.has('error'));
    if (new URL(page.url()).pathname.startsWith('/desk')) return;
    expect(new URL(page.url()).searchParams.get('error')).toBe('team-limited');
    await page.waitForTimeout(11_000);
  }
  throw new Error(`${email} could not sign in: ${page.url()}`);
}

/** A session made in this process (tests other than the sign-in itself need not use the form). */
async function withSession(context: BrowserContext, email: string): Promise<void> {
  const cookie = await passwordCookie(email);
  await context.addCookies(
    cookie.split('; ').map((pair) => {
      const at = pair.indexOf('=');
      return { name: pair.slice(0, at), value: pair.slice(at + 1), url: stack.appUrl };
    }),
  );
}

async function axeProblems(page: Page): Promise<string[]> {
  const results = await new AxeBuilder({ page }).analyze();
  return results.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical').map((v) => `${v.id}: ${v.help} (${v.nodes.length})`);
}

/** The revisions stored for a lead, oldest first. */
async function storedRevisions(leadId: string) {
  return getDb().select({ number: leadRevisions.number, plantInput: leadRevisions.plantInput }).from(leadRevisions).where(eq(leadRevisions.assessmentId, leadId)).orderBy(leadRevisions.number);
}

/** Waits until the run's live figures differ from its figures before the walk. */
async function waitForNewFigures(page: Page, runId: string): Promise<void> {
  const run = page.locator('article.walk-run', { has: page.locator(`#walk-${runId}-heading`) });
  await expect
    .poll(async () => {
      const lines = await run.locator('.walk-figure-line').allInnerTexts();
      const before = lines.find((l) => l.startsWith('Before:'))?.slice(7);
      const now = lines.find((l) => l.startsWith('Now:'))?.slice(4);
      return before !== undefined && now !== undefined && before !== now;
    }, { timeout: 20_000 })
    .toBe(true);
}

describe('the site walk, in a browser', () => {
  let browser: Browser;
  beforeAll(async () => {
    const region = await ensureDeskRegion('test-walk-banksia', 'Banksia Heights (site walk)', ['26']);
    await ensureConsultant({ ...walker, regionIds: [region], cap: 50 });
    await ensureConsultant({ ...second, regionIds: [region] });
    browser = await launchBrowser();
  });
  afterAll(async () => {
    await browser?.close();
    await stopSender();
    await closeDb();
  });

  it('a consultant claims a fresh lead, books the walk, measures a run on a phone and sees the revision beside the owner’s answers', async () => {
    const stamp = Date.now();
    const lead = await submitLead('2601', { email: `owner.${stamp}@banksia-creamery.example`, company: `Banksia Creamery ${stamp}` });
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    const problems = watchForErrors(page);

    // Signed in, the open list shows the lead and nothing of who sent it.
    await signIn(page, walker.email);
    await page.goto(url('/desk?pageSize=50'), { waitUntil: 'networkidle' });
    await expect.poll(() => page.locator('body').innerText()).toContain(lead.reference);
    const openText = await page.locator('body').innerText();
    for (const secret of [lead.company, lead.contactName, lead.ownerEmail, lead.phone]) expect(openText).not.toContain(secret);

    // Claimed from the list: the lead page now names the owner.
    await page.getByRole('button', { name: new RegExp(`^Claim ${lead.reference}`) }).click();
    await page.waitForURL(new RegExp(`/desk/leads/${lead.id}\\?claimed=1`));
    await expect.poll(() => page.locator('body').innerText()).toContain(lead.ownerEmail);

    // Along the pipeline to a booked site walk.
    await page.getByRole('button', { name: 'We are talking' }).click();
    await page.getByRole('button', { name: 'Site walk booked' }).waitFor();
    await page.getByRole('button', { name: 'Site walk booked' }).click();
    await page.locator('.stage-badge', { hasText: 'Walk booked' }).waitFor();

    // On a phone: the walk, with a measured length and a contact reading on the steam header.
    await page.setViewportSize({ width: 390, height: 844 });
    await page.getByRole('link', { name: 'Open the site walk' }).click();
    await page.waitForURL(/\/site-walk$/);
    const header = page.locator('article.walk-run', { has: page.locator('#walk-steam-1-heading') });
    await header.getByText('Correct this run').click();
    await page.locator('#walk-steam-1-measurements-lengthM').fill('26.5');
    await page.locator('#walk-steam-1-measurements-surfaceTemperatureC').fill('152');
    await page.locator('#walk-steam-1-measurements-airTemperatureC').fill('24');
    await waitForNewFigures(page, 'steam-1');
    expect(await axeProblems(page)).toEqual([]);
    const tapTargets = await page.locator('.walk button, .walk input:not([type=radio]):not([type=checkbox]), .walk select, .walk summary, .walk-choice').evaluateAll((nodes) =>
      nodes.filter((n) => (n as HTMLElement).offsetParent !== null).map((n) => Math.round(n.getBoundingClientRect().height)),
    );
    expect(Math.min(...tapTargets)).toBeGreaterThanOrEqual(44);
    await page.locator('#walk-reason').fill('Paced the boiler house header; probe on the bare pipe by the second valve');
    await page.getByRole('button', { name: /^Save revision 1/ }).click();

    // Back on the lead: the owner's answers beside the walk's, with the diff and who made it.
    await page.waitForURL(new RegExp(`/desk/leads/${lead.id}\\?revised=1#site-walk`));
    const walk = page.locator('#site-walk');
    await walk.getByText('Revision 1 is saved.').waitFor();
    const run = walk.locator('article.compare-run', { hasText: 'Boiler steam header' });
    expect(await run.locator('.compare-badge').innerText()).toBe('Corrected');
    expect(await run.innerText()).toContain('Changed in revision 1 by Nell Banksia (Banksia Lagging)');
    const lengthRow = run.locator('tr', { has: page.locator('th', { hasText: /^Length$/ }) });
    expect(await lengthRow.locator('td').allInnerTexts()).toEqual([expect.stringContaining('20\u00a0m'), expect.stringContaining('26.5\u00a0m, measured')]);
    const readingRow = run.locator('tr', { has: page.locator('th', { hasText: /^Surface reading$/ }) });
    expect(await readingRow.locator('td').allInnerTexts()).toEqual([expect.stringContaining('none taken'), expect.stringContaining('152\u00a0°C by contact probe, air 24\u00a0°C')]);
    const costRow = run.locator('tr', { has: page.locator('th', { hasText: /^Cost a year$/ }) });
    const [costBefore, costAfter] = await costRow.locator('td').allInnerTexts();
    expect(costBefore).not.toBe(costAfter);
    expect(await walk.locator('table.compare').first().textContent()).toContain('After the walk (revision 1)');
    expect(await walk.innerText()).toContain('As the owner sent it: Hot water to wash bay.');
    expect(await axeProblems(page)).toEqual([]);
    await page.setViewportSize({ width: 1280, height: 900 });
    expect(await axeProblems(page)).toEqual([]);
    expect(problems).toEqual([]);

    // The region's other consultant no longer sees it among the open leads.
    const other = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    await withSession(other, second.email);
    const otherPage = await other.newPage();
    await otherPage.goto(url('/desk?pageSize=50'), { waitUntil: 'networkidle' });
    expect(await otherPage.locator('main').innerText()).not.toContain(lead.reference);
    const list = (await (await asPerson(await passwordCookie(second.email), '/api/leads?view=open&pageSize=50')).json()) as { items: { id: string }[] };
    expect(list.items.map((i) => i.id)).not.toContain(lead.id);

    // The owner was told who will contact them.
    const mail = await waitForMessages(lead.ownerEmail, (all) => all.some((m) => m.subject.includes('will contact you')));
    const introduction = mail.find((m) => m.subject.includes('will contact you'))!;
    expect(introduction.subject).toBe(`${walker.name} of ${walker.firm} will contact you about ${lead.reference}`);
    await other.close();
    await context.close();
  });

  it('a walk edited without a connection survives a reload, waits on the phone, and is sent when the connection returns', async () => {
    const lead = await submitLead('2602', { email: `offline.${Date.now()}@banksia-smokehouse.example` });
    const cookie = await passwordCookie(walker.email);
    expect((await asPerson(cookie, `/api/leads/${lead.id}/claim`, { method: 'POST', body: {} })).status).toBe(200);

    const context: BrowserContext = await browser.newContext({ viewport: { width: 390, height: 844 } });
    await withSession(context, walker.email);
    const page = await context.newPage();
    const walkUrl = url(`/desk/leads/${lead.id}/site-walk`);
    await page.goto(walkUrl, { waitUntil: 'networkidle' });
    // Online first: the page and its files are kept for a reload without signal.
    await expect
      .poll(() => page.evaluate(async (path) => Boolean(await (await caches.open('lagwise-walk-v1')).match(path)) && Boolean(navigator.serviceWorker.controller), new URL(walkUrl).pathname), { timeout: 20_000 })
      .toBe(true);

    await context.setOffline(true);
    const washLine = page.locator('article.walk-run', { has: page.locator('#walk-hw-1-heading') });
    await washLine.getByText('Correct this run').click();
    await page.locator('#walk-hw-1-measurements-lengthM').fill('14.2');
    await page.locator('#walk-hw-1-measurements-lengthM').blur();
    await page.locator('.walk-offline').waitFor();
    await expect.poll(() => page.evaluate((key) => localStorage.getItem(key) ?? '', `lagwise:walk:v1:${lead.id}`)).toContain('14.2');

    // Reloaded in the plant room: the page opens from the phone's copy, the edit still there.
    await page.reload();
    await page.locator('article.walk-run').first().waitFor();
    expect(await page.locator('#walk-hw-1-measurements-lengthM').inputValue()).toBe('14.2');
    expect(await page.locator('article.walk-run', { has: page.locator('#walk-hw-1-heading') }).locator('.walk-badge').innerText()).toBe('Corrected');

    // Saved without signal: it waits on the phone and says so, through another reload too.
    await page.getByRole('button', { name: /^Save revision 1/ }).click();
    await page.locator('.walk-waiting', { hasText: 'Saved on this phone, not yet sent' }).waitFor();
    expect(await storedRevisions(lead.id)).toEqual([]);
    await page.reload();
    await page.locator('.walk-waiting', { hasText: 'Saved on this phone, not yet sent' }).waitFor();
    expect(await storedRevisions(lead.id)).toEqual([]);

    // Back in signal: it goes by itself, once, and the lead shows it.
    await context.setOffline(false);
    await page.waitForURL(new RegExp(`/desk/leads/${lead.id}\\?revised=1#site-walk`), { timeout: 30_000 });
    const stored = await storedRevisions(lead.id);
    expect(stored.map((r) => r.number)).toEqual([1]);
    const runs = (stored[0]!.plantInput as { runs: { id: string; measurements?: { lengthM?: number } }[] }).runs;
    expect(runs.find((r) => r.id === 'hw-1')?.measurements?.lengthM).toBe(14.2);
    expect(await page.evaluate((key) => localStorage.getItem(key), `lagwise:walk:v1:${lead.id}`)).toBeNull();

    // Signing out takes the page copy off the phone.
    expect(await page.evaluate(() => caches.has('lagwise-walk-v1'))).toBe(true);
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL((to) => !to.pathname.startsWith('/desk'));
    await expect.poll(() => page.evaluate(() => caches.has('lagwise-walk-v1'))).toBe(false);
    await context.close();
  });

  it('a revision saved elsewhere meanwhile is shown, and the phone’s changes are not sent over it unasked', async () => {
    const lead = await submitLead('2603', { email: `conflict.${Date.now()}@banksia-bakery.example` });
    const cookie = await passwordCookie(walker.email);
    expect((await asPerson(cookie, `/api/leads/${lead.id}/claim`, { method: 'POST', body: {} })).status).toBe(200);
    const context = await browser.newContext({ viewport: { width: 390, height: 844 } });
    await withSession(context, walker.email);
    const page = await context.newPage();
    await page.goto(url(`/desk/leads/${lead.id}/site-walk`), { waitUntil: 'networkidle' });
    await page.locator('article.walk-run', { has: page.locator('#walk-steam-1-heading') }).getByText('Correct this run').click();
    await page.locator('#walk-steam-1-measurements-lengthM').fill('31');
    await expect.poll(() => page.evaluate((key) => localStorage.getItem(key) ?? '', `lagwise:walk:v1:${lead.id}`)).toContain('31');

    // Meanwhile, from the office: revision 1 changes the wash line.
    const { original } = (await (await asPerson(cookie, `/api/leads/${lead.id}/revisions`)).json()) as { original: { plant: { runs: { id: string; lengthM: number }[] } } };
    const office = await asPerson(cookie, `/api/leads/${lead.id}/revisions`, {
      method: 'POST',
      body: { baseNumber: 0, reason: 'From the drawings', runs: original.plant.runs.map((r) => (r.id === 'hw-1' ? { ...r, lengthM: 16 } : r)) },
    });
    expect(office.status).toBe(201);

    await page.getByRole('button', { name: /^Save revision 1/ }).click();
    const conflict = page.locator('.walk-conflict');
    await conflict.getByText('A newer revision was saved').waitFor();
    expect(await conflict.innerText()).toContain('saved revision 1');
    await conflict.getByText('Hot water to wash bay (length)').waitFor();
    expect((await storedRevisions(lead.id)).map((r) => r.number)).toEqual([1]);
    expect(await page.locator('#walk-steam-1-measurements-lengthM').inputValue()).toBe('31');

    // Chosen knowingly: the phone's changes go on top of revision 1 as revision 2.
    await conflict.getByRole('button', { name: 'Keep my changes and save them over it' }).click();
    await page.getByRole('button', { name: /^Save revision 2/ }).click();
    await page.waitForURL(new RegExp(`/desk/leads/${lead.id}\\?revised=2#site-walk`));
    expect((await storedRevisions(lead.id)).map((r) => r.number)).toEqual([1, 2]);
    await context.close();
  });
});
