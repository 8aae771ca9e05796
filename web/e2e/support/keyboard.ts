import type { Page } from 'playwright-core';
import { expect } from 'vitest';
import { DEMO_PASSWORD, seriousAxeViolations } from './browser';

// Keyboard-only journeys: what has focus, moving it with Tab alone, signing in and skipping
// the navigation by keyboard, and axe once a dialog has finished drawing.

/** What has focus: its tag, role, accessible name as the page shows it, and whether a focus ring is drawn. */
export async function focused(page: Page): Promise<{ tag: string; name: string; id: string; visible: boolean; inDialog: boolean }> {
  return page.evaluate(() => {
    const el = document.activeElement as HTMLElement | null;
    if (!el || el === document.body) return { tag: 'body', name: '', id: '', visible: false, inDialog: false };
    const style = getComputedStyle(el);
    const ring = (style.outlineStyle !== 'none' && parseFloat(style.outlineWidth) > 0) || (style.boxShadow !== 'none' && style.boxShadow !== '');
    const name = (el.getAttribute('aria-label') ?? (el as HTMLInputElement).labels?.[0]?.textContent ?? el.textContent ?? '').trim().replace(/\s+/g, ' ');
    return { tag: el.tagName.toLowerCase(), name, id: el.id, visible: ring, inDialog: Boolean(el.closest('[role="dialog"]')) };
  });
}

/** Presses Tab (or Shift+Tab) until the focused element's name matches, checking each stop on the way has a visible focus ring. */
export async function tabTo(page: Page, name: RegExp, { back = false, max = 80 } = {}): Promise<void> {
  const unseen: string[] = [];
  for (let i = 0; i < max; i++) {
    await page.keyboard.press(back ? 'Shift+Tab' : 'Tab');
    const f = await focused(page);
    if (f.tag !== 'body' && !f.visible) unseen.push(`${f.tag} "${f.name.slice(0, 40)}"`);
    if (name.test(f.name)) {
      expect(unseen, 'every focus stop shows a visible focus ring').toEqual([]);
      return;
    }
  }
  throw new Error(`focus never reached ${name} in ${max} ${back ? 'Shift+Tab' : 'Tab'} presses`);
}

/** Waits until an opening dialog is fully drawn (its fade-in over): axe measures contrast on what it sees. */
export async function settled(page: Page): Promise<void> {
  const dialog = page.getByRole('dialog');
  await expect
    .poll(() =>
      dialog.evaluate((el) => {
        let opacity = 1;
        for (let node: Element | null = el; node; node = node.parentElement) opacity *= Number(getComputedStyle(node).opacity);
        return opacity;
      }),
    )
    .toBe(1);
}

export async function axeClean(page: Page): Promise<void> {
  expect(await seriousAxeViolations(page)).toEqual([]);
}

/** Signs in with the keyboard only: the e-mail field has focus first (or is reached by Tab), Enter sends the form. */
export async function keyboardSignIn(page: Page, email: string): Promise<void> {
  await page.goto('/sign-in');
  await page.getByLabel(/e-?mail/i).waitFor();
  if (!/e-?mail/i.test((await focused(page)).name)) await tabTo(page, /e-?mail/i);
  await page.keyboard.type(email);
  await page.keyboard.press('Tab');
  expect((await focused(page)).name).toMatch(/password/i);
  await page.keyboard.type(DEMO_PASSWORD);
  await page.keyboard.press('Enter');
  await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
}

/** From the top of a page: the first Tab reaches the skip link, Enter moves focus to the main content. */
export async function skipToMain(page: Page): Promise<void> {
  await page.evaluate(() => (document.activeElement as HTMLElement | null)?.blur());
  await page.keyboard.press('Tab');
  const skip = await focused(page);
  expect(skip.name).toBe('Skip to main content');
  expect(skip.visible).toBe(true);
  await page.keyboard.press('Enter');
  await expect.poll(async () => (await focused(page)).id).toBe('main-content');
}
