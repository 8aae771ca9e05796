import { readFileSync } from 'node:fs';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BASE_URL, DEMO_PASSWORD, launchBrowser, newContext, screenshot, signIn, watchErrors } from './support/browser';

// A 5.1 V part whose dynamic impedance (40 Ω at 5 mA) is above the spec's 30 Ω: the one failing
// check a waiver can accept. Invented values of the usual size (common practice, no source).
const run = Date.now().toString(36).toUpperCase();
const entered = { source: 'entered' as const };
const v = (value: number, printed: string) => ({ value, printed, provenance: entered });
const CARD = {
  vzMin: v(4.85, '4.85 V'),
  vzNom: v(5.1, '5.1 V'),
  vzMax: v(5.36, '5.36 V'),
  izt: v(5e-3, '5 mA'),
  zzt: v(40, '40 Ω'),
  izk: v(0.25e-3, '0.25 mA'),
  zzk: v(500, '500 Ω'),
  irMax: v(1e-6, '1 µA'),
  vr: v(2, '2 V'),
  tc: { value: 0.3, unit: 'mV/K', printed: '+0.3 mV/K', provenance: entered },
  pdMax: v(0.5, '500 mW'),
  pdRefC: v(25, '25 °C'),
  tjMax: v(150, '150 °C'),
  rthJA: v(250, '250 K/W'),
};
const SPEC = {
  iRef: 5e-3,
  vz: { min: 4.4, nom: 5.1, max: 5.8 },
  zdMax: 30,
  knee: { iKnee: 0.25e-3, maxRatio: 20, maxSpan: null },
  leakage: { irMax: 2e-6, vr: 2 },
  tc: { min: -1e-3, max: 3e-3 },
  power: { pdMin: 0.3, deratingFraction: 0.5 },
  packages: ['SOD-123'],
  envelope: { iMin: 1e-3, iMax: 20e-3, taMin: -40, taMax: 85 },
  outputWindow: null,
  marginalBandPercent: 5,
};

async function api<T>(token: string | null, method: string, path: string, body?: unknown): Promise<T> {
  const res = await fetch(`${BASE_URL}/api${path}`, {
    method,
    headers: { 'Content-Type': 'application/json', ...(token ? { Authorization: `Bearer ${token}` } : {}) },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  const json = (await res.json().catch(() => null)) as T;
  if (!res.ok) throw new Error(`${method} ${path} → ${res.status} ${JSON.stringify(json)}`);
  return json;
}
const tokenOf = async (email: string) => (await api<{ accessToken: string }>(null, 'POST', '/auth/login', { email, password: DEMO_PASSWORD })).accessToken;

describe('a waiver approved by a second engineer, and the decision record, in Chromium', () => {
  let browser: Browser;
  let close: () => Promise<void>;
  let contexts: BrowserContext[] = [];
  let caseId = 0;

  async function pageFor(email: string): Promise<{ page: Page; errors: string[] }> {
    const context = await newContext(browser);
    contexts.push(context);
    const page = await context.newPage();
    const errors = watchErrors(page);
    await signIn(page, email);
    return { page, errors };
  }

  beforeAll(async () => {
    ({ browser, close } = await launchBrowser());
    // The case is set up through the API: a house part and spec, a part with its card, a case sent for review.
    const engineer = await tokenOf('engineer@demo.test');
    const reviewer = await api<{ id: number }>(await tokenOf('reviewer@demo.test'), 'GET', '/auth/me');
    const hp = await api<{ id: number }>(engineer, 'POST', '/house-parts', { partNumber: `HPW-${run}`, description: 'Regulator diode, waiver journey' });
    await api(engineer, 'PUT', `/house-parts/${hp.id}/spec`, { baseVersion: 0, spec: SPEC });
    const vp = await api<{ id: number }>(engineer, 'POST', '/vendor-parts', { manufacturer: 'Fennick Semiconductor', mpn: `FZW-${run}`, package: 'SOD-123' });
    await api(engineer, 'PUT', `/vendor-parts/${vp.id}/rating-card`, { version: 0, fields: CARD });
    const opened = await api<{ id: number; version: number }>(engineer, 'POST', '/qualifications', { housePartId: hp.id, vendorPartId: vp.id });
    await api(engineer, 'POST', `/qualifications/${opened.id}/submit`, { version: opened.version, reviewerId: reviewer.id });
    caseId = opened.id;
  });
  afterAll(async () => {
    for (const c of contexts) await c.close();
    contexts = [];
    await close?.();
  });

  it('the preparer proposes a waiver for the failing check; the second engineer approves it, clears the case on it and downloads the record', async () => {
    const preparer = await pageFor('engineer@demo.test');
    await preparer.page.goto(`/qualifications/${caseId}`);
    const form = preparer.page.getByRole('form', { name: 'Prepare a waiver' });
    await form.getByRole('textbox', { name: 'Check' }).click();
    await preparer.page.getByRole('option', { name: /Dynamic impedance at the reference current \(fail\)/ }).click();
    await form.getByLabel('Accepted limit').fill('45 Ω');
    await form.getByLabel('Reason').fill('The filter after the regulator absorbs the extra ripple; checked on the bench board.');
    const expiry = new Date(Date.now() + 180 * 86_400_000).toISOString().slice(0, 10);
    await form.getByLabel('Expires on').fill(expiry);
    await form.getByRole('button', { name: 'Prepare waiver' }).click();
    const waivers = preparer.page.getByRole('region', { name: 'Waivers' });
    await expect.poll(() => waivers.getByText(/another engineer must approve it/).count()).toBe(1);
    expect(await waivers.getByRole('button', { name: 'Approve waiver' }).count()).toBe(0);
    await screenshot(preparer.page, 'waiver-1-prepared');
    expect(preparer.errors).toEqual([]);

    const reviewer = await pageFor('reviewer@demo.test');
    await reviewer.page.goto(`/qualifications/${caseId}`);
    const panel = reviewer.page.getByRole('region', { name: 'Waivers' });
    await panel.getByRole('button', { name: 'Approve waiver' }).click();
    await expect.poll(() => panel.getByText(/approved by Tomas Eklund/).count()).toBe(1);
    const actions = reviewer.page.getByRole('group', { name: 'Actions on this case' });
    await actions.getByRole('button', { name: 'Clear with waiver' }).click();
    const dialog = reviewer.page.getByRole('dialog');
    if ((await dialog.getByLabel('Note').count()) > 0) await dialog.getByLabel('Note').fill('Cleared on the approved waiver of Zd, until its expiry.');
    await dialog.getByRole('button', { name: 'Clear with waiver' }).click();
    await dialog.waitFor({ state: 'hidden' });
    await expect.poll(() => reviewer.page.getByText('Cleared with waiver').count()).toBeGreaterThan(0);
    await screenshot(reviewer.page, 'waiver-2-cleared');

    const record = reviewer.page.getByRole('button', { name: `Decision record of case #${caseId} (PDF)` });
    await expect.poll(() => record.count()).toBe(1);
    const download = reviewer.page.waitForEvent('download');
    await record.click();
    const file = await (await download).path();
    const bytes = readFileSync(file!);
    expect(bytes.subarray(0, 5).toString()).toBe('%PDF-');
    expect(reviewer.errors).toEqual([]);
  });
});
