import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser, newContext, screenshot, watchErrors } from './support/browser';
import { axeClean, focused, keyboardSignIn, skipToMain, tabTo } from './support/keyboard';

/**
 * The datasheet upload by keyboard alone: Tab to the drop area, Enter opens the file chooser,
 * the upload's progress and result are announced in the list, and the series review opens
 * from its button by Enter. No mouse click anywhere; axe on each screen.
 */

// The invented Lumenvale series datasheet from test-fixtures (20 parts). A comment line after
// its end marker gives this run new bytes, so it is stored and read afresh.
const FIXTURE = join(new URL('.', import.meta.url).pathname, '..', '..', 'test-fixtures', 'datasheets', 'lumenvale-lvd1-series.pdf');

describe('datasheet upload by keyboard alone', () => {
  let browser: Browser;
  let close: () => Promise<void>;

  beforeAll(async () => {
    ({ browser, close } = await launchBrowser());
  });
  afterAll(async () => close?.());

  it('Tab to the drop area, Enter to choose the file, Enter on the review: every stop visible', async () => {
    const page = await (await newContext(browser)).newPage();
    // Listening from the start turns on the browser's file-chooser interception now; turned on
    // only when Enter is pressed, it can come too late and the chooser goes unseen.
    page.on('filechooser', () => undefined);
    const errors = watchErrors(page);
    await keyboardSignIn(page, 'engineer@demo.test');
    await page.goto('/vendor-parts/upload');
    await page.locator('[aria-label^="Drop datasheet PDFs here"]').waitFor();
    await axeClean(page);
    await skipToMain(page);

    await tabTo(page, /Drop datasheet PDFs here or choose files/);
    expect((await focused(page)).name).toMatch(/^Drop datasheet PDFs here/);
    const chooser = page.waitForEvent('filechooser');
    await page.keyboard.press('Enter');
    await (
      await chooser
    ).setFiles({
      name: 'lumenvale-lvd1-keyboard.pdf',
      mimeType: 'application/pdf',
      buffer: Buffer.concat([readFileSync(FIXTURE), Buffer.from(`% keyboard upload ${Date.now()}\n`)]),
    });

    const item = page.getByRole('listitem', { name: 'Upload of lumenvale-lvd1-keyboard.pdf' });
    await expect.poll(() => item.getAttribute('data-status'), { timeout: 60_000 }).toBe('done');
    await expect.poll(() => item.getByTestId('extraction-summary').textContent(), { timeout: 60_000 }).toMatch(/20 parts found/);
    // Focus stayed on the page (on the drop area), not lost to the body while the upload ran.
    expect((await focused(page)).tag).not.toBe('body');
    await axeClean(page);
    await screenshot(page, 'keyboard-upload-2-read');

    await tabTo(page, /^Review 20 parts and create them/);
    await page.keyboard.press('Enter');
    const review = page.getByTestId('series-review');
    await review.waitFor();
    await expect.poll(async () => (await focused(page)).tag).not.toBe('body');
    // The review's own controls are reached by Tab from where focus is now.
    await tabTo(page, /Choose all parts/);
    await axeClean(page);
    await screenshot(page, 'keyboard-upload-3-review');
    expect(errors).toEqual([]);
  });
});
