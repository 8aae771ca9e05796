import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser, newContext, screenshot, signIn, watchErrors } from './support/browser';
import { takeCspViolations } from './support/csp';

// The navigation each demo role must see (and nothing else), as the product's role map says.
const ALL = ['Board', 'House parts', 'Vendor parts', 'Qualifications', 'Find parts', 'Sources', 'Outbox', 'Users'];
const NAV: Record<string, string[]> = {
  'admin@demo.test': ALL,
  'engineer@demo.test': ['Board', 'House parts', 'Vendor parts', 'Qualifications', 'Find parts', 'Sources'],
  'reviewer@demo.test': ['Board', 'House parts', 'Vendor parts', 'Qualifications', 'Find parts', 'Sources'],
  'designer@demo.test': ['Find parts'],
  'buyer@demo.test': ['Sources'],
};

describe('app shell in Chromium', () => {
  let browser: Browser;
  let close: () => Promise<void>;
  beforeAll(async () => {
    ({ browser, close } = await launchBrowser());
  });
  afterAll(async () => close?.());

  it('sends a visitor without a session to sign-in, and refuses a wrong password', async () => {
    const context = await newContext(browser);
    const page = await context.newPage();
    await page.goto('/board');
    await page.waitForURL(/\/sign-in/);
    await page.getByLabel(/e-?mail/i).fill('engineer@demo.test');
    await page.getByLabel(/password/i).fill('not-the-password');
    await page.getByRole('button', { name: /sign in/i }).click();
    // Password hashing takes most of a second on a busy machine: give the answer time to arrive.
    await expect.poll(() => page.getByRole('alert').filter({ hasText: /do not match/i }).count(), { timeout: 10_000 }).toBe(1);
    expect(page.url()).toMatch(/\/sign-in/);
    await screenshot(page, 'shell-sign-in-refused');
    await context.close();
  });

  it('is served with a policy that blocks inline scripts, and the journeys notice a violation', async () => {
    const context = await newContext(browser);
    const page = await context.newPage();
    const res = await page.goto('/sign-in');
    expect(res?.headers()['content-security-policy']).toMatch(/script-src 'self'/);
    expect(takeCspViolations()).toEqual([]); // the app itself needs nothing the policy forbids
    await page.evaluate(() => {
      const s = document.createElement('script');
      s.textContent = 'window.injected = true';
      document.head.append(s);
    });
    // Both channels report it: the page's securitypolicyviolation event and Chromium's console message.
    const seen: string[] = [];
    await expect
      .poll(() => {
        seen.push(...takeCspViolations());
        return [seen.some((v) => /^script-src/.test(v)), seen.some((v) => v.startsWith('console:'))];
      })
      .toEqual([true, true]);
    expect(await page.evaluate(() => (window as unknown as { injected?: boolean }).injected)).toBeUndefined();
    await context.close();
  });

  for (const [email, expected] of Object.entries(NAV)) {
    it(`signs in as ${email}, shows only that role's navigation, signs out`, async () => {
      const context = await newContext(browser, email.startsWith('designer') ? 'dark' : 'light');
      const page = await context.newPage();
      const errors = watchErrors(page);
      await signIn(page, email);
      const nav = page.getByRole('navigation');
      await expect.poll(() => nav.getByRole('link').count()).toBeGreaterThan(0);
      for (const label of ALL) {
        const count = await nav.getByRole('link', { name: label, exact: true }).count();
        expect(count, `${email}: "${label}" ${expected.includes(label) ? 'missing' : 'should not be shown'}`).toBe(expected.includes(label) ? 1 : 0);
      }
      await screenshot(page, `shell-${email.split('@')[0]}`);
      await page.getByRole('button', { name: /sign out/i }).click();
      await page.waitForURL(/\/sign-in/);
      // the old session is gone: a protected page sends us back to sign-in
      await page.goto('/sources');
      await page.waitForURL(/\/sign-in/);
      expect(errors.filter((e) => !/401|Unauthorized/.test(e))).toEqual([]);
      await context.close();
    });
  }
});
