import { describe, expect, it } from 'vitest';
import { formatMargin, formatNumber, formatPercent, formatQuantity, formatTc, roundToDigits, roundToStated, statedDigits } from './format';
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
    for (const [value, kind] of [
      [4.7, 'voltage'],
      [2.5e-7, 'current'],
      [-0.0019, 'tempCoVoltage'],
      [0.06, 'tempCoPercent'],
    ] as const) {
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

  it('rounds a stored value to the figures its datasheet text states, and only the noise when the text states another number', () => {
    expect(statedDigits('4.70 V')).toBe(3);
    expect(statedDigits('0.25 mA')).toBe(2);
    expect(statedDigits('500 ohm')).toBe(3);
    expect(statedDigits('-1.4 mV/°C')).toBe(2);
    expect(statedDigits('none')).toBeNull();
    expect(String(roundToStated(0.25 * 0.001 + 1e-20, '0.25 mA'))).toBe('0.00025');
    expect(String(roundToStated(0.0012 - 0.003, '-1.8 mV/K'))).toBe('-0.0018');
    // a coefficient converted from %/K: the printed 0.05 does not state 2.55 mV/K
    expect(roundToStated(0.05 * 5.1 * 10, '0.05 %/K')).toBe(2.55);
    expect(roundToStated(2.5523456789, '0.05 %/K')).toBe(2.5523456789);
  });

  it('never moves a value by more than the import calls the same (1e-9 relative), on values drawn afresh', () => {
    const seed = Date.now() % 100000;
    (globalThis as unknown as { console: { log(message: string): void } }).console.log(`roundToStated seed ${seed}`);
    let state = seed;
    const next = () => (state = (state * 1103515245 + 12345) % 2147483648) / 2147483648;
    for (let i = 0; i < 500; i++) {
      const value = (next() < 0.5 ? -1 : 1) * 10 ** (next() * 12 - 9) * (1 + next());
      const printed = `${value.toPrecision(1 + Math.floor(next() * 5))} X`;
      const out = roundToStated(value, printed)!;
      expect(Math.abs(out - value), `${value} printed ${printed}`).toBeLessThanOrEqual(1e-9 * Math.abs(value));
    }
  });
});

// Temperature coefficients of Zener diodes are stated in mV/K (or %/K) on datasheets; a typical
// 5.1 V part lies near −1…+1 mV/K (JEDEC-style datasheet practice; from memory, common practice).
describe('a temperature coefficient keeps the one prefix datasheets use', () => {
  it.each([
    [-0.0006, '\u22120.60 mV/K'],
    [0.0023, '2.30 mV/K'],
    [-0.0019, '\u22121.90 mV/K'],
    [0.0125, '12.5 mV/K'],
    [0.0851, '85.1 mV/K'],
    [0, '0 mV/K'],
    [7.5e-5, '0.075 mV/K'],
    [3e-6, '0.0030 mV/K'],
    [0.000999, '0.999 mV/K'],
    [0.0009996, '1.00 mV/K'],
  ] as const)('%d V/K → %s', (value, text) => {
    expect(formatQuantity(value, 'tempCoVoltage')).toBe(text);
  });

  it('never falls back to µV/K or V/K, whatever the size', () => {
    for (const v of [-6e-4, 6e-5, 1.2e-3, 0.2]) expect(formatQuantity(v, 'tempCoVoltage')).toMatch(/ mV\/K$/);
  });

  it('formats a card value in either of its units', () => {
    expect(formatTc({ value: -0.6, unit: 'mV/K' })).toBe('\u22120.60 mV/K');
    expect(formatTc({ value: 0.06, unit: '%/K' })).toBe('0.0600 %/K');
    expect(formatTc(null)).toBe('–');
  });

  it('reads back through parseQuantity', () => {
    expect(parseQuantity(formatQuantity(-0.0006, 'tempCoVoltage'), 'tempCoVoltage')).toBeCloseTo(-0.0006, 12);
  });
});

describe('every displayed negative number carries a true minus (U+2212), never a hyphen', () => {
  it.each([
    ['voltage', () => formatQuantity(-5.1, 'voltage')],
    ['temperature', () => formatQuantity(-40, 'temperature', { trim: true })],
    ['tc', () => formatQuantity(-0.0014, 'tempCoVoltage')],
    ['number', () => formatNumber(-1.2345)],
    ['percent', () => formatPercent(-0.025)],
    ['margin', () => formatMargin(-3.14)],
  ])('%s', (_, text) => {
    expect(text()).toMatch(/^\u2212/);
    expect(text()).not.toContain('-');
  });

  it('holds for values drawn afresh each run', () => {
    const seed = Date.now() % 100000;
    (globalThis as unknown as { console: { log(message: string): void } }).console.log(`minus-sign seed ${seed}`);
    let state = seed;
    const next = () => (state = (state * 1103515245 + 12345) % 2147483648) / 2147483648;
    for (let i = 0; i < 200; i++) {
      const x = -(10 ** (next() * 16 - 12)) * (1 + next());
      for (const kind of ['voltage', 'current', 'resistance', 'power', 'temperature', 'thermalResistance', 'tempCoVoltage', 'tempCoPercent'] as const) {
        const text = formatQuantity(x, kind);
        expect(text, `${x} as ${kind}`).not.toMatch(/-|e[+-]?\d/);
        expect(text.startsWith('\u2212') || /^0 /.test(text), `${x} as ${kind}`).toBe(true);
      }
      expect(formatNumber(x)).toMatch(/^\u2212/);
    }
  });
});

describe('trimmed values for sentences and plain numbers', () => {
  it('drops trailing zeros only when asked', () => {
    expect(formatQuantity(25, 'temperature', { trim: true })).toBe('25 °C');
    expect(formatQuantity(25, 'temperature')).toBe('25.0 °C');
    expect(formatQuantity(5.1, 'voltage', { digits: 4, trim: true })).toBe('5.1 V');
    expect(formatQuantity(120, 'resistance', { trim: true })).toBe('120 Ω');
  });

  it('percentages and ratios', () => {
    expect(formatPercent(0.0526)).toBe('5.26 %');
    expect(formatPercent(0.05, { digits: 2 })).toBe('5 %');
    expect(formatPercent(0.021, { signed: true })).toBe('+2.1 %');
    expect(formatNumber(1.0512)).toBe('1.05');
    expect(formatNumber(12345)).toBe('12345');
    expect(formatMargin(2.06)).toBe('+2.1 %');
    expect(formatMargin(-0.04)).toBe('±0.0 %');
  });
});
