/**
 * Prints how the extractor scores on random-layout datasheets, per layout choice, for
 * iterating on the extractor:
 *
 *   npx tsx api/scripts/score-random-layouts.ts --seed 1 --count 150 [--misses 5] [--failing 40] [--set arrangement=rows --set decimal=comma]
 *   npx tsx api/scripts/score-random-layouts.ts --seed 1 --count 10 --scanned    (image-only copies, read by OCR)
 *   npx tsx api/scripts/score-random-layouts.ts --seed 1 --count 150 --field zzt   (the documents missing a field)
 *
 * Documents use seeds seed … seed + count − 1; `npm run generate:random -w test-fixtures`
 * writes the same documents to a folder for looking at.
 */
import { parseArgs } from 'node:util';
import { extractDatasheet } from '../src/extraction';
import { OcrEngine } from '../src/extraction/ocr/ocr-engine';
import { extractWithOcr } from '../src/extraction/ocr/ocr-extraction';
import { formatReport, scoreRandomLayouts } from '../test/helpers/random-layout-score';

async function main(): Promise<void> {
  const { values } = parseArgs({
    options: {
      seed: { type: 'string', default: '1' },
      count: { type: 'string', default: '150' },
      misses: { type: 'string', default: '0' },
      failing: { type: 'string', default: '25' },
      set: { type: 'string', multiple: true, default: [] },
      scanned: { type: 'boolean', default: false },
      field: { type: 'string' },
    },
  });
  // --set name=value pins a layout choice (numbers and true/false are read as such).
  const overrides: Record<string, unknown> = {};
  for (const s of values.set ?? []) {
    const [k, v] = s.split('=');
    overrides[k] = v === 'true' ? true : v === 'false' ? false : /^\d+$/.test(v) ? Number(v) : v;
  }
  const seed = Number(values.seed);
  const count = Number(values.count);
  if (!Number.isInteger(seed) || !Number.isInteger(count) || count < 1) throw new Error('--seed and --count must be whole numbers (count at least 1)');
  const rasterise = values.scanned ? await loadRasteriser() : undefined;
  const started = Date.now();
  // Image-only copies go through the product's OCR path (the plain extractor has no text to read there).
  const engine = values.scanned ? new OcrEngine(300) : undefined;
  const report = await scoreRandomLayouts(
    Array.from({ length: count }, (_, i) => seed + i),
    (pdf) => (engine ? extractWithOcr(pdf, { engine, dpi: 300, maxOcrPages: 20 }) : extractDatasheet(pdf)),
    overrides,
    rasterise,
  );
  await engine?.stop();
  console.log(formatReport(report, { misses: Number(values.misses), failing: Number(values.failing) }));
  // --field zzt: the documents that miss that field most, with their layout.
  if (values.field) {
    const wanted = ` ${values.field}: `;
    const byDoc = report.docs
      .map((d) => ({ d, n: d.misses.filter((m) => m.includes(wanted)).length }))
      .filter((x) => x.n > 0)
      .sort((a, b) => b.n - a.n);
    console.log(`\n${values.field} missed in ${byDoc.length} documents (most first):`);
    for (const { d, n } of byDoc.slice(0, 15)) console.log(`  ${d.seed}: ${n}  ${d.layout}`);
  }
  console.log(`\n(${((Date.now() - started) / 1000).toFixed(1)} s)`);
}

/** The OCR work's rasteriser (test-fixtures/scripts/lib/raster.ts), when it is on this branch. */
async function loadRasteriser(): Promise<(pdf: Buffer, seed: number) => Promise<Buffer>> {
  const path = '../../test-fixtures/scripts/lib/raster';
  let mod: { rasterisePdf?: (pdf: Uint8Array, o: { seed: number }) => Promise<{ pdf: Buffer }> };
  try {
    mod = (await import(path)) as typeof mod;
  } catch {
    throw new Error('--scanned needs test-fixtures/scripts/lib/raster.ts (the OCR work); merge it first');
  }
  const fn = mod.rasterisePdf;
  if (!fn) throw new Error('test-fixtures/scripts/lib/raster.ts has no rasterisePdf');
  return async (pdf, seed) => (await fn(pdf, { seed })).pdf;
}

main().catch((err: unknown) => {
  console.error(err);
  process.exit(1);
});
