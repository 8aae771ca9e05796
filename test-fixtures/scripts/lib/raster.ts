import { createCanvas } from '@napi-rs/canvas';
import PDFDocument from 'pdfkit';
import { Prng } from './prng';
import { FIXTURE_DATE } from './sheet';

/**
 * Turns a text PDF into what a scanner makes of a printout: every page becomes one greyscale
 * JPEG image (no text layer), a little rotated, with paper grain and specks. The answer key of
 * the source stays valid page for page, so a rasterised copy measures OCR against it.
 * Seeded: the same seed and source give the same bytes.
 */
export interface RasterOptions {
  seed: number;
  /** Scan resolution; 200–300 is what office scanners send. */
  dpi?: number;
  /** Largest skew either way, degrees (each page draws its own within ±maxRotation). */
  maxRotation?: number;
  /** Grey-level noise amplitude (0–255) and the share of pixels hit by dark or light specks. */
  noise?: number;
  specks?: number;
  /** JPEG quality 1–100. */
  quality?: number;
  /** 1-based pages to keep (default all). */
  pages?: number[];
}

export interface RasterPage {
  page: number;
  rotation: number;
}

export interface Rasterised {
  pdf: Buffer;
  pages: RasterPage[];
  dpi: number;
}

type Pdfjs = typeof import('pdfjs-dist/legacy/build/pdf.mjs');
let pdfjsPromise: Promise<Pdfjs> | undefined;
function pdfjs(): Promise<Pdfjs> {
  pdfjsPromise ??= import('pdfjs-dist/legacy/build/pdf.mjs');
  return pdfjsPromise;
}

export async function rasterisePdf(source: Uint8Array, options: RasterOptions): Promise<Rasterised> {
  const dpi = options.dpi ?? 300;
  const maxRotation = options.maxRotation ?? 1;
  const noise = options.noise ?? 10;
  const specks = options.specks ?? 0.0005;
  const quality = options.quality ?? 85;
  const prng = new Prng(options.seed);
  const lib = await pdfjs();
  const doc = await lib.getDocument({ data: new Uint8Array(source), verbosity: 0, isEvalSupported: false, useSystemFonts: false }).promise;
  const out = new PDFDocument({
    autoFirstPage: false,
    margin: 0,
    info: { Title: 'Scanned copy', Creator: 'Shuntwise test-fixtures rasteriser', Producer: 'pdfkit', CreationDate: FIXTURE_DATE, ModDate: FIXTURE_DATE },
  });
  const chunks: Buffer[] = [];
  out.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve, reject) => {
    out.on('end', () => resolve(Buffer.concat(chunks)));
    out.on('error', reject);
  });
  const pages: RasterPage[] = [];
  try {
    const wanted = options.pages ?? Array.from({ length: doc.numPages }, (_, i) => i + 1);
    for (const n of wanted) {
      const page = await doc.getPage(n);
      const viewport = page.getViewport({ scale: dpi / 72 });
      const w = Math.round(viewport.width);
      const h = Math.round(viewport.height);
      const flat = createCanvas(w, h);
      const flatCtx = flat.getContext('2d');
      flatCtx.fillStyle = '#ffffff';
      flatCtx.fillRect(0, 0, w, h);
      // @napi-rs/canvas stands in for the DOM canvas pdfjs is typed for.
      await page.render({ canvas: flat, canvasContext: flatCtx, viewport } as unknown as Parameters<typeof page.render>[0]).promise;
      page.cleanup();

      const rotation = prng.between(-maxRotation, maxRotation);
      const scan = createCanvas(w, h);
      const ctx = scan.getContext('2d');
      ctx.fillStyle = '#ffffff';
      ctx.fillRect(0, 0, w, h);
      ctx.translate(w / 2, h / 2);
      ctx.rotate((rotation * Math.PI) / 180);
      ctx.drawImage(flat, -w / 2, -h / 2);
      ctx.setTransform(1, 0, 0, 1, 0, 0);

      // Greyscale, a slightly grey paper, grain on every pixel and the odd speck.
      const image = ctx.getImageData(0, 0, w, h);
      const px = image.data;
      for (let i = 0; i < px.length; i += 4) {
        let g = 0.299 * px[i] + 0.587 * px[i + 1] + 0.114 * px[i + 2];
        g = 12 + g * 0.92 + (prng.next() - 0.5) * noise;
        const r = prng.next();
        if (r < specks / 2) g = 60;
        else if (r < specks) g = 250;
        const v = g < 0 ? 0 : g > 255 ? 255 : g;
        px[i] = px[i + 1] = px[i + 2] = v;
      }
      ctx.putImageData(image, 0, 0);
      const jpeg = scan.toBuffer('image/jpeg', quality);
      const size: [number, number] = [page.view[2] - page.view[0], page.view[3] - page.view[1]];
      out.addPage({ size, margin: 0 });
      out.image(jpeg, 0, 0, { width: size[0], height: size[1] });
      pages.push({ page: n, rotation });
    }
  } finally {
    await doc.destroy();
  }
  out.end();
  return { pdf: await done, pages, dpi };
}
