import { detectDecimalSeparator, normaliseNumbers } from './number-style';
import { findConditions } from './field-patterns';
import type { PdfText, PdfTextItem } from './pdf-text';
import { findQuantities, unitKind } from './quantity-text';
import { generateRandomDatasheet } from '@shuntwise/test-fixtures';
import { readPdf } from './pdf-text';
import { extractRatings } from './rating-extractor';
import { fieldFor } from './field-patterns';
import { namesAnotherPart } from './block-reader';

/**
 * The pieces that make extraction generalise over layouts, each with small inputs built
 * here. Values and part numbers are invented. Unit notation (µ/μ/u, Ω/Ω/ohm, mV/K, %/°C,
 * K/W, °C/W) and the decimal comma are common practice in datasheets (no source); SI
 * prefixes follow the BIPM SI Brochure, 9th edition (from memory); tolerance limits as
 * VZnom × (1 ∓ tolerance) are common practice (no source).
 */

function item(str: string, x: number, y: number, size = 8, width = str.length * size * 0.5): PdfTextItem {
  return { str, x, y, width, height: size };
}

function pdf(...pages: PdfTextItem[][]): PdfText {
  return { pageCount: pages.length, hasText: true, pages: pages.map((items, i) => ({ page: i + 1, width: 595, height: 842, items })) };
}

function row(y: number, xs: number[], cells: string[]): PdfTextItem[] {
  return cells.map((c, i) => item(c, xs[i], y));
}

describe('the decimal separator of a document', () => {
  it('is the comma when values print "3,6 V" and "0,30 µA"', () => {
    expect(detectDecimalSeparator(['VZ 3,6 V', 'IR 0,30 µA', 'Page 1 of 2'])).toBe(',');
  });

  it('stays the point when the only commas are thousands separators, dates or lists', () => {
    expect(detectDecimalSeparator(['5.1 V', '1,000 pieces per reel', 'issued 01.05.2024', 'IZ = 5, 10 and 20 mA'])).toBe('.');
  });

  it('reads a decimal-comma number in place and never takes "1.000" (a thousand) for 1', () => {
    const text = normaliseNumbers('VZ 3,6 V; reel of 1.000', ',');
    expect(text).toHaveLength('VZ 3,6 V; reel of 1.000'.length);
    expect(findQuantities(text).map((q) => q.value)).toEqual(['3.6']);
    // A signed value is a number; a part number's "-3,6" is not touched.
    expect(normaliseNumbers('TC -0,058 %/K for AB-3,6', ',')).toBe('TC -0.058 %/K for AB-3,6');
  });

  it('returns the value as printed, with its comma, and the SI value', () => {
    const XS = [50, 130, 180, 230];
    const result = extractRatings(
      pdf([
        ...row(700, XS, ['Type', 'VZ nom (V)', 'IR max (µA)', 'VR (V)']),
        ...row(685, XS, ['QK-3V6', '3,6', '0,30', '1,5']),
        ...row(673, XS, ['QK-3V9', '3,9', '0,20', '1,5']),
      ]),
    );
    expect(result.variants[0].fields.vzNom).toMatchObject({ value: '3,6', si: 3.6, method: 'table' });
    expect(result.variants[0].fields.irMax).toMatchObject({ value: '0,30', si: 3e-7 });
  });
});

describe('the physical dimension of a unit decides what a column can be', () => {
  it('classifies the unit spellings datasheets use', () => {
    expect(unitKind('mV/K')).toBe('tempCoVoltage');
    expect(unitKind('mV/°C')).toBe('tempCoVoltage');
    expect(unitKind('%/K')).toBe('tempCoPercent');
    expect(unitKind('%/°C')).toBe('tempCoPercent');
    expect(unitKind('K/W')).toBe('thermalResistance');
    expect(unitKind('°C/W')).toBe('thermalResistance');
    expect(unitKind('\u2126')).toBe('resistance');
    expect(unitKind('ohm')).toBe('resistance');
    expect(unitKind('uA')).toBe('current');
    expect(unitKind('μA')).toBe('current');
  });

  it('takes a current under "IZT" for the test current and refuses a voltage-unit header as an impedance', () => {
    expect(fieldFor('IZT', 'current')).toMatchObject({ field: 'izt' });
    expect(fieldFor('ZZT', 'voltage')).toBeUndefined();
    expect(fieldFor('rzk max', 'resistance')).toMatchObject({ field: 'zzk' });
    expect(fieldFor('UR', 'voltage')).toMatchObject({ field: 'vr' });
  });
});

describe('conditions bound to the value they qualify', () => {
  it('reads "@" after a value as its test condition, by the field of that value', () => {
    expect(findConditions('144 ohm @ 0.25 mA', 'zzk').conditions).toEqual([expect.objectContaining({ field: 'izk', value: '0.25', unit: 'mA' })]);
    expect(findConditions('0.10 uA @ 6.5 V', 'irMax').conditions).toEqual([expect.objectContaining({ field: 'vr', value: '6.5', unit: 'V' })]);
    // What remains to be read is the value itself, never the condition's number.
    expect(findQuantities(findConditions('0.10 uA @ 6.5 V', 'irMax').rest).map((q) => q.value)).toEqual(['0.10']);
  });

  it('keeps the unit printed after the condition with its value ("56.0 @ 0.89 mA V")', () => {
    const rest = findConditions('56.0 @ 0.89 mA V', 'vzNom').rest;
    expect(findQuantities(rest)[0]).toMatchObject({ value: '56.0', unit: 'V' });
  });

  it('never reads the 25 °C of a test condition as the junction temperature', () => {
    const result = extractRatings(
      pdf([
        ...row(760, [50, 130, 180, 230], ['Type', 'VZ nom (V)', 'IZT (mA)', 'ZZT (Ω)']),
        ...row(745, [50, 130, 180, 230], ['RX-5V1', '5.1', '5', '60']),
        ...row(733, [50, 130, 180, 230], ['RX-5V6', '5.6', '5', '40']),
        item('Maximum ratings (Tj = 25 °C unless otherwise noted)', 50, 700, 9, 260),
        ...row(685, [50, 250, 330, 420, 460], ['Power dissipation', 'Ptot', 'TA = 25 °C', '500', 'mW']),
        ...row(673, [50, 250, 420, 460], ['Junction temperature', 'Tj', '150', '°C']),
      ]),
    );
    expect(result.variants[0].fields.pdMax).toMatchObject({ value: '500', si: 0.5 });
    expect(result.variants[0].fields.tjMax).toMatchObject({ value: '150', si: 150 });
  });
});

describe('a series table whose rows lost most of their cells (as a scan can)', () => {
  it('reads a row with two figures left, each under its own header', () => {
    const XS = [53, 96, 134, 169, 210, 256, 300, 355, 414, 462, 510];
    const result = extractRatings(
      pdf([
        ...row(752, XS, ['Type', 'Package', 'Marking', 'VBR Min.', 'VBR Typ.', 'VBR Max.', 'ZZT Max.', 'rzk Max.', 'IR Max.', 'SZ Typ.', 'IZ(max) Max.']),
        ...row(740, [53, 96, 134, 256, 510], ['BH-240', 'MiniMELF', 'N1', '25.2V', '7 mA']),
        ...row(729, [53, 96, 134, 256, 462, 510], ['BH-270', 'MiniMELF', 'N2', '28.4V', '24.3 mV/K', '7 mA']),
      ]),
    );
    const read = Object.fromEntries(result.variants.map((v) => [v.mpn, { vzMax: v.fields.vzMax?.si, izm: v.fields.izm?.si, tc: v.fields.tc?.si }]));
    expect(read).toEqual({ 'BH-240': { vzMax: 25.2, izm: 0.007, tc: undefined }, 'BH-270': { vzMax: 28.4, izm: 0.007, tc: 0.0243 } });
  });
});

describe('a units row whose middle cell a scan could not read', () => {
  // Min / nom / max of one parameter share its unit (common practice for datasheet tables, no source).
  const XS = [52, 142, 178, 210, 249, 285];
  const table = (nomUnit: string, maxUnit: string) =>
    pdf([
      item('Vz @ Izt', 168, 268),
      ...row(268, [52, 249, 285], ['Device', 'Izt', 'Zzt']),
      ...row(258, [142, 178, 210, 285], ['min', 'nom', 'max', 'max']),
      ...row(247, XS.slice(1), ['(V)', nomUnit, maxUnit, '(mA)', '(ohm)']),
      ...row(236, XS, ['QTV3-2.4', '2.28', '2.4', '2.52', '5', '88']),
      ...row(223, XS, ['QTV3-3.3', '3.14', '3.3', '3.47', '5', '59']),
    ]);
  const vz = (r: ReturnType<typeof extractRatings>) =>
    r.variants.map((v) => [v.mpn, v.fields.vzMin?.si, v.fields.vzNom?.si, v.fields.vzMax?.si, v.fields.zzt?.si]);

  it('reads the column in the unit its min and max siblings print ("(VM" between two "(V)")', () => {
    expect(vz(extractRatings(table('(VM', '(V)')))).toEqual([
      ['QTV3-2.4', 2.28, 2.4, 2.52, 88],
      ['QTV3-3.3', 3.14, 3.3, 3.47, 59],
    ]);
  });

  it('reads a column labelled only as a Zener or reverse voltage in volts when the scan lost its lone "V" (common practice, no source)', () => {
    const XS2 = [52, 142, 190, 238, 286, 330, 440, 480];
    const doc = (leakUnit: string) =>
      pdf([
        ...row(268, XS2, ['Type', 'V(BR) min', 'V(BR) nom', 'V(BR) max', 'rzj max', 'Leakage current at VR', 'VRM', 'TC typ']),
        // The units row as a scan left it: "V" lost under the four voltages (and perhaps the leakage's "µA").
        ...row(258, [286, 330, 480], ['ohm', leakUnit, 'mV/K']),
        ...row(247, XS2, ['QTW36', '34.2', '36.0', '37.8', '130', '0.2', '25.2', '36.6']),
        ...row(236, XS2, ['QTW39', '37.1', '39.0', '41.0', '160', '0.2', '27.3', '35.2']),
      ]);
    const read = (r: ReturnType<typeof extractRatings>) =>
      r.variants.map((v) => [v.mpn, v.fields.vzMin?.si, v.fields.vzNom?.si, v.fields.vzMax?.si, v.fields.vr?.si, v.fields.irMax?.si]);
    expect(read(extractRatings(doc('µA')))).toEqual([
      ['QTW36', 34.2, 36, 37.8, 25.2, 2e-7],
      ['QTW39', 37.1, 39, 41, 27.3, 2e-7],
    ]);
    // "Leakage current at VR" names a voltage too, but also a current: with its unit lost it is
    // left unread, never taken for a voltage.
    expect(read(extractRatings(doc('')))).toEqual([
      ['QTW36', 34.2, 36, 37.8, 25.2, undefined],
      ['QTW39', 37.1, 39, 41, 27.3, undefined],
    ]);
  });

  it('borrows no unit when the siblings print different ones', () => {
    const read = vz(extractRatings(table('(VM', '(mV)')));
    expect(read.map((r) => r[2])).toEqual([undefined, undefined]);
  });
});

describe('series-table cells a scan garbled', () => {
  const XS = [52, 111, 155, 199, 244, 300];
  const table = (...rows: string[][]) =>
    pdf([...row(744, XS, ['Type', 'VZ min', 'VZ nom', 'VZ max', 'ZZT max', 'VR']), ...rows.flatMap((cells, i) => row(722 - 10 * i, XS, cells))]);

  it('leaves out a cell holding several figures of one kind (min, nom and max run together)', () => {
    const result = extractRatings(
      table(['GQN24', '22.8V 24.00 V 25.2V', '', '', '53 Ω', '16.8 V'], ['GQN27', '25.7 V', '27.00 V', '28.4 V', '60 Ω', '18.9 V']),
    );
    const v = Object.fromEntries(result.variants.map((x) => [x.mpn, [x.fields.vzMin?.si, x.fields.vzNom?.si, x.fields.vzMax?.si, x.fields.vr?.si]]));
    // The wide cell also merges the three columns for the other rows: what they return must be right.
    expect(v.GQN24).toEqual([undefined, undefined, undefined, 16.8]);
    v.GQN27.forEach((got, i) => expect([undefined, [25.7, 27, 28.4, 18.9][i]]).toContain(got));
    expect(result.warnings.some((w) => /GQN24: "22\.8V 24\.00 V 25\.2V" .* holds several figures/.test(w))).toBe(true);
  });

  it('leaves out a bare figure ending in 0 in a column whose other figures print Ω (a scan read "150 Ω" as 1500)', () => {
    const result = extractRatings(
      pdf([
        ...row(744, XS, ['Type', 'VZ min', 'VZ nom', 'VZ max', 'ZZT (Ω)', 'VR']),
        ...row(722, XS, ['GQE8V2', '7.8 V', '8.20 V', '8.6 V', '150 Ω', '5.7 V']),
        ...row(712, XS, ['GQE9V1', '8.6 V', '9.10 V', '9.6 V', '1500', '6.4 V']),
        ...row(702, XS, ['GQE10', '9.5 V', '10.00 V', '10.5 V', '160Ω', '7 V']),
      ]),
    );
    const zzt = Object.fromEntries(result.variants.map((x) => [x.mpn, x.fields.zzt?.si]));
    expect(zzt).toEqual({ GQE8V2: 150, GQE9V1: undefined, GQE10: 160 });
  });

  it('never takes a row whose part number was lost for the header (its "150 Ω" would give the column its unit)', () => {
    const result = extractRatings(
      table(
        ['', '7.8 V', '8.20 V', '8.6 V', '150 Ω', '5.7 V'],
        ['GQE9V1', '8.6 V', '9.10 V', '9.6 V', '1500', '6.4 V'],
        ['GQE10', '9.5 V', '10.00 V', '10.5 V', '160Ω', '7 V'],
      ),
    );
    const read = Object.fromEntries(result.variants.map((x) => [x.mpn, [x.fields.vzNom?.si, x.fields.zzt?.si]]));
    expect(read).toEqual({ GQE9V1: [9.1, undefined], GQE10: [10, 160] });
  });
});

describe('transposed tables: part numbers as columns', () => {
  const XS = [50, 180, 230, 280, 330];
  it('reads each row by its label and unit, and its condition for every part', () => {
    const result = extractRatings(
      pdf([
        ...row(700, XS, ['Parameter', 'Symbol', 'TV-100', 'TV-110', 'TV-120']),
        ...row(688, XS, ['Zener voltage, nom at IZT = 5 mA (V)', 'VZ', '10.0', '11.0', '12.0']),
        ...row(676, XS, ['Dynamic impedance, max (Ω)', 'ZZT', '20', '22', '25']),
        ...row(664, XS, ['Reverse current, max at VR (µA)', 'IR', '0.2', '0.1', '0.1']),
        item('Package', 50, 652),
        ...row(652, XS.slice(2), ['SOD-123', 'SOD-123', 'SOD-323']),
      ]),
    );
    expect(result.variants.map((v) => v.mpn)).toEqual(['TV-100', 'TV-110', 'TV-120']);
    expect(result.variants[1].fields.vzNom).toMatchObject({ value: '11.0', si: 11, method: 'table' });
    expect(result.variants[1].fields.izt).toMatchObject({ value: '5', si: 0.005 });
    expect(result.variants[2].fields.zzt).toMatchObject({ si: 25 });
    expect(result.variants[0].fields.irMax).toMatchObject({ si: 2e-7 });
    expect(result.variants[2].package).toMatchObject({ value: 'SOD-323' });
  });

  it('reads a value whose footnote mark stands before its unit, and a row whose first figure was lost (its cell holds the unit alone)', () => {
    // As an OCR reading gives them: "15.00 (Note 2)V", and "mA" where "32 mA" was printed.
    const WIDE = [50, 210, 260, 340, 420];
    const result = extractRatings(
      pdf([
        ...row(700, WIDE, ['Parameter', 'Symbol', 'TV-150', 'TV-160', 'TV-180']),
        ...row(688, WIDE, ['Breakdown voltage, nom at Itest = 5 mA', 'VBR', '15.00 (Note 2)V', '16.00 V', 'V']),
        ...row(676, WIDE, ['Maximum regulator current, max', 'IZM', 'mA', '30 mA', '27 mA']),
      ]),
    );
    const fields = Object.fromEntries(result.variants.map((v) => [v.mpn, { vz: v.fields.vzNom?.si, izm: v.fields.izm?.si }]));
    expect(fields).toEqual({ 'TV-150': { vz: 15, izm: undefined }, 'TV-160': { vz: 16, izm: 0.03 }, 'TV-180': { vz: undefined, izm: 0.027 } });
  });

  it('leaves out a bare figure ending in 0 or 2 in a row whose other figures print Ω (a scan read "310 Ω" as 3100)', () => {
    const WIDE = [50, 210, 260, 340, 420, 500];
    const result = extractRatings(
      pdf([
        ...row(700, WIDE, ['Parameter', 'Symbol', 'TV-300', 'TV-330', 'TV-360', 'TV-390']),
        ...row(688, WIDE, ['Dynamic impedance, maximum at IZ = 0.5 mA', 'ZZT', '290 Ω', '3100', '3700', '360 Ω']),
        ...row(676, WIDE, ['Knee impedance, maximum at IZ = 0.25 mA', 'ZZK', '600 Ω', '650 Ω', '700 Ω', '715']),
      ]),
    );
    const read = Object.fromEntries(result.variants.map((v) => [v.mpn, [v.fields.zzt?.si, v.fields.zzk?.si]]));
    // A bare figure ending in another digit stays: nothing says its unit was lost.
    expect(read).toEqual({ 'TV-300': [290, 600], 'TV-330': [undefined, 650], 'TV-360': [undefined, 700], 'TV-390': [360, 715] });
    expect(result.warnings.filter((w) => /lacks the Ω/.test(w))).toHaveLength(2);
  });
});

describe('maximum ratings scoped to the series or package they name', () => {
  it('gives each series its own power rating and leaves a field empty when two values cannot be told apart', () => {
    const XS = [50, 130, 180, 230];
    const result = extractRatings(
      pdf([
        ...row(760, XS, ['Type', 'VZ nom (V)', 'IZT (mA)', 'ZZT (Ω)']),
        ...row(745, XS, ['ABQ5V1', '5.1', '5', '60']),
        ...row(733, XS, ['ABQ5V6', '5.6', '5', '40']),
        ...row(721, XS, ['CDW5V1', '5.1', '20', '10']),
        ...row(709, XS, ['CDW5V6', '5.6', '20', '8']),
        item('Maximum ratings, ABQ series', 50, 680, 10, 150),
        ...row(665, [50, 250, 420], ['Power dissipation', 'Ptot', '500 mW']),
        item('Maximum ratings, CDW series', 50, 640, 10, 150),
        ...row(625, [50, 250, 420], ['Power dissipation', 'Ptot', '1.3 W']),
        item('Thermal resistance junction to ambient RthJA 250 K/W', 50, 600, 9, 240),
        item('Thermal resistance junction to ambient RthJA 300 K/W', 50, 588, 9, 240),
      ]),
    );
    const byMpn = new Map(result.variants.map((v) => [v.mpn, v]));
    expect(byMpn.get('ABQ5V1')!.fields.pdMax).toMatchObject({ si: 0.5 });
    expect(byMpn.get('CDW5V6')!.fields.pdMax).toMatchObject({ si: 1.3 });
    expect(byMpn.get('ABQ5V1')!.fields.rthJA).toBeUndefined();
    expect(result.warnings.some((w) => /rthJA left empty/.test(w))).toBe(true);
  });

  it('reads a series heading that a scan cut into words as the heading: it scopes the ratings under it and ends the part block above', () => {
    // Seen on a fresh scan: "Maximum | ratings, | SKFE | series | (SMB)" was passed over as a table
    // row, so SH-10's block ran on into the SKFE ratings, and each series took the other's.
    const words = (y: number, ...ws: string[]) => {
      let x = 50;
      return ws.map((w) => {
        const it = item(w, x, y);
        x += it.width + 6;
        return it;
      });
    };
    const result = extractRatings(
      pdf([
        ...words(780, 'Maximum', 'ratings,', 'SH', 'series', '(SOT-23)'),
        ...row(768, [50, 300], ['Continuous power dissipation, PZ .......', '250 mW']),
        ...row(756, [50, 300], ['Thermal resistance, RthJA .......', '500 K/W']),
        ...row(730, [50], ['SH-10']),
        ...row(718, [50, 300], ['Working voltage nom., VZ [V] .......', '10']),
        ...row(706, [50, 300], ['Dynamic impedance max., ZZT [Ω] .......', '20']),
        ...words(680, 'Maximum', 'ratings,', 'SKFE', 'series', '(SMB)'),
        ...row(668, [50, 300], ['Continuous power dissipation, PZ .......', '1 W']),
        ...row(656, [50, 300], ['Thermal resistance, RthJA .......', '150 K/W']),
        ...row(630, [50], ['SKFE-43']),
        ...row(618, [50, 300], ['Working voltage nom., VZ [V] .......', '43']),
        ...row(606, [50, 300], ['Dynamic impedance max., ZZT [Ω] .......', '90']),
      ]),
    );
    const byMpn = new Map(result.variants.map((v) => [v.mpn, v]));
    expect(byMpn.get('SH-10')?.fields).toMatchObject({ vzNom: { si: 10 }, pdMax: { si: 0.25 }, rthJA: { si: 500 } });
    expect(byMpn.get('SKFE-43')?.fields).toMatchObject({ vzNom: { si: 43 }, pdMax: { si: 1 }, rthJA: { si: 150 } });
  });

  it("takes no figure from a table beside the ratings on a two-column page (a package outline's Min and Max)", () => {
    // The ratings table in the left column, the outline dimensions in the right: one text line each.
    const cell = (str: string, x: number, y: number) => item(str, x, y, 7, str.length * 3);
    const line = (y: number, xs: number[], cells: string[]) => cells.map((c, i) => cell(c, xs[i], y));
    const XS = [52, 137, 154, 218, 270, 310, 365, 415];
    const result = extractRatings(
      pdf([
        ...line(800, [50, 110, 160, 210], ['Type', 'Package', 'VZ nom (V)', 'IZT (mA)']),
        ...line(788, [50, 110, 160, 210], ['QRT12', 'DO-35', '12', '2']),
        ...line(776, [50, 110, 160, 210], ['QRT13', 'DO-35', '13', '2']),
        item('Maximum ratings, DO-35 package', 50, 761, 9, 120),
        item('Package outline DO-35 (mm)', 308, 761, 9, 100),
        ...line(747, XS, ['Parameter', 'Symbol', 'Conditions', 'Value', 'Unit', 'Dim.', 'Min', 'Max']),
        ...line(735, XS, ['Continuous power dissipation', 'Pd', 'TA = 25 °C', '200 (Note 1)', 'mW', 'A', '0.95', '1.35']),
        ...line(723, XS, ['Maximum junction temperature', 'TJ', '', '175', '°C', 'b', '0.45', '0.65']),
      ]),
    );
    // Before: 1.35 "mW", the outline's maximum of dimension A under the ratings' unit.
    expect(result.variants.find((v) => v.mpn === 'QRT12')?.fields).toMatchObject({ pdMax: { si: 0.2 }, tjMax: { si: 175 } });
  });
});

describe('the package of a part whose table gives none', () => {
  // Ratings per package, a package outline for one of them and ordering codes for some parts
  // (a layout seen in a fresh random batch, where every part took the outline's package and its ratings).
  const XS = [50, 130, 180, 230];
  const doc = (withOrdering: boolean) =>
    pdf([
      ...row(760, XS, ['Type', 'VZ nom (V)', 'IZT (mA)', 'ZZT (Ω)']),
      ...row(745, XS, ['KQB-068', '6.8', '1', '91']),
      ...row(733, XS, ['KQB-075W', '7.5', '1', '77']),
      ...row(721, XS, ['KQB-082', '8.2', '1', '82']),
      item('Maximum ratings, SOD-523 package', 50, 690, 10, 170),
      item('Continuous power dissipation, PD ........ 500 mW', 50, 675, 9, 300),
      item('Maximum ratings, SOD-323 package', 50, 650, 10, 170),
      item('Continuous power dissipation, PD ........ 400 mW', 50, 635, 9, 300),
      ...(withOrdering
        ? [
            ...row(610, [50, 150, 250], ['Ordering code', 'Package', 'Packing']),
            ...row(598, [50, 150, 250], ['KQB-068-T7', 'SOD-523', '7 in reel']),
            ...row(586, [50, 150, 250], ['KQB-075W-T7', 'SOD-323', '7 in reel']),
          ]
        : []),
      item('Package outline SOD-323 (mm)', 50, 560, 10, 150),
    ]);
  const read = (r: ReturnType<typeof extractRatings>) => Object.fromEntries(r.variants.map((v) => [v.mpn, [v.package?.value, v.fields.pdMax?.si]]));

  it('is not the one a package outline names while the ratings name two packages', () => {
    expect(read(extractRatings(doc(false)))).toEqual({
      'KQB-068': [undefined, undefined],
      'KQB-075W': [undefined, undefined],
      'KQB-082': [undefined, undefined],
    });
  });

  it("is the one its ordering code names, and brings that package's ratings", () => {
    expect(read(extractRatings(doc(true)))).toEqual({
      'KQB-068': ['SOD-523', 0.5],
      'KQB-075W': ['SOD-323', 0.4],
      'KQB-082': [undefined, undefined],
    });
  });
});

describe('tolerance given by a part-number letter with a legend', () => {
  it('makes one variant per letter with VZ limits derived from VZnom, marked as derived', () => {
    const XS = [50, 130, 180, 230];
    const result = extractRatings(
      pdf([
        ...row(760, XS, ['Type', 'VZ nom (V)', 'IZT (mA)', 'ZZT (Ω)']),
        ...row(745, XS, ['LGX10', '10', '5', '20']),
        ...row(733, XS, ['LGX12', '12', '5', '25']),
        item('Tolerance of VZ: the letter after the type number gives it (B ±2 %, C ±5 %).', 50, 700, 9, 330),
      ]),
    );
    expect(result.variants.map((v) => v.mpn)).toEqual(['LGX10B', 'LGX10C', 'LGX12B', 'LGX12C']);
    const c = result.variants[1];
    expect(c.fields.vzMin).toMatchObject({ si: 9.5, derived: 'tolerance-suffix' });
    expect(c.fields.vzMax).toMatchObject({ si: 10.5, derived: 'tolerance-suffix' });
    expect(c.fields.vzNom).toMatchObject({ si: 10 });
    expect(c.fields.vzNom!.derived).toBeUndefined();
  });

  it('reads a legend wrapped in the right-hand column beside other text, its last percentage on the next line', () => {
    const XS = [50, 130, 180, 230];
    const result = extractRatings(
      pdf([
        ...row(760, XS, ['Type', 'VZ nom (V)', 'IZT (mA)', 'ZZT (Ω)']),
        ...row(745, XS, ['LGW56', '56', '20', '130']),
        ...row(733, XS, ['LGW62', '62', '20', '140']),
        // Left column: a part's heading; right column, on the same baselines, the legend wrapped after "C ±5".
        item('Package: SOD-123F (TA = 25 °C)', 50, 700, 9, 150),
        item('Tolerance of VZ: the letter after the type number gives it (A ±1 %, B ±2 %, C ±5', 300, 700, 9, 280),
        item('Marking on the body', 50, 689, 9, 100),
        item('%). Example: LGW56A is the 56 V type with ±1 %.', 300, 689, 9, 200),
      ]),
    );
    expect(result.variants.map((v) => v.mpn)).toEqual(['LGW56A', 'LGW56B', 'LGW56C', 'LGW62A', 'LGW62B', 'LGW62C']);
    expect(result.variants[2].fields.vzMin).toMatchObject({ si: 53.2, derived: 'tolerance-suffix' });
  });

  it("never reads the legend's example as a rating of the part whose block it sits in, even when a lost word splits the line", () => {
    // One part per block; the VZ row's figure is missing (as an OCR reading can lose it), and the
    // legend line is cut in two where its first percentage was lost: "… (A | %, B ±2 % …) Example: QRN220A is the 22 V".
    const result = extractRatings(
      pdf([
        item('QRN240', 50, 760, 10, 40),
        ...row(740, [50, 130, 230], ['Zener current at test', 'IZT', '5 mA']),
        ...row(728, [50, 130], ['Zener voltage', 'VZ']),
        item('Tolerance of VZ: the letter after the type number gives it (A', 50, 700, 9, 260),
        item('%, B ±2 %, C ±5 %). Example: QRN220A is the 22 V', 330, 700, 9, 220),
      ]),
    );
    const values = result.variants.flatMap((v) => Object.values(v.fields).map((f) => f.si));
    expect(values).not.toContain(22);
    expect(result.variants.every((v) => v.fields.vzNom === undefined)).toBe(true);
  });
});

describe('a line inside a part’s block that names another part', () => {
  it('is not read for this part; the part itself, a suffixed type or an ordering code of it still is', () => {
    expect(namesAnotherPart('Example: QRN220A is the 22 V', 'QRN240')).toBe(true);
    expect(namesAnotherPart('Zener voltage QRN240B 24 V', 'QRN240')).toBe(false);
    expect(namesAnotherPart('Ordering code QRN240-TR', 'QRN240')).toBe(false);
    expect(namesAnotherPart('Package SOD-123, VZ 24 V at IZT = 5 mA', 'QRN240')).toBe(false);
    expect(namesAnotherPart('Rth(j-a) 625 K/W, IZ(K) 0.25 mA', 'QRN240')).toBe(false);
  });
});

describe('a part heading with its test conditions in brackets', () => {
  it('starts the part\'s block when a scan read its words as four cells or more ("QRN6V8 | (IZT = | 1 | mA)")', () => {
    const block = (mpn: string, y: number, vz: string, zz: string) => [
      ...row(y, [50, 95, 130, 142], [mpn, '(IZT =', '1', 'mA)']),
      ...row(y - 12, [50, 200, 215], ['Breakdown voltage Typ., VBR', vz, 'V']),
      ...row(y - 24, [50, 200, 215], ['Differential resistance Max., rzj', zz, 'ohm']),
    ];
    const result = extractRatings(pdf([...block('QRN6V8', 700, '6.8', '76'), ...block('QRN7V5', 640, '7.5', '73')]));
    const [a, b] = ['QRN6V8', 'QRN7V5'].map((m) => result.variants.find((v) => v.mpn === m));
    // Each part keeps its own figures and the condition of its heading (the 76 Ω and 73 Ω no longer meet in one block).
    expect(a?.fields).toMatchObject({ vzNom: { si: 6.8 }, zzt: { si: 76 }, izt: { si: 0.001 } });
    expect(b?.fields).toMatchObject({ vzNom: { si: 7.5 }, zzt: { si: 73 }, izt: { si: 0.001 } });
  });
});

describe('a parameter-table row whose test condition lost its figure (as a scan can lose it)', () => {
  // Seen on a fresh scan: "IZ = 2,6 mA" read as "IZ = | mA" gave a Zener voltage row's figures, and
  // a coefficient's, as the test current; "VRM = 16,8 V" read as "VRM = | V" gave a leakage of
  // 0.5 µA as a test voltage of 0.5 V.
  it("keeps the lost condition out of the row: its symbol names no field and its unit is not the row's", () => {
    const xs = [50, 80, 200, 270, 310, 350, 390];
    const result = extractRatings(
      pdf([
        ...row(760, [50], ['XQ24']),
        ...row(748, xs, ['Symbol', 'Parameter', 'Conditions', 'Min.', 'Typ.', 'Max.', 'Unit']),
        ...row(736, [50, 80, 200, 226, 270, 310, 350, 390], ['UZ', 'Zener voltage', 'IZ =', 'mA', '22.8', '24.0', '25.2', 'V']),
        ...row(724, [50, 80, 200, 226, 310, 390], ['SZ', 'Temperature coefficient', 'IZ =', 'mA', '+0.089', '%/K']),
        ...row(712, [50, 80, 200, 230, 350, 390], ['IR', 'Reverse leakage current', 'VRM =', 'V', '0.5', 'µA']),
        ...row(700, [50, 80, 200, 226, 350], ['UZ', 'Zener voltage', 'IZ =', 'mA', '25.2']),
      ]),
    );
    const part = result.variants.find((v) => v.mpn === 'XQ24');
    expect(part?.fields.izt).toBeUndefined();
    expect(part?.fields.vr).toBeUndefined();
    expect(part?.fields).toMatchObject({ vzMin: { si: 22.8 }, vzNom: { si: 24 }, vzMax: { si: 25.2 }, irMax: { si: 0.5e-6 } });
  });

  it('still reads a whole condition beside the row', () => {
    const xs = [50, 80, 200, 270, 310, 350, 390];
    const result = extractRatings(
      pdf([
        ...row(760, [50], ['XQ24']),
        ...row(748, xs, ['Symbol', 'Parameter', 'Conditions', 'Min.', 'Typ.', 'Max.', 'Unit']),
        ...row(736, xs, ['UZ', 'Zener voltage', 'IZ = 2.6 mA', '22.8', '24.0', '25.2', 'V']),
        ...row(724, [50, 80, 200, 350, 390], ['IR', 'Reverse leakage current', 'VRM = 16.8 V', '0.5', 'µA']),
      ]),
    );
    expect(result.variants.find((v) => v.mpn === 'XQ24')?.fields).toMatchObject({
      izt: { si: 0.0026 },
      vr: { si: 16.8 },
      vzNom: { si: 24 },
      irMax: { si: 0.5e-6 },
    });
  });
});

describe('a list value with a footnote mark run into it (as a scan can read "+14.5 (2)")', () => {
  it('leaves out a figure with a closing bracket after it and no opening one, and reads the others', () => {
    const result = extractRatings(
      pdf([
        ...row(760, [50], ['KF-160']),
        ...row(748, [50, 260], ['Zener voltage nom., VZ [V] ........', '16']),
        ...row(736, [50, 260], ['Voltage temperature coefficient typ., αVZ [mV/°C] ....', '+14.52)']),
        ...row(724, [50, 260], ['Dynamic resistance max., rzj [ohm] ........', '85 (2)']),
      ]),
    );
    const part = result.variants.find((v) => v.mpn === 'KF-160');
    expect(part?.fields.tc).toBeUndefined();
    expect(part?.fields).toMatchObject({ vzNom: { si: 16 }, zzt: { si: 85 } });
  });
});

describe('a Zener-voltage line without its qualifier where the document qualifies its VZ lines', () => {
  // Each part's block prints VZ as min., nom. and max. lines (common practice, no source). A scan
  // can lose the "min." of one line; the figure left over is the minimum, not the nominal.
  const block = (mpn: string, y: number, lines: Array<[string, string]>) => [
    item(mpn, 50, y, 10, 40),
    ...lines.flatMap(([label, value], i) => row(y - 12 * (i + 1), [50, 220], [label, value])),
  ];
  const qualified = (mpn: string, y: number, [min, nom, max]: string[]) =>
    block(mpn, y, [
      ['Zener voltage min., UZ', min],
      ['Zener voltage nom., UZ', nom],
      ['Zener voltage max., UZ', max],
    ]);

  it('is not returned as the nominal unless its own block brackets it with a qualified minimum and maximum', () => {
    const result = extractRatings(
      pdf([
        ...qualified('QRN43', 760, ['40.9 V', '43 V', '45.2 V']),
        // "min." lost; the block's nominal line was not read at all (as on a fresh scan).
        ...block('QRN47', 680, [
          ['Zener voltage, UZ', '44.7 V'],
          ['Leakage current max., IR', '0.05 µA'],
        ]),
        // "min." lost beside a qualified maximum.
        ...block('QRN51', 620, [
          ['Zener voltage, UZ', '48.5 V'],
          ['Zener voltage max., UZ', '53.6 V'],
        ]),
      ]),
    );
    const fields = (mpn: string) => result.variants.find((v) => v.mpn === mpn)?.fields;
    expect(fields('QRN43')).toMatchObject({ vzMin: { si: 40.9 }, vzNom: { si: 43 }, vzMax: { si: 45.2 } });
    expect(fields('QRN47')?.vzNom).toBeUndefined();
    expect(fields('QRN51')?.vzNom).toBeUndefined();
    expect(fields('QRN51')?.vzMax?.si).toBe(53.6);
  });

  it("stands as the nominal where the document prints VZ unqualified, or between its block's qualified minimum and maximum", () => {
    const plain = extractRatings(
      pdf([
        ...block('QRN51', 700, [
          ['Zener voltage, UZ', '5.1 V'],
          ['Leakage current max., IR', '2 µA'],
        ]),
        ...block('QRN56', 640, [
          ['Zener voltage, UZ', '5.6 V'],
          ['Leakage current max., IR', '1 µA'],
        ]),
      ]),
    );
    expect(plain.variants.map((v) => v.fields.vzNom?.si)).toEqual([5.1, 5.6]);
    const bracketed = extractRatings(
      pdf(
        block('QRN56', 600, [
          ['Zener voltage min., UZ', '5.32 V'],
          ['Zener voltage, UZ', '5.6 V'],
          ['Zener voltage max., UZ', '5.88 V'],
        ]),
      ),
    );
    expect(bracketed.variants[0].fields).toMatchObject({ vzMin: { si: 5.32 }, vzNom: { si: 5.6 }, vzMax: { si: 5.88 } });
  });
});

describe("a part block that runs into the next part's (its heading lost, as a scan can lose it)", () => {
  const block = (mpn: string | null, y: number, vz: string, zz: string) => [
    ...(mpn ? [item(mpn, 50, y, 10, 40)] : []),
    ...row(y - 12, [50, 220], ['Package', 'DO-35']),
    ...row(y - 24, [50, 220], ['Zener voltage nominal, VZ', vz]),
    ...row(y - 36, [50, 220], ['Dynamic impedance maximum, ZZT', zz]),
  ];
  it('ends at a second package line or a second Zener-voltage line of the same kind, so the part keeps only its own figures', () => {
    // QRN082's own VZ figure was lost; QRN091's heading was lost, so its lines follow QRN082's.
    const lostVz = extractRatings(pdf([...block('QRN082', 700, '', '16 Ω'), ...block(null, 640, '9.1 V', '17 Ω')]));
    const a = lostVz.variants.find((v) => v.mpn === 'QRN082');
    expect(a?.fields.vzNom).toBeUndefined();
    expect(a?.fields.zzt?.si).toBe(16);
    // Without package lines, the second nominal Zener voltage ends the block.
    const noPackage = (mpn: string | null, y: number, vz: string, zz: string) => block(mpn, y, vz, zz).filter((i) => i.str !== 'Package' && i.str !== 'DO-35');
    const both = extractRatings(pdf([...noPackage('QRN082', 700, '8.2 V', '16 Ω'), ...noPackage(null, 640, '9.1 V', '17 Ω')]));
    expect(both.variants.find((v) => v.mpn === 'QRN082')?.fields).toMatchObject({ vzNom: { si: 8.2 }, zzt: { si: 16 } });
  });
});

describe('ratings in prose', () => {
  it('reads a part paragraph clause by clause, conditions included', () => {
    const result = extractRatings(
      pdf([
        item('SQN120, SOD-123: VZ is 12 V nominal (11.4 V to 12.6 V) measured at IZT = 5 mA.', 50, 700, 9, 360),
        item('ZZT does not exceed 30 ohm. IR is 0.1 µA maximum at VR = 8.4 V; SZ is 9.2 mV/K typical.', 50, 688, 9, 360),
      ]),
    );
    const v = result.variants[0];
    expect(v.mpn).toBe('SQN120');
    expect(v.fields.vzNom).toMatchObject({ si: 12, method: 'sentence' });
    expect(v.fields.vzMin).toMatchObject({ si: 11.4 });
    expect(v.fields.vzMax).toMatchObject({ si: 12.6 });
    expect(v.fields.izt).toMatchObject({ si: 0.005 });
    expect(v.fields.zzt).toMatchObject({ si: 30 });
    expect(v.fields.irMax).toMatchObject({ si: 1e-7 });
    expect(v.fields.vr).toMatchObject({ si: 8.4 });
    expect(v.fields.tc).toMatchObject({ si: 0.0092 });
    expect(v.package).toMatchObject({ value: 'SOD-123' });
  });

  it('reads a bracketed range as the limits, never as the nominal, when the nominal before it was not read', () => {
    // Seen on a scan: "UZ is 2.70 (2) V nominal (2.57 V to 2.84 V)" lost its garbled nominal, and 2.57 V became VZnom.
    const result = extractRatings(
      pdf([
        item('NWR2V7, SOT-23: UZ is V nominal (2.57 V to 2.84 V) measured at IT = 1 mA.', 50, 700, 9, 360),
        item('ZZ does not exceed 330 ohm. ID is 200 µA maximum at VRM = 1 V.', 50, 688, 9, 360),
      ]),
    );
    const v = result.variants[0];
    expect(v.fields.vzNom).toBeUndefined();
    expect(v.fields).toMatchObject({ vzMin: { si: 2.57 }, vzMax: { si: 2.84 }, zzt: { si: 330 } });
  });

  it('never takes the letters of a part number for a qualifier ("The MAX3V6 regulates at 3.60 V" is the nominal)', () => {
    const result = extractRatings(
      pdf([
        item('The MAX3V6 (DO-35) regulates at 3.60 V when driven at 5 mA; its differential resistance there is at most 42 Ω.', 50, 700, 9, 420),
        item('The MINA4V7 (DO-35) regulates at 4.70 V when driven at 5 mA; its differential resistance there is at most 30 Ω.', 50, 680, 9, 420),
      ]),
    );
    const read = result.variants.map((v) => [v.mpn, v.fields.vzMin?.si, v.fields.vzNom?.si, v.fields.vzMax?.si, v.fields.izt?.si]);
    expect(read).toEqual([
      ['MAX3V6', undefined, 3.6, undefined, 0.005],
      ['MINA4V7', undefined, 4.7, undefined, 0.005],
    ]);
  });

  it('leaves a worked example full of numbers alone', () => {
    const result = extractRatings(
      pdf([item('Design example: supply 24 V, load 5 mA, R = (24 V − 12 V) / 15 mA ≈ 800 Ω; the diode dissipates 180 mW.', 50, 700, 9, 420)]),
    );
    expect(result.variants).toEqual([]);
  });
});

describe('a page turned by 90°', () => {
  it('is read in the frame of its text: every part of a rotated series table is found', async () => {
    // A generated datasheet (test-fixtures random layouts) whose characteristics page is drawn turned by 90°.
    const { pdf: bytes, answers } = await generateRandomDatasheet(4242, { orientation: 'rotated', arrangement: 'rows', pageColumns: 1, tolerance: 'min-max' });
    const text = await readPdf(new Uint8Array(bytes));
    const result = extractRatings(text);
    const found = new Set(result.variants.map((v) => v.mpn));
    for (const v of answers.variants) expect(found.has(v.mpn)).toBe(true);
  });

  it('keeps the few turned rows of a continuation page under an upright running header and footer', async () => {
    // Generated datasheet 1608789731: the TMC table continues on page 3 with three turned rows,
    // fewer characters than the page's upright header and footer.
    const { pdf: bytes, answers } = await generateRandomDatasheet(1608789731);
    const text = await readPdf(new Uint8Array(bytes));
    const onPage3 = answers.variants.filter((v) => Object.values(v.fields).some((f) => f?.page === 3)).map((v) => v.mpn);
    expect(onPage3.length).toBeGreaterThanOrEqual(3);
    const found = new Set(extractRatings(text).variants.map((v) => v.mpn));
    for (const mpn of onPage3) expect(found.has(mpn)).toBe(true);
  });
});
