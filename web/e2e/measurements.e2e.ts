import { readFileSync, writeFileSync, mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BASE_URL, DEMO_PASSWORD, launchBrowser, newContext, screenshot, signIn, watchErrors } from './support/browser';

// The invented bench file of the demo part QHZ5V1AF (test-fixtures/measurements): the demo seed
// stored it; a sample appended by this run gives new bytes, so it is stored as a new set.
const FIXTURE = join(new URL('.', import.meta.url).pathname, '..', '..', 'test-fixtures', 'measurements', 'qhz5v1af-lot-l2351.csv');
const POLL = { timeout: 15_000 };

async function vendorPartId(mpn: string): Promise<number> {
  const login = await fetch(`${BASE_URL}/api/auth/login`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json' },
    body: JSON.stringify({ email: 'engineer@demo.test', password: DEMO_PASSWORD }),
  });
  const { accessToken } = (await login.json()) as { accessToken: string };
  const list = await fetch(`${BASE_URL}/api/vendor-parts?mpn=${encodeURIComponent(mpn)}`, { headers: { Authorization: `Bearer ${accessToken}` } });
  const body = (await list.json()) as { items: Array<{ id: number; mpn: string }> };
  return body.items.find((p) => p.mpn === mpn)!.id;
}

/** The demo file with one more sample (S99, inside the window) whose points are the first sample's, lowered by 0.2 V. */
function freshFile(): string {
  const text = readFileSync(FIXTURE, 'utf8').trimEnd();
  const first = text
    .split('\n')
    .filter((l) => l.startsWith('S01,'))
    .map((l) => {
      const [, lot, current, voltage, temp] = l.split(',');
      return `S99,${lot},${current},${(Number(voltage) - 0.2).toFixed(4)},${temp}`;
    });
  const dir = mkdtempSync(join(tmpdir(), 'measure-'));
  const path = join(dir, `qhz5v1af-recheck-${Date.now()}.csv`);
  writeFileSync(path, `${text}\n${first.join('\n')}\n`);
  return path;
}

describe('measured samples journey in Chromium', () => {
  let browser: Browser;
  let close: () => Promise<void>;
  let context: BrowserContext;
  let page: Page;
  let errors: string[];

  beforeAll(async () => {
    ({ browser, close } = await launchBrowser());
    context = await newContext(browser);
    page = await context.newPage();
    errors = watchErrors(page);
    await signIn(page, 'engineer@demo.test');
  });
  afterAll(async () => {
    await context?.close();
    await close?.();
  });

  it('shows the demo lot of QHZ5V1AF drifting past its datasheet window, then takes a new file through preview to a stored set', async () => {
    const id = await vendorPartId('QHZ5V1AF');
    await page.goto(`/vendor-parts/${id}`);
    const section = page.getByRole('region', { name: 'Measured samples' });
    const seeded = section.getByRole('article', { name: 'Measurement set qhz5v1af-lot-l2351.csv' });
    await expect.poll(() => seeded.count(), POLL).toBe(1);
    await expect.poll(() => seeded.getByText(/outside: S\d\d/).count(), POLL).toBeGreaterThan(0);
    await expect.poll(() => seeded.getByRole('img', { name: /Measured points of 6 sample/ }).count(), POLL).toBe(1);
    await seeded.scrollIntoViewIfNeeded();
    await screenshot(page, 'measurements-seeded-lot');

    const chooser = page.waitForEvent('filechooser');
    await section.getByRole('button', { name: 'Choose a measurement CSV' }).click();
    await (await chooser).setFiles(freshFile());
    await expect.poll(() => section.getByText(/7 sample\(s\), \d+ point\(s\) read\./).count(), POLL).toBe(1);
    await section.getByLabel('Lot or date code').fill('L2351');
    await section.getByLabel('Instrument').fill('source-measure unit SMU-1');
    await section.getByRole('button', { name: 'Store measurements' }).click();
    await expect.poll(() => section.getByRole('article', { name: /Measurement set qhz5v1af-recheck-/ }).count(), POLL).toBe(1);
    const stored = section.getByRole('article', { name: /Measurement set qhz5v1af-recheck-/ });
    await expect.poll(() => stored.getByText('source-measure unit SMU-1', { exact: false }).count(), POLL).toBeGreaterThan(0);
    await stored.scrollIntoViewIfNeeded();
    await screenshot(page, 'measurements-stored-set');
    expect(errors).toEqual([]);
  });
});
