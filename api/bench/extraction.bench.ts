/**
 * Datasheet extraction speed, measured in one run beside pdfjs-dist's own text extraction
 * on the same files, so that the figure that matters is a ratio that machine speed and
 * load mostly cancel out of:
 *   - extraction pages per second over the fixture datasheets,
 *   - pdfjs getTextContent pages per second on the same files (target: extraction ≥ 0.6 × pdfjs),
 *   - buffer → extraction result for the ten-page datasheet, warm (pdfjs already loaded),
 *   - the cold import of pdfjs, once.
 * Figures only; never a timed test.
 */
import { readFileSync } from 'node:fs';
import { performance } from 'node:perf_hooks';
import { listDatasheetFixtures } from '@shuntwise/test-fixtures';
import { extractDatasheet, loadPdfjs } from '../src/extraction';
import { median, quantile } from './bench-support';

const ROUNDS = 7;
const TEN_PAGE_RUNS = 25;

async function pdfjsText(pdfjs: Awaited<ReturnType<typeof loadPdfjs>>, bytes: Uint8Array): Promise<number> {
  const doc = await pdfjs.getDocument({ data: new Uint8Array(bytes), verbosity: 0, isEvalSupported: false, disableFontFace: true, useSystemFonts: false })
    .promise;
  let items = 0;
  for (let n = 1; n <= doc.numPages; n++) {
    const page = await doc.getPage(n);
    items += (await page.getTextContent()).items.length;
    page.cleanup();
  }
  await doc.destroy();
  return items;
}

async function main(): Promise<void> {
  const files = listDatasheetFixtures().map((f) => ({ name: f.name, pages: f.answers.pages, bytes: new Uint8Array(readFileSync(f.pdfPath)) }));
  const totalPages = files.reduce((n, f) => n + f.pages, 0);
  const ten = files.find((f) => f.pages === 10);
  if (!ten) throw new Error('the ten-page fixture datasheet is missing (run npm run generate -w test-fixtures)');

  const t0 = performance.now();
  const pdfjs = await loadPdfjs();
  const coldImportMs = performance.now() - t0;
  const t1 = performance.now();
  await extractDatasheet(ten.bytes);
  const firstDocumentMs = performance.now() - t1;

  // Warm both paths before measuring.
  for (const f of files) {
    await pdfjsText(pdfjs, f.bytes);
    await extractDatasheet(f.bytes);
  }

  const pdfjsRates: number[] = [];
  const extractionRates: number[] = [];
  for (let r = 0; r < ROUNDS; r++) {
    // Alternate which path goes first so that drift (GC, CPU boost) falls on both alike.
    const order = r % 2 === 0 ? ['pdfjs', 'extraction'] : ['extraction', 'pdfjs'];
    for (const which of order) {
      const start = performance.now();
      for (const f of files) {
        if (which === 'pdfjs') await pdfjsText(pdfjs, f.bytes);
        else await extractDatasheet(f.bytes);
      }
      const rate = totalPages / ((performance.now() - start) / 1000);
      (which === 'pdfjs' ? pdfjsRates : extractionRates).push(rate);
    }
  }

  const tenMs: number[] = [];
  for (let i = 0; i < TEN_PAGE_RUNS; i++) {
    const start = performance.now();
    const result = await extractDatasheet(ten.bytes);
    tenMs.push(performance.now() - start);
    if (result.variants.length === 0) throw new Error('the ten-page datasheet gave no variants');
  }

  const pdfjsRate = median(pdfjsRates);
  const extractionRate = median(extractionRates);
  const ratio = extractionRate / pdfjsRate;
  const fmt = (x: number, d = 1) => x.toFixed(d);
  console.log(`fixture set: ${files.length} datasheets, ${totalPages} pages; ${ROUNDS} rounds, medians`);
  console.log(`  pdfjs getTextContent      ${fmt(pdfjsRate)} pages/s`);
  console.log(`  extraction (whole)        ${fmt(extractionRate)} pages/s`);
  console.log(`  ratio extraction / pdfjs  ${fmt(ratio, 2)}   (target ≥ 0.60: ${ratio >= 0.6 ? 'met' : 'NOT met'})`);
  console.log(`ten-page datasheet (${ten.name}), buffer → extraction result, warm, ${TEN_PAGE_RUNS} runs:`);
  console.log(`  median ${fmt(median(tenMs))} ms, p90 ${fmt(quantile(tenMs, 0.9))} ms, min ${fmt(Math.min(...tenMs))} ms`);
  console.log(`cold: import of pdfjs-dist ${fmt(coldImportMs)} ms; first document after it ${fmt(firstDocumentMs)} ms`);
}

main().catch((err: unknown) => {
  console.error(err);
  process.exit(1);
});
