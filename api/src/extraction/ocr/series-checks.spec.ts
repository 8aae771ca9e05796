import type { ExtractedVariant } from '@shuntwise/contracts';
import { capitalised, corroboratedSpelling, detachedPoint, seriesOutliers, unnamedSeries } from './series-checks';

/**
 * The OCR checks that read a value against the other parts of its series. Part numbers and
 * values are invented; how such series run is common practice for regulator diodes (no source):
 * test current, leakage and impedances change by a few times at most from one part to the next,
 * and plain-number series print VZ as the part number's digits.
 */

type Fields = ExtractedVariant['fields'];
const q = (si: number, ocr = true) => ({ value: String(si), unit: '', si, page: 1, text: '', ocr });
const part = (mpn: string, vz: number, extra: Partial<Record<keyof Fields, number>> = {}): ExtractedVariant =>
  ({ mpn, fields: { vzNom: q(vz), ...Object.fromEntries(Object.entries(extra).map(([k, v]) => [k, q(v!)])) } }) as ExtractedVariant;

describe('OCR figures against their series', () => {
  it('leaves out a figure ten times off both neighbours by VZ ("3,5 mA" read as 35)', () => {
    const series = [
      part('RXNX-300', 30, { izt: 0.0035, irMax: 1e-7 }),
      part('RXNX-330', 33, { izt: 0.0035, irMax: 1e-7 }),
      part('RXNX-360', 36, { izt: 0.035, irMax: 1e-7 }),
      part('RXNX-390', 39, { izt: 0.0035, irMax: 1e-7 }),
    ];
    expect(Object.fromEntries(seriesOutliers(series))).toEqual({ 'RXNX-360': ['izt'] });
  });

  it('judges a part at the end of a series by its two nearest, and keeps a series whose figure steps gradually', () => {
    const end = [part('QD-10', 10, { irMax: 5e-6 }), part('QD-12', 12, { irMax: 5e-7 }), part('QD-15', 15, { irMax: 5e-7 })];
    expect(Object.fromEntries(seriesOutliers(end))).toEqual({ 'QD-10': ['irMax'] });
    // Leakage falling 100, 50, 10, 3, 1 µA over the series (steps of up to 5×) is no outlier.
    const falling = [2.4, 3.3, 4.7, 5.6, 6.8].map((vz, i) => part(`QE${vz}`, vz, { irMax: [1e-4, 5e-5, 1e-5, 3e-6, 1e-6][i] }));
    expect(seriesOutliers(falling).size).toBe(0);
    // Values of a text layer (not OCR'd) are never judged here.
    const printed = [part('QF-10', 10), part('QF-12', 12), part('QF-15', 15)].map((v, i) => ({
      ...v,
      fields: { ...v.fields, izt: q([0.02, 0.2, 0.02][i], false) },
    }));
    expect(seriesOutliers(printed).size).toBe(0);
  });

  it('leaves out a leakage test voltage whose share of VZ is far from both neighbours\' ("7,7 V" read as 1.7)', () => {
    const series = [part('FQ10', 10, { vr: 7 }), part('FQ11', 11, { vr: 1.7 }), part('FQ12', 12, { vr: 8.4 }), part('FQ13', 13, { vr: 9.1 })];
    expect(Object.fromEntries(seriesOutliers(series))).toEqual({ FQ11: ['vr'] });
    // Low-voltage parts test leakage at a smaller share of VZ (1 V at 3.3 V, 2 V at 5.1 V): a gradual change stays.
    const low = [part('FQ3V3', 3.3, { vr: 1 }), part('FQ3V9', 3.9, { vr: 1 }), part('FQ4V7', 4.7, { vr: 2 }), part('FQ5V6', 5.6, { vr: 2 })];
    expect(seriesOutliers(low).size).toBe(0);
  });

  it('leaves out a nominal VZ that is not the digits of its part number where the series prints VZ so', () => {
    const series = [part('TM-082', 7.79), part('TM-091', 9.1), part('TM-100', 10)];
    expect(Object.fromEntries(seriesOutliers(series))).toEqual({ 'TM-082': ['vzNom'] });
    // Limits and the leakage test voltage that lost their decimal comma ("20,9" read as 209, "15,4" as 154).
    const limits = (mpn: string, min: number, max: number, vr?: number): ExtractedVariant =>
      ({ mpn, fields: { vzMin: q(min), vzMax: q(max), ...(vr !== undefined ? { vr: q(vr) } : {}) } }) as ExtractedVariant;
    const tkv = [limits('TKV22', 209, 23.1, 154), limits('TKV27', 25.7, 28.4, 18.9), limits('TKV30', 28.5, 31.5, 21), part('TKV33', 33)];
    expect(Object.fromEntries(seriesOutliers(tkv))).toEqual({ TKV22: ['vzMin', 'vr'] });
    // No part read well enough to show the scale: E24 numbers still code VZ in volts or tenths (IEC 60063 E24, from memory).
    const lost = [limits('TKV22', 209, 231), limits('TKV27', 257, 28.4, 189), limits('TKV30', 28.5, 315), limits('TKV33', 313, 347)];
    expect(Object.fromEntries(seriesOutliers(lost))).toEqual({
      TKV22: ['vzMin', 'vzMax'],
      TKV27: ['vzMin', 'vr'],
      TKV30: ['vzMax'],
      TKV33: ['vzMin', 'vzMax'],
    });
    // No scale learnt either, and a minimum read into the nominal's column (53.2 V for GQNP56).
    const shifted = [
      limits('GQNP24', 22.8, 252),
      limits('GQNP27', 25.7, 284),
      limits('GQNP33', 31.4, 347),
      { ...limits('GQNP56', 51, 58.8), fields: { vzNom: q(53.2), vzMax: q(58.8) } } as ExtractedVariant,
    ];
    expect(seriesOutliers(shifted).get('GQNP56')).toEqual(['vzNom']);
    // Two parts whose figures all lost the comma alike agree on "ten volts a unit": no such scale.
    const alike = [limits('TKV22', 209, 231), limits('TKV24', 228, 252), { mpn: 'TKV27', fields: { tjMax: q(423) } } as ExtractedVariant];
    expect(Object.fromEntries(seriesOutliers(alike))).toEqual({ TKV22: ['vzMin', 'vzMax'], TKV24: ['vzMin', 'vzMax'] });
    // A series that does not code VZ in its numbers is not judged by them.
    expect(seriesOutliers([part('KX-101', 7.5), part('KX-102', 8.2), part('KX-103', 9.1)]).size).toBe(0);
    // A package or tolerance letter after the number keeps it the code: "12,6 V" read as 126 V for LCK12W.
    const lck = [part('LCK10W', 10), part('LCK11W', 11), limits('LCK12W', 11.4, 126), part('LCK13W', 13)];
    expect(Object.fromEntries(seriesOutliers(lck))).toEqual({ LCK12W: ['vzMax'] });
  });
});

describe('OCR text around a figure', () => {
  it('doubts a figure with a lone point before it (". 15W" for 1.5 W), not one after a leader or inside a number', () => {
    expect(detachedPoint({ value: '15', text: 'Power dissipation, PD (TA = 25 °C) . 15W' })).toBe(true);
    expect(detachedPoint({ value: '1.5', text: 'Power dissipation, PD (TA = 25 °C) ........ 1.5 W' })).toBe(false);
    expect(detachedPoint({ value: '5', text: 'IR at VR = 3.5 V' })).toBe(false);
  });

  it('mends small letters shaped like their capitals in a part number among capitals, and gives up on others', () => {
    expect(capitalised('FjJF300', ['FJJF330', 'FSDT330', 'FSDT360'])).toBe('FJJF300');
    expect(capitalised('FlJF300', ['FJJF330', 'FSDT330', 'FSDT360'])).toBeNull();
    expect(capitalised('FJJF300', ['FJJF330', 'FSDT330'])).toBeUndefined();
    // Too few capital part numbers beside it to judge.
    expect(capitalised('Zq-5v1', ['Zq-5v6', 'ZQ-6V2'])).toBeUndefined();
    // A small o touching a digit is a zero misread (or read twice), not an O.
    expect(capitalised('GJ0o91', ['GJ082', 'GJ100', 'GJ110'])).toBeNull();
  });
});

describe('an OCR part of a series the document names nowhere else', () => {
  const lines = ['Invented Devices   TJK and TNLS series   DS-1234', 'Type  VZ  IZT', 'TK-16  16  5', 'TNLS-30  30  10', 'TNLS-33  33  10'];
  const parts = (...mpns: string[]) => mpns.map((mpn) => ({ mpn, ocr: true }));

  it('is left out when no other part shares its letters and no other line mentions them (a lost letter: TJK-16 read as TK-16)', () => {
    expect(unnamedSeries(parts('TK-16', 'TNLS-30', 'TNLS-33'), [lines])).toEqual(['TK-16']);
  });

  it('stays when the title, a heading or an ordering code names its series again', () => {
    expect(unnamedSeries(parts('TJK-16', 'TNLS-30', 'TNLS-33'), [lines.map((l) => l.replace('TK-16', 'TJK-16'))])).toEqual([]);
    // Where no series one letter off is named, an ordering code naming it again is enough.
    const untitled = lines.slice(1);
    expect(unnamedSeries(parts('TK-16', 'TNLS-30'), [[...untitled, 'Ordering code TK-16-TR']])).toEqual([]);
    expect(unnamedSeries(parts('TK-16', 'TNLS-30'), [untitled])).toEqual(['TK-16']);
    // Letters one off the title's series (TJK) stay doubtful however often the rows repeat them.
    expect(unnamedSeries(parts('TK-16', 'TNLS-30'), [[...lines, 'Ordering code TK-16-TR']])).toEqual(['TK-16']);
    // Two parts of a series are not enough: with no other line naming TK, both are misreadings alike.
    expect(unnamedSeries(parts('TK-16', 'TK-18'), [[...lines, 'TK-18  18  5']])).toEqual(['TK-16', 'TK-18']);
    // A symbol that starts with the same letters (TKVZ, a coefficient) is no mention of the series.
    expect(unnamedSeries(parts('TK-16', 'TNLS-30', 'TNLS-33'), [[...lines, 'TKVZ  Temperature coefficient']])).toEqual(['TK-16']);
  });

  it('leaves out a whole series whose letters no line but its own rows mentions (NKVO0xx where the title says NKV)', () => {
    const doc = ['Invented Devices   NJS and NKV series', 'NJS039  3.9  5', 'NJS043  4.3  5', 'NKVO043  4.3  20', 'NKVO047  4.7  20', 'NKVO051  5.1  20'];
    expect(unnamedSeries(parts('NJS039', 'NJS043', 'NKVO043', 'NKVO047', 'NKVO051'), [doc])).toEqual(['NKVO043', 'NKVO047', 'NKVO051']);
    const read = doc.map((l) => l.replace(/NKVO/g, 'NKV'));
    expect(unnamedSeries(parts('NJS039', 'NJS043', 'NKV043', 'NKV047', 'NKV051'), [read])).toEqual([]);
    // A scan of the table page alone may name its series only in its rows: kept, unless a series one letter off is named.
    expect(unnamedSeries(parts('NKV043', 'NKV047', 'NKV051'), [read.slice(3)])).toEqual([]);
    // Two capitals are as often a unit, a symbol or an abbreviation as a series: "CB" on the page
    // says nothing about the CBX3 series (the whole series had been left out of a fixture scan).
    const cbx = ['CB  Invented Devices  CBX3 series', 'CBX3-2.4  2.4  5', 'CBX3-2.7  2.7  5', 'CBX3-3.0  3.0  5'];
    expect(unnamedSeries(parts('CBX3-2.4', 'CBX3-2.7', 'CBX3-3.0'), [cbx])).toEqual([]);
  });

  it('counts mentions per reading: the same row read by both OCR readings is still its only mention', () => {
    expect(unnamedSeries(parts('TK-16', 'TNLS-30', 'TNLS-33'), [lines, lines])).toEqual(['TK-16']);
    expect(unnamedSeries(parts('TK-16', 'TNLS-30', 'TNLS-33'), [lines.slice(1), [...lines.slice(1), 'Ordering code TK-16-TR']])).toEqual([]);
    // A row of another misread part (KIM36, in the other reading) is no naming of KIM30's series: the title says KJM.
    const kjm = ['KPB and KJM series', 'KIM30  B2  29.4  30.00'];
    expect(unnamedSeries(parts('KIM30', 'KPB10', 'KPB11'), [kjm, ['KPB and KJM series', 'KJM30  B2  29.4', 'KIM36  B4  36.7']])).toEqual(['KIM30']);
  });

  it('is never applied to a part read from a text layer', () => {
    expect(unnamedSeries([{ mpn: 'TK-16', ocr: false }], [lines])).toEqual([]);
  });
});

describe('the spelling another line gives an OCR part number with a letter beside a digit', () => {
  // The engine reads a printed 0 as "O0", "0o" or "O" and a 1 as "l" or "I" on glyph-set text
  // (seen on rasterised random-layout pages).
  const doc = [
    'GJ and GCA series',
    'GJ082',
    'Ordering code Package Quantity',
    'GJ091)-T7 DO-35 3.000',
    'GJ091K-T7 DO-35 3.000',
    'Example: GCA033] is the 3.3 V type',
  ];
  it('takes the spelling a line of the document names, the tolerance letter kept', () => {
    expect(corroboratedSpelling('GCAO033', doc)).toBe('GCA033');
    expect(corroboratedSpelling('GJ0o91J', doc)).toBe('GJ091J');
    expect(corroboratedSpelling('GJ0o91K', doc)).toBe('GJ091K');
    expect(corroboratedSpelling('GJO82', doc)).toBe('GJ082');
  });
  it('leaves the part as read where no line names a spelling, or where two would fit', () => {
    expect(corroboratedSpelling('GJ0o62J', doc)).toBeUndefined();
    // "GJO91" names GJ091 (O as 0) and GJ91 (O dropped) where both are printed: no choice is made.
    expect(corroboratedSpelling('GJO91', [...doc, 'GJ91 DO-35'])).toBeUndefined();
    // A letter away from any digit is not touched; nor is a part number read cleanly.
    expect(corroboratedSpelling('GOJ082', doc)).toBeUndefined();
    expect(corroboratedSpelling('GJ082', doc)).toBeUndefined();
    // The misread spelling itself is no naming of the other ("GCAO033" names no GCA033).
    expect(corroboratedSpelling('GCAO033', ['GCAO033 SMB', 'GCAO033K-T7'])).toBeUndefined();
  });
});
