import { createCanvas } from '@napi-rs/canvas';
import { loadPdfjs, type PdfTextItem } from '../pdf-text';
import type { OcrEngine } from './ocr-engine';
import { ocrItems } from './ocr-items';

/**
 * Renders the pages that have no text layer and reads them by OCR. A page without any image
 * on it (a blank page) is not read: there is nothing to see.
 */

export interface PageOcrOptions {
  engine: OcrEngine;
  dpi: number;
  /** Called before each page is rendered, so a supervisor can extend its deadline. */
  onPage?: (page: number) => void;
}

export interface PageOcrResult {
  page: number;
  /** False when the page holds no image (nothing to read). */
  hasImage: boolean;
  items: PdfTextItem[];
}

export async function ocrPages(buffer: Uint8Array, pages: number[], options: PageOcrOptions): Promise<PageOcrResult[]> {
  const pdfjs = await loadPdfjs();
  const imageOps = new Set<number>([
    pdfjs.OPS.paintImageXObject,
    pdfjs.OPS.paintInlineImageXObject,
    pdfjs.OPS.paintImageMaskXObject,
    pdfjs.OPS.paintImageXObjectRepeat,
    pdfjs.OPS.paintInlineImageXObjectGroup,
    pdfjs.OPS.paintImageMaskXObjectGroup,
    pdfjs.OPS.paintImageMaskXObjectRepeat,
  ]);
  const doc = await pdfjs.getDocument({
    data: new Uint8Array(buffer),
    verbosity: pdfjs.VerbosityLevel.ERRORS,
    isEvalSupported: false,
    disableFontFace: true,
    useSystemFonts: false,
  }).promise;
  const out: PageOcrResult[] = [];
  try {
    for (const n of pages) {
      const page = await doc.getPage(n);
      const ops = await page.getOperatorList();
      if (!ops.fnArray.some((fn) => imageOps.has(fn))) {
        out.push({ page: n, hasImage: false, items: [] });
        page.cleanup();
        continue;
      }
      options.onPage?.(n);
      const viewport = page.getViewport({ scale: options.dpi / 72 });
      const widthPx = Math.round(viewport.width);
      const heightPx = Math.round(viewport.height);
      const canvas = createCanvas(widthPx, heightPx);
      const ctx = canvas.getContext('2d');
      ctx.fillStyle = '#ffffff';
      ctx.fillRect(0, 0, widthPx, heightPx);
      // @napi-rs/canvas stands in for the DOM canvas pdfjs is typed for.
      await page.render({ canvas: canvas, canvasContext: ctx, viewport } as unknown as Parameters<typeof page.render>[0]).promise;
      page.cleanup();
      const png = canvas.toBuffer('image/png');
      const lines = await options.engine.read(png);
      const [, , , y1] = page.view;
      const pageHeight = y1 - page.view[1];
      out.push({ page: n, hasImage: true, items: ocrItems(lines, { scale: options.dpi / 72, widthPx, heightPx, pageHeight }) });
    }
  } finally {
    await doc.destroy();
  }
  return out;
}
