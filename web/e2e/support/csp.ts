import type { BrowserContext } from 'playwright-core';

/**
 * Content-Security-Policy violations seen by any page of any watched context, oldest first.
 * support/csp-setup.ts fails the running journey on any (after each test), so a page that
 * needs an inline script, an outside host or eval shows up as a failed journey, not as a
 * silently broken screen in production.
 */
const violations: string[] = [];

export async function watchCsp(context: BrowserContext): Promise<void> {
  await context.exposeBinding('__shuntwiseCspViolation', ({ page }, text: string) => {
    violations.push(`${text} (on ${page.url()})`);
  });
  await context.addInitScript(() => {
    document.addEventListener(
      'securitypolicyviolation',
      (e) => {
        const report = (window as unknown as { __shuntwiseCspViolation?: (t: string) => void }).__shuntwiseCspViolation;
        report?.(`${e.effectiveDirective} blocked ${e.blockedURI || '(inline)'} at ${e.sourceFile || '?'}:${e.lineNumber}`);
      },
      true,
    );
  });
  // Chromium also reports each refusal on the console; catch those the event misses (workers, early loads).
  context.on('console', (m) => {
    if (m.type() === 'error' && /Content Security Policy/i.test(m.text())) violations.push(`console: ${m.text().slice(0, 300)}`);
  });
}

/** The violations collected so far; clears the list. */
export function takeCspViolations(): string[] {
  return violations.splice(0, violations.length);
}
