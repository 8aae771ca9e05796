import { afterAll, afterEach, expect } from 'vitest';
import { takeCspViolations } from './csp';

// Every journey fails on a Content-Security-Policy violation (see support/csp.ts).
afterEach(() => {
  expect(takeCspViolations().join('\n'), 'Content-Security-Policy violations during this journey').toBe('');
});
afterAll(() => {
  expect(takeCspViolations().join('\n'), 'Content-Security-Policy violations after the last journey').toBe('');
});
