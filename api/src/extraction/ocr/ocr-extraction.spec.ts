import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { OcrEngine, OcrLine } from './ocr-engine';
import { extractWithOcr, leaveOut } from './ocr-extraction';

/**
 * The OCR path's own checks, with the engine replaced by one that "reads" given lines from the
 * committed image-only fixture (test-fixtures/bad-uploads/scanned.pdf), so the rules are tested
 * apart from what Tesseract makes of a page. Part numbers and values are invented.
 */

const scanned = readFileSync(join(__dirname, '../../../../test-fixtures/bad-uploads/scanned.pdf'));

/** A line of words at a baseline (image pixels, 300 dpi: 4.17 px per point), each word sure. */
function line(y: number, ...cells: Array<[number, string]>): OcrLine {
  const words = cells.flatMap(([x, text]) => {
    let at = x;
    return text.split(' ').map((w) => {
      const word = { text: w, confidence: 95, x0: at, y0: y - 30, x1: at + w.length * 17, y1: y };
      at = word.x1 + 12;
      return word;
    });
  });
  return { words, baseline: { x0: words[0].x0, y0: y, x1: words[words.length - 1].x1, y1: y }, rowHeight: 36 };
}

/** An engine whose whole-page reading gives `lines` and whose cell-by-cell reading gives `cells`. */
function engineReading(lines: OcrLine[], cells: OcrLine[] = []): OcrEngine {
  return { read: async () => lines, readCells: async () => cells, probe: async () => [], stop: async () => undefined } as unknown as OcrEngine;
}

// A datasheet names its series beside its part rows (the title here).
const block = [
  line(350, [250, 'Invented Devices XQ series']),
  line(400, [250, 'XQ5V1A']),
  line(450, [250, 'Zener voltage, VZ ..........'], [1400, '5.1 V']),
  line(500, [250, 'Test current, IZT ..........'], [1400, '5 mA']),
  line(550, [250, 'XQ6V2A']),
  line(600, [250, 'Zener voltage, VZ ..........'], [1400, '6.2 V']),
  line(650, [250, 'Test current, IZT ..........'], [1400, '5 mA']),
];

describe('reading a scanned page: what the OCR path leaves out', () => {
  it('keeps parts read from a scan, flagged as OCR', async () => {
    const result = await extractWithOcr(scanned, { engine: engineReading(block), dpi: 300, maxOcrPages: 5 });
    expect(result.variants.map((v) => v.mpn)).toEqual(['XQ5V1A', 'XQ6V2A']);
    expect(result.variants[0].fields.vzNom).toMatchObject({ si: 5.1, ocr: true });
  });

  it('combines the two readings (whole page, cell by cell): a part or value only one read stands, two different figures for a field are both left out', async () => {
    const half = block.slice(0, 4);
    // Each reading alone holds only one of the parts: together they hold both.
    const parts = await extractWithOcr(scanned, { engine: engineReading(half, [block[0], ...block.slice(4)]), dpi: 300, maxOcrPages: 1 });
    expect(parts.variants.map((v) => v.mpn).sort()).toEqual(['XQ5V1A', 'XQ6V2A']);
    // XQ5V1A: the cell reading adds its leakage; XQ6V2A: the readings disagree on IZT (5 mA against 3 mA).
    const cells = [
      ...half,
      line(520, [250, 'Leakage current, IR ..........'], [1400, '2 µA']),
      ...block.slice(4, 6),
      line(650, [250, 'Test current, IZT ..........'], [1400, '3 mA']),
    ];
    const both = await extractWithOcr(scanned, { engine: engineReading(block, cells), dpi: 300, maxOcrPages: 1 });
    const [a, b] = ['XQ5V1A', 'XQ6V2A'].map((m) => both.variants.find((v) => v.mpn === m)!);
    expect(Object.keys(a.fields).sort()).toEqual(['irMax', 'izt', 'vzNom']);
    expect(a.fields.irMax).toMatchObject({ si: 2e-6, ocr: true });
    expect(b.fields.izt).toBeUndefined();
    expect(b.fields.vzNom).toMatchObject({ si: 6.2 });
    expect(both.warnings.join(' ')).toMatch(/XQ6V2A: two OCR readings of the page gave different figures for izt/);
  });

  it('leaves out a coefficient converted from %/K with a nominal VZ that is itself left out', () => {
    const fields = {
      vzNom: { value: '5.1', unit: 'V', si: 5.1, page: 1, text: 'VZ 5.1 V', ocr: true },
      tc: { value: '0.05', unit: '%/K', si: 0.00255, page: 1, text: 'TC 0.05 %/K', ocr: true, derived: 'converted' as const },
      izt: { value: '5', unit: 'mA', si: 0.005, page: 1, text: 'IZT 5 mA', ocr: true },
    };
    expect(leaveOut({ ...fields }, ['vzNom'])).toEqual(['vzNom', 'tc']);
    expect(leaveOut({ ...fields }, ['izt'])).toEqual(['izt']);
    // A coefficient printed in V/K does not rest on VZ.
    expect(leaveOut({ ...fields, tc: { ...fields.tc, derived: undefined } }, ['vzNom'])).toEqual(['vzNom']);
  });

  it('leaves out the parts of a page whose tolerance-letter legend OCR could not read, and says why', async () => {
    // The legend's ± came out as "£" and "[332]": no letters can be expanded, so "XQ5V1A" may not be a whole part number.
    const lines = [...block, line(750, [250, 'Tolerance of VZ: the letter after the type number gives it (A [332]%, B £2 %).'])];
    const result = await extractWithOcr(scanned, { engine: engineReading(lines), dpi: 300, maxOcrPages: 5 });
    expect(result.variants).toEqual([]);
    expect(result.warnings.join(' ')).toMatch(/letter after the part number.*legend/);
    // The page's parts were read and left out: it is not called a page where OCR found nothing.
    expect(result.warnings.join(' ')).not.toMatch(/page 1: no text layer and OCR found no ratings/);
  });

  it('leaves out the parts a legend read for another series did not expand (a base number is not a part), and keeps the expanded ones', async () => {
    // The XQ legend reads whole; the KRV series' own legend lost its figures ("C %"), so KRV20 stays a bare base number.
    const lines = [
      block[0],
      ...block.slice(1).map((l, i) => (i % 3 === 0 ? line(l.baseline.y0, [250, l.words[0].text.replace(/A$/, '')]) : l)),
      line(700, [250, 'KRV20']),
      line(750, [250, 'Zener voltage, VZ ..........'], [1400, '20 V']),
      line(800, [250, 'Test current, IZT ..........'], [1400, '10 mA']),
      line(900, [250, 'Tolerance of VZ: the letter after the type number gives it (A ±1 %, B ±2 %). Example: XQ5V1A']),
      line(950, [250, 'Tolerance of VZ: the letter after the type number gives it (B %, C %). Example: KRV20B']),
    ];
    const result = await extractWithOcr(scanned, { engine: engineReading(lines), dpi: 300, maxOcrPages: 5 });
    expect(result.variants.map((v) => v.mpn).sort()).toEqual(['XQ5V1A', 'XQ5V1B', 'XQ6V2A', 'XQ6V2B']);
    // ±1 % of 5.1 V, derived from the letter (common practice, no source).
    expect(result.variants.find((v) => v.mpn === 'XQ5V1A')!.fields.vzMin).toMatchObject({ si: 5.049, derived: 'tolerance-suffix', ocr: true });
    expect(result.warnings.join(' ')).toMatch(/legend of the letters for KRV20/);
  });

  it('keeps the parts a legend expanded whose VZnom was unreadable: their numbers are known, their limits are not', async () => {
    // XQ6V2's VZ figure came out as "mys": XQ6V2A and XQ6V2B stand with their test current and no VZ limits.
    const lines = [
      block[0],
      line(400, [250, 'XQ5V1']),
      line(450, [250, 'Zener voltage, VZ ..........'], [1400, '5.1 V']),
      line(500, [250, 'Test current, IZT ..........'], [1400, '5 mA']),
      line(550, [250, 'XQ6V2']),
      line(600, [250, 'Zener voltage, VZ ..........'], [1400, 'mys']),
      line(650, [250, 'Test current, IZT ..........'], [1400, '5 mA']),
      line(900, [250, 'Tolerance of VZ: the letter after the type number gives it (A ±1 %, B ±2 %). Example: XQ5V1A']),
    ];
    const result = await extractWithOcr(scanned, { engine: engineReading(lines), dpi: 300, maxOcrPages: 5 });
    expect(result.variants.map((v) => v.mpn).sort()).toEqual(['XQ5V1A', 'XQ5V1B', 'XQ6V2A', 'XQ6V2B']);
    const b = result.variants.find((v) => v.mpn === 'XQ6V2B')!;
    expect(b.fields.izt).toMatchObject({ si: 0.005, ocr: true });
    expect(b.fields.vzNom ?? b.fields.vzMin ?? b.fields.vzMax).toBeUndefined();
  });

  it('mends a part number read with a small letter shaped like its capital, and leaves out one misread otherwise', async () => {
    const more = [
      line(700, [250, 'XQ6v8A']),
      line(750, [250, 'Zener voltage, VZ ..........'], [1400, '6.8 V']),
      line(800, [250, 'XQ7l5A']),
      line(850, [250, 'Zener voltage, VZ ..........'], [1400, '7.5 V']),
    ];
    const result = await extractWithOcr(scanned, { engine: engineReading([...block, ...more]), dpi: 300, maxOcrPages: 5 });
    expect(result.variants.map((v) => v.mpn)).toEqual(['XQ5V1A', 'XQ6V2A', 'XQ6V8A']);
    expect(result.warnings.join(' ')).toMatch(/XQ7l5A: .*small letters among capitals/);
  });

  it('turns a page that reads as noise and reads it the way it reads best (a table scanned sideways)', async () => {
    const noise = [line(400, [250, '~ = © o'])];
    const calls: string[] = [];
    let reads = 0;
    const engine = {
      read: async () => (reads++ === 0 ? (calls.push('read upright'), noise) : (calls.push('read turned'), block)),
      probe: async () => (calls.push('probe'), calls.filter((c) => c === 'probe').length === 1 ? block.concat(block, block) : noise),
      readCells: async () => (calls.push('cells'), []),
      stop: async () => undefined,
    } as unknown as OcrEngine;
    // The first page only (the fixture has two).
    const result = await extractWithOcr(scanned, { engine, dpi: 300, maxOcrPages: 1 });
    expect(calls).toEqual(['read upright', 'probe', 'probe', 'read turned', 'cells']);
    expect(result.variants.map((v) => v.mpn)).toEqual(['XQ5V1A', 'XQ6V2A']);
  });
});
