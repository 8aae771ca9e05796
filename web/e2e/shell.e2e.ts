import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { clippedTables, launchBrowser, newContext, screenshot, seriousAxeViolations, signIn, watchErrors } from './support/browser';
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
    await expect
      .poll(
        () =>
          page
            .getByRole('alert')
            .filter({ hasText: /do not match/i })
            .count(),
        { timeout: 15_000 },
      )
      .toBe(1);
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
      if (expected.length > 1) {
        const nav = page.getByRole('navigation');
        await expect.poll(() => nav.getByRole('link').count()).toBeGreaterThan(0);
        for (const label of ALL) {
          const count = await nav.getByRole('link', { name: label, exact: true }).count();
          expect(count, `${email}: "${label}" ${expected.includes(label) ? 'missing' : 'should not be shown'}`).toBe(expected.includes(label) ? 1 : 0);
        }
      } else {
        // One screen: its page at full width, the account in the header, no sidebar.
        await expect
          .poll(() =>
            page
              .getByRole('heading', { name: expected[0], level: 1 })
              .or(page.getByRole('heading', { name: expected[0] }))
              .count(),
          )
          .toBeGreaterThan(0);
        expect(await page.getByRole('navigation', { name: 'Main navigation' }).count()).toBe(0);
        expect(await page.getByRole('group', { name: 'Account' }).count()).toBe(1);
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

  // Every screen each role opens, at a desktop and a narrow (1024 px) width: axe-core finds no
  // serious or critical violation, and no table is cut off (it scrolls or reflows).
  const SCREENS: Record<string, string[]> = {
    'admin@demo.test': ['/users', '/outbox'],
    'engineer@demo.test': ['/board', '/house-parts', '/vendor-parts', '/qualifications', '/find', '/sources'],
    'designer@demo.test': ['/find'],
    'buyer@demo.test': ['/sources'],
  };
  const DETAILS: Array<[string, string]> = [
    ['/house-parts', 'a[href^="/house-parts/"]'],
    ['/vendor-parts', 'a[href^="/vendor-parts/"]:not([href$="/import"]):not([href$="/upload"])'],
    ['/qualifications', 'a[href^="/qualifications/"]'],
    ['/board', 'a[href^="/compare"]'],
  ];

  async function settle(page: import('playwright-core').Page) {
    await page.waitForLoadState('networkidle').catch(() => undefined);
    await expect
      .poll(() => page.locator('.mantine-Loader-root').count(), { timeout: 15_000 })
      .toBe(0)
      .catch(() => undefined);
  }

  async function audit(page: import('playwright-core').Page, name: string, findings: string[]) {
    await settle(page);
    for (const width of [1440, 1024]) {
      await page.setViewportSize({ width, height: 900 });
      await page.waitForTimeout(150);
      await page.evaluate(() => window.scrollTo(0, 0));
      await screenshot(page, `screen-${name}-${width}`);
      for (const v of await seriousAxeViolations(page)) findings.push(`${name} @${width}: ${v}`);
      for (const c of await clippedTables(page)) findings.push(`${name} @${width}: ${c}`);
    }
  }

  it('every screen passes axe-core (no serious or critical violation) and cuts no table at 1440 and 1024 px', async () => {
    const findings: string[] = [];
    {
      const context = await newContext(browser);
      const page = await context.newPage();
      await page.goto('/sign-in');
      await audit(page, 'sign-in', findings);
      await context.close();
    }
    for (const [email, paths] of Object.entries(SCREENS)) {
      const context = await newContext(browser);
      const page = await context.newPage();
      await signIn(page, email);
      const who = email.split('@')[0];
      for (const path of paths) {
        await page.goto(path);
        await audit(page, `${who}${path.replace(/\//g, '-')}`, findings);
        if (path === '/sources') {
          // At 1024 px, beside the navigation, every column of Sources is in view (no hidden scroll).
          const [needs, has] = await page.evaluate(() => {
            const table = document.querySelector('table[aria-label="Sources"]') as HTMLElement;
            return [table.scrollWidth, table.parentElement!.clientWidth];
          });
          if (needs > has) findings.push(`${who} sources @1024: the table needs ${needs} px of ${has} px`);
        }
      }
      if (who === 'engineer') {
        for (const [list, selector] of DETAILS) {
          await page.goto(list);
          await settle(page);
          const link = page.locator(selector).first();
          if ((await link.count()) === 0) {
            findings.push(`no detail link on ${list} (${selector})`);
            continue;
          }
          const href = (await link.getAttribute('href'))!;
          await page.goto(href);
          await audit(page, `engineer${href.split('?')[0].replace(/\//g, '-')}`, findings);
        }
      }
      await context.close();
    }
    expect(findings).toEqual([]);
  }, 600_000);
});
