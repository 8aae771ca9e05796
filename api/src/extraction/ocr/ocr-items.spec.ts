import { mergeReadings, readingQuality, type OcrLine, type OcrWord } from './ocr-engine';
import { codedVoltage, implausibleValues, misreadPartNumbers } from './ocr-extraction';
import { legendSigns, ocrItems, repairOcrWord, skewOf, unitsRow } from './ocr-items';
import { pageBody, withoutSidewaysMargins } from './page-ocr';
import { withSecondRead } from './segmented-reading';

/**
 * The repairs and checks applied to OCR output. The misreadings are the ones the English
 * model makes on scanned datasheets (seen on rasterised fixture pages: µ as H/p/y, Ω as Q,
 * − as '=', a decimal point as ':', IZT as 1ZT).
 */
describe('repairOcrWord', () => {
  it.each([
    ['=1.7', '-1.7'],
    ['—0.57', '-0.57'],
    ['2:52', '2.52'],
    ['0;25', '0.25'],
    ['2:57.', '2.57'],
    ['(Q)', '(Ω)'],
    ['(kQ)', '(kΩ)'],
    ['(HA)', '(µA)'],
    ['(pA)', '(µA)'],
    ['[pA]', '[µA]'],
    ['[Q]', '[Ω]'],
    ['10HA', '10µA'],
    ['25Q', '25Ω'],
    ['(Vv)', '(V)'],
    ['UA', 'µA'],
    ['0.5UA', '0.5µA'],
    ['[UA]', '[µA]'],
    ['MA', 'mA'],
    ['2MA', '2mA'],
    ['[MA]', '[mA]'],
    ['(MA)', '(mA)'],
    ['MAX', 'MAX'],
    ['1ZT', 'IZT'],
    ['1IZT', 'IZT'],
    ['lZK', 'IZK'],
    ['(1ZT', '(IZT'],
    ['(I1ZT', '(IZT'],
    ['1Z(K)', 'IZ(K)'],
    ['1Z', 'IZ'],
    ['mv/°C', 'mV/°C'],
    ['+2.4mv/K', '+2.4mV/K'],
    ['Vv', 'V'],
    ['v', 'V'],
    ['aVvVZ', 'αVZ'],
    ['BRZ05-2Vv7', 'BRZ05-2V7'],
    ['BRZ05-2v4', 'BRZ05-2V4'],
    ['SOD-123', 'SOD-123'],
    ['150', '150'],
  ])('%s → %s', (raw, fixed) => {
    expect(repairOcrWord(raw)).toBe(fixed);
  });

  it.each(['234]', '3:1]', '1.2|3'])('does not trust a number with stray marks: %s', (raw) => {
    expect(repairOcrWord(raw)).toBeUndefined();
  });
});

describe('repairOcrWord: power, thermal and temperature units', () => {
  it('reads "mw" as mW, "K/wW" as K/W and a copyright sign as °C, alone or glued to the figure', () => {
    expect(['mw', '300mw', 'K/wW', 'K/w', '(©', '©', '°c'].map(repairOcrWord)).toEqual(['mW', '300mW', 'K/W', 'K/W', '°C', '°C', '°C']);
    // Nothing else changes: a lone W, mA and ordinary words stay as read.
    expect(['W', 'mA', 'Cc', 'wW'].map(repairOcrWord)).toEqual(['W', 'mA', 'Cc', 'wW']);
  });
});

describe('ocrItems', () => {
  const word = (text: string, x0: number, confidence = 95) => ({ text, confidence, x0, y0: 0, x1: x0 + 60, y1: 30 });
  // A line tilted by 1°: its baseline climbs 35 px over 2000 px (tan 1° ≈ 0.01746).
  const tilted = (y: number, words: OcrLine['words']): OcrLine => ({ baseline: { x0: 200, y0: y, x1: 2200, y1: y + 34.9 }, rowHeight: 33, words });
  const geometry = { scale: 300 / 72, widthPx: 2480, heightPx: 3508, pageHeight: 841.89 };

  it('measures the skew from the long baselines', () => {
    expect(skewOf([tilted(500, []), tilted(600, [])], 500)).toBeCloseTo((1 * Math.PI) / 180, 3);
  });

  it('puts a tilted row back on one baseline in PDF points and keeps its columns in line with the next row', () => {
    const items = ocrItems(
      [tilted(500, [word('BRZ05-5V1', 200), word('5.1', 1000), word('5', 2000)]), tilted(550, [word('BRZ05-5V6', 200), word('5.6', 1000)])],
      geometry,
    );
    const row1 = items.slice(0, 3);
    expect(new Set(row1.map((i) => i.y)).size).toBe(1);
    expect(row1[0].y).toBeGreaterThan(items[3].y);
    // 1000 px at 300 dpi is 240 pt (72 pt per inch); both rows' 5.x cells stay within a point of each other.
    expect(Math.abs(items[1].x - items[4].x)).toBeLessThan(1);
    expect(items[0].height).toBeCloseTo(33 / (300 / 72), 1);
  });

  it('leaves out unsure numbers but keeps unsure header units and symbols, repaired', () => {
    const items = ocrItems([tilted(500, [word('(Q)', 200, 30), word('1ZT', 400, 20), word('5.1', 600, 60), word('Type', 800, 30)])], geometry);
    expect(items.map((i) => i.str)).toEqual(['(Ω)', 'IZT']);
  });

  it('reads a figure run together with its condition\'s "@" as the figure, the sign and the condition, each in its share of the box', () => {
    // Seen on a scanned leader list: "8,2 @ 2 mA" came out as "8,2@" and "2", "32 @ 2 mA" as one word.
    const items = ocrItems(
      [tilted(500, [word('8,2@', 1000), word('2', 1100), word('mA', 1200)]), tilted(600, [{ ...word('32@2mA', 1000), x1: 1120 }])],
      geometry,
    );
    expect(items.map((i) => i.str)).toEqual(['8.2', '@', '2', 'mA', '32', '@', '2mA']);
    const px = (i: number) => items[i].x * (300 / 72);
    expect(px(5) - px(4)).toBeCloseTo(40, 0);
    expect(px(6) - px(5)).toBeCloseTo(20, 0);
    // A glued word that lost its points ("02@105V" for "0.2 @ 10.5 V") stays whole and is refused.
    expect(ocrItems([tilted(500, [word('02@105V', 1000)])], geometry).map((i) => i.str)).toEqual([]);
    // An unsure glued figure is still left out; its condition alone carries no value.
    expect(ocrItems([tilted(500, [word('8,2@', 1000, 60)])], geometry).map((i) => i.str)).toEqual(['@']);
  });
});

describe('plausibility of OCR voltages', () => {
  const v = (si: number) => ({ value: String(si), unit: 'V', si, page: 1, text: '', ocr: true });

  it('reads the voltage code of a part number (5V1 = 5.1 V, common practice for regulator diodes, no source)', () => {
    expect(codedVoltage('BRZ05-5V1')).toBe(5.1);
    expect(codedVoltage('NMZ-03V6')).toBe(3.6);
    expect(codedVoltage('QHZ4V7A')).toBe(4.7);
    expect(codedVoltage('LVD1-033')).toBeUndefined();
  });

  it('drops a leakage of a milliampere or more, or under a nanoampere (a lost µ, or µ read as p; regulator leakage is nA to a few hundred µA, common practice, from memory)', () => {
    expect(implausibleValues('BRZ05-5V1', { vzNom: v(5.1), irMax: v(0.5) })).toEqual(['irMax']);
    expect(implausibleValues('BRZ05-5V1', { vzNom: v(5.1), irMax: v(1e-12) })).toEqual(['irMax']);
    expect(implausibleValues('BRZ05-5V1', { vzNom: v(5.1), irMax: v(2e-6) })).toEqual([]);
    expect(implausibleValues('BRZ05-5V1', { vzNom: v(5.1), irMax: v(5e-9) })).toEqual([]);
  });

  it('drops a VZ that lost its decimal point, a VR above VZ and an out-of-order VZ set', () => {
    expect(implausibleValues('BRZ05-5V1', { vzMin: v(4.85), vzNom: v(51), vzMax: v(5.36) })).toEqual(['vzNom']);
    expect(implausibleValues('BRZ05-7V5', { vzNom: v(7.5), vr: v(53) })).toEqual(['vr']);
    // The limits agree with each other; the nominal ten times off them goes alone.
    expect(implausibleValues('CBX3-4.3', { vzMin: v(4.09), vzNom: v(43), vzMax: v(4.52) })).toEqual(['vzNom']);
    // Out of order within the tolerance band: which one is wrong is not known, all go.
    expect(implausibleValues('CBX3-4.3', { vzMin: v(4.52), vzNom: v(4.3), vzMax: v(4.09) }).sort()).toEqual(['vzMax', 'vzMin', 'vzNom']);
    expect(implausibleValues('BRZ05-5V1', { vzMin: v(4.85), vzNom: v(5.1), vzMax: v(5.36), vr: v(2) })).toEqual([]);
    // No VZ read: the voltage coded in the part number bounds VR.
    expect(implausibleValues('SCA-8V2', { vr: v(57) })).toEqual(['vr']);
    expect(implausibleValues('SCA-8V2', { vr: v(5.7) })).toEqual([]);
  });

  it('drops a VZ limit more than 1.25× from the others: a tolerance beyond about ±20 % is a lost separator (common practice for regulator diodes, no source)', () => {
    // No voltage code in these part numbers, so only the limits bound each other.
    expect(implausibleValues('WP15W', { vzMin: v(14.7), vzNom: v(15), vzMax: v(153) })).toEqual(['vzMax']);
    expect(implausibleValues('WP15W', { vzMin: v(1.47), vzNom: v(15), vzMax: v(15.3) })).toEqual(['vzMin']);
    expect(implausibleValues('WP15W', { vzNom: v(15), vzMax: v(153) }).sort()).toEqual(['vzMax', 'vzNom']);
    expect(implausibleValues('WP15W', { vzMin: v(1.47), vzNom: v(15), vzMax: v(153) }).sort()).toEqual(['vzMax', 'vzMin', 'vzNom']);
    // ±20 %, the widest tolerance in use, stays.
    expect(implausibleValues('WP15W', { vzMin: v(12), vzNom: v(15), vzMax: v(18) })).toEqual([]);
    // A value typed from a text layer is not OCR's to drop.
    expect(implausibleValues('WP15W', { vzMin: v(14.7), vzNom: v(15), vzMax: { ...v(153), ocr: false } })).toEqual([]);
  });

  it('drops a temperature coefficient beyond ±0.15 %/K of VZ', () => {
    const tc = (si: number) => ({ value: '', unit: 'mV/°C', si, page: 1, text: '', ocr: true });
    expect(implausibleValues('BRZ05-3V6', { vzNom: v(3.6), tc: tc(-0.014) })).toEqual(['tc']);
    expect(implausibleValues('BRZ05-3V6', { vzNom: v(3.6), tc: tc(-0.0014) })).toEqual([]);
    // No VZ read: the part number's code bounds it; with neither, it is left out (a lost decimal comma makes it 10× too large).
    expect(implausibleValues('BRZ05-3V6', { tc: tc(-0.0014) })).toEqual([]);
    expect(implausibleValues('KPB12', { tc: tc(0.087) })).toEqual(['tc']);
  });

  it('drops a negative value of any field but the coefficient (an equals sign read as a minus; only the coefficient has a sign, common practice, no source)', () => {
    const a = (si: number) => ({ value: '', unit: 'A', si, page: 1, text: '', ocr: true });
    const tc = (si: number) => ({ value: '', unit: 'mV/K', si, page: 1, text: '', ocr: true });
    expect(implausibleValues('TH-8V2', { vzNom: v(8.2), vr: v(-5.3), izt: a(-0.005), tc: tc(-0.002) }).sort()).toEqual(['izt', 'vr']);
    expect(implausibleValues('TH-8V2', { vzNom: v(8.2), vr: v(5.3), izt: a(0.005) })).toEqual([]);
  });

  it('drops a dynamic impedance whose product with the test current exceeds VZ (a lost point: "3.5 Ω" read as 35; ZZT × IZT is a few tenths of a volt, common practice, no source)', () => {
    const f = (si: number, unit: string) => ({ value: String(si), unit, si, page: 1, text: '', ocr: true });
    expect(implausibleValues('MCC3V9', { vzNom: v(3.9), izt: f(0.13, 'A'), zzt: f(35, 'Ω') })).toEqual(['zzt']);
    expect(implausibleValues('MCC3V9', { vzNom: v(3.9), izt: f(0.13, 'A'), zzt: f(3.5, 'Ω') })).toEqual([]);
    // A high-voltage part at a low test current: 350 Ω × 2.5 mA = 0.875 V, well under 100 V.
    expect(implausibleValues('MCC100', { vzNom: v(100), izt: f(0.0025, 'A'), zzt: f(350, 'Ω') })).toEqual([]);
  });

  it('drops a figure printed with a leading zero and no separator (a decimal comma the scan lost: "05" for 0,5 µA)', () => {
    const ua = (value: string, si: number) => ({ value, unit: 'uA', si, page: 1, text: '', ocr: true });
    expect(implausibleValues('VPK-240', { vzNom: v(24), irMax: ua('05', 5e-6) })).toEqual(['irMax']);
    expect(implausibleValues('VPK-240', { vzNom: v(24), irMax: ua('0,5', 5e-7) })).toEqual([]);
    // "0" alone is no lost separator, though a leakage of nothing is no rating either (under a nanoampere).
    expect(implausibleValues('VPK-240', { vzNom: v(24), irMax: ua('0', 0) })).toEqual(['irMax']);
    expect(implausibleValues('VPK-240', { vzNom: v(24), irMax: ua('10', 1e-5) })).toEqual([]);
  });

  it('drops the power rating and thermal resistance when they disagree with Tj max: Pd = (Tj max − TA) / RthJA (common practice, no source)', () => {
    const q = (si: number, unit: string, text = '') => ({ value: String(si), unit, si, page: 1, text, ocr: true });
    // (150 − 25) °C / 63 K/W = 1.98 W: 2 W fits, 1 W (a "2" misread) does not.
    const fields = (pd: number, text = 'Total power dissipation, Ptot (TA = 25 °C)') => ({
      pdMax: q(pd, 'W', text),
      rthJA: q(63, '°C/W'),
      tjMax: q(150, '°C'),
    });
    expect(implausibleValues('TM-082', fields(2))).toEqual([]);
    expect(implausibleValues('TM-082', fields(1)).sort()).toEqual(['pdMax', 'rthJA']);
    expect(implausibleValues('TM-082', fields(20)).sort()).toEqual(['pdMax', 'rthJA']);
    // At TA = 50 °C: (150 − 50) / 63 = 1.59 W.
    expect(implausibleValues('TM-082', fields(1.6, 'Ptot at TA = 50 °C'))).toEqual([]);
    // Rated at the lead or case temperature: RthJA does not bound it; nor is it bounded without Tj max.
    expect(implausibleValues('TM-082', fields(5, 'Ptot (TL = 75 °C)'))).toEqual([]);
  });

  it('drops currents out of order (IZK < IZT ≤ IZM) and a test current whose power IZT × VZ exceeds the rating (common practice, no source)', () => {
    const q = (si: number, unit: string) => ({ value: String(si), unit, si, page: 1, text: '', ocr: true });
    const ma = (x: number) => q(x / 1000, 'mA');
    // 36 V at 3.5 mA is 126 mW of a 500 mW part; "35" mA would be 1.26 W.
    expect(implausibleValues('RXNX-360', { vzNom: v(36), izt: ma(3.5), izk: ma(1), izm: ma(13), pdMax: q(0.5, 'W') })).toEqual([]);
    expect(implausibleValues('RXNX-360', { vzNom: v(36), izt: ma(35), pdMax: q(0.5, 'W') })).toEqual(['izt']);
    expect(implausibleValues('RXNX-360', { vzNom: v(36), izt: ma(35), izm: ma(13) }).sort()).toEqual(['izm', 'izt']);
    expect(implausibleValues('RXNX-360', { vzNom: v(36), izt: ma(3.5), izk: ma(5) }).sort()).toEqual(['izk', 'izt']);
  });
});

describe('merging the block and sparse readings of a page', () => {
  const word = (text: string, x0: number, confidence: number, y0 = 100): OcrWord => ({ text, confidence, x0, y0, x1: x0 + 40, y1: y0 + 20 });
  const line = (words: OcrWord[]): OcrLine => ({ words, baseline: { x0: words[0].x0, y0: 118, x1: words[words.length - 1].x1, y1: 118 }, rowHeight: 24 });

  it('adds the words only the sparse reading found to the line they sit on, and keeps the surer of two readings of one word', () => {
    const block = [line([word('(V)', 0, 30), word('(ohm)', 200, 90)])];
    const sparse = [line([word('(V)', 2, 92), word('(mA)', 100, 88), word('(ohm)', 201, 60)])];
    const merged = mergeReadings(block, sparse);
    expect(merged).toHaveLength(1);
    expect(merged[0].words.map((w) => `${w.text}:${w.confidence}`)).toEqual(['(V):92', '(mA):88', '(ohm):90']);
    // The first reading itself is not changed.
    expect(block[0].words[0].confidence).toBe(30);
  });

  it('gives a word far from every line a line of its own', () => {
    const merged = mergeReadings([line([word('Type', 0, 95)])], [line([word('5', 300, 90, 400)])]);
    expect(merged).toHaveLength(2);
    expect(merged[1].words[0].text).toBe('5');
  });
});

describe('a tolerance legend read by OCR', () => {
  it("reads a plus before a tolerance letter's percentage as ±, and nowhere else", () => {
    const read = (text: string) => legendSigns(text.split(' ')).join(' ');
    expect(read('gives it (A ±1 %, B +2 %, C ±5 %).')).toBe('gives it (A ±1 %, B ±2 %, C ±5 %).');
    expect(read('B +2%')).toBe('B ±2%');
    expect(read('Vcc +5 % and A +2 V')).toBe('Vcc +5 % and A +2 V');
  });
});

describe('a units row read by OCR', () => {
  const row = (text: string) => unitsRow(text.split(' ').map(repairOcrWord));
  it('reads the lone letters the engine makes of a unit as that unit, in a row of units only', () => {
    expect(row('Vv Y Vv 0 µA Vv %/°C mA')).toEqual(['V', 'V', 'V', 'Ω', 'µA', 'V', '%/°C', 'mA']);
    expect(row('v Vv kQ (pA)')).toEqual(['V', 'V', 'kΩ', '(µA)']);
    // Not a units row: a lone Y or 0 elsewhere stays as read.
    expect(row('Type Y 0 12')).toEqual(['Type', 'Y', '0', '12']);
    expect(row('Y 0 V')).toEqual(['Y', '0', 'V']);
  });
});

describe('part numbers misread by OCR', () => {
  // Invented part numbers; regulator series code VZ as 5V1 or as a plain number (common practice, no source).
  it('leaves out a part number with a character inserted into the shape its series shares', () => {
    const read = ['QZ4VT7A', 'QZ5V1AF', 'QZ5V6A', 'QZ6V2AF', 'QZ6V8A', 'QZ10A', 'QZ12AF', 'QZ15A'];
    expect(misreadPartNumbers(read)).toEqual(['QZ4VT7A']);
    // Two rows read as one line.
    expect(misreadPartNumbers(['VLY-30', 'VLY-33', 'VLY-39VLY-43', 'VLY-43'])).toEqual(['VLY-39VLY-43']);
    expect(misreadPartNumbers(['VLY-30', 'VLY-39VLY-43'])).toEqual(['VLY-39VLY-43']);
    // A series' letter lost: a lone part whose letters are one edit from a series of two or more.
    expect(misreadPartNumbers(['KJM33', 'KJM36', 'KM36', 'KJM39', 'KJM43'])).toEqual(['KM36']);
    // A 5 read as S after the voltage code's V: the part read right is in the list too.
    expect(misreadPartNumbers(['NA6V8', 'NA7V5', 'NA7VS', 'NA8V2'])).toEqual(['NA7VS']);
    expect(misreadPartNumbers(['KM36', 'KJM39', 'KJM43'])).toEqual(['KM36']);
    expect(misreadPartNumbers(['KPB12', 'KPB13', 'KPB15', 'KJM39', 'KJM43', 'KJM47'])).toEqual([]);
  });

  it('leaves out a part number with a digit read as the letter it looks like (SC1S for SC15)', () => {
    // Read back as digits, it is another part of the list, or the shape two or more of the series share.
    expect(misreadPartNumbers(['SC13', 'SC15', 'SC1S', 'SC16'])).toEqual(['SC1S']);
    expect(misreadPartNumbers(['SC12', 'SC13', 'SC1S', 'SC16'])).toEqual(['SC1S']);
    expect(misreadPartNumbers(['TX1O', 'TX11', 'TX12'])).toEqual(['TX1O']);
    // A suffix letter the series carries (B tolerance, G packing) is no misreading.
    expect(misreadPartNumbers(['QZ5V1B', 'QZ5V6B', 'QZ6V2B', 'QZ6V8B'])).toEqual([]);
    expect(misreadPartNumbers(['KDZ10G', 'KDZ12G', 'KDZ15G'])).toEqual([]);
    // An O or I between digits: a digit misread or read twice (GJ091J read as GJ0O91J).
    expect(misreadPartNumbers(['GJ082J', 'GJ082K', 'GJ0O91J', 'GJ0O91K'])).toEqual(['GJ0O91J', 'GJ0O91K']);
  });

  it("leaves out part numbers that lost their series' hyphen, even when several lost it alike", () => {
    const read = ['VPK-180', 'VPK-200', 'VPK-220', 'VPK-240', 'VPK270', 'VPK-300', 'VPK330', 'VPK360', 'VPK-390', 'VPK-430'];
    expect(misreadPartNumbers(read)).toEqual(['VPK270', 'VPK330', 'VPK360']);
    // Half and half: which is the series' own shape is not known, nothing is left out.
    expect(misreadPartNumbers(['VPK-180', 'VPK-200', 'VPK-220', 'VPK240', 'VPK270', 'VPK300'])).toEqual([]);
    // A point between digits is the voltage code's own: whole volts beside tenths lost nothing.
    const codes = ['CBX3-2.4', 'CBX3-2.7', 'CBX3-3.0', 'CBX3-3.3', 'CBX3-8.2', 'CBX3-9.1', 'CBX3-10', 'CBX3-11'];
    expect(misreadPartNumbers(codes)).toEqual([]);
  });

  it('keeps series that mix plain numbers with letter-for-point codes, and series too small to judge', () => {
    expect(misreadPartNumbers(['QZ4V7A', 'QZ5V1A', 'QZ10A', 'QZ12A', 'QZ100A'])).toEqual([]);
    expect(misreadPartNumbers(['QZ10A', 'QZ12A', 'QZ15A', 'QZ18A', 'QZ100A'])).toEqual([]);
    expect(misreadPartNumbers(['QZ4VT7A', 'QZ5V1A'])).toEqual([]);
  });
});

describe('whether a page reads as turned', () => {
  const word = (text: string, y: number, confidence = 95) => ({ text, confidence, x0: 100, y0: y - 10, x1: 200, y1: y + 10 });
  const line = (...words: ReturnType<typeof word>[]) => ({ words, baseline: { x0: 0, y0: words[0].y1, x1: 1000, y1: words[0].y1 }, rowHeight: 20 });
  // A 3 508-pixel-high page (A4 at 300 dpi): an upright running header and footer, and a sideways table in between read as noise.
  const header = line(...['Invented', 'Diode', 'Company', 'series', 'DS-6877', 'Rev.'].map((t) => word(t, 150)));
  const footer = line(...['Invented', 'Diode', 'Company', 'Specifications', 'subject', 'change', 'without', 'notice', 'Page'].map((t) => word(t, 3400)));
  const noise = Array.from({ length: 30 }, (_, i) => line(word(['£', '©', 'oO', 'NNN'][i % 4], 400 + i * 90, 70)));

  it('is judged on the page body alone: a well-read header and footer do not make a sideways table look upright', () => {
    const reading = [header, ...noise, footer];
    expect(readingQuality(reading)).toBeGreaterThanOrEqual(15);
    const body = pageBody(reading, 3508);
    expect(body.flatMap((l) => l.words.map((w) => w.text))).not.toContain('Company');
    expect(readingQuality(body)).toBeLessThan(15);
  });

  it('keeps every line of the body', () => {
    const text = line(...['Zener', 'voltage', 'nominal'].map((t) => word(t, 1500)));
    expect(pageBody([header, text, footer], 3508)).toEqual([text]);
  });
});

describe('a turned page read in the frame of its sideways table', () => {
  // An A4 page turned to landscape at 300 dpi: 3 508 pixels wide. Its upright header and footer
  // now stand on end in the left and right bands and come out as scraps at the ends of rows.
  const word = (text: string, x: number) => ({ text, confidence: 80, x0: x, y0: 990, x1: x + 12 * text.length, y1: 1010 });
  const line = (...words: ReturnType<typeof word>[]) => ({ words, baseline: { x0: words[0].x0, y0: 1010, x1: 3400, y1: 1010 }, rowHeight: 20 });
  const texts = (lines: ReturnType<typeof line>[]) => lines.map((l) => l.words.map((w) => w.text).join(' '));

  it('drops the scraps of the sideways header and footer at the start and end of a row', () => {
    const row = line(word('g', 115), word('SNF082', 262), word('SOD-323', 445), word('8.20V', 875), word('230Ω', 1540), word('=)', 3355));
    expect(texts(withoutSidewaysMargins([row], 3508))).toEqual(['SNF082 SOD-323 8.20V 230Ω']);
    // A line of scraps alone goes altogether.
    expect(withoutSidewaysMargins([line(word('[Ω]', 120))], 3508)).toEqual([]);
  });

  it("keeps the table's own words that reach into a band, and short words inside it", () => {
    const row = line(word('continued', 200), word('on', 330), word('N1', 640), word('Ω', 1700));
    expect(texts(withoutSidewaysMargins([row], 3508))).toEqual(['continued on N1 Ω']);
  });
});

describe('a small-print figure read without its decimal point', () => {
  const read = (confidence: number, ...texts: string[]): OcrLine[] => [
    {
      baseline: { x0: 0, y0: 20, x1: 100, y1: 20 },
      rowHeight: 20,
      words: texts.map((text, i) => ({ text, confidence, x0: i * 50, y0: 0, x1: i * 50 + 40, y1: 20 })),
    },
  ];
  const reading = (...texts: string[]) => read(90, ...texts);
  const text = (ls: OcrLine[]) => ls.flatMap((l) => l.words.map((w) => w.text)).join(' ');
  it('takes the enlarged reading when it is the same figure with a separator between its digits', async () => {
    expect(text(await withSecondRead(reading('680V'), async () => reading('6.80V')))).toBe('6.80V');
    expect(text(await withSecondRead(reading('71v'), async () => reading('7.1V')))).toBe('7.1V');
    expect(text(await withSecondRead(reading('48', 'V'), async () => reading('4,8', 'V')))).toBe('4,8 V');
  });

  it('keeps the first reading when the enlarged one differs in anything else, or has no separator either', async () => {
    expect(text(await withSecondRead(reading('99', 'Ω'), async () => reading('8.9', 'Q')))).toBe('99 Ω');
    expect(text(await withSecondRead(reading('59V'), async () => reading('59V')))).toBe('59V');
    expect(text(await withSecondRead(reading('680V'), async () => reading('6.81V')))).toBe('680V');
  });

  it('takes the surer of two alike readings of an unsure figure, and never an unlike one', async () => {
    const confidence = (ls: OcrLine[]) => ls[0].words[0].confidence;
    expect(confidence(await withSecondRead(read(57, '6.80V'), async () => read(87, '6.80V')))).toBe(87);
    expect(confidence(await withSecondRead(read(57, '6.80V'), async () => read(40, '6.80V')))).toBe(57);
    expect(text(await withSecondRead(read(57, '6.80V'), async () => read(95, '6.30V')))).toBe('6.80V');
    // Without a separator a surer reading is no better: "105V" may be 10.5 V either way (seen on a scan).
    expect(confidence(await withSecondRead(read(60, '105V'), async () => read(90, '105V')))).toBe(60);
  });

  it('does not read again a sure figure that has its separator, a label, or a row of several words', async () => {
    const again = jest.fn(async () => reading('1.0'));
    for (const first of [reading('6.2V'), reading('Zener'), reading('10', 'to', '20'), reading('5')]) await withSecondRead(first, again);
    expect(again).not.toHaveBeenCalled();
  });
});
