import { randomInt } from 'node:crypto';
import { generateRandomDatasheet } from '@shuntwise/test-fixtures';
import {
  FLOOR,
  formatReport,
  GOAL,
  matchesPrinted,
  precisionOf,
  recallOf,
  scoreRandomLayouts,
  type RandomLayoutReport,
} from '../../test/helpers/random-layout-score';
import { readPdf } from './pdf-text';
import { extractDatasheet } from './rating-extractor';

/**
 * Extraction measured on datasheets it has never seen: every run draws a fresh seed and
 * generates LAYOUT_COUNT (150) invented datasheets of random layout with their answer keys
 * (test-fixtures/scripts/lib/random-layout), plus a fixed list of regression seeds. The
 * reference is the generator's record of what it printed, outside the extractor.
 *
 * Replay a run: LAYOUT_SEED=<printed seed> npx jest src/extraction/random-layouts.spec.ts
 * Iterate:      npx tsx api/scripts/score-random-layouts.ts --seed <seed> --count 150
 *
 * The goal is issue 8's (recall ≥ 97 %, precision ≥ 99.5 %: precision before recall, an empty
 * field rather than a doubtful number); the tests hold the floors the extractor reaches today
 * (FLOOR in test/helpers/random-layout-score.ts) and print the distance to the goal.
 */

/** Seeds kept as regressions: one or more of each arrangement, and documents that once failed. */
const REGRESSION_SEEDS = [
  1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 101, 202, 303, 404, 505, 606, 707, 808, 909, 1001, 2002, 3003,
  // Found on fresh draws: two-column pages on one pitch, transposed blocks, sentences, titles.
  4263, 4266, 4308, 4355, 91027, 91066, 123495, 123510, 777024, 777051, 777058, 777067, 777071, 777133,
  // A series named MAX (its letters once read as a qualifier: VZ nominal returned as the maximum).
  698966714,
];

const seed = process.env.LAYOUT_SEED ? Number(process.env.LAYOUT_SEED) : randomInt(1, 2 ** 31 - 200_000);
const count = process.env.LAYOUT_COUNT ? Number(process.env.LAYOUT_COUNT) : 150;

describe('datasheet extraction on random layouts', () => {
  let report: RandomLayoutReport;

  beforeAll(async () => {
    if (!Number.isInteger(seed) || !Number.isInteger(count) || count < 1) throw new Error('LAYOUT_SEED and LAYOUT_COUNT must be whole numbers');
    console.log(`random layouts: seed ${seed}, ${count} documents and ${REGRESSION_SEEDS.length} regression seeds (replay: LAYOUT_SEED=${seed})`);
    const seeds = [...Array.from({ length: count }, (_, i) => seed + i), ...REGRESSION_SEEDS];
    report = await scoreRandomLayouts(seeds, (pdf) => extractDatasheet(pdf));
    console.log(`random layouts, seed ${seed}:\n${formatReport(report, { worstChoices: 25, failing: 25, misses: 3 })}`);
  }, 900_000);

  /** The failure message: the figure, the seed to replay, the worst layout choices and the failing seeds. */
  const shortfall = (what: string, value: number, floor: number) =>
    `${what} ${(100 * value).toFixed(1)} % is below its floor of ${(100 * floor).toFixed(1)} % (replay: LAYOUT_SEED=${seed})\n` +
    formatReport(report, { worstChoices: 20, failing: 20, misses: 2 });
  const goalNote = (what: string, value: number, goal: number) =>
    console.log(
      `random layouts: ${what} ${(100 * value).toFixed(1)} % against the goal of ${(100 * goal).toFixed(1)} %${value >= goal ? ' (met)' : ' (not met yet)'}`,
    );

  it('draws every arrangement and both sides of each main choice in one run', () => {
    const drawn = new Set(report.perChoice.keys());
    for (const a of ['rows', 'transposed', 'part-per-page', 'leader-list', 'param-table', 'sentences']) expect(drawn).toContain(`arrangement=${a}`);
    for (const label of [
      'decimal=comma',
      'decimal=point',
      'orientation=rotated',
      'pageColumns=2',
      'tolerance=suffix-legend',
      'series=2',
      'maxRatings=per-package',
    ]) {
      expect(drawn).toContain(label);
    }
  });

  it('writes answer keys that agree with the text of the PDFs (the generator itself)', async () => {
    for (const s of REGRESSION_SEEDS.slice(0, 12)) {
      const { pdf, answers } = await generateRandomDatasheet(s);
      const text = await readPdf(new Uint8Array(pdf));
      expect(text.pageCount).toBe(answers.pages);
      const pageText = text.pages.map((p) =>
        p.items
          .map((i) => i.str)
          .join('')
          .replace(/\s/g, ''),
      );
      for (const v of answers.variants) {
        expect(v.package.page).toBeGreaterThan(0);
        expect(pageText[v.package.page - 1]).toContain(v.package.value);
        for (const [f, a] of Object.entries(v.fields)) {
          if (a.derived) continue;
          // pdfjs normalises µ to μ and Ω (ohm sign) to Ω; the number as printed must be on its page.
          const where = `seed ${s} ${v.mpn} ${f} ${a.value} p${a.page}`;
          expect([where, pageText[a.page - 1].includes(a.value.replace(/\s/g, ''))]).toEqual([where, true]);
          // So must its unit, in the text layer too: documents made after hundreds of others once
          // printed "[Ω]" with "!" in the text (a glyph cache shared between documents).
          const unit = `seed ${s} ${v.mpn} ${f} unit ${a.unit} p${a.page}`;
          expect([unit, pageText[a.page - 1].normalize('NFKC').includes(a.unit.replace(/\s/g, '').normalize('NFKC'))]).toEqual([unit, true]);
        }
      }
    }
  });

  it(`returns the printed value (after unit conversion, within the printed digits) for at least ${Math.round(FLOOR.precision * 1000) / 10} % of the values it returns (goal ${GOAL.precision * 100} %)`, () => {
    const precision = precisionOf(report.total);
    goalNote('precision', precision, GOAL.precision);
    expect(precision >= FLOOR.precision ? '' : shortfall('precision', precision, FLOOR.precision)).toBe('');
  });

  it(`recovers at least ${Math.round(FLOOR.recall * 100)} % of the printed ratings (goal ${GOAL.recall * 100} %)`, () => {
    const recall = recallOf(report.total);
    goalNote('recall', recall, GOAL.recall);
    expect(recall >= FLOOR.recall ? '' : shortfall('recall', recall, FLOOR.recall)).toBe('');
  });

  it(`finds at least ${(FLOOR.partsFound * 100).toFixed(1)} % of the part numbers and invents at most ${(FLOOR.partsInvented * 100).toFixed(1)} % (goal: all, none)`, () => {
    const printed = report.docs.reduce((n, d) => n + d.printedParts, 0);
    const missed = report.docs.reduce((n, d) => n + d.missingParts.length, 0);
    const made = report.docs.reduce((n, d) => n + d.inventedParts.length, 0);
    console.log(`random layouts: ${printed - missed} of ${printed} part numbers found, ${made} invented (goal: all found, none invented)`);
    const missing = report.docs.filter((d) => d.missingParts.length).map((d) => `seed ${d.seed}: ${d.missingParts.slice(0, 5).join(', ')}`);
    const invented = report.docs.filter((d) => d.inventedParts.length).map((d) => `seed ${d.seed}: ${d.inventedParts.slice(0, 5).join(', ')}`);
    const ok = (printed - missed) / printed >= FLOOR.partsFound && made / printed <= FLOOR.partsInvented;
    expect(ok ? {} : { missing: missing.slice(0, 20), invented: invented.slice(0, 20) }).toEqual({});
  });
});

describe('scoring a returned value against the printed one', () => {
  const value = (v: string, unit: string, si: number, derived?: 'tolerance-suffix') => ({ value: v, unit, si, page: 1, ...(derived ? { derived } : {}) });
  const got = (si: number) => ({ value: '', unit: '', si, page: 1, text: '' });

  // Rounding to the printed digits: half a unit of the last digit (common practice, no source).
  it('accepts the printed value within the rounding of its digits and nothing further', () => {
    expect(matchesPrinted(value('5.1', 'V', 5.1), got(5.1))).toBe(true);
    expect(matchesPrinted(value('5.1', 'V', 5.1), got(5.149))).toBe(true);
    expect(matchesPrinted(value('5.1', 'V', 5.1), got(5.16))).toBe(false);
  });

  it('rejects a decimal comma read as a whole number (0,30 µA read as 3, or as 30 µA)', () => {
    // µ = 10⁻⁶ (BIPM SI Brochure, 9th edition; from memory).
    expect(matchesPrinted(value('0,30', 'µA', 0.3e-6), got(0.3e-6))).toBe(true);
    expect(matchesPrinted(value('0,30', 'µA', 0.3e-6), got(3))).toBe(false);
    expect(matchesPrinted(value('0,30', 'µA', 0.3e-6), got(30e-6))).toBe(false);
  });

  it('compares a %/K coefficient in V/K (α·VZ/100, common practice, no source)', () => {
    // −0.005 %/K of 5.1 V = −0.255 mV/K.
    expect(matchesPrinted(value('−0.005', '%/K', -0.000255), got(-0.000255))).toBe(true);
    expect(matchesPrinted(value('−0.005', '%/K', -0.000255), got(-0.005))).toBe(false);
  });

  it('holds a limit derived from a tolerance letter to one part in a million', () => {
    // 5.1 V with ±2 %: 4.998 V.
    expect(matchesPrinted(value('4.998', 'V', 4.998, 'tolerance-suffix'), got(4.998))).toBe(true);
    expect(matchesPrinted(value('4.998', 'V', 4.998, 'tolerance-suffix'), got(5.0))).toBe(false);
  });
});
