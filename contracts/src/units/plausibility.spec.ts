import { describe, expect, it } from 'vitest';
import { plausibilityWarning, USUAL_RANGES } from './plausibility';

describe('plausibility of spec values (usual ranges: common practice, no source)', () => {
  it('warns on a Zener voltage typed a prefix off and names the value probably meant', () => {
    // "5.1 mV" and "5.1 kV" for a 5.1 V regulator diode: SI prefixes m = 10⁻³, k = 10³ (BIPM SI Brochure, 9th edition, from memory).
    expect(plausibilityWarning('zenerVoltage', 5.1e-3)).toBe('5.10 mV is outside the usual range of regulator diodes (1.80 V … 400 V): did you mean 5.10 V?');
    expect(plausibilityWarning('zenerVoltage', 5100)).toBe('5.10 kV is outside the usual range of regulator diodes (1.80 V … 400 V): did you mean 5.10 V?');
    expect(plausibilityWarning('zenerVoltage', 5.1)).toBeNull();
    expect(plausibilityWarning('zenerVoltage', 1.8)).toBeNull();
    expect(plausibilityWarning('zenerVoltage', 400)).toBeNull();
    // Outside, but no prefix step lands inside: only the range is named.
    expect(plausibilityWarning('zenerVoltage', 0.9)).toBe('900 mV is outside the usual range of regulator diodes (1.80 V … 400 V); check the unit');
  });

  it('warns on test currents and power ratings a prefix off, and says nothing for an empty value', () => {
    expect(plausibilityWarning('testCurrent', 5)).toMatch(/did you mean 5.00 mA\?$/);
    expect(plausibilityWarning('testCurrent', 5e-3)).toBeNull();
    expect(plausibilityWarning('powerRating', 500)).toMatch(/did you mean 500 mW\?$/);
    expect(plausibilityWarning('powerRating', 0.5)).toBeNull();
    expect(plausibilityWarning('zenerVoltage', null)).toBeNull();
    expect(plausibilityWarning('zenerVoltage', Number.NaN)).toBeNull();
  });

  it('accepts every value inside each usual range and warns on every value outside it (random values, seed printed)', () => {
    const seed = Math.floor(Math.random() * 2 ** 31);
    // contracts compile without DOM or Node types: reach the console through globalThis.
    (globalThis as unknown as { console: { log(message: string): void } }).console.log(`plausibility seed ${seed}`);
    let s = seed;
    const rand = () => (s = (s * 1103515245 + 12345) % 2 ** 31) / 2 ** 31;
    for (const [name, { min, max }] of Object.entries(USUAL_RANGES)) {
      for (let k = 0; k < 200; k++) {
        const inside = min * (max / min) ** rand();
        expect([seed, name, inside, plausibilityWarning(name as keyof typeof USUAL_RANGES, inside)]).toEqual([seed, name, inside, null]);
        const outside = rand() < 0.5 ? min * 10 ** (-6 * rand() - 1e-3) : max * 10 ** (6 * rand() + 1e-3);
        expect([seed, name, outside, plausibilityWarning(name as keyof typeof USUAL_RANGES, outside)]).toEqual([
          seed,
          name,
          outside,
          expect.stringMatching(/outside the usual range/),
        ]);
      }
    }
  });
});
