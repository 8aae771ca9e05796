import { randomInt } from 'node:crypto';
import { formatReport, precisionOf, recallOf, scoreRandomLayouts } from '../../../test/helpers/random-layout-score';
import { rasterisePdf } from '../../../test/helpers/raster';
import { OcrEngine } from './ocr-engine';
import { extractWithOcr } from './ocr-extraction';

/**
 * OCR measured on scans of datasheets it has never seen: each run draws a fresh seed, generates
 * SCAN_COUNT invented datasheets of random layout, rasterises them as a scanner would (slight
 * tilt, grain, specks, JPEG; test-fixtures/scripts/lib/raster.ts) and reads them through the
 * product's OCR path. The reference is the generator's record of what it printed.
 *
 * Run:          OCR_RANDOM=1 npx jest src/extraction/ocr/random-scans.spec.ts (SCAN_SEED=<seed> replays)
 * Iterate:      npx tsx api/scripts/score-random-layouts.ts --seed <seed> --count 6 --scanned
 *
 * The goal (issue 8) is recall ≥ 90 % and precision ≥ 98 %; neither is met yet. On 2026-12-04
 * recall was 18–38 % (whole tables of some layouts are still lost) and precision 89–100 % (a
 * decimal comma the scan loses makes a figure ten times too large where nothing bounds it). The
 * floors below hold precision and invented parts; recall is printed, not held: one pair of
 * documents may both be layouts OCR reads nothing of yet (a CI run drew two at 0–15 %), so
 * no floor above zero would be honest at this sample size.
 */

const GOAL = { recall: 0.9, precision: 0.98 };
/** What fresh seeds reach today (2026-12-04: precision 89–100 % per pair of documents), with a margin. */
const FLOOR = { precision: 0.85, partsInvented: 0.05 };
const SCAN_COUNT = Number(process.env.SCAN_COUNT ?? 2);
const seed = Number(process.env.SCAN_SEED ?? randomInt(1, 2 ** 31 - 1));

describe(`OCR of scanned random-layout datasheets (seed ${seed}; SCAN_SEED=${seed} replays)`, () => {
  const engine = new OcrEngine(300);
  afterAll(() => engine.stop());

  // Not in `npm test` yet: fresh seeds still find wrong values and invented parts (seed 658289250:
  // precision 88 %, DCJY-20 and DCJY-22 invented), so it fails on some draws. Run it with
  // OCR_RANDOM=1 while working on the OCR path.
  (process.env.OCR_RANDOM === '1' ? it : it.skip)(
    `reads ${SCAN_COUNT} fresh scans with precision ≥ ${FLOOR.precision * 100} % (floor; goal ${GOAL.precision * 100} %) and prints recall against its ${GOAL.recall * 100} % goal`,
    async () => {
      const report = await scoreRandomLayouts(
        Array.from({ length: SCAN_COUNT }, (_, i) => seed + i),
        (pdf) => extractWithOcr(pdf, { engine, dpi: 300, maxOcrPages: 20 }),
        {},
        async (pdf, s) => (await rasterisePdf(pdf, { seed: s })).pdf,
      );
      const recall = recallOf(report.total);
      const precision = precisionOf(report.total);
      console.log(
        `seed ${seed}: recall ${(recall * 100).toFixed(1)} % (goal ${GOAL.recall * 100} %), precision ${(precision * 100).toFixed(1)} % (goal ${GOAL.precision * 100} %)\n${formatReport(report, { failing: SCAN_COUNT })}`,
      );
      expect(precision).toBeGreaterThanOrEqual(FLOOR.precision);
      // A part number misread into one the document does not print (seed 1208559043: "KM36" beside
      // the KJM series) is a wrong part, not a wrong field; the goal is none.
      const invented = report.docs.flatMap((d) => d.inventedParts);
      const printed = report.docs.reduce((n, d) => n + d.printedParts, 0);
      if (invented.length) console.log(`invented parts (goal: none): ${invented.join(', ')}`);
      expect(invented.length).toBeLessThanOrEqual(FLOOR.partsInvented * printed);
    },
    900_000,
  );

  // Scans whose fresh draws once gave wrong values or invented parts, kept as regressions (in
  // `npm test`): a base number a tolerance legend did not expand (658289251: DCJY-20), a second
  // series taking the first's header (1208559044: KM36, KJM39's IZT), lost hyphens and decimal
  // commas (1514036030: VPK270, "05" µA), Ω read as a digit in a transposed table and a legend
  // only one of the two readings kept whole (31339: "310 Ω" as 3100; HNA-4V3 left unexpanded).
  // Reading is deterministic for a seed, so these hold their goal's precision and no invented
  // part; recall is printed.
  const REGRESSION_SEEDS = [658289251, 1208559044, 1514036030, 31339];
  it(`reads the regression scans (${REGRESSION_SEEDS.join(', ')}) with precision ≥ ${GOAL.precision * 100} % and no invented part`, async () => {
    const report = await scoreRandomLayouts(
      REGRESSION_SEEDS,
      (pdf) => extractWithOcr(pdf, { engine, dpi: 300, maxOcrPages: 20 }),
      {},
      async (pdf, s) => (await rasterisePdf(pdf, { seed: s })).pdf,
    );
    console.log(
      `regression scans: recall ${(recallOf(report.total) * 100).toFixed(1)} %, precision ${(precisionOf(report.total) * 100).toFixed(1)} %\n${formatReport(report, { failing: REGRESSION_SEEDS.length })}`,
    );
    expect(precisionOf(report.total)).toBeGreaterThanOrEqual(GOAL.precision);
    expect(report.docs.flatMap((d) => d.inventedParts)).toEqual([]);
    // Each document still yields parts: the guards leave out the doubtful, not everything.
    for (const d of report.docs) expect(d.tally.tp).toBeGreaterThan(10);
  }, 900_000);
});
