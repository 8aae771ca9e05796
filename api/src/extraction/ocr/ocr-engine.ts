import { existsSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { createWorker, OEM, PSM, type Worker } from 'tesseract.js';

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
          await w.setParameters({ tessedit_pageseg_mode: PSM.SINGLE_BLOCK, user_defined_dpi: String(this.dpi) });
          resolve(w);
        })
        .catch(reject);
    }).catch((err: unknown) => {
      this.worker = undefined;
      throw err;
    });
    return this.worker;
  }

  async read(png: Buffer): Promise<OcrLine[]> {
    const worker = await this.start();
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
