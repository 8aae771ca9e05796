import { describe, expect, it } from 'vitest';
import { roundingOf, vzTolerance } from './vz-tolerance';

const v = (value: number, printed: string | null = null) => ({ value, printed });

describe('vzTolerance', () => {
  // A ±5 % 5.1 V part spans 4.845…5.355 V (arithmetic); printed to two decimals it reads 4.85 / 5.36 V (common practice, no source).
  it('reads a ±5 % part printed 4.85 / 5.1 / 5.36 V as 5 %, not the 5.1 % of the rounded ends', () => {
    expect(vzTolerance({ vzNom: v(5.1), vzMin: v(4.85), vzMax: v(5.36) })).toBeCloseTo(0.05, 6);
    expect(vzTolerance({ vzNom: v(5.1, '5.1 V'), vzMin: v(4.85, '4.85 V'), vzMax: v(5.36, '5.36 V') })).toBeCloseTo(0.05, 6);
  });

  it('takes a tolerance printed with the values as printed', () => {
    expect(vzTolerance({ vzNom: v(5.1, '5.1 V ±2 %'), vzMin: v(4.85), vzMax: v(5.36) })).toBe(0.02);
  });

  it('does not forgive more than the rounding: a ±10 % part stays 10 %, one truly wider than 5 % stays above 5 %', () => {
    // 13.2 V printed is at least 13.15 V: 9.58 % over 12 V, inside "±10 % or better" and far outside ±5 %.
    expect(vzTolerance({ vzNom: v(12), vzMin: v(10.8), vzMax: v(13.2) })).toBeCloseTo(1.15 / 12, 5);
    // 5.37 V printed: at least 5.365 V, i.e. 5.2 % over 5.1 V.
    expect(vzTolerance({ vzNom: v(5.1), vzMin: v(4.85), vzMax: v(5.37) })!).toBeGreaterThan(0.05);
  });

  it('counts the printed digits, also in millivolts, and at most three significant digits from a bare value', () => {
    expect(roundingOf(v(5.36, '5.360 V'))).toBeCloseTo(0.0005, 9);
    expect(roundingOf(v(5.36, '5360 mV'))).toBeCloseTo(0.0005, 9);
    expect(roundingOf(v(6))).toBeCloseTo(0.005, 9);
    expect(roundingOf(v(4.85))).toBeCloseTo(0.005, 9);
  });

  it('is unknown without both ends', () => {
    expect(vzTolerance({ vzNom: v(5.1), vzMin: v(4.85) })).toBeNull();
    expect(vzTolerance({ vzMin: v(4.85), vzMax: v(5.36) })).toBeNull();
  });
});
