import { mkdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';
import { watchCsp } from './csp';

export const BASE_URL = process.env.E2E_BASE_URL ?? 'http://127.0.0.1:8080';
export const DEMO_PASSWORD = process.env.E2E_DEMO_PASSWORD ?? 'shuntwise-demo';
const SCREENSHOTS = process.env.E2E_SCREENSHOTS ?? join(process.cwd(), 'artifacts', 'screenshots');

/**
 * Debian's Chromium, headless, with the flags this closed network needs (see RECIPES.md).
 * playwright gives every launch a new empty profile folder of its own.
 */
export async function launchBrowser(): Promise<{ browser: Browser; close(): Promise<void> }> {
  const browser = await chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    headless: true,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
      '--disable-dev-shm-usage',
    ],
  });
  return {
    browser,
    close: () => browser.close(),
  };
}

/** A fresh context whose pages report Content-Security-Policy violations (the journey fails on any). */
export async function newContext(browser: Browser, scheme: 'light' | 'dark' = 'light'): Promise<BrowserContext> {
  const context = await browser.newContext({ viewport: { width: 1440, height: 900 }, colorScheme: scheme, baseURL: BASE_URL });
  context.setDefaultTimeout(20_000);
  await watchCsp(context);
  return context;
}

/** Saves a full-page PNG under artifacts/screenshots (git-ignored) and returns its path. */
export async function screenshot(page: Page, name: string): Promise<string> {
  mkdirSync(SCREENSHOTS, { recursive: true });
  const path = join(SCREENSHOTS, `${name}.png`);
  await page.screenshot({ path, fullPage: true });
  return path;
}

/** Signs in through the sign-in page as a person would. */
export async function signIn(page: Page, email: string, password = DEMO_PASSWORD): Promise<void> {
  await page.goto('/sign-in');
  await page.getByLabel(/e-?mail/i).fill(email);
  await page.getByLabel(/password/i).fill(password);
  await page.getByRole('button', { name: /sign in/i }).click();
  await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
}

/** Collects console errors and failed requests so a journey can assert the page stayed clean. */
export function watchErrors(page: Page): string[] {
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(`pageerror: ${e.message}`));
  page.on('console', (m) => {
    if (m.type() === 'error') errors.push(`console: ${m.text()}`);
  });
  return errors;
}

interface AxeViolation {
  id: string;
  impact: string | null;
  help: string;
  nodes: Array<{ target: unknown[] }>;
}

/**
 * Runs axe-core (the root's copy, injected into the page) on what the page shows now and
 * returns the serious and critical violations, each as "rule: help (targets)".
 */
export async function seriousAxeViolations(page: Page): Promise<string[]> {
  const loaded = await page.evaluate(() => typeof (window as unknown as { axe?: unknown }).axe !== 'undefined');
  // Evaluated through the browser's debugging protocol, not as a <script>: the app's Content-Security-Policy
  // (rightly) refuses inline scripts, and the journeys fail on any violation.
  if (!loaded) await page.evaluate(readFileSync(join(process.cwd(), 'node_modules', 'axe-core', 'axe.min.js'), 'utf8'));
  const violations = await page.evaluate(async () => {
    const axe = (window as unknown as { axe: { run(context: Document, options: object): Promise<{ violations: AxeViolation[] }> } }).axe;
    const result = await axe.run(document, { resultTypes: ['violations'] });
    return result.violations.map((v) => ({ id: v.id, impact: v.impact, help: v.help, nodes: v.nodes.map((n) => ({ target: n.target })) }));
  });
  return violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map(
      (v) =>
        `${v.id} (${v.impact}): ${v.help} — ${v.nodes
          .slice(0, 3)
          .map((n) => JSON.stringify(n.target))
          .join(', ')}`,
    );
}

/** Tables wider than their box with no way to scroll to the rest (cut off, not scrollable). */
export async function clippedTables(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const out: string[] = [];
    for (const table of Array.from(document.querySelectorAll('table'))) {
      const rect = table.getBoundingClientRect();
      if (rect.width === 0) continue;
      let node: HTMLElement | null = table.parentElement;
      while (node && node !== document.body) {
        const style = getComputedStyle(node);
        const scrolls = /(auto|scroll)/.test(style.overflowX);
        if (scrolls) break;
        const box = node.getBoundingClientRect();
        if (style.overflowX === 'hidden' && rect.right > box.right + 1) {
          out.push(`${table.getAttribute('aria-label') ?? 'table'} is cut at ${Math.round(box.right)} px (needs ${Math.round(rect.right)} px)`);
          break;
        }
        node = node.parentElement;
      }
      if (!node || node === document.body) {
        if (rect.right > document.documentElement.clientWidth + 1)
          out.push(`${table.getAttribute('aria-label') ?? 'table'} runs past the window (${Math.round(rect.right)} px)`);
      }
    }
    return out;
  });
}
