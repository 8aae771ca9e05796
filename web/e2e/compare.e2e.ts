import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BASE_URL, DEMO_PASSWORD, launchBrowser, newContext, screenshot, seriousAxeViolations, signIn, watchErrors } from './support/browser';

interface CompareAnswer {
  housePart: { id: number; partNumber: string };
  sources: Array<{
    vendorPart: { mpn: string };
    evaluation: { checks: Array<{ id: string; limit: number | null }> } | null;
    powerLimit: { allowed: number | null } | null;
  }>;
}

async function bearer(): Promise<string> {
  const response = await fetch(`${BASE_URL}/api/auth/login`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json' },
    body: JSON.stringify({ email: 'engineer@demo.test', password: DEMO_PASSWORD }),
  });
  if (!response.ok) throw new Error(`sign-in failed: ${response.status}`);
  return ((await response.json()) as { accessToken: string }).accessToken;
}

async function get<T>(path: string, token: string): Promise<T> {
  const response = await fetch(`${BASE_URL}/api${path}`, { headers: { Authorization: `Bearer ${token}` } });
  if (!response.ok) throw new Error(`GET ${path}: ${response.status}`);
  return (await response.json()) as T;
}

/** A demo house part whose evaluated sources are held to different dissipation limits (read only: nothing is changed). */
async function findPart(): Promise<CompareAnswer> {
  const token = await bearer();
  const board = await get<{ items: Array<{ housePart: { id: number; specVersion: number | null } }> }>('/qualification-views/board?pageSize=200', token);
  for (const row of board.items) {
    if (row.housePart.specVersion === null) continue;
    const answer = await get<CompareAnswer>(`/qualification-views/compare/${row.housePart.id}`, token);
    const limits = new Set(
      answer.sources
        .map((s) => s.powerLimit?.allowed)
        .filter((x): x is number => typeof x === 'number')
        .map((x) => x.toPrecision(3)),
    );
    if (limits.size >= 2) return answer;
  }
  throw new Error('no demo house part has two sources with different derated dissipation limits');
}

describe('Compare in Chromium: each part its own dissipation limit, tolerance bands, the linear I–V', () => {
  let browser: Browser;
  let close: () => Promise<void>;
  let part: CompareAnswer;

  beforeAll(async () => {
    ({ browser, close } = await launchBrowser());
    part = await findPart();
  });
  afterAll(async () => close?.());

  async function openCompare(width: number): Promise<{ page: Page; errors: string[] }> {
    const page = await (await newContext(browser)).newPage();
    await page.setViewportSize({ width, height: 900 });
    const errors = watchErrors(page);
    await signIn(page, 'engineer@demo.test');
    await page.goto(`/compare/${part.housePart.id}`);
    await page.getByRole('table', { name: 'Checks by source' }).waitFor();
    await page.locator('[data-testid="iv-chart"] .recharts-line').first().waitFor();
    return { page, errors };
  }

  for (const width of [1440, 1024]) {
    it(`shows every part's derated limit in its own column and both views of the curves at ${width} px`, async () => {
      const { page, errors } = await openCompare(width);
      const row = page.locator('tr[data-check="power-dissipation"]');
      await expect.poll(() => row.locator('td').nth(1).textContent()).toContain("each part's own");
      const own = await row.getByTestId('own-limit-power-dissipation').allTextContents();
      expect(own.length).toBeGreaterThanOrEqual(2);
      for (const text of own) expect(text).toMatch(/^limit ≤ [\d.]+ mW: \d+(\.\d+)? % of [\d.]+ mW derated to [\d.]+ °C/);
      expect(new Set(own.map((t) => t.split(':')[0])).size).toBeGreaterThanOrEqual(2);
      const chart = page.getByTestId('iv-chart');
      const lines = await chart.locator('.recharts-line').count();

      await page.locator('label', { hasText: 'Tolerance bands' }).click();
      expect(await page.getByRole('switch', { name: 'Tolerance bands' }).isChecked()).toBe(true);
      await expect.poll(() => chart.locator('.recharts-area').count()).toBe(lines);
      expect(await chart.locator('.recharts-line').count()).toBe(lines);
      await page.getByRole('region', { name: 'Breakdown curves' }).scrollIntoViewIfNeeded();
      await screenshot(page, `compare-1-log-bands-${width}`);
      expect(await seriousAxeViolations(page)).toEqual([]);

      await page.getByRole('radiogroup', { name: 'Current axis' }).getByText('Linear I–V (mA)').click();
      await expect.poll(() => chart.getAttribute('data-scale')).toBe('linear');
      const yTicks = await chart.locator('.recharts-yAxis .recharts-cartesian-axis-tick-value').allTextContents();
      expect(yTicks[0]).toBe('0');
      expect(yTicks.slice(1).every((t) => / mA$/.test(t))).toBe(true);
      expect((await chart.locator('.recharts-xAxis .recharts-cartesian-axis-tick-value').allTextContents()).every((t) => / m?V$/.test(t))).toBe(true);
      await screenshot(page, `compare-2-linear-${width}`);
      expect(await seriousAxeViolations(page)).toEqual([]);
      expect(errors).toEqual([]);
      await page.context().close();
    });
  }

  it('warns on a Zener voltage typed a prefix off in the spec form, and says what "Use at most" stores', async () => {
    const page = await (await newContext(browser)).newPage();
    const errors = watchErrors(page);
    await signIn(page, 'engineer@demo.test');
    await page.goto(`/house-parts/${part.housePart.id}`);
    const form = page.getByRole('form', { name: `Spec of ${part.housePart.partNumber}` });
    const vzMax = form.getByLabel(/^VZ max/);
    await vzMax.fill('5.4 kV');
    await expect
      .poll(() => form.locator('[data-warning]').first().textContent())
      .toMatch(/5.40 kV is outside the usual range of regulator diodes \(1.80 V … 400 V\): did you mean 5.40 V\?/);
    const share = form.getByLabel('Use at most');
    await share.fill('0.5');
    await share.blur();
    await expect.poll(() => form.getByTestId('derating-reading').textContent()).toMatch(/stores 0.5 % of the derated rating .*that is 50 %\?/);
    await form.locator('[data-warning]').first().scrollIntoViewIfNeeded();
    await screenshot(page, 'compare-3-spec-warnings-1440');
    expect(await seriousAxeViolations(page)).toEqual([]);
    expect(errors).toEqual([]);
    await page.context().close();
  });
});
