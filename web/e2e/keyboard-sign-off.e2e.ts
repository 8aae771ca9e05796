import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BASE_URL, DEMO_PASSWORD, launchBrowser, newContext, screenshot, watchErrors } from './support/browser';
import { axeClean, focused, keyboardSignIn, settled, skipToMain, tabTo } from './support/keyboard';

/**
 * The sign-off (two-engineer clearance) by keyboard alone: Tab, Shift+Tab, Enter, Space and
 * typing; no mouse click anywhere. Each stop checks that focus is visible and lands where a
 * keyboard user expects it (into a dialog when it opens, back to the page when it closes),
 * and the skip link takes focus past the navigation. axe runs on every screen.
 */

async function token(email: string): Promise<string> {
  const response = await fetch(`${BASE_URL}/api/auth/login`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json' },
    body: JSON.stringify({ email, password: DEMO_PASSWORD }),
  });
  if (!response.ok) throw new Error(`sign-in of ${email} failed: ${response.status}`);
  return ((await response.json()) as { accessToken: string }).accessToken;
}

async function api<T>(method: string, path: string, bearer: string, body?: unknown): Promise<T> {
  const response = await fetch(`${BASE_URL}/api${path}`, {
    method,
    headers: { Authorization: `Bearer ${bearer}`, ...(body ? { 'Content-Type': 'application/json' } : {}) },
    body: body ? JSON.stringify(body) : undefined,
  });
  if (!response.ok) throw new Error(`${method} ${path}: ${response.status} ${await response.text()}`);
  return (await response.json()) as T;
}

/** A draft case for a demo alternate without a case that evaluates as a pass (opened through the API: the journey is the sign-off). */
async function openDraftCase(): Promise<{ id: number; mpn: string }> {
  const bearer = await token('engineer@demo.test');
  const board = await api<{ items: Array<{ housePart: { id: number; specVersion: number | null }; sources: Array<{ role: string; state: string }> }> }>(
    'GET',
    '/qualification-views/board?pageSize=200&state=none',
    bearer,
  );
  for (const row of board.items) {
    if (row.housePart.specVersion === null || !row.sources.some((s) => s.role === 'alternate' && s.state === 'none')) continue;
    const compare = await api<{
      sources: Array<{ role: string; latestCase: unknown; evaluation: { overall: string } | null; vendorPart: { id: number; mpn: string } }>;
    }>('GET', `/qualification-views/compare/${row.housePart.id}`, bearer);
    const source = compare.sources.find((s) => s.role === 'alternate' && s.latestCase === null && s.evaluation?.overall === 'pass');
    if (!source) continue;
    const opened = await api<{ id: number }>('POST', '/qualifications', bearer, {
      housePartId: row.housePart.id,
      vendorPartId: source.vendorPart.id,
      summary: 'Second source, prepared for a keyboard-only sign-off.',
    });
    return { id: opened.id, mpn: source.vendorPart.mpn };
  }
  throw new Error('the demo catalogue has no alternate left without a case that evaluates as a pass: start from a fresh demo seed');
}

function signOffState(page: Page) {
  return page.getByRole('region', { name: 'Sign-off' }).locator('[data-state]').first();
}

describe('sign-off by keyboard alone: engineer A sends the case for review, engineer B clears it', () => {
  let browser: Browser;
  let close: () => Promise<void>;
  let target: { id: number; mpn: string };

  beforeAll(async () => {
    ({ browser, close } = await launchBrowser());
    target = await openDraftCase();
  });
  afterAll(async () => close?.());

  it('engineer A: skip link, then Send for review through its dialog, by keyboard', async () => {
    const page = await (await newContext(browser)).newPage();
    const errors = watchErrors(page);
    await keyboardSignIn(page, 'engineer@demo.test');
    await page.goto(`/qualifications/${target.id}`);
    await expect.poll(() => signOffState(page).getAttribute('data-state')).toBe('draft');
    await page.getByRole('table', { name: 'Checks' }).waitFor();
    await axeClean(page);
    await skipToMain(page);

    await tabTo(page, /^Send for review$/);
    await screenshot(page, 'keyboard-sign-off-1-focus-on-send');
    await page.keyboard.press('Enter');
    const dialog = page.getByRole('dialog');
    await dialog.waitFor();
    // Focus moved into the dialog.
    await expect.poll(async () => (await focused(page)).inDialog).toBe(true);
    await settled(page);
    await axeClean(page);
    if (!/Note for the reviewer/.test((await focused(page)).name)) await tabTo(page, /Note for the reviewer/);
    await page.keyboard.type('Every check passes; please review.');
    await screenshot(page, 'keyboard-sign-off-2-send-dialog');
    await tabTo(page, /^Send for review$/);
    expect((await focused(page)).inDialog).toBe(true);
    await page.keyboard.press('Enter');
    await expect.poll(() => signOffState(page).getAttribute('data-state')).toBe('in-review');
    await dialog.waitFor({ state: 'hidden' });
    // Focus came back to the page, not lost on the body.
    await expect.poll(async () => (await focused(page)).tag).not.toBe('body');
    const after = await focused(page);
    expect(after.inDialog).toBe(false);
    await screenshot(page, 'keyboard-sign-off-3-in-review');
    await axeClean(page);
    expect(errors).toEqual([]);
  });

  it('engineer B: Shift+Tab and Space, a dialog closed by Escape returns focus; then Clear by keyboard', async () => {
    const page = await (await newContext(browser)).newPage();
    const errors = watchErrors(page);
    await keyboardSignIn(page, 'reviewer@demo.test');
    await page.goto(`/qualifications/${target.id}`);
    const actions = page.getByRole('group', { name: 'Actions on this case' });
    await expect.poll(() => actions.getByRole('button').allTextContents()).toContain('Clear');
    // No Withdraw for the reviewer: that is the preparer's.
    expect(await actions.getByRole('button').allTextContents()).not.toContain('Withdraw');
    await skipToMain(page);

    await tabTo(page, /^Send back to draft$/);
    await tabTo(page, /^Clear$/, { back: true });
    // Space opens it; Escape closes it and focus returns to the button that opened it.
    await page.keyboard.press('Space');
    const dialog = page.getByRole('dialog');
    await dialog.waitFor();
    await expect.poll(async () => (await focused(page)).inDialog).toBe(true);
    await page.keyboard.press('Escape');
    await dialog.waitFor({ state: 'hidden' });
    await expect.poll(async () => (await focused(page)).name).toBe('Clear');

    await page.keyboard.press('Enter');
    await dialog.waitFor();
    await expect.poll(async () => (await focused(page)).inDialog).toBe(true);
    if (!/^Note/.test((await focused(page)).name)) await tabTo(page, /^Note/);
    await page.keyboard.type('Equivalent on every check; cleared by keyboard.');
    await settled(page);
    await axeClean(page);
    await screenshot(page, 'keyboard-sign-off-4-clear-dialog');
    await tabTo(page, /^Clear$/);
    expect((await focused(page)).inDialog).toBe(true);
    await page.keyboard.press('Enter');
    await expect.poll(() => signOffState(page).getAttribute('data-state')).toBe('cleared');
    await dialog.waitFor({ state: 'hidden' });
    await expect.poll(async () => (await focused(page)).tag).not.toBe('body');
    await screenshot(page, 'keyboard-sign-off-5-cleared');
    await axeClean(page);
    expect(errors).toEqual([]);
  });
});
