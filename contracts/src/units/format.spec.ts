import { describe, expect, it } from 'vitest';
import { formatQuantity, roundToDigits } from './format';
import { parseQuantity } from './parse';

// Engineering notation with SI prefixes (BIPM SI Brochure, 9th edition): the mantissa stays
// within 1…999 and the prefix moves in steps of 10³.
describe('formatQuantity prints SI numbers with engineering prefixes', () => {
  it.each([
    [4.7, 'voltage', '4.70 V'],
    [0.00025, 'current', '250 µA'],
    [-0.0019, 'tempCoVoltage', '\u22121.90 mV/K'],
    [1200, 'resistance', '1.20 kΩ'],
    [0.5, 'power', '500 mW'],
    [150, 'temperature', '150 °C'],
    [0.06, 'tempCoPercent', '0.0600 %/K'],
    [250, 'thermalResistance', '250 K/W'],
    [0, 'voltage', '0 V'],
  ] as const)('%d as %s → %s', (value, kind, text) => {
    expect(formatQuantity(value, kind)).toBe(text);
  });

  it('carries a rounded 999.6 m to the next prefix rather than printing 1000 m', () => {
    expect(formatQuantity(0.9996, 'voltage')).toBe('1.00 V');
    expect(formatQuantity(0.0009996, 'current')).toBe('1.00 mA');
  });

  it('never prints exponent notation, even when rounding adds a figure', () => {
    expect(formatQuantity(0.0997, 'voltage', { digits: 2 })).toBe('100 mV');
    expect(formatQuantity(99.7, 'temperature', { digits: 2 })).toBe('100 °C');
    expect(formatQuantity(123456, 'thermalResistance')).toBe('123456 K/W');
  });

  it('shows missing values as a dash and infinities with their sign', () => {
    expect(formatQuantity(null, 'voltage')).toBe('–');
    expect(formatQuantity(undefined, 'voltage', { empty: 'no data' })).toBe('no data');
    expect(formatQuantity(Number.NEGATIVE_INFINITY, 'resistance')).toBe('\u2212∞ Ω');
  });

  it('what it prints reads back through parseQuantity', () => {
    for (const [value, kind] of [[4.7, 'voltage'], [2.5e-7, 'current'], [-0.0019, 'tempCoVoltage'], [0.06, 'tempCoPercent']] as const) {
      expect(parseQuantity(formatQuantity(value, kind), kind)).toBeCloseTo(value, 12);
    }
  });
});

describe('roundToDigits keeps exported numbers to the printed precision', () => {
  it('drops binary noise a subtraction leaves (IEEE 754 doubles, common practice)', () => {
    expect(roundToDigits(0.0012 - 0.003)).toBe(-0.0018);
    expect(String(roundToDigits(0.1 + 0.2, 3))).toBe('0.3');
    expect(roundToDigits(5.1234, 4)).toBe(5.123);
    expect(roundToDigits(null)).toBeNull();
    expect(roundToDigits(Number.NaN)).toBeNull();
  });
});
