import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser, newContext, screenshot, signIn, watchErrors } from './support/browser';

/** A full-page picture from the top, so the fixed header sits where it belongs. */
async function shot(page: Page, name: string) {
  await page.evaluate(() => window.scrollTo(0, 0));
  await screenshot(page, name);
}

/** Types into a labelled field of the page (or of a part of it) and leaves it, as a person tabs on. */
async function fill(scope: Page | ReturnType<Page['locator']>, label: string, text: string) {
  const input = scope.getByRole('textbox', { name: label, exact: true });
  await input.fill(text);
  await input.blur();
}

describe('Find parts in Chromium (demo seed)', () => {
  let browser: Browser;
  let close: () => Promise<void>;
  beforeAll(async () => {
    ({ browser, close } = await launchBrowser());
  });
  afterAll(async () => close?.());

  it('the designer finds a cleared part by filters and text, checks it in a 12 V ± 10 %, 0–20 mA circuit, and compares it with the approved part', async () => {
    const context = await newContext(browser);
    const page = await context.newPage();
    const errors = watchErrors(page);
    await signIn(page, 'designer@demo.test');
    await page.waitForURL(/\/find/);
    const results = page.getByRole('table', { name: 'Search results' });
    await expect.poll(() => results.getByRole('row').count()).toBeGreaterThan(5);
    await shot(page, 'find-parts-start');

    // Filters: Zener voltage 5 … 6 V at the test current, package SOD-123; then text with a typo.
    await fill(page, 'VZ from', '5');
    await fill(page, 'VZ to', '6 V');
    await page.getByRole('textbox', { name: 'Package' }).click();
    await page.getByRole('option', { name: /^SOD-123 \(/ }).click();
    await page.keyboard.press('Escape');
    await expect.poll(() => page.url()).toContain('package=SOD-123');
    await expect.poll(() => results.getByRole('row', { name: 'QHZ5V6A' }).count()).toBe(1);
    await fill(page, 'Search', 'qhz5v6');
    await expect.poll(() => page.url()).toContain('q=qhz5v6');
    const row = results.getByRole('row', { name: 'QHZ5V6A' });
    await expect.poll(() => row.count()).toBe(1);
    // every row left is within the filters
    await expect.poll(async () => (await results.locator('tbody tr').count()) <= 3).toBe(true);
    const rowText = await row.innerText();
    expect(rowText).toContain('Cleared');
    expect(rowText).toContain('OHI-ZD-1056');
    expect(rowText).toMatch(/since \d{2} \w{3} \d{4}/);
    expect(rowText).toContain('5.60 V');
    await shot(page, 'find-parts-results');

    // The circuit check: 12 V ± 10 % supply, 0–20 mA load, −20 … 70 °C, E24 ±5 %.
    await row.getByRole('button', { name: /^Check QHZ5V6A/ }).click();
    const form = page.getByRole('form', { name: 'Circuit' });
    await fill(form, 'Nominal', '12 V');
    await form.getByRole('button', { name: 'Supply ±10 % around the nominal' }).click();
    expect(await form.getByRole('textbox', { name: 'Lowest', exact: true }).inputValue()).toBe('10.8 V');
    expect(await form.getByRole('textbox', { name: 'Highest', exact: true }).inputValue()).toBe('13.2 V');
    await fill(form, 'Smallest', '0');
    await fill(form, 'Largest', '20 mA');
    await form.getByRole('button', { name: 'Check circuit' }).click();

    const check = page.getByRole('region', { name: 'Circuit check of QHZ5V6A' });
    await check.waitFor();
    const verdict = await check.getByTestId('verdict-alert').innerText();
    expect(verdict).toContain('QHZ5V6A: Works at every corner');
    const chosen = await check.getByTestId('chosen-resistor').innerText();
    expect(chosen).toMatch(/^\d+(\.\d+)? Ω$/);
    // The chosen value lies inside the working range shown beside it.
    const [lo, hi] = (await check.getByTestId('resistor-range').innerText()).split('…').map((s) => Number.parseFloat(s));
    const r = Number.parseFloat(chosen);
    expect(r).toBeGreaterThanOrEqual(lo);
    expect(r).toBeLessThanOrEqual(hi);
    // R = (Vs − Vz)/(Iz + IL,max) = (12 − 5.6)/(5 mA + 20 mA) = 256 Ω at the nominal supply (common practice, no source).
    expect(await check.getByTestId('simple-resistor').innerText()).toBe('256 Ω');
    expect(await check.getByTestId('simple-finding').innerText()).toMatch(/above the largest working value/);
    expect(await check.getByTestId('diode-power').innerText()).toMatch(/mW of \d+ mW/);
    expect(await check.getByTestId('output-band').innerText()).toMatch(/V … .* V/);
    expect(await check.getByText(/Estimates — confirm before you rely on them/).count()).toBe(1);
    await shot(page, 'find-parts-circuit-check');

    // Compare with the house part's approved source in the same circuit.
    await fill(page, 'Search', 'OHI-ZD-1056');
    await expect.poll(() => results.getByRole('row', { name: 'BRZ05-5V6' }).count()).toBe(1);
    await page.getByRole('checkbox', { name: 'Compare BRZ05-5V6' }).check({ force: true });
    await form.getByRole('button', { name: 'Check 2 parts' }).click();
    const comparison = page.getByRole('table', { name: 'Comparison' });
    await comparison.waitFor();
    await expect.poll(async () => (await comparison.innerText()).match(/Works at every corner|No resistor works|Cannot decide/g)?.length ?? 0).toBe(2);
    const headers = await comparison.getByRole('columnheader').allInnerTexts();
    expect(headers.join(' ')).toContain('QHZ5V6A');
    expect(headers.join(' ')).toContain('BRZ05-5V6');
    await shot(page, 'find-parts-compare');

    // A supply too wide for a 500 mW part: no resistor works, and the screen says why.
    await page.getByRole('button', { name: 'Remove BRZ05-5V6 from the check' }).click();
    await fill(form, 'Lowest', '9 V');
    await fill(form, 'Nominal', '15 V');
    await fill(form, 'Highest', '24 V');
    await fill(form, 'Largest', '30 mA');
    await form.getByRole('button', { name: 'Check circuit' }).click();
    await expect.poll(() => check.getByTestId('verdict-alert').innerText()).toContain('No resistor works');
    expect(await check.getByTestId('verdict-alert').innerText()).toMatch(/power limit needs at least \d+ Ω but the knee needs at most [\d.]+ Ω/);
    expect(await check.getByTestId('chosen-resistor').innerText()).toBe('none');
    expect(await check.getByTestId('resistor-range').innerText()).toMatch(/^none: power needs ≥/);
    await shot(page, 'find-parts-no-resistor');
    expect(errors).toEqual([]);
    await context.close();
  });

  it('a buyer is not offered Find parts; parts not cleared are marked when asked for (dark scheme)', async () => {
    const buyerContext = await newContext(browser);
    const buyer = await buyerContext.newPage();
    await signIn(buyer, 'buyer@demo.test');
    await buyer.goto('/find');
    await expect.poll(() => buyer.getByText('Not available for your role').count()).toBe(1);
    await buyerContext.close();

    const context = await newContext(browser, 'dark');
    const page = await context.newPage();
    const errors = watchErrors(page);
    await signIn(page, 'designer@demo.test');
    await page.getByText('Include parts not cleared', { exact: true }).click();
    await expect.poll(() => page.url()).toContain('includeNotCleared=true');
    await fill(page, 'Search', 'QHZ24AF');
    const row = page.getByRole('table', { name: 'Search results' }).getByRole('row', { name: 'QHZ24AF' });
    await expect.poll(() => row.count()).toBe(1);
    expect(await row.innerText()).toContain('Not cleared');
    await shot(page, 'find-parts-not-cleared-dark');
    expect(errors).toEqual([]);
    await context.close();
  });
});
