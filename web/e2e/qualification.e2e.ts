import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BASE_URL, DEMO_PASSWORD, launchBrowser, newContext, screenshot, signIn, watchErrors } from './support/browser';

interface Target {
  housePartId: number;
  partNumber: string;
  vendorPartId: number;
  manufacturer: string;
  mpn: string;
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
 * An alternate of the demo catalogue that has no case yet and evaluates as a pass, so a
 * second engineer can clear it plainly. Chosen through the API so the journey also runs
 * again on a stack where an earlier run used the first such source.
 */
async function findTarget(): Promise<Target> {
  const bearer = await token('engineer@demo.test');
  const board = await get<{
    items: Array<{
      housePart: { id: number; partNumber: string; specVersion: number | null };
      sources: Array<{ role: string; state: string; vendorPart: { id: number } }>;
    }>;
  }>('/qualification-views/board?pageSize=200&state=none', bearer);
  for (const row of board.items) {
    if (row.housePart.specVersion === null || !row.sources.some((s) => s.role === 'alternate' && s.state === 'none')) continue;
    const compare = await get<{
      sources: Array<{
        role: string;
        latestCase: unknown;
        evaluation: { overall: string } | null;
        vendorPart: { id: number; manufacturer: string; mpn: string };
      }>;
    }>(`/qualification-views/compare/${row.housePart.id}`, bearer);
    const source = compare.sources.find((s) => s.role === 'alternate' && s.latestCase === null && s.evaluation?.overall === 'pass');
    if (source)
      return {
        housePartId: row.housePart.id,
        partNumber: row.housePart.partNumber,
        vendorPartId: source.vendorPart.id,
        manufacturer: source.vendorPart.manufacturer,
        mpn: source.vendorPart.mpn,
      };
  }
  throw new Error('the demo catalogue has no alternate left without a case that evaluates as a pass: start from a fresh demo seed');
}

async function signedIn(browser: Browser, email: string): Promise<{ page: Page; errors: string[] }> {
  const page = await (await newContext(browser)).newPage();
  const errors = watchErrors(page);
  await signIn(page, email);
  return { page, errors };
}

/** The state badge of the case page's sign-off panel. */
function signOffState(page: Page) {
  return page.getByRole('region', { name: 'Sign-off' }).locator('[data-state]').first();
}

describe('qualification in Chromium: engineer A prepares, engineer B clears, the buyer sees it and is mailed', () => {
  let browser: Browser;
  let close: () => Promise<void>;
  let target: Target;
  let caseUrl = '';

  beforeAll(async () => {
    ({ browser, close } = await launchBrowser());
    target = await findTarget();
  });
  afterAll(async () => close?.());

  it('the Board and Compare screens load with the demo data', async () => {
    const { page, errors } = await signedIn(browser, 'engineer@demo.test');
    await page.waitForURL(/\/board/);
    const board = page.getByRole('table', { name: 'Board' });
    await board.waitFor();
    // The demo seed has a case in every state: each tally is at least one.
    for (const state of ['Draft', 'In review', 'Cleared', 'Cleared with conditions', 'Rejected', 'Withdrawn', 'Revoked']) {
      const tally = page.getByRole('button', { name: new RegExp(`^${state}: \\d+$`) });
      expect(Number((await tally.getAttribute('aria-label'))!.split(': ')[1])).toBeGreaterThan(0);
    }
    expect(await board.locator('[data-state="cleared-with-conditions"]').count()).toBeGreaterThan(0);
    await screenshot(page, 'qualification-1-board');

    await page.getByRole('button', { name: /^In review: / }).click();
    await expect
      .poll(() => board.locator('tbody [data-state]').evaluateAll((els) => [...new Set(els.map((e) => e.getAttribute('data-state')))]))
      .toEqual(['in-review']);
    await screenshot(page, 'qualification-2-board-in-review');

    await page.goto(`/compare/${target.housePartId}`);
    await page.getByRole('table', { name: 'Checks by source' }).waitFor();
    await page.locator('[data-testid="iv-chart"] .recharts-line').first().waitFor();
    expect(await page.locator('[data-testid="iv-chart"] .recharts-line').count()).toBeGreaterThan(2);
    expect(await page.getByTestId(`window-${target.mpn}`).textContent()).toMatch(/V … .*V/);
    await screenshot(page, 'qualification-3-compare');
    expect(errors).toEqual([]);
  });

  it('engineer A opens a case for an alternate from the Board and sends it for review, and cannot clear it', async () => {
    const { page, errors } = await signedIn(browser, 'engineer@demo.test');
    await page.getByRole('textbox', { name: 'House part' }).fill(target.partNumber);
    const open = page.getByRole('button', { name: `Open a case: ${target.mpn} for ${target.partNumber}` });
    await open.click();
    const dialog = page.getByRole('dialog', { name: `Qualify ${target.mpn} for ${target.partNumber}` });
    await dialog.getByLabel('Notes').fill('Second source for the analogue front end; purchasing asked for a quote.');
    await screenshot(page, 'qualification-4-open-case');
    await dialog.getByRole('button', { name: 'Open the case' }).click();
    await page.waitForURL(/\/qualifications\/\d+$/);
    await dialog.waitFor({ state: 'hidden' });
    caseUrl = new URL(page.url()).pathname;
    await expect.poll(() => signOffState(page).getAttribute('data-state')).toBe('draft');
    await page.getByRole('table', { name: 'Checks' }).waitFor();
    await screenshot(page, 'qualification-5-draft');

    await page.getByRole('group', { name: 'Actions on this case' }).getByRole('button', { name: 'Send for review' }).click();
    const submit = page.getByRole('dialog');
    await submit.getByLabel('Note for the reviewer').fill('Every check passes; please review.');
    await submit.getByRole('button', { name: 'Send for review' }).click();
    await expect.poll(() => signOffState(page).getAttribute('data-state')).toBe('in-review');
    await submit.waitFor({ state: 'hidden' });
    // The two-person rule, said before anyone tries: no decision button for the preparer.
    const actions = page.getByRole('group', { name: 'Actions on this case' });
    expect(await actions.getByRole('button').allTextContents()).toEqual(['Send back to draft', 'Withdraw']);
    expect(await page.getByText(/You prepared this case, so another engineer must decide it/).count()).toBe(1);
    await screenshot(page, 'qualification-6-in-review-preparer');

    // The server refuses the preparer's own clearance too, in plain words.
    const bearer = await token('engineer@demo.test');
    const id = Number(caseUrl.split('/').pop());
    const seen = (await (await fetch(`${BASE_URL}/api/qualifications/${id}`, { headers: { Authorization: `Bearer ${bearer}` } })).json()) as {
      version: number;
    };
    const refused = await fetch(`${BASE_URL}/api/qualifications/${id}/clear`, {
      method: 'POST',
      headers: { Authorization: `Bearer ${bearer}`, 'Content-Type': 'application/json' },
      body: JSON.stringify({ version: seen.version }),
    });
    expect(refused.status).toBe(403);
    expect(((await refused.json()) as { message: string }).message).toMatch(/another engineer must decide it/);
    expect(errors).toEqual([]);
  });

  it('engineer B finds the case in review and clears it', async () => {
    const { page, errors } = await signedIn(browser, 'reviewer@demo.test');
    await page.getByRole('navigation').getByRole('link', { name: 'Qualifications', exact: true }).click();
    await page.getByRole('link', { name: `#${caseUrl.split('/').pop()}`, exact: true }).click();
    await page.waitForURL(new RegExp(`${caseUrl}$`));
    const actions = page.getByRole('group', { name: 'Actions on this case' });
    await expect
      .poll(() => actions.getByRole('button').allTextContents())
      .toEqual(['Approve as approved source', 'Clear', 'Clear with conditions', 'Reject', 'Send back to draft']);
    await screenshot(page, 'qualification-7-in-review-reviewer');

    await actions.getByRole('button', { name: 'Clear', exact: true }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByLabel('Note').fill('Equivalent on every check; margins compared on the Compare screen.');
    await screenshot(page, 'qualification-8-clear-dialog');
    await dialog.getByRole('button', { name: 'Clear', exact: true }).click();
    await expect.poll(() => signOffState(page).getAttribute('data-state')).toBe('cleared');
    await dialog.waitFor({ state: 'hidden' });
    const panel = page.getByRole('region', { name: 'Sign-off' });
    expect(await panel.textContent()).toMatch(/Decided byTomas Eklund/);
    const trail = page.getByRole('region', { name: 'Audit trail' });
    expect(await trail.textContent()).toMatch(/Opened.*Sent for review.*Cleared/s);
    await screenshot(page, 'qualification-9-cleared');
    expect(errors).toEqual([]);
  });

  it('the buyer sees the cleared source on Sources', async () => {
    const { page, errors } = await signedIn(browser, 'buyer@demo.test');
    await page.waitForURL(/\/sources/);
    await page.getByRole('textbox', { name: 'House part' }).fill(target.partNumber);
    const row = page.locator(`tr[data-source="${target.partNumber}/${target.mpn}"]`);
    // The filter is the server's: wait until only that house part's sources are listed.
    await expect
      .poll(() => page.locator('tr[data-source]').evaluateAll((rows) => [...new Set(rows.map((r) => r.getAttribute('data-source')!.split('/')[0]))]))
      .toEqual([target.partNumber]);
    expect(await row.locator('[data-state]').getAttribute('data-state')).toBe('cleared');
    expect(await row.textContent()).toContain('Tomas Eklund');
    // A plain clearance carries no conditions: its note stays on the case, not in the Conditions column.
    expect(await row.textContent()).not.toContain('Equivalent on every check');
    await screenshot(page, 'qualification-10-sources-buyer');

    // The mail's link opens Sources on that house part alone.
    await page.goto(`/sources?housePartId=${target.housePartId}`);
    await expect
      .poll(() => page.locator('tr[data-source]').evaluateAll((rows) => [...new Set(rows.map((r) => r.getAttribute('data-source')!.split('/')[0]))]))
      .toEqual([target.partNumber]);
    expect(errors).toEqual([]);
  });

  it("the admin sees the buyer's mail about it in the Outbox", async () => {
    const { page, errors } = await signedIn(browser, 'admin@demo.test');
    await page.getByRole('navigation').getByRole('link', { name: 'Outbox', exact: true }).click();
    const mail = page.getByRole('article', { name: `${target.partNumber}: ${target.manufacturer} ${target.mpn} cleared` });
    // Mail leaves the outbox after the decision commits; refresh until the fake has it.
    await expect
      .poll(
        async () => {
          await page.getByRole('button', { name: 'Refresh' }).click();
          await mail
            .first()
            .waitFor({ timeout: 2_000 })
            .catch(() => undefined);
          return mail.count();
        },
        { timeout: 30_000 },
      )
      .toBe(1);
    expect(await mail.textContent()).toContain('buyer@demo.test');
    expect(await mail.textContent()).toContain(caseUrl);
    expect(await mail.textContent()).toContain(`/sources?housePartId=${target.housePartId}`);
    await mail.scrollIntoViewIfNeeded();
    await screenshot(page, 'qualification-11-outbox');
    expect(errors).toEqual([]);
  });
});
