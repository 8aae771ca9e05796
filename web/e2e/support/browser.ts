import { mkdirSync } from 'node:fs';
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
