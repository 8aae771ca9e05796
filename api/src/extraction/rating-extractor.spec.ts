import { readFileSync } from 'node:fs';
import { extractionResultSchema, type ExtractionField, type ExtractionResult } from '@shuntwise/contracts';
import { listDatasheetFixtures, type DatasheetFixture, type RatingField } from '@shuntwise/test-fixtures';
import { extractDatasheet } from './rating-extractor';

/**
 * The reference is outside the extractor: each fixture PDF comes with the answer key its
 * generator wrote from the values it printed (test-fixtures/scripts, invented datasheets).
 * A field counts as recovered only when the printed value, the printed unit, the SI value
 * and the page all agree. SI prefixes (m = 10⁻³, µ = 10⁻⁶) follow the BIPM SI Brochure,
 * 9th edition (quoted from memory); tc in %/K is turned into V/K as α·VZ/100 (common
 * practice, no source).
 */

const FIELDS: RatingField[] = ['vzMin', 'vzNom', 'vzMax', 'izt', 'zzt', 'izk', 'zzk', 'irMax', 'vr', 'tc', 'pdMax', 'tjMax', 'rthJA', 'izm'];

/** pdfjs hands µ back as Greek mu and the ohm sign as omega (its Unicode normalisation); the glyphs are the same. */
const sameUnit = (a: string, b: string) => canonical(a) === canonical(b);
const canonical = (u: string) => u.replace(/\u03BC/g, '\u00B5').replace(/\u2126/g, '\u03A9');
const sameSi = (a: number, b: number) => Math.abs(a - b) <= 1e-9 * Math.max(1e-9, Math.abs(b));

interface Tally {
  tp: number;
  fp: number;
  fn: number;
}

describe('datasheet extraction on the invented fixture datasheets', () => {
  const fixtures = listDatasheetFixtures();
  const results = new Map<string, ExtractionResult>();
  const tally = new Map<string, Tally>([...FIELDS, 'package'].map((f) => [f, { tp: 0, fp: 0, fn: 0 }]));
  const misses: string[] = [];

  beforeAll(async () => {
    for (const fx of fixtures) results.set(fx.name, await extractDatasheet(new Uint8Array(readFileSync(fx.pdfPath))));
    for (const fx of fixtures) score(fx, results.get(fx.name)!);
    printTable();
  });

  function score(fx: DatasheetFixture, result: ExtractionResult): void {
    const found = new Map(result.variants.map((v) => [v.mpn, v]));
    for (const want of fx.answers.variants) {
      const got = found.get(want.mpn);
      found.delete(want.mpn);
      for (const f of FIELDS) {
        const a = want.fields[f];
        const g = got?.fields[f as ExtractionField];
        const t = tally.get(f)!;
        const right = a && g && g.value === a.value && sameUnit(g.unit, a.unit) && sameSi(g.si, a.si) && g.page === a.page;
        if (right) t.tp++;
        else {
          if (a) t.fn++;
          if (g) t.fp++;
          if (a || g)
            misses.push(
              `${fx.name} ${want.mpn} ${f}: want ${a ? `${a.value} ${a.unit} p${a.page}` : '—'}, got ${g ? `${g.value} ${g.unit} (${g.si}) p${g.page}` : '—'}`,
            );
        }
      }
      const t = tally.get('package')!;
      if (got?.package?.value === want.package.value && got.package.page === want.package.page) t.tp++;
      else {
        t.fn++;
        if (got?.package) t.fp++;
        misses.push(`${fx.name} ${want.mpn} package: want ${want.package.value} p${want.package.page}, got ${got?.package?.value ?? '—'}`);
      }
    }
    // Variants the key does not know are invented: every field of them is a false positive.
    for (const extra of found.values()) {
      for (const f of Object.keys(extra.fields)) tally.get(f)!.fp++;
      misses.push(`${fx.name}: variant ${extra.mpn} is not in the answer key`);
    }
  }

  function printTable(): void {
    const rows = [...tally].map(([f, t]) => {
      const precision = t.tp + t.fp ? t.tp / (t.tp + t.fp) : 1;
      const recall = t.tp + t.fn ? t.tp / (t.tp + t.fn) : 1;
      return `${f.padEnd(8)} ${String(t.tp).padStart(4)} ${String(t.fp).padStart(4)} ${String(t.fn).padStart(4)}   ${precision.toFixed(3)}     ${recall.toFixed(3)}`;
    });
    console.log(['field      TP   FP   FN   precision  recall', ...rows, ...(misses.length ? ['', ...misses.slice(0, 40)] : [])].join('\n'));
  }

  it('covers all eight layouts and the 120 variants of the answer keys', () => {
    expect(fixtures).toHaveLength(8);
    expect(fixtures.reduce((n, fx) => n + fx.answers.variants.length, 0)).toBe(120);
  });

  it('recovers every field of every variant, and nothing the datasheets do not print', () => {
    expect(misses).toEqual([]);
    for (const [, t] of tally) expect(t.fp + t.fn).toBe(0);
  });

  it('answers in the shape of the contract, with the page count and a text layer', () => {
    for (const fx of fixtures) {
      const r = results.get(fx.name)!;
      expect(extractionResultSchema.parse(r)).toEqual(r);
      expect(r.pages).toBe(fx.answers.pages);
      expect(r.hasText).toBe(true);
      expect(r.warnings).toEqual([]);
    }
  });

  it('gives each value the text it came from, which holds the printed number and the part number or label', () => {
    for (const fx of fixtures) {
      for (const v of results.get(fx.name)!.variants) {
        for (const c of Object.values(v.fields)) {
          expect(c.text).toContain(c.value);
          expect(c.box!.width).toBeGreaterThan(0);
          expect(c.box!.x).toBeGreaterThanOrEqual(0);
          expect(c.box!.y).toBeGreaterThanOrEqual(0);
        }
      }
    }
  });

  it('converts a %/K coefficient with the same variant’s VZnom and says so', () => {
    const lvd = results.get('lumenvale-lvd1-series.pdf')!.variants.find((v) => v.mpn === 'LVD1-051')!;
    // −0.005 %/K of 5.1 V is −0.255 mV/K (α·VZ/100; common practice, no source).
    expect(lvd.fields.tc!.unit).toBe('%/K');
    expect(lvd.fields.tc!.si).toBeCloseTo(-0.000255, 12);
    expect(lvd.fields.tc!.note).toMatch(/converted from −0\.005 %\/K with VZnom = 5\.1 V/);
  });

  it('takes device-wide values from the ratings table, not from features or prose, and applies them to every variant', () => {
    const tpz = results.get('tevorrow-tpz15-series.pdf')!;
    for (const v of tpz.variants) {
      expect(v.fields.pdMax).toMatchObject({ value: '1.5', unit: 'W', page: 2 });
      // "−55 to +150 °C": the upper end of the operating range; not the 260 °C reflow peak on page 9.
      expect(v.fields.tjMax).toMatchObject({ value: '+150', si: 150, page: 2 });
      expect(v.package).toMatchObject({ value: 'SMB', page: 3 });
    }
  });

  it('reads the test currents that only the column headers give (Ostrander) from the header', () => {
    const odw = results.get('ostrander-odw-series.pdf')!.variants;
    expect(odw.find((v) => v.mpn === 'ODW10')!.fields.izt).toMatchObject({ value: '5', unit: 'mA', si: 0.005, text: 'VZ at IZT = 5 mA' });
    expect(odw.find((v) => v.mpn === 'ODW47')!.fields.izt).toMatchObject({ value: '2', unit: 'mA', si: 0.002 });
    expect(odw.find((v) => v.mpn === 'ODW47')!.fields.izk).toMatchObject({ value: '0.25', unit: 'mA', si: 0.00025 });
  });

  it('leaves out what a datasheet does not print (Corriebank gives no knee point and no IZM)', () => {
    for (const v of results.get('corriebank-cbx3-series.pdf')!.variants) {
      expect(v.fields.izk).toBeUndefined();
      expect(v.fields.zzk).toBeUndefined();
      expect(v.fields.izm).toBeUndefined();
    }
  });
});
