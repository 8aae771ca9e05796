import { existsSync } from 'node:fs';
import { dirname, join } from 'node:path';
import type { Canvas } from '@napi-rs/canvas';
import { createWorker, OEM, PSM, type Worker } from 'tesseract.js';
import { cleanScan } from './scan-cleanup';
import { readByLines } from './segmented-reading';

/**
 * Tesseract (tesseract.js 7, WebAssembly) with the English LSTM model shipped as an npm
 * package (@tesseract.js-data/eng), so nothing is downloaded at run time. One engine reads
 * one page at a time; it is started on first use and ended by the caller.
 */

/** A word as Tesseract reports it, in image pixels (origin top-left). */
export interface OcrWord {
  text: string;
  /** 0–100. */
  confidence: number;
  x0: number;
  y0: number;
  x1: number;
  y1: number;
}

/** A text line: its words, its baseline (a straight line that may slope on a skewed scan) and row height. */
export interface OcrLine {
  words: OcrWord[];
  baseline: { x0: number; y0: number; x1: number; y1: number };
  /** Ascender to descender, pixels: close to the font size. */
  rowHeight: number;
}

/** Where the traineddata lives; throws a plain error when the package is missing. */
export function engTrainedDataPath(): string {
  const dir = join(dirname(require.resolve('@tesseract.js-data/eng/package.json')), '4.0.0_best_int');
  if (!existsSync(join(dir, 'eng.traineddata.gz'))) {
    throw new Error(`OCR model not found at ${dir}/eng.traineddata.gz: is @tesseract.js-data/eng installed?`);
  }
  return dir;
}

export class OcrEngine {
  private worker: Promise<Worker> | undefined;

  constructor(private readonly dpi: number) {}

  private start(): Promise<Worker> {
    this.worker ??= new Promise<Worker>((resolve, reject) => {
      const langPath = engTrainedDataPath();
      // Without errorHandler a failed start neither resolves nor rejects; without
      // cacheMethod 'none' it writes ./eng.traineddata and silently reuses it later.
      createWorker('eng', OEM.LSTM_ONLY, { langPath, gzip: true, cacheMethod: 'none', errorHandler: reject })
        .then(async (w) => {
          await w.setParameters({ user_defined_dpi: String(this.dpi) });
          resolve(w);
        })
        .catch(reject);
    }).catch((err: unknown) => {
      this.worker = undefined;
      throw err;
    });
    return this.worker;
  }

  /**
   * A second, independent reading of the page: cleaned (deskewed, rules erased, black on
   * white), cut into lines and cells from its ink, and each cell read alone as one line of
   * text. The engine's own layout analysis drops lone figures of sparse tables (a parameter
   * table's min/typ/max column came out empty); handed one cell, it reads it. Its words are in
   * the deskewed page's pixels.
   */
  async readCells(page: Canvas): Promise<OcrLine[]> {
    const worker = await this.start();
    const { grey, width, height } = cleanScan(page, this.dpi);
    let current: PSM | undefined;
    return readByLines(grey, width, height, this.dpi, async (png, mode) => {
      const psm = mode === 'line' ? PSM.SINGLE_LINE : PSM.SINGLE_BLOCK;
      if (psm !== current) await worker.setParameters({ tessedit_pageseg_mode: (current = psm) });
      return this.lines(worker, png);
    });
  }

  /**
   * Two readings of the page: as one block of text (keeps lines and lone figures in table
   * cells) and as sparse text (finds small isolated words such as a units row's "(mA)" that the
   * block reading drops). Words of the second that overlap none of the first are added to the
   * line they sit on, or stand as lines of their own.
   */
  async read(png: Buffer): Promise<OcrLine[]> {
    const worker = await this.start();
    await worker.setParameters({ tessedit_pageseg_mode: PSM.SINGLE_BLOCK });
    const block = await this.lines(worker, png);
    await worker.setParameters({ tessedit_pageseg_mode: PSM.SPARSE_TEXT });
    const sparse = await this.lines(worker, png);
    return mergeReadings(block, sparse);
  }

  /** One quick reading (as a block only), to judge which way up a page reads. */
  async probe(png: Buffer): Promise<OcrLine[]> {
    const worker = await this.start();
    await worker.setParameters({ tessedit_pageseg_mode: PSM.SINGLE_BLOCK });
    return this.lines(worker, png);
  }

  private async lines(worker: Worker, png: Buffer): Promise<OcrLine[]> {
    const { data } = await worker.recognize(png, {}, { blocks: true, text: false });
    const lines: OcrLine[] = [];
    for (const block of data.blocks ?? []) {
      for (const paragraph of block.paragraphs) {
        for (const line of paragraph.lines) {
          lines.push({
            baseline: { x0: line.baseline.x0, y0: line.baseline.y0, x1: line.baseline.x1, y1: line.baseline.y1 },
            rowHeight: line.rowAttributes.rowHeight,
            words: line.words.map((w) => ({ text: w.text, confidence: w.confidence, x0: w.bbox.x0, y0: w.bbox.y0, x1: w.bbox.x1, y1: w.bbox.y1 })),
          });
        }
      }
    }
    return lines;
  }

  async stop(): Promise<void> {
    const w = this.worker;
    this.worker = undefined;
    if (w) await (await w.catch(() => undefined))?.terminate();
  }
}

const overlaps = (a: OcrWord, b: OcrWord) => {
  const w = Math.min(a.x1, b.x1) - Math.max(a.x0, b.x0);
  const h = Math.min(a.y1, b.y1) - Math.max(a.y0, b.y0);
  return w > 0 && h > 0 && w * h > 0.3 * Math.min((a.x1 - a.x0) * (a.y1 - a.y0), (b.x1 - b.x0) * (b.y1 - b.y0));
};

/** The first reading, with the words only the second found added where they sit. */
export function mergeReadings(first: OcrLine[], second: OcrLine[]): OcrLine[] {
  const out = first.map((l) => ({ ...l, words: l.words.map((w) => ({ ...w })) }));
  const seen = out.flatMap((l) => l.words);
  for (const line of second) {
    for (const word of line.words) {
      if (!word.text.trim()) continue;
      const same = seen.filter((w) => overlaps(w, word));
      // Where both readings have the word, the surer one stands (the block reading is often unsure of small print).
      if (same.length === 1 && word.confidence > same[0].confidence + 10 && !/\s/.test(word.text)) Object.assign(same[0], word);
      if (same.length) continue;
      seen.push(word);
      const cx = (word.x0 + word.x1) / 2;
      // The line whose baseline, at the word's place, runs within half a row of the word's foot.
      const host = out.find((l) => {
        const b = l.baseline;
        const y = b.x1 === b.x0 ? b.y0 : b.y0 + ((b.y1 - b.y0) * (cx - b.x0)) / (b.x1 - b.x0);
        return Math.abs(y - word.y1) < 0.5 * l.rowHeight && cx > Math.min(...l.words.map((w) => w.x0)) - 4 * l.rowHeight;
      });
      if (host) {
        host.words.push(word);
        host.words.sort((a, b) => a.x0 - b.x0);
      } else out.push({ words: [word], baseline: { x0: word.x0, y0: line.baseline.y0, x1: word.x1, y1: line.baseline.y1 }, rowHeight: line.rowHeight });
    }
  }
  return out;
}

/** How well a page read: the words of three or more letters or digits the engine was sure of. */
export function readingQuality(lines: OcrLine[]): number {
  return lines.flatMap((l) => l.words).filter((w) => w.confidence >= 80 && /[\p{L}\p{N}]{3,}/u.test(w.text)).length;
}

/** The share of a reading's words (of 20 or more) the engine was unsure of (below 60). */
export function unsureShare(lines: OcrLine[]): number {
  const words = lines.flatMap((l) => l.words).filter((w) => w.text.trim());
  if (words.length < 20) return 0;
  return words.filter((w) => w.confidence < 60).length / words.length;
}
