import { type Canvas, createCanvas } from '@napi-rs/canvas';
import { loadPdfjs, type PdfTextItem } from '../pdf-text';
import { type OcrEngine, type OcrLine, type OcrWord, readingQuality, unsureShare } from './ocr-engine';
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
  /** The engine's reading of the whole page. */
  items: PdfTextItem[];
  /** The cell-by-cell reading of the cleaned page (see OcrEngine.readCells). */
  cellItems: PdfTextItem[];
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
        out.push({ page: n, hasImage: false, items: [], cellItems: [] });
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
      const [x0, y0, x1, y1] = page.view;
      let lines = await options.engine.read(canvas.toBuffer('image/png'));
      let image: Canvas = canvas;
      let geometry = { scale: options.dpi / 72, widthPx, heightPx, pageHeight: y1 - y0 };
      // A page scanned or drawn turned by 90° reads as noise: when few words come out sure, or
      // most words are unsure (a sideways table under an upright page header), the page is tried
      // turned both ways (a quick reading each) and read fully the way that reads best. Its text
      // is then read in its own frame, as the text layer's turned tables are.
      // The running header and footer (upright above and below a turned table) are left out of
      // that judgement: read well, they made a sideways page look upright.
      const body = pageBody(lines, heightPx);
      if (readingQuality(body) < 15 || unsureShare(body) > 0.5) {
        const turns = [90, 270].map((deg) => ({ deg, image: turned(canvas, deg) }));
        let best: { deg: number; image: Canvas; quality: number } | undefined;
        for (const t of turns) {
          const quality = readingQuality(await options.engine.probe(t.image.toBuffer('image/png')));
          if (!best || quality > best.quality) best = { ...t, quality };
        }
        if (best && best.quality > 2 * Math.max(5, readingQuality(body))) {
          lines = await options.engine.read(best.image.toBuffer('image/png'));
          image = best.image;
          geometry = { scale: options.dpi / 72, widthPx: heightPx, heightPx: widthPx, pageHeight: x1 - x0 };
        }
      }
      let cells = await options.engine.readCells(image);
      if (image !== canvas) {
        lines = withoutSidewaysMargins(lines, image.width);
        cells = withoutSidewaysMargins(cells, image.width);
      }
      out.push({ page: n, hasImage: true, items: ocrItems(lines, geometry), cellItems: ocrItems(cells, geometry) });
    }
  } finally {
    await doc.destroy();
  }
  return out;
}

/** The band a page's running header and footer leave (the top and bottom 8 % of its height). */
export const BODY_MARGIN = 0.08;

/** A reading without the words of the page's top and bottom bands (its running header and footer). */
export function pageBody(lines: OcrLine[], heightPx: number): OcrLine[] {
  const inside = (w: OcrWord) => {
    const y = (w.y0 + w.y1) / 2;
    return y > BODY_MARGIN * heightPx && y < (1 - BODY_MARGIN) * heightPx;
  };
  return lines.map((l) => ({ ...l, words: l.words.filter(inside) })).filter((l) => l.words.length > 0);
}

/**
 * A turned page's reading without the bits of its upright running header and footer. Turned to
 * read a sideways table, the page's header and footer stand on end in the left and right bands,
 * and the engine makes a column of one-to-three-character scraps of them ("g", "=)", "[Ω]") that
 * sit at the start or end of the table's rows and keep a row from being read as one. Longer
 * words there (the table's own first column may reach into the band) are kept.
 */
export function withoutSidewaysMargins(lines: OcrLine[], widthPx: number): OcrLine[] {
  const scrap = (w: OcrWord) => {
    const x = (w.x0 + w.x1) / 2;
    return (x < BODY_MARGIN * widthPx || x > (1 - BODY_MARGIN) * widthPx) && w.text.trim().length <= 3;
  };
  return lines.map((l) => ({ ...l, words: l.words.filter((w) => !scrap(w)) })).filter((l) => l.words.length > 0);
}

/** The image turned by 90° or 270° (clockwise), on a canvas of swapped size. */
function turned(source: Canvas, deg: 90 | 270 | number): Canvas {
  const out = createCanvas(source.height, source.width);
  const ctx = out.getContext('2d');
  if (deg === 90) {
    ctx.translate(source.height, 0);
    ctx.rotate(Math.PI / 2);
  } else {
    ctx.translate(0, source.width);
    ctx.rotate(-Math.PI / 2);
  }
  ctx.drawImage(source, 0, 0);
  return out;
}
