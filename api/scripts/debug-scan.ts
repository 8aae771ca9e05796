/**
 * Prints a scanned copy of a PDF's pages as OCR reads it (lines per page) and what is extracted:
 *   npx tsx api/scripts/debug-scan.ts <file.pdf> <page,page> [seed]
 */
import { readFileSync } from 'node:fs';
import { rasterisePdf } from '../../test-fixtures/scripts/lib/raster';
import { OcrEngine } from '../src/extraction/ocr/ocr-engine';
import { extractWithOcr } from '../src/extraction/ocr/ocr-extraction';
import { ocrPages } from '../src/extraction/ocr/page-ocr';
import { pageLines } from '../src/extraction/text-layout';
import { readPdf } from '../src/extraction/pdf-text';
import { extractRatings } from '../src/extraction/rating-extractor';

async function main(): Promise<void> {
  const [path, pageList, seedText] = process.argv.slice(2);
  const pages = pageList.split(',').map(Number);
  const scan = await rasterisePdf(readFileSync(path), { seed: Number(seedText ?? 1), pages });
  const engine = new OcrEngine(300);
  const read = await ocrPages(
    scan.pdf,
    pages.map((_, i) => i + 1),
    { engine, dpi: 300 },
  );
  for (const r of read) {
    console.log(`--- page ${r.page}`);
    for (const l of pageLines({ page: r.page, width: 595, height: 842, items: r.items } as never))
      console.log(`${l.y.toFixed(0).padStart(4)} | ${l.cells.map((c) => `[${c.x0.toFixed(0)}]${c.text}`).join(' ')}`);
  }
  const text = await readPdf(scan.pdf);
  const plain = extractRatings({ ...text, hasText: true, pages: text.pages.map((p) => ({ ...p, items: read.find((r) => r.page === p.page)?.items ?? [] })) });
  console.log(`(extractor alone: ${plain.variants.length} parts; ${plain.warnings.join(' / ')})`);
  console.log(JSON.stringify(read[0].items.slice(0, 12)));
  const result = await extractWithOcr(scan.pdf, { engine, dpi: 300, maxOcrPages: 20 });
  for (const v of result.variants)
    console.log(
      v.mpn,
      Object.entries(v.fields)
        .map(([k, f]) => `${k}=${f.text}`)
        .join(' '),
    );
  for (const w of result.warnings) console.log(`warn: ${w}`);
  await engine.stop();
}
void main();
