import type { PdfText, PdfTextItem } from './pdf-text';
import { extractRatings } from './rating-extractor';

/**
 * Layout cases the fixture PDFs do not cover, built as positioned text the way pdfjs
 * reports it (x, y baseline in points). Values are invented; unit notation is common
 * practice (no source).
 */

function item(str: string, x: number, y: number, size = 8, width = str.length * size * 0.5): PdfTextItem {
  return { str, x, y, width, height: size };
}

function pdf(...pages: PdfTextItem[][]): PdfText {
  return { pageCount: pages.length, hasText: true, pages: pages.map((items, i) => ({ page: i + 1, width: 595, height: 842, items })) };
}

/** One table row: cells at the given x positions. */
function row(y: number, xs: number[], cells: string[]): PdfTextItem[] {
  return cells.map((c, i) => item(c, xs[i], y));
}

const XS = [50, 130, 180, 230, 280, 330, 380];

describe('reading series tables from positioned text', () => {
  it('joins subscripts to their symbol and words that pdfjs hands over one by one', () => {
    const header = [
      item('Part', 50, 700),
      item('number', 69, 700),
      // "VZ" printed as V with a lowered, smaller Z, as many datasheets do.
      item('V', 130, 700),
      item('Z', 134.5, 698.5, 6, 3),
      item('min', 140, 700),
      item('V', 180, 700),
      item('Z', 184.5, 698.5, 6, 3),
      item('max', 190, 700),
      item('I', 230, 700),
      item('ZT', 233, 698.5, 6, 6),
      item('Z', 280, 700),
      item('ZT', 284.5, 698.5, 6, 6),
      item('(V)', 130, 690),
      item('(V)', 180, 690),
      item('(mA)', 230, 690),
      item('(ohm)', 280, 690),
    ];
    const result = extractRatings(
      pdf([...header, ...row(675, XS, ['XQ7-5V1', '4.85', '5.36', '5', '60']), ...row(663, XS, ['XQ7-6V2', '5.89', '6.51', '5', '10'])]),
    );
    expect(result.variants.map((v) => v.mpn)).toEqual(['XQ7-5V1', 'XQ7-6V2']);
    const v = result.variants[0];
    expect(v.fields.vzMin).toMatchObject({ value: '4.85', unit: 'V', si: 4.85 });
    expect(v.fields.vzMax).toMatchObject({ value: '5.36', unit: 'V' });
    expect(v.fields.izt).toMatchObject({ value: '5', unit: 'mA', si: 0.005 });
    expect(v.fields.zzt).toMatchObject({ value: '60', unit: 'ohm', si: 60 });
    expect(v.fields.vzNom).toBeUndefined();
  });

  it('continues a table on the next page without a header, and never takes an ordering table for ratings', () => {
    const header = row(700, XS, ['Type', 'VZ nom (V)', 'IZT (mA)', 'ZZT (Ω)', 'IR (µA)', 'VR (V)']);
    const page1 = [...header, ...row(685, XS, ['KLM-3V3', '3.3', '5', '95', '5', '1']), ...row(673, XS, ['KLM-3V6', '3.6', '5', '90', '5', '1'])];
    const page2 = [
      item('Vendor running header', 50, 810, 10, 120),
      ...row(780, XS, ['KLM-3V9', '3.9', '5', '90', '3', '1']),
      ...row(768, XS, ['KLM-4V3', '4.3', '5', '90', '3', '1']),
      // An ordering table further down: part numbers and numbers, but no ratings in its header.
      ...row(600, XS, ['Part number', 'Reel (in)', 'Pieces', 'Tape (mm)']),
      ...row(585, XS, ['KLM-3V3-T7', '7', '3000', '8']),
      ...row(573, XS, ['KLM-3V6-T7', '7', '3000', '8']),
    ];
    const result = extractRatings(pdf(page1, page2));
    expect(result.variants.map((v) => v.mpn)).toEqual(['KLM-3V3', 'KLM-3V6', 'KLM-3V9', 'KLM-4V3']);
    const v = result.variants[3];
    expect(v.fields.vzNom).toMatchObject({ value: '4.3', unit: 'V', page: 2 });
    expect(v.fields.zzt).toMatchObject({ unit: 'Ω', si: 90 });
    expect(v.fields.irMax).toMatchObject({ unit: 'µA', si: 3e-6 });
  });

  it("does not give a table's header to rows of another series below it whose own header was not read", () => {
    // The second table's header is garbled (a scan): its rows must not take the first table's test current.
    const page1 = [
      ...row(700, XS, ['Type', 'VZ nom (V)', 'IZT (mA)', 'ZZT (Ω)', 'IR (µA)', 'VR (V)']),
      ...row(685, XS, ['KLM-3V3', '3.3', '5', '95', '5', '1']),
      ...row(673, XS, ['KLM-3V6', '3.6', '5', '90', '5', '1']),
    ];
    const page2 = [
      item('Electrical characteristics, PRQ series (IZT = 2.5 mA)', 50, 810, 10, 260),
      item('~ ;; ee', 50, 795),
      ...row(780, XS, ['PRQ-39', '39', '2.5', '130', '0.5', '27']),
      ...row(768, XS, ['PRQ-43', '43', '2.5', '130', '0.5', '30']),
      item('Ordering information', 50, 700),
      // The same series further on continues the same table.
      ...row(600, XS, ['KLM-3V9', '3.9', '5', '90', '3', '1']),
    ];
    const result = extractRatings(pdf(page1, page2));
    expect(result.variants.map((v) => v.mpn)).toEqual(['KLM-3V3', 'KLM-3V6', 'KLM-3V9']);
    expect(result.variants[2].fields.izt).toMatchObject({ si: 0.005, page: 2 });
  });

  it('leaves a %/K coefficient empty with a warning when the variant has no nominal voltage', () => {
    const items = [...row(700, XS, ['Type', 'VZ min (V)', 'VZ max (V)', 'IZT (mA)', 'TC (%/K)']), ...row(685, XS, ['PQR-12', '11.4', '12.6', '5', '+0.075'])];
    const result = extractRatings(pdf(items));
    expect(result.variants[0].fields.tc).toBeUndefined();
    expect(result.variants[0].fields.vzMin).toMatchObject({ si: 11.4 });
    expect(result.warnings).toEqual([expect.stringMatching(/PQR-12: the temperature coefficient is given in %\/K but no nominal Zener voltage/)]);
  });

  it('skips a dash, which datasheets print for "not specified", and warns about a cell it cannot read', () => {
    const items = [
      ...row(700, XS, ['Type', 'VZ nom (V)', 'IZT (mA)', 'ZZK (Ω)', 'IZK (mA)']),
      ...row(685, XS, ['STU-5V1', '5.1', '5', '–', '–']),
      ...row(673, XS, ['STU-5V6', '5.6', '5', 'see note', '1']),
    ];
    const result = extractRatings(pdf(items));
    expect(result.variants[0].fields.zzk).toBeUndefined();
    expect(result.variants[0].fields.izk).toBeUndefined();
    expect(result.variants[1].fields.zzk).toBeUndefined();
    expect(result.variants[1].fields.izk).toMatchObject({ si: 0.001 });
    expect(result.warnings).toEqual([expect.stringMatching(/STU-5V6: "see note" under "ZZK \(Ω\)" on page 1 is not a number/)]);
  });

  it('says so when a text PDF holds no recognisable ratings', () => {
    const result = extractRatings(pdf([item('Application note: layout of shunt regulators', 50, 700, 10, 240)]));
    expect(result.variants).toEqual([]);
    expect(result.warnings).toEqual([expect.stringMatching(/No part numbers with ratings were recognised/)]);
  });
});

describe('two-column pages', () => {
  it('reads the left column before the right one where their lines sit side by side, and keeps a table across the page whole', () => {
    // Left column: prose and a key–value block; right column: the same kind of block for
    // another part, its baselines 6 pt off the left ones. Below, a table across the page.
    const left: PdfTextItem[] = [];
    const right: PdfTextItem[] = [];
    const leftLines = [
      'XA5V1',
      'Zener voltage, nom. VZ (V) .......... 5.1',
      'Test current IZT (mA) .............. 5',
      'Dynamic impedance, max. ZZT (Ω) .... 60',
      'Notes on use of the part',
      'more prose here',
      'and a little more',
      'and the end',
    ];
    const rightLines = [
      'XA6V2',
      'Zener voltage, nom. VZ (V) .......... 6.2',
      'Test current IZT (mA) .............. 4',
      'Dynamic impedance, max. ZZT (Ω) .... 10',
      'Notes on the other part',
      'more prose there',
      'and the end',
    ];
    leftLines.forEach((t, i) => left.push(item(t, 50, 700 - 14 * i)));
    rightLines.forEach((t, i) => right.push(item(t, 310, 694 - 12 * i)));
    const table = [
      item('Maximum ratings', 50, 574),
      ...row(560, [50, 200, 330], ['Parameter', 'Symbol', 'Value']),
      ...row(548, [50, 200, 330], ['Power dissipation', 'Ptot', '500 mW']),
      ...row(536, [50, 200, 330], ['Junction temperature', 'Tj', '150 °C']),
    ];
    const result = extractRatings(pdf([...left, ...right, ...table]));
    const byMpn = new Map(result.variants.map((v) => [v.mpn, v.fields]));
    // Invented values; a mix of the two columns would give XA5V1 the 6.2 V of its neighbour.
    expect(byMpn.get('XA5V1')?.vzNom?.si).toBe(5.1);
    expect(byMpn.get('XA5V1')?.zzt?.si).toBe(60);
    expect(byMpn.get('XA6V2')?.vzNom?.si).toBe(6.2);
    expect(byMpn.get('XA6V2')?.izt?.si).toBeCloseTo(0.004, 12);
    expect(byMpn.get('XA6V2')?.zzt?.si).toBe(10);
    // The table across the page below is read as one row per rating (the part read last, in the right column, takes it).
    expect(byMpn.get('XA6V2')?.pdMax?.si).toBe(0.5);
    expect(byMpn.get('XA6V2')?.tjMax?.si).toBe(150);
  });

  it('finds the columns when their lines share baselines, a title and a footer run across the page, and few lines stand alone', () => {
    // Both columns set on one 12 pt pitch: most baselines hold text on both sides; three lines
    // of each column stand alone. Reading across would give XB5V1 the right column's 47 V.
    const items: PdfTextItem[] = [item('Voltage regulator diodes, 4.7 V to 47 V, a title across the page', 50, 760, 8, 330)];
    const leftLines = [
      'Silicon planar regulator diodes for reference',
      'and bias circuits across the whole range',
      'of nominal voltages in E24 steps',
      'Features',
      '• Nominal voltages 4.7 V to 47 V',
      '• Reflow up to 260 °C',
      '• Lead-free plating',
      'drift upwards.',
      'end of notes',
    ];
    const rightLines = [
      'XB5V1',
      'Package ........................ SOD-523',
      'Zener voltage, VZ ............. 5.1 V',
      'Dynamic resistance, rZ ....... 60 ohm',
      'XB47',
      'Package ........................ SOD-323',
      'Zener voltage, VZ ............. 47 V',
      'Dynamic resistance, rZ ....... 120 ohm',
      'Measured with pulses of 20 ms',
    ];
    leftLines.forEach((t, i) => items.push(item(t, 50, 730 - 12 * i, 8, Math.min(230, t.length * 4))));
    rightLines.forEach((t, i) => items.push(item(t, 308, 694 - 12 * i, 8, Math.min(230, t.length * 4))));
    items.push(item('Invented Devices. Specifications are subject to change without notice.', 50, 29, 8, 330));
    const result = extractRatings(pdf(items));
    const byMpn = new Map(result.variants.map((v) => [v.mpn, v.fields]));
    expect(byMpn.get('XB5V1')?.vzNom?.si).toBe(5.1);
    expect(byMpn.get('XB5V1')?.zzt?.si).toBe(60);
    expect(byMpn.get('XB47')?.vzNom?.si).toBe(47);
    expect(byMpn.get('XB47')?.zzt?.si).toBe(120);
  });

  it('finds two columns of the same kind set on one pitch from top to bottom, where no line of either stands alone', () => {
    // Each column holds one part's key–value block; every baseline has text on both sides.
    // Read across, XC5V1's lines would run on into XC6V2's.
    const items: PdfTextItem[] = [];
    const block = (mpn: string, vz: string, zz: string) => [
      mpn,
      'Package ..................... SOD-123',
      `Zener voltage, VZ ............ ${vz} V`,
      `Dynamic impedance, ZZT ....... ${zz} ohm`,
      'Test current, IZT ............ 5 mA',
      'Reverse current, IR .......... 2 µA',
      'Reverse voltage, VR .......... 1 V',
      'Maximum current, IZM ......... 80 mA',
      'Notes: pulsed measurement',
      'Marking on the body',
    ];
    block('XC5V1', '5.1', '60').forEach((t, i) => items.push(item(t, 50, 700 - 12 * i, 8, Math.min(220, t.length * 4))));
    block('XC6V2', '6.2', '10').forEach((t, i) => items.push(item(t, 310, 700 - 12 * i, 8, Math.min(220, t.length * 4))));
    const result = extractRatings(pdf(items));
    const byMpn = new Map(result.variants.map((v) => [v.mpn, v.fields]));
    expect(byMpn.get('XC5V1')?.vzNom?.si).toBe(5.1);
    expect(byMpn.get('XC5V1')?.zzt?.si).toBe(60);
    expect(byMpn.get('XC6V2')?.vzNom?.si).toBe(6.2);
    expect(byMpn.get('XC6V2')?.zzt?.si).toBe(10);
  });

  it('puts the gutter left of a part heading that starts a little before the symbols of its table', () => {
    // Two parts' parameter tables side by side on a landscape page, then one on its own: the
    // right column's headings start at 431, its symbols (centred) at 443.6–447.6.
    const items: PdfTextItem[] = [];
    const cell = (str: string, x: number, y: number) => items.push(item(str, x, y, 7, str.length * 3.5));
    const part = (x: number, y: number, mpn: string, vz: string[], zz: string) => {
      cell(mpn, x, y);
      cell('Package: SOD-523', x, y - 11);
      [
        ['Symbol', 5],
        ['Parameter', 63],
        ['Conditions', 135],
        ['minimum', 185],
        ['typical', 240],
        ['maximum', 287],
        ['Unit', 332],
      ].forEach(([t, dx]) => cell(t as string, x + (dx as number), y - 23));
      [
        ['VZ', 15.6],
        ['Working voltage', 40],
        ['Itest = 5 mA', 131],
        [vz[0], 195],
        [vz[1], 233],
        [vz[2], 298],
        ['V', 337],
      ].forEach(([t, dx]) => cell(t as string, x + (dx as number), y - 35));
      [
        ['rzj', 15.6],
        ['Differential resistance', 40],
        ['Itest = 5 mA', 131],
        [zz, 301],
        ['Ω', 337],
      ].forEach(([t, dx]) => cell(t as string, x + (dx as number), y - 47));
      [
        ['IR', 16.6],
        ['Reverse leakage current', 40],
        ['UR = 4.8 V', 131],
        ['5', 303],
        ['uA', 335],
      ].forEach(([t, dx]) => cell(t as string, x + (dx as number), y - 59));
      [
        ['αVZ', 12.6],
        ['Temperature coefficient', 40],
        ['Itest = 5 mA', 131],
        ['0.021', 229],
        ['%/K', 333],
      ].forEach(([t, dx]) => cell(t as string, x + (dx as number), y - 71));
    };
    part(60, 546, 'QNC-6V8', ['6.46', '6.8', '7.14'], '16');
    part(431, 546, 'QNC-10', ['9.5', '10.0', '10.5'], '17');
    part(60, 449, 'QNC-7V5', ['7.13', '7.5', '7.88'], '17');
    part(431, 449, 'QNC-11', ['10.5', '11.0', '11.6'], '19');
    part(60, 351, 'QNC-8V2', ['7.79', '8.2', '8.61'], '16');
    const result = extractRatings({ pageCount: 1, hasText: true, pages: [{ page: 1, width: 842, height: 595, items }] });
    const read = Object.fromEntries(result.variants.map((v) => [v.mpn, [v.fields.vzNom?.si, v.fields.zzt?.si]]));
    expect(read).toEqual({ 'QNC-6V8': [6.8, 16], 'QNC-10': [10, 17], 'QNC-7V5': [7.5, 17], 'QNC-11': [11, 19], 'QNC-8V2': [8.2, 16] });
  });
});
