import { fieldFor, findConditions } from './field-patterns';
import { findPackage, isPartNumber } from './part-numbers';
import { findQuantities, headerUnit, isNumericCell, toSi } from './quantity-text';

/**
 * How datasheet text is tokenised. Unit symbols and prefixes per the BIPM SI Brochure,
 * 9th edition (quoted from memory: µ = 10⁻⁶, m = 10⁻³, k = 10³; Ω the ohm); the ASCII
 * spellings "u", "ohm" and "C" for °C, and symbols such as IZT/ZZK/VR, are common practice
 * in datasheets (no source). Package outline names (SOD-123, DO-41, SMA) are the trade's.
 */

describe('finding quantities in datasheet text', () => {
  it('reads micro as µ, μ or u and ohm as Ω (U+03A9), Ω (U+2126) or "ohm"', () => {
    const texts = ['0.5 \u00B5A', '0.5 \u03BCA', '0.5 uA'];
    for (const t of texts) {
      const [q] = findQuantities(t);
      expect(q).toMatchObject({ value: '0.5', kind: 'current' });
      expect(toSi(q.value, q.unit, 'current')).toBeCloseTo(5e-7, 15);
    }
    for (const t of ['7 \u03A9', '7 \u2126', '7 ohm', '7 Ohms']) {
      const [q] = findQuantities(t);
      expect(q).toMatchObject({ value: '7', kind: 'resistance' });
      expect(toSi(q.value, q.unit, 'resistance')).toBe(7);
    }
  });

  it('reads no number from figures run together by overlapping cells ("37.139.0" is 37.1 and 39.0, or nothing)', () => {
    // Precision before recall (common practice, no source): a number with two decimal points is not a value.
    expect(findQuantities('37.139.0 @ 2 mA41.0').map((q) => q.value)).not.toContain('37.139');
    expect(findQuantities('37.139.0 V')).toEqual([]);
    expect(findQuantities('VZ 39.0 V')[0]).toMatchObject({ value: '39.0', unit: 'V' });
  });

  it('keeps the printed sign, reads the true minus sign, and knows temperature-coefficient units', () => {
    expect(findQuantities('αVZ −2.1 mV/°C')[0]).toMatchObject({ value: '−2.1', unit: 'mV/°C', kind: 'tempCoVoltage' });
    expect(toSi('−2.1', 'mV/°C', 'tempCoVoltage')).toBeCloseTo(-0.0021, 12);
    expect(findQuantities('+0.055 %/K')[0]).toMatchObject({ value: '+0.055', unit: '%/K', kind: 'tempCoPercent' });
    expect(findQuantities('250 K/W')[0]).toMatchObject({ kind: 'thermalResistance' });
    expect(findQuantities('83 °C/W')[0]).toMatchObject({ kind: 'thermalResistance' });
  });

  it('does not read a derating slope as a power, nor digits inside a package or part name as numbers', () => {
    expect(findQuantities('Derate above 25 °C at 12 mW/°C').map((q) => [q.value, q.kind])).toEqual([
      ['25', 'temperature'],
      ['12', undefined],
    ]);
    expect(findQuantities('Case: SOD-123, FR4 board')).toEqual([]);
    expect(findQuantities('≤ 7 Ω')[0]).toMatchObject({ value: '7', unit: 'Ω' });
  });

  it('finds the unit of a column header in brackets and ignores footnote marks and conditions', () => {
    expect(headerUnit('VZ at IZT 2) min (V)')).toBe('V');
    expect(headerUnit('IR max [µA]')).toBe('µA');
    expect(headerUnit('αVZ typ (mV/°C)')).toBe('mV/°C');
    expect(headerUnit('Electrical characteristics (Tamb = 25 °C)')).toBeUndefined();
    expect(isNumericCell('150 1)')).toBe(true);
    expect(isNumericCell('see note')).toBe(false);
  });
});

describe('naming the card field of a header or label', () => {
  it('lets the unit settle mixed headers such as "IR at VR"', () => {
    expect(fieldFor('IR at VR max (µA)', 'current')?.field).toBe('irMax');
    expect(fieldFor('IR at VR (V)', 'voltage')?.field).toBe('vr');
    expect(fieldFor('VZ at IZT min (V)', 'voltage')?.field).toBe('vzMin');
    expect(fieldFor('ZZK at IZK max (Ω)', 'resistance')?.field).toBe('zzk');
    expect(fieldFor('ZZK at IZK IZK (mA)', 'current')?.field).toBe('izk');
    expect(fieldFor('Knee imp. Leakage IR max (µA)', 'current')?.field).toBe('irMax');
    expect(fieldFor('Forward voltage VF', 'voltage')).toBeUndefined();
  });

  it('prefers the typical temperature coefficient to its limits', () => {
    expect(fieldFor('TC typ (%/K)', 'tempCoPercent')).toMatchObject({ field: 'tc', rank: 2 });
    expect(fieldFor('TC max (%/K)', 'tempCoPercent')).toMatchObject({ field: 'tc', rank: 0 });
  });

  it('reads test conditions and knows that IZ on a knee line is the knee current', () => {
    expect(findConditions('IZ = 5 mA, f = 1 kHz', 'zzt').conditions).toEqual([expect.objectContaining({ field: 'izt', value: '5', unit: 'mA' })]);
    expect(findConditions('IZ = 0.25 mA', 'zzk').conditions).toEqual([expect.objectContaining({ field: 'izk', value: '0.25' })]);
    expect(findConditions('at VR = 1 V', 'irMax').conditions).toEqual([expect.objectContaining({ field: 'vr', value: '1', unit: 'V' })]);
    expect(findConditions('IZ = IZT').conditions).toEqual([]);
  });
});

describe('part numbers and packages', () => {
  it('tells part numbers from package names, symbols and dimensions', () => {
    for (const mpn of ['BRZ05-5V1', 'LVD1-051', 'CBX3-5.1', 'AM-ZR5V1', 'QHZ5V1AF', 'ODW10']) expect(isPartNumber(mpn)).toBe(true);
    for (const other of ['SOD-123', 'SOD-123F', 'DO-41', 'RthJA', 'A1', 'FR4', 'Tstg', '5V1']) expect(isPartNumber(other)).toBe(false);
  });

  it('finds the package name, the longer spelling first', () => {
    expect(findPackage('Package: SMA (DO-214AC), moulded plastic')?.value).toBe('SMA');
    expect(findPackage('in SOD-123F, flat leads')?.value).toBe('SOD-123F');
    expect(findPackage('Case: SOD 323 plastic')?.value).toBe('SOD-323');
    expect(findPackage('SMAJ series')).toBeUndefined();
  });
});
