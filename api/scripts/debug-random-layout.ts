/**
 * Prints one random-layout document as the extractor sees it (lines per page), its answer key
 * and what was extracted, for working on the extractor:
 *   npx tsx api/scripts/debug-random-layout.ts --seed 4252 [--lines] [--scanned] [--set k=v]
 * --scanned reads the document's rasterised copy by OCR (as the scored --scanned run does); its lines
 * are the engine's whole-page reading, or with --cells the cell-by-cell one.
 */
import { parseArgs } from 'node:util';
import { generateRandomDatasheet } from '@shuntwise/test-fixtures';
import { extractRatings } from '../src/extraction/rating-extractor';
import { readPdf } from '../src/extraction/pdf-text';
import { pageLines } from '../src/extraction/text-layout';
import { OcrEngine } from '../src/extraction/ocr/ocr-engine';
import { ocrPages } from '../src/extraction/ocr/page-ocr';
import { extractWithOcr } from '../src/extraction/ocr/ocr-extraction';
import { rasterisePdf } from '../../test-fixtures/scripts/lib/raster';

async function main(): Promise<void> {
  const { values } = parseArgs({
    options: {
      seed: { type: 'string' },
      lines: { type: 'boolean', default: false },
      scanned: { type: 'boolean', default: false },
      cells: { type: 'boolean', default: false },
      set: { type: 'string', multiple: true, default: [] },
    },
  });
  const overrides: Record<string, unknown> = {};
  for (const s of values.set ?? []) {
    const [k, v] = s.split('=');
    overrides[k] = v === 'true' ? true : v === 'false' ? false : /^\d+$/.test(v) ? Number(v) : v;
  }
  const doc = await generateRandomDatasheet(Number(values.seed), overrides);
  console.log(doc.answers.layout);
  console.log(JSON.stringify(doc.choices));
  const engine = values.scanned ? new OcrEngine(300) : undefined;
  const source = values.scanned ? (await rasterisePdf(doc.pdf, { seed: Number(values.seed) })).pdf : doc.pdf;
  const pdf = await readPdf(source);
  if (engine) {
    const read = await ocrPages(
      source,
      pdf.pages.map((p) => p.page),
      { engine, dpi: 300 },
    );
    for (const r of read) pdf.pages[r.page - 1] = { ...pdf.pages[r.page - 1], items: values.cells ? r.cellItems : r.items };
    (pdf as { hasText: boolean }).hasText = true;
  }
  if (values.lines) {
    for (const p of pdf.pages) {
      console.log(`--- page ${p.page}`);
      for (const l of pageLines(p)) console.log(`${l.y.toFixed(0).padStart(4)} | ${l.cells.map((c) => `[${c.x0.toFixed(0)}]${c.text}`).join(' ')}`);
    }
  }
  const r = engine ? await extractWithOcr(source, { engine, dpi: 300, maxOcrPages: 20 }) : extractRatings(pdf);
  await engine?.stop();
  if (engine) {
    const plain = extractRatings(pdf);
    console.log(
      `(the extractor alone on the OCR'd text: ${plain.variants.map((v) => `${v.mpn}[${Object.keys(v.fields).length}]`).join(' ')}; ${plain.warnings.join(' / ')})`,
    );
  }
  const got = new Map(r.variants.map((v) => [v.mpn, v]));
  for (const v of doc.answers.variants) {
    const g = got.get(v.mpn);
    const row = Object.entries(v.fields).map(([f, a]) => {
      const e = g?.fields[f as keyof typeof g.fields];
      return `${f}=${a.value}${a.unit}${e ? (Math.abs(e.si - a.si) <= 1e-6 * Math.abs(a.si) + 1e-12 ? '✓' : `✗(${e.si} ← ${e.text})`) : '·'}`;
    });
    // Values for a field the document does not print count as wrong too.
    const extra = Object.entries(g?.fields ?? {}).filter(([f]) => !(f in v.fields));
    row.push(...extra.map(([f, e]) => `${f}: not printed ✗(${e!.si} ← ${e!.text})`));
    console.log(`${v.mpn}${g ? '' : ' (NOT FOUND)'}: ${row.join(' ')}`);
  }
  for (const v of r.variants) if (!doc.answers.variants.some((a) => a.mpn === v.mpn)) console.log(`invented: ${v.mpn}`);
  for (const w of r.warnings) console.log(`warn: ${w}`);
}
void main();
