import { randomInt } from 'node:crypto';
import { formatReport, precisionOf, recallOf, scoreRandomLayouts } from '../../../test/helpers/random-layout-score';
import { rasterisePdf } from '../../../../test-fixtures/scripts/lib/raster';
import { OcrEngine } from './ocr-engine';
import { extractWithOcr } from './ocr-extraction';

/**
 * OCR measured on scans of datasheets it has never seen: each run draws a fresh seed, generates
 * SCAN_COUNT invented datasheets of random layout, rasterises them as a scanner would (slight
 * tilt, grain, specks, JPEG; test-fixtures/scripts/lib/raster.ts) and reads them through the
 * product's OCR path. The reference is the generator's record of what it printed.
 *
 * Replay a run: SCAN_SEED=<printed seed> npx jest src/extraction/ocr/random-scans.spec.ts
 * Iterate:      npx tsx api/scripts/score-random-layouts.ts --seed <seed> --count 6 --scanned
 *
 * The goal (issue 8) is recall ≥ 90 % and precision ≥ 98 %. Precision is held to its goal
 * here: a scan may leave fields empty, never fill one wrongly. Recall is far from its goal
 * (about 18–20 % on 2026-12-04: whole tables of some layouts are still lost); the floor below
 * only catches a reading that collapses, and the run prints the distance to the goal.
 */

const GOAL = { recall: 0.9, precision: 0.98 };
const RECALL_FLOOR = 0.05;
const SCAN_COUNT = Number(process.env.SCAN_COUNT ?? 2);
const seed = Number(process.env.SCAN_SEED ?? randomInt(1, 2 ** 31 - 1));

describe(`OCR of scanned random-layout datasheets (seed ${seed}; SCAN_SEED=${seed} replays)`, () => {
  const engine = new OcrEngine(300);
  afterAll(() => engine.stop());

  it(`reads ${SCAN_COUNT} fresh scans with precision ≥ ${GOAL.precision * 100} %, no invented parts, and recall above the collapse floor`, async () => {
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
    expect(precision).toBeGreaterThanOrEqual(GOAL.precision);
    expect(report.docs.flatMap((d) => d.inventedParts)).toEqual([]);
    expect(recall).toBeGreaterThanOrEqual(RECALL_FLOOR);
  }, 900_000);
});
