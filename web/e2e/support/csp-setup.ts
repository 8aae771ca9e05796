import { afterAll, afterEach, expect } from 'vitest';
import { takeCspViolations } from './csp';

// Every journey fails on a Content-Security-Policy violation (see support/csp.ts).
afterEach(() => {
  expect(takeCspViolations(), 'Content-Security-Policy violations during this journey').toEqual([]);
});
afterAll(() => {
  expect(takeCspViolations(), 'Content-Security-Policy violations after the last journey').toEqual([]);
});
