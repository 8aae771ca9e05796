import { describe, expect, it } from 'vitest';
import { UnitParseError, kindOfUnit, parseQuantity, parseRange } from './parse';

// Expected SI values follow from the SI prefixes (BIPM SI Brochure, 9th edition): m = 10⁻³,
// µ = 10⁻⁶, k = 10³; a kelvin step equals a degree-Celsius step.
describe('parseQuantity reads what datasheets print', () => {
  it.each([
    ['5.1 V', 'voltage', 5.1],
    ['20mA', 'current', 0.02],
    ['0.5 µA', 'current', 5e-7], // micro sign U+00B5
    ['0.5 μA', 'current', 5e-7], // Greek mu U+03BC
    ['0.5 uA', 'current', 5e-7],
    ['500 mW', 'power', 0.5],
    ['1.3 W', 'power', 1.3],
    ['\u22122.5 mV/°C', 'tempCoVoltage', -0.0025], // true minus sign
    ['-2.5 mV/K', 'tempCoVoltage', -0.0025],
    ['0.06 %/K', 'tempCoPercent', 0.06],
    ['0.06 %/°C', 'tempCoPercent', 0.06],
    ['7 \u03A9', 'resistance', 7], // Greek capital omega
    ['7 \u2126', 'resistance', 7], // ohm sign, as some PDFs encode it
    ['7 ohm', 'resistance', 7],
    ['1.2 kΩ', 'resistance', 1200],
    ['250 K/W', 'thermalResistance', 250],
    ['250 °C/W', 'thermalResistance', 250],
    ['150 °C', 'temperature', 150],
    ['+5V', 'voltage', 5],
    ['1e-3 A', 'current', 1e-3],
  ] as const)('%s as %s → %d (SI prefixes)', (text, kind, expected) => {
    expect(parseQuantity(text, kind)).toBeCloseTo(expected, 15);
  });

  it('a unit that does not fit the quantity is an error naming the field and what was expected', () => {
    expect(() => parseQuantity('5.1 V', 'current', { field: 'izt' })).toThrow(UnitParseError);
    expect(() => parseQuantity('5.1 V', 'current', { field: 'izt' })).toThrow('izt: cannot read "5.1 V" as a current (e.g. 20 mA, 0.5 µA)');
    expect(() => parseQuantity('-2.5 mV', 'tempCoVoltage', { field: 'tc' })).toThrow(/^tc: .*temperature coefficient in V\/K/);
    expect(() => parseQuantity('7 parsecs', 'resistance', { field: 'zzt' })).toThrow(/^zzt:/);
  });

  it('a number without a unit is an error unless the column header supplies one', () => {
    expect(() => parseQuantity('20', 'current', { field: 'izt' })).toThrow(/no unit given/);
    expect(parseQuantity('20', 'current', { field: 'izt', defaultUnit: 'mA' })).toBeCloseTo(0.02, 15);
  });

  it('prefixes are refused where the trade never uses them (k°C, m%/K)', () => {
    expect(() => parseQuantity('1 k°C', 'temperature')).toThrow(UnitParseError);
    expect(() => parseQuantity('60 m%/K', 'tempCoPercent')).toThrow(UnitParseError);
  });

  it('kindOfUnit tells a coefficient from a voltage and a thermal resistance from a temperature', () => {
    expect(kindOfUnit('mV/°C')).toBe('tempCoVoltage');
    expect(kindOfUnit('V')).toBe('voltage');
    expect(kindOfUnit('°C/W')).toBe('thermalResistance');
    expect(kindOfUnit('°C')).toBe('temperature');
    expect(kindOfUnit('%/K')).toBe('tempCoPercent');
    expect(kindOfUnit('furlong')).toBeUndefined();
  });
});

describe('parseRange reads min…max as printed', () => {
  it.each([
    ['4.85…5.36 V', 'voltage', 4.85, 5.36],
    ['4.85...5.36 V', 'voltage', 4.85, 5.36],
    ['4.85 – 5.36 V', 'voltage', 4.85, 5.36],
    ['4.85-5.36V', 'voltage', 4.85, 5.36],
    ['-55 to +150 °C', 'temperature', -55, 150],
    ['-2.5 … -1.5 mV/K', 'tempCoVoltage', -0.0025, -0.0015],
    ['500 µA – 2 mA', 'current', 5e-4, 2e-3],
    ['1e-3 - 2e-3 A', 'current', 1e-3, 2e-3],
  ] as const)('%s (SI prefixes)', (text, kind, low, high) => {
    const [a, b] = parseRange(text, kind);
    expect(a).toBeCloseTo(low, 15);
    expect(b).toBeCloseTo(high, 15);
  });

  it('names the field when the range is reversed or not a range', () => {
    expect(() => parseRange('5.36…4.85 V', 'voltage', { field: 'vz' })).toThrow(/^vz: .*first value is the smaller/);
    expect(() => parseRange('5.1 V', 'voltage', { field: 'vz' })).toThrow(/^vz: .*a range of a voltage/);
  });
});
