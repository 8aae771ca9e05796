/**
 * Peak resident memory of reading one scanned PDF by OCR (what the extraction child's memory
 * limit, EXTRACTION_MEMORY_LIMIT_MB, is measured against):
 *   npx tsx api/scripts/ocr-memory.ts <file.pdf>
 */
import { readFileSync } from 'node:fs';
import { OcrEngine } from '../src/extraction/ocr/ocr-engine';
import { extractWithOcr } from '../src/extraction/ocr/ocr-extraction';

async function main(): Promise<void> {
  let peak = 0;
  const timer = setInterval(() => (peak = Math.max(peak, process.memoryUsage.rss())), 50);
  const engine = new OcrEngine(300);
  if (process.env.NO_CELLS) engine.readCells = async () => [];
  const started = Date.now();
  const result = await extractWithOcr(readFileSync(process.argv[2]), { engine, dpi: 300, maxOcrPages: 10 });
  clearInterval(timer);
  await engine.stop();
  console.log(`${result.variants.length} parts, peak RSS ${(peak / 2 ** 20).toFixed(0)} MiB, ${((Date.now() - started) / 1000).toFixed(1)} s`);
}
void main();
