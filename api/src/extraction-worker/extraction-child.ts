/**
 * The extraction child process: reads one file at a time with the text extractor, and OCR
 * for image-only pages. Started and killed by ExtractionPool; it keeps pdfjs loaded between
 * files. A hostile file can make it run long or swell: the pool kills it from outside.
 */
import { loadPdfjs, PdfReadError } from '../extraction';
import { OcrEngine } from '../extraction/ocr/ocr-engine';
import { extractWithOcr } from '../extraction/ocr/ocr-extraction';
import type { ChildMessage, ExtractRequest } from './extraction-protocol';

function send(message: ChildMessage): void {
  process.send?.(message);
}

let engine: OcrEngine | undefined;

async function handle(request: ExtractRequest): Promise<void> {
  try {
    if (request.ocr.enabled) engine ??= new OcrEngine(request.ocr.dpi);
    const result = await extractWithOcr(request.bytes, {
      engine: request.ocr.enabled ? engine! : null,
      dpi: request.ocr.dpi,
      maxOcrPages: request.ocr.maxPages,
      onOcrPage: (page) => send({ type: 'ocr-page', id: request.id, page }),
    });
    // The OCR engine holds a few hundred MB: let it go between files.
    await engine?.stop();
    send({ type: 'done', id: request.id, result, rssBytes: process.memoryUsage.rss() });
  } catch (err) {
    await engine?.stop().catch(() => undefined);
    const error = err instanceof Error ? err : new Error(String(err));
    send({
      type: 'failed',
      id: request.id,
      error: { name: error.name, code: err instanceof PdfReadError ? err.code : undefined, message: error.message },
      rssBytes: process.memoryUsage.rss(),
    });
  }
}

process.on('message', (message: ExtractRequest) => {
  if (message?.type === 'extract') void handle(message);
});
// The API went away: nothing left to do.
process.on('disconnect', () => process.exit(0));

loadPdfjs().then(
  () => send({ type: 'ready' }),
  (err: unknown) => {
    console.error('extraction child: pdfjs did not load', err);
    process.exit(1);
  },
);
