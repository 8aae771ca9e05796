import { readFileSync } from 'node:fs';
import type { ExtractionResult } from '@shuntwise/contracts';
import { listDatasheetFixtures, listScannedFixtures } from '@shuntwise/test-fixtures';
import { rasterisePdf } from '../../../test/helpers/raster';
import { scoreOcr } from '../../../test/helpers/ocr-score';
import { extractRatings, readPdf } from '..';
import { OcrEngine } from './ocr-engine';
import { extractWithOcr } from './ocr-extraction';

/**
 * OCR measured against the answer keys of the invented fixture datasheets (the values their
 * generator printed): table pages are rasterised afresh each run as a scanner would (300 dpi
 * greyscale JPEG, a random tilt within ±1°, paper grain and specks; seed printed, OCR_SEED
 * replays), read back through OCR and the text extractor, and scored. OCR costs a few seconds
 * per page, so the default run reads OCR_PAGES = 2 pages; OCR_SCANNED=1 also reads the
 * committed scanned copies (five pages).
 *
 * Precision must stay at 98 % or better: a scan gives no value rather than a doubtful one.
 * Recall: the goal is 90 %. Each page is read twice (as a block and as sparse text, merged),
 * which brought back the small bracketed units the block reading dropped; fresh seeds now give
 * 77–87 % (2026-12-04; a lost minus sign or a smudged lone digit still takes a value), so the
 * test holds the line at 65 % until the goal is met.
 * OCR_PAGES = 2 reads two or three pages (one scan of one or two pages at a time).
 */
const PRECISION_GOAL = 0.98;
// Fresh draws 77–87 % with the two readings (seed 1266693798 went from 51 % to 77 %); the 90 % goal is printed and still open.
// 2026-12-05, after the unit and part-number repairs: 84–96 % on five seeds (623475612 went from 61 % to 96 %).
const RECALL_FLOOR = 0.65;

/**
 * Scans of the fixture set that hold a ratings table with its header (file name prefix, pages):
 * Corriebank's table runs on to page 2 without repeating its header, so it is scanned whole.
 */
const TABLE_SCANS: Array<[string, number[]]> = [
  ['brackenford', [2]],
  ['corriebank', [1, 2]],
];

const seed = Number(process.env.OCR_SEED ?? Math.floor(Math.random() * 2 ** 31));
const pageCount = Number(process.env.OCR_PAGES ?? 2);

function mulberry(a: number): () => number {
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** The text extractor on the same pages of the original, for what OCR has to give back. */
async function textOf(pdfPath: string, pages: number[]): Promise<ExtractionResult> {
  const text = await readPdf(readFileSync(pdfPath));
  return extractRatings({ ...text, pages: text.pages.filter((p) => pages.includes(p.page)) });
}

/** OCR results renumbered to the original's pages (a scan of chosen pages starts at 1). */
function renumber(result: ExtractionResult, pages: number[]): ExtractionResult {
  return {
    ...result,
    variants: result.variants.map((v) => ({
      ...v,
      fields: Object.fromEntries(Object.entries(v.fields).map(([k, x]) => [k, { ...x, page: pages[x.page - 1] }])),
    })),
  };
}

describe(`OCR of scanned datasheet pages (seed ${seed}; OCR_SEED=${seed} replays)`, () => {
  const engine = new OcrEngine(300);
  afterAll(() => engine.stop());

  it(`reads ${pageCount} freshly scanned table pages with precision ≥ ${PRECISION_GOAL * 100} % and recall ≥ ${RECALL_FLOOR * 100} %, every value flagged as OCR with its page and box`, async () => {
    const random = mulberry(seed);
    const fixtures = listDatasheetFixtures();
    const totals = { expected: 0, recalled: 0, returned: 0, correct: 0 };
    const wrong: string[] = [];
    for (let read = 0; read < pageCount;) {
      const [prefix, pages] = TABLE_SCANS[Math.floor(random() * TABLE_SCANS.length)];
      const fixture = fixtures.find((f) => f.name.startsWith(prefix))!;
      const scan = await rasterisePdf(readFileSync(fixture.pdfPath), { seed: Math.floor(random() * 2 ** 31), pages });
      read += pages.length;
      // The scan really has no text layer: everything below comes from OCR.
      expect((await readPdf(scan.pdf)).hasText).toBe(false);
      const result = await extractWithOcr(scan.pdf, { engine, dpi: 300, maxOcrPages: pages.length });
      expect(result.hasText).toBe(false);
      const values = result.variants.flatMap((v) => Object.values(v.fields));
      expect(values.length).toBeGreaterThan(0);
      for (const value of values) expect(value).toMatchObject({ ocr: true, page: expect.any(Number), box: expect.any(Object) });
      const score = scoreOcr(fixture.answers, pages, await textOf(fixture.pdfPath, pages), renumber(result, pages));
      console.log(
        `${fixture.name} p. ${pages.join('+')} (tilt ${scan.pages.map((p) => p.rotation.toFixed(2)).join(', ')}°): recall ${score.recalled}/${score.expected}, precision ${score.correct}/${score.returned}`,
      );
      for (const k of Object.keys(totals) as Array<keyof typeof totals>) totals[k] += score[k];
      wrong.push(...score.wrong.map((w) => `${fixture.name}: ${w}`));
    }
    if (wrong.length) console.log(`wrong values (seed ${seed}):\n  ${wrong.join('\n  ')}`);
    expect(totals.correct / totals.returned).toBeGreaterThanOrEqual(PRECISION_GOAL);
    expect(totals.recalled / totals.expected).toBeGreaterThanOrEqual(RECALL_FLOOR);
  }, 600_000);

  (process.env.OCR_SCANNED === '1' ? it : it.skip)(
    'reads the committed scanned copies with the same precision',
    async () => {
      for (const scanned of listScannedFixtures()) {
        const pages = Array.from({ length: scanned.original.answers.pages }, (_, i) => i + 1);
        const result = await extractWithOcr(readFileSync(scanned.pdfPath), { engine, dpi: 300, maxOcrPages: pages.length });
        const score = scoreOcr(scanned.original.answers, pages, await textOf(scanned.original.pdfPath, pages), result);
        console.log(`${scanned.name}: recall ${score.recalled}/${score.expected}, precision ${score.correct}/${score.returned}`, score.wrong);
        expect(score.correct / score.returned).toBeGreaterThanOrEqual(PRECISION_GOAL);
        expect(score.recalled / score.expected).toBeGreaterThanOrEqual(RECALL_FLOOR);
      }
    },
    1_200_000,
  );
});
