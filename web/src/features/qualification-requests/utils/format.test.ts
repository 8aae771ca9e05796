import { describe, expect, it } from 'vitest';
import { age, formatDay } from './format';

describe('request dates', () => {
  it('shows a calendar date as that day wherever the viewer is (day-month-year, en-GB; common practice, no source)', () => {
    expect(formatDay('2027-03-31')).toBe('31 Mar 2027');
    expect(formatDay('2028-02-29')).toBe('29 Feb 2028');
    expect(formatDay(null)).toBe('–');
    expect(formatDay('soon')).toBe('soon');
  });

  it('counts whole days since a request was sent', () => {
    const now = Date.parse('2026-12-01T12:00:00Z');
    expect(age('2026-12-01T08:00:00Z', now)).toBe('today');
    expect(age('2026-11-30T11:00:00Z', now)).toBe('1 day ago');
    expect(age('2026-11-20T12:00:00Z', now)).toBe('11 days ago');
    // a clock a little ahead of the server's never gives a negative age
    expect(age('2026-12-01T12:05:00Z', now)).toBe('today');
  });
});
