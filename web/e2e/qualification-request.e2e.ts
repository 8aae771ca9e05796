import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BASE_URL, DEMO_PASSWORD, launchBrowser, newContext, screenshot, signIn, watchErrors } from './support/browser';

interface Part {
  vendorPartId: number;
  manufacturer: string;
  mpn: string;
  vzNom: number;
}
interface HousePartChoice {
  id: number;
  partNumber: string;
  nom: number;
  packages: string[];
}

async function token(email: string): Promise<string> {
  const response = await fetch(`${BASE_URL}/api/auth/login`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json' },
    body: JSON.stringify({ email, password: DEMO_PASSWORD }),
  });
  if (!response.ok) throw new Error(`sign-in of ${email} failed: ${response.status}`);
  return ((await response.json()) as { accessToken: string }).accessToken;
}

async function get<T>(path: string, bearer: string): Promise<T> {
  const response = await fetch(`${BASE_URL}/api${path}`, { headers: { Authorization: `Bearer ${bearer}` } });
  if (!response.ok) throw new Error(`GET ${path}: ${response.status}`);
  return (await response.json()) as T;
}

/**
 * Catalogue parts nobody may design in yet, with a rating card, on no house part's source
 * list (so the other journeys' sources stay as they are), without a case and not asked for
 * by the designer, each with the house part whose spec window is nearest its Zener voltage.
 * Chosen through the API so the journey also runs again on a stack an earlier run used.
 */
async function findTargets(count: number): Promise<Array<{ part: Part; housePart: HousePartChoice }>> {
  const engineer = await token('engineer@demo.test');
  const designer = await token('designer@demo.test');
  const board = await get<{ items: Array<{ sources: Array<{ vendorPart: { id: number } }> }> }>('/qualification-views/board?pageSize=200', engineer);
  const sources = new Set(board.items.flatMap((row) => row.sources.map((s) => s.vendorPart.id)));
  const asked = await get<{ items: Array<{ vendorPart: { id: number } }> }>('/qualification-requests?status=all&pageSize=200', designer);
  const askedFor = new Set(asked.items.map((r) => r.vendorPart.id));
  const houseParts = await get<{ items: Array<{ id: number; partNumber: string; specVersion: number | null }> }>('/house-parts?pageSize=200', engineer);
  const choices: HousePartChoice[] = [];
  for (const h of houseParts.items.filter((h) => h.specVersion !== null)) {
    const spec = await get<{ spec: { vz: { nom: number }; packages: string[] } }>(`/house-parts/${h.id}/spec`, engineer);
    choices.push({ id: h.id, partNumber: h.partNumber, nom: spec.spec.vz.nom, packages: spec.spec.packages });
  }
  const search = await get<{
    items: Array<{
      vendorPart: { id: number; manufacturer: string; mpn: string; package: string | null };
      card: { vzNom: number } | null;
      cleared: boolean;
      qualificationOpen: boolean;
    }>;
  }>('/search?includeNotCleared=true&pageSize=100&sort=vzNom', designer);
  const found: Array<{ part: Part; housePart: HousePartChoice }> = [];
  for (const item of search.items) {
    if (item.cleared || item.qualificationOpen || !item.card || sources.has(item.vendorPart.id) || askedFor.has(item.vendorPart.id)) continue;
    const cases = await get<{ total: number }>(`/qualifications?vendorPartId=${item.vendorPart.id}&latest=false`, engineer);
    if (cases.total > 0) continue;
    const vzNom = item.card.vzNom;
    const housePart = choices.reduce((best, h) => (Math.abs(h.nom - vzNom) < Math.abs(best.nom - vzNom) ? h : best));
    // Near a house part's window and in a package its spec allows: the case then compares like with like.
    if (Math.abs(housePart.nom - vzNom) / vzNom > 0.02 || !housePart.packages.includes(item.vendorPart.package ?? '')) continue;
    found.push({ part: { vendorPartId: item.vendorPart.id, manufacturer: item.vendorPart.manufacturer, mpn: item.vendorPart.mpn, vzNom }, housePart });
    if (found.length === count) return found;
  }
  throw new Error('the demo catalogue has too few parts left that are on no source list, have no case and were not asked for: start from a fresh demo seed');
}

async function signedIn(browser: Browser, email: string): Promise<{ page: Page; errors: string[]; done(): Promise<void> }> {
  const context = await newContext(browser);
  const page = await context.newPage();
  const errors = watchErrors(page);
  await signIn(page, email);
  return { page, errors, done: () => context.close() };
}

/** A full-page picture from the top, so the fixed header sits where it belongs. */
async function shot(page: Page, name: string) {
  await page.evaluate(() => window.scrollTo(0, 0));
  await screenshot(page, name);
}

/** Find parts with the catalogue's parts not cleared included, narrowed to one part number. */
async function findPart(page: Page, mpn: string) {
  await page.goto('/find?includeNotCleared=true');
  const input = page.getByRole('textbox', { name: 'Search', exact: true });
  await input.fill(mpn);
  await input.blur();
  const results = page.getByRole('table', { name: 'Search results' });
  // The text reaches the search after a pause: wait until the part ranks first.
  await expect.poll(() => page.url()).toContain(`q=${encodeURIComponent(mpn)}`);
  await expect.poll(() => results.locator('tbody tr').first().getAttribute('aria-label')).toBe(mpn);
  return results.getByRole('row', { name: mpn, exact: true });
}

describe('asking for a qualification in Chromium: the designer asks, an engineer takes it up from the Board, the designer sees it', () => {
  let browser: Browser;
  let close: () => Promise<void>;
  let asked: { part: Part; housePart: HousePartChoice };
  let declined: { part: Part; housePart: HousePartChoice };
  let caseId = 0;

  beforeAll(async () => {
    ({ browser, close } = await launchBrowser());
    [asked, declined] = await findTargets(2);
  });
  afterAll(async () => close?.());

  it('the designer finds a part not cleared and asks for it to be qualified, leaving the house part to the engineer', async () => {
    const { page, errors, done } = await signedIn(browser, 'designer@demo.test');
    const row = await findPart(page, asked.part.mpn);
    expect(await row.innerText()).toContain('Not cleared');
    await shot(page, 'qualification-request-1-find-not-cleared');

    await row.getByRole('button', { name: `Ask for qualification of ${asked.part.mpn}` }).click();
    const dialog = page.getByRole('dialog', { name: `Ask for qualification of ${asked.part.mpn}` });
    // the note is required: nothing is sent without it
    await dialog.getByRole('button', { name: 'Send the request' }).click();
    await dialog.getByText('Say what it is for: the design, why this part, by when').waitFor();
    await dialog
      .getByRole('textbox', { name: /What it is for/ })
      .fill(
        `Clamp for the new field transmitter, board rev C. The ${asked.part.mpn} is in stock at our distributor and costs less; 2 000 pieces a year from the pilot run on.`,
      );
    await dialog.getByLabel('Needed by').fill('2099-03-31');
    await shot(page, 'qualification-request-2-ask-dialog');
    await dialog.getByRole('button', { name: 'Send the request' }).click();
    await dialog.waitFor({ state: 'hidden' });
    await page.getByText(/^Request #\d+ sent$/).waitFor();

    const panel = page.getByRole('region', { name: 'My qualification requests' });
    const request = panel.getByRole('row', { name: new RegExp(`^Request #\\d+: ${asked.part.mpn}$`) });
    await request.waitFor();
    expect(await request.innerText()).toContain('Waiting for an engineer');
    expect(await request.innerText()).toContain('engineer chooses');
    expect(await request.innerText()).toContain('Needed by 31 Mar 2099');
    expect(await row.getByTestId(`asked-${asked.part.mpn}`).innerText()).toBe('you asked · waiting');
    await shot(page, 'qualification-request-3-my-requests-waiting');
    expect(errors).toEqual([]);
    await done();
  });

  it('an engineer sees the request above the Board, opens a case from it for the nearest house part, and lands on the draft', async () => {
    const { page, errors, done } = await signedIn(browser, 'engineer@demo.test');
    await page.waitForURL(/\/board/);
    const panel = page.getByRole('region', { name: 'Asked for qualification' });
    const row = panel.getByRole('row', { name: new RegExp(`^Request #\\d+: ${asked.part.mpn}$`) });
    await row.waitFor();
    const text = await row.innerText();
    expect(text).toContain('Lena Okafor');
    expect(text).toContain('not named');
    expect(text).toContain('31 Mar 2099');
    expect(text).toContain('Clamp for the new field transmitter');
    await page.getByRole('table', { name: 'Board' }).waitFor();
    await shot(page, 'qualification-request-4-board-panel');

    const requestId = Number((await row.getAttribute('aria-label'))!.match(/#(\d+)/)![1]);
    await row.getByRole('button', { name: `Open a case from request #${requestId}` }).click();
    const dialog = page.getByRole('dialog', { name: `Open a case for ${asked.part.mpn}` });
    await dialog.getByRole('button', { name: 'Open the case' }).click();
    await dialog.getByText('Choose the house part to qualify it for').waitFor();
    await dialog.getByRole('textbox', { name: /For house part/ }).fill(asked.housePart.partNumber);
    await page.getByRole('option', { name: new RegExp(`^${asked.housePart.partNumber}`) }).click();
    await shot(page, 'qualification-request-5-open-case-dialog');
    await dialog.getByRole('button', { name: 'Open the case' }).click();
    await page.waitForURL(/\/qualifications\/\d+$/);
    caseId = Number(new URL(page.url()).pathname.split('/').pop());
    await page.getByRole('table', { name: 'Checks' }).waitFor();
    const notes = page.getByRole('region', { name: 'Notes' });
    await expect
      .poll(() => notes.innerText())
      .toContain(`Asked for by Lena Okafor in request #${requestId}, needed by 2099-03-31: Clamp for the new field transmitter`);
    expect(await page.getByRole('region', { name: 'Sign-off' }).locator('[data-state]').first().getAttribute('data-state')).toBe('draft');
    await shot(page, 'qualification-request-6-case-draft');

    // back on the Board the request is gone from the panel, and the part is a source with its case
    await page.goto('/board');
    await page.getByRole('table', { name: 'Board' }).waitFor();
    await expect.poll(() => panel.getByRole('row', { name: new RegExp(`^Request #${requestId}:`) }).count()).toBe(0);
    expect(errors).toEqual([]);
    await done();
  });

  it('the designer sees the request taken up, with the case and where it stands', async () => {
    const { page, errors, done } = await signedIn(browser, 'designer@demo.test');
    const row = await findPart(page, asked.part.mpn);
    const panel = page.getByRole('region', { name: 'My qualification requests' });
    const request = panel.getByRole('row', { name: new RegExp(`^Request #\\d+: ${asked.part.mpn}$`) });
    await expect.poll(() => request.innerText()).toContain('Taken up');
    const text = await request.innerText();
    expect(text).toContain(`Case #${caseId}`);
    expect(text).toContain('Draft');
    expect(text).toContain(`for ${asked.housePart.partNumber} · opened by Priya Raman`);
    // the result says a qualification is under way; the part is still not for new designs
    expect(await row.innerText()).toContain('qualification under way');
    expect(await row.getByTestId(`asked-${asked.part.mpn}`).count()).toBe(0);
    // asking again is offered for another house part only
    expect(await row.getByRole('button', { name: `Ask for qualification of ${asked.part.mpn} for another house part` }).count()).toBe(1);
    await shot(page, 'qualification-request-7-my-requests-taken-up');
    expect(errors).toEqual([]);
    await done();
  });

  it('a second request is declined with a reply, which the designer sees; the admin sees both mails to the designer', async () => {
    const designer = await signedIn(browser, 'designer@demo.test');
    const row = await findPart(designer.page, declined.part.mpn);
    await row.getByRole('button', { name: `Ask for qualification of ${declined.part.mpn}` }).click();
    const ask = designer.page.getByRole('dialog');
    await ask.getByRole('textbox', { name: 'For house part' }).fill(declined.housePart.partNumber);
    await designer.page.getByRole('option', { name: new RegExp(`^${declined.housePart.partNumber}`) }).click();
    await ask.getByRole('textbox', { name: /What it is for/ }).fill('Display board shunt regulator: a second source for the next build.');
    await ask.getByRole('button', { name: 'Send the request' }).click();
    await ask.waitFor({ state: 'hidden' });

    const engineer = await signedIn(browser, 'reviewer@demo.test');
    const panel = engineer.page.getByRole('region', { name: 'Asked for qualification' });
    const pending = panel.getByRole('row', { name: new RegExp(`^Request #\\d+: ${declined.part.mpn}$`) });
    await pending.waitFor();
    expect(await pending.innerText()).toContain(declined.housePart.partNumber);
    const requestId = Number((await pending.getAttribute('aria-label'))!.match(/#(\d+)/)![1]);
    await pending.getByRole('button', { name: `Decline request #${requestId}` }).click();
    const dialog = engineer.page.getByRole('dialog', { name: `Decline request #${requestId}` });
    await dialog
      .getByRole('textbox', { name: /Reply to Lena Okafor/ })
      .fill(`The vendor has announced the end of life of this series; ask for an approved part of ${declined.housePart.partNumber} instead.`);
    await shot(engineer.page, 'qualification-request-8-decline-dialog');
    await dialog.getByRole('button', { name: 'Decline the request' }).click();
    await dialog.waitFor({ state: 'hidden' });
    await expect.poll(() => pending.count()).toBe(0);
    expect(engineer.errors).toEqual([]);
    await engineer.done();

    await designer.page.reload();
    const mine = designer.page.getByRole('region', { name: 'My qualification requests' });
    const request = mine.getByRole('row', { name: `Request #${requestId}: ${declined.part.mpn}` });
    await expect.poll(() => request.innerText()).toContain('Declined');
    expect(await request.innerText()).toContain('Tomas Eklund: The vendor has announced the end of life of this series');
    await shot(designer.page, 'qualification-request-9-my-requests-declined');
    expect(designer.errors).toEqual([]);
    await designer.done();

    // the outbox captured what the designer was sent
    const admin = await signedIn(browser, 'admin@demo.test');
    await admin.page.getByRole('navigation').getByRole('link', { name: 'Outbox', exact: true }).click();
    const takenUp = admin.page.getByRole('article', {
      name: new RegExp(`^Your request #\\d+ was taken up: case #${caseId} \\(${asked.part.mpn} for ${asked.housePart.partNumber}\\)$`),
    });
    const refused = admin.page.getByRole('article', {
      name: `Your request #${requestId} was declined: ${declined.part.manufacturer} ${declined.part.mpn} for ${declined.housePart.partNumber}`,
    });
    await expect
      .poll(
        async () => {
          await admin.page.getByRole('button', { name: 'Refresh' }).click();
          await refused
            .first()
            .waitFor({ timeout: 2_000 })
            .catch(() => undefined);
          return (await takenUp.count()) + (await refused.count());
        },
        { timeout: 30_000 },
      )
      .toBe(2);
    expect(await takenUp.innerText()).toContain('designer@demo.test');
    expect(await takenUp.innerText()).toContain(`/qualifications/${caseId}`);
    expect(await refused.innerText()).toContain('Reply: The vendor has announced the end of life');
    await refused.scrollIntoViewIfNeeded();
    await screenshot(admin.page, 'qualification-request-10-outbox');
    expect(admin.errors).toEqual([]);
    await admin.done();
  });
});
