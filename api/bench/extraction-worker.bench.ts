/**
 * What isolation and OCR cost, measured in one run so machine speed mostly cancels out:
 *   - the extraction child's overhead per upload: the fixture datasheets read through the
 *     warm child process (bytes over IPC, result back) vs in-process, as a ratio of medians,
 *   - OCR seconds per page on rasterised copies of fixture pages (seeded scans), with the
 *     recall and precision of the values against the answer keys.
 * OCR_BENCH_PAGES (default 3) sets how many scanned pages are read; OCR_BENCH_SEED replays a run.
 * Figures only; never a timed test.
 */
import { readFileSync } from 'node:fs';
import { performance } from 'node:perf_hooks';
import { listDatasheetFixtures } from '@shuntwise/test-fixtures';
import { rasterisePdf } from '../test/helpers/raster';
import { extractDatasheet, extractRatings, readPdf } from '../src/extraction';
import { OcrEngine } from '../src/extraction/ocr/ocr-engine';
import { extractWithOcr } from '../src/extraction/ocr/ocr-extraction';
import { ExtractionPool } from '../src/extraction-worker/extraction-pool';
import { scoreOcr } from '../test/helpers/ocr-score';
import { median, seededRandom } from './bench-support';

const ROUNDS = 5;

async function overhead(): Promise<void> {
  const files = listDatasheetFixtures().map((f) => new Uint8Array(readFileSync(f.pdfPath)));
  const pool = new ExtractionPool({
    timeLimitMs: 120_000,
    memoryLimitBytes: 2048 * 1024 * 1024,
    ocrMsPerPage: 60_000,
    workers: 1,
    ocr: { enabled: true, dpi: 300, maxPages: 10 },
  });
  const t0 = performance.now();
  await pool.warm();
  const startMs = performance.now() - t0;
  for (const f of files) {
    await pool.extract(f);
    await extractDatasheet(f);
  }
  const inProcess: number[] = [];
  const viaChild: number[] = [];
  for (let r = 0; r < ROUNDS; r++) {
    for (const which of r % 2 === 0 ? ['child', 'in'] : ['in', 'child']) {
      for (const f of files) {
        const start = performance.now();
        if (which === 'child') await pool.extract(f);
        else await extractDatasheet(f);
        (which === 'child' ? viaChild : inProcess).push(performance.now() - start);
      }
    }
  }
  await pool.close();
  const a = median(inProcess);
  const b = median(viaChild);
  console.log(`extraction child process (${files.length} fixture datasheets × ${ROUNDS} rounds, medians per upload):`);
  console.log(`  in-process ${a.toFixed(1)} ms, via the child ${b.toFixed(1)} ms, ratio child / in-process ${(b / a).toFixed(2)}`);
  console.log(`  child start (tsx here; plain node in the built app) ${startMs.toFixed(0)} ms, once per child`);
}

async function ocr(): Promise<void> {
  const seed = Number(process.env.OCR_BENCH_SEED ?? Math.floor(Math.random() * 2 ** 31));
  const wanted = Number(process.env.OCR_BENCH_PAGES ?? 3);
  const random = seededRandom(seed);
  const fixtures = listDatasheetFixtures();
  const engine = new OcrEngine(300);
  let pages = 0;
  let seconds = 0;
  const totals = { expected: 0, recalled: 0, returned: 0, correct: 0 };
  console.log(`OCR of rasterised fixture pages (seed ${seed}; OCR_BENCH_SEED=${seed} replays):`);
  while (pages < wanted) {
    const f = fixtures[Math.floor(random() * fixtures.length)];
    const page = 1 + Math.floor(random() * f.answers.pages);
    const source = readFileSync(f.pdfPath);
    const scan = await rasterisePdf(source, { seed: Math.floor(random() * 2 ** 31), pages: [page] });
    const start = performance.now();
    const result = await extractWithOcr(scan.pdf, { engine, dpi: 300, maxOcrPages: 1 });
    const s = (performance.now() - start) / 1000;
    const text = await readPdf(source);
    const fromText = extractRatings({ ...text, pages: text.pages.filter((p) => p.page === page) });
    const renumbered = {
      ...result,
      variants: result.variants.map((v) => ({ ...v, fields: Object.fromEntries(Object.entries(v.fields).map(([k, x]) => [k, { ...x, page }])) })),
    };
    const score = scoreOcr(f.answers, [page], fromText, renumbered);
    for (const k of Object.keys(totals) as Array<keyof typeof totals>) totals[k] += score[k];
    console.log(`  ${f.name} p. ${page}: ${s.toFixed(1)} s, recall ${score.recalled}/${score.expected}, precision ${score.correct}/${score.returned}`);
    pages++;
    seconds += s;
  }
  await engine.stop();
  const pct = (a: number, b: number) => (b ? `${((100 * a) / b).toFixed(1)} %` : 'n/a');
  console.log(`  ${(seconds / pages).toFixed(1)} s per page (render + OCR + extraction, 300 dpi)`);
  console.log(
    `  recall ${pct(totals.recalled, totals.expected)} (${totals.recalled}/${totals.expected}), precision ${pct(totals.correct, totals.returned)} (${totals.correct}/${totals.returned})`,
  );
}

async function main(): Promise<void> {
  await overhead();
  await ocr();
}

main().catch((err: unknown) => {
  console.error(err);
  process.exit(1);
});
