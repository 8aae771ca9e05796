import { CorruptPdfError, EmptyFileError, EncryptedPdfError, NotPdfError } from './pdf-errors';

/** pdfjs-dist is ESM-only; the api is CommonJS, so it is loaded with a real dynamic import. */
type Pdfjs = typeof import('pdfjs-dist/legacy/build/pdf.mjs');

let pdfjsPromise: Promise<Pdfjs> | undefined;

/**
 * Loads pdfjs-dist once per process (about 0.1 s cold). In Node it runs its worker code on
 * the main thread ("fake worker"), so no worker file needs configuring.
 */
export function loadPdfjs(): Promise<Pdfjs> {
  pdfjsPromise ??= import('pdfjs-dist/legacy/build/pdf.mjs').catch((err: unknown) => {
    pdfjsPromise = undefined; // let a later call retry
    throw err;
  });
  return pdfjsPromise;
}

/** One run of text as pdfjs reports it; x, y is the baseline start in PDF points (origin bottom-left). */
export interface PdfTextItem {
  str: string;
  x: number;
  y: number;
  width: number;
  height: number;
}

export interface PdfPageText {
  /** 1-based. */
  page: number;
  width: number;
  height: number;
  items: PdfTextItem[];
}

export interface PdfText {
  pageCount: number;
  /** False when no page has any text (a scan). */
  hasText: boolean;
  pages: PdfPageText[];
}

/** The direction of a run's baseline in quarter turns: 0 (left to right), 90 (upwards), 180, 270 (downwards). */
function turnOf(a: number, b: number): 0 | 90 | 180 | 270 {
  if (Math.abs(a) >= Math.abs(b)) return a >= 0 ? 0 : 180;
  return b > 0 ? 90 : 270;
}

/**
 * The direction most of a page's text runs in (by characters), so that a page turned by 90° is
 * read upright. The running header and footer (the top and bottom 8 % of the page) are left out
 * of the count: upright, they outweighed the three turned rows of a table's continuation page,
 * and those rows were dropped.
 */
function dominantTurn(items: Array<{ str: string; a: number; b: number; f: number }>, bottom: number, height: number): 0 | 90 | 180 | 270 {
  const inBody = (i: { f: number }) => i.f - bottom > 0.08 * height && i.f - bottom < 0.92 * height;
  const body = items.some(inBody) ? items.filter(inBody) : items;
  const count = new Map<number, number>();
  for (const i of body) count.set(turnOf(i.a, i.b), (count.get(turnOf(i.a, i.b)) ?? 0) + i.str.length);
  let best: 0 | 90 | 180 | 270 = 0;
  for (const [t, n] of count) if (n > (count.get(best) ?? 0)) best = t as 0 | 90 | 180 | 270;
  return best;
}

/** Bytes are enough to tell the common mistakes apart. */
function sniff(bytes: Uint8Array): string | undefined {
  const head = (n: number) => Array.from(bytes.subarray(0, n));
  const starts = (sig: number[]) => head(sig.length).every((b, i) => b === sig[i]);
  if (starts([0x89, 0x50, 0x4e, 0x47])) return 'a PNG image';
  if (starts([0xff, 0xd8, 0xff])) return 'a JPEG image';
  if (starts([0x47, 0x49, 0x46, 0x38])) return 'a GIF image';
  if (starts([0x50, 0x4b, 0x03, 0x04])) return 'a ZIP archive (perhaps a Word or Excel file)';
  if (starts([0xd0, 0xcf, 0x11, 0xe0])) return 'an old Microsoft Office file';
  const text = Buffer.from(bytes.subarray(0, 256)).toString('latin1').trimStart().toLowerCase();
  if (text.startsWith('<!doctype html') || text.startsWith('<html')) return 'a web page (HTML)';
  if ([...text].every((ch) => ch === '\t' || ch === '\n' || ch === '\r' || (ch >= ' ' && ch <= '~'))) return 'a plain text file';
  return undefined;
}

function indexOfAscii(bytes: Uint8Array, needle: string, from: number, to: number): number {
  const n = Buffer.from(needle, 'latin1');
  return Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength).subarray(from, to).indexOf(n);
}

/**
 * Checks what can be checked without parsing: empty, not a PDF, cut off before its
 * end-of-file marker. Throws the typed error; returns quietly otherwise.
 */
export function checkPdfBytes(bytes: Uint8Array): void {
  if (bytes.byteLength === 0) throw new EmptyFileError();
  // The signature may follow a little junk (PDF 1.7, 7.5.2 tolerates it); readers look in the first 1 KB.
  if (indexOfAscii(bytes, '%PDF-', 0, 1024) < 0) throw new NotPdfError(sniff(bytes));
  const tailStart = Math.max(0, bytes.byteLength - 2048);
  if (indexOfAscii(bytes, '%%EOF', tailStart, bytes.byteLength) < 0) {
    throw new CorruptPdfError('truncated', 'the file ends before its end-of-file marker (%%EOF), as after an interrupted download or copy.');
  }
}

function describe(err: unknown): string {
  if (err instanceof Error) return err.message.replace(/\.$/, '') + '.';
  return String(err);
}

/**
 * Reads every page's text items with positions. Throws EmptyFileError, NotPdfError,
 * EncryptedPdfError or CorruptPdfError; a scan is not an error (hasText is false).
 * The caller's buffer is not modified (pdfjs gets a copy, which it detaches).
 */
export async function readPdf(buffer: Uint8Array): Promise<PdfText> {
  checkPdfBytes(buffer);
  const pdfjs = await loadPdfjs();
  const task = pdfjs.getDocument({
    data: new Uint8Array(buffer),
    verbosity: pdfjs.VerbosityLevel.ERRORS,
    isEvalSupported: false,
    disableFontFace: true,
    useSystemFonts: false,
  });
  let doc: Awaited<typeof task.promise>;
  try {
    doc = await task.promise;
  } catch (err) {
    await task.destroy().catch(() => undefined);
    if (err instanceof Error && err.name === 'PasswordException') throw new EncryptedPdfError();
    throw new CorruptPdfError('corrupt', describe(err));
  }
  try {
    const pages: PdfPageText[] = [];
    let hasText = false;
    for (let n = 1; n <= doc.numPages; n++) {
      let page;
      let content;
      try {
        page = await doc.getPage(n);
        content = await page.getTextContent();
      } catch (err) {
        throw new CorruptPdfError('corrupt', `page ${n} could not be read (${describe(err)})`);
      }
      const [x0, y0, x1, y1] = page.view;
      const raw: Array<{ str: string; a: number; b: number; e: number; f: number; width: number; height: number }> = [];
      for (const item of content.items) {
        if (!('str' in item) || item.str.trim() === '') continue;
        const [a, b, , , e, f] = item.transform as number[];
        raw.push({ str: item.str, a, b, e, f, width: item.width, height: item.height });
      }
      const turn = dominantTurn(raw, y0, y1 - y0);
      const w = x1 - x0;
      const h = y1 - y0;
      const items: PdfTextItem[] = [];
      for (const r of raw) {
        // Text turned by 90° (a landscape table on a portrait page) is read in its own frame: its baseline becomes horizontal.
        if (turnOf(r.a, r.b) !== turn) continue;
        const size = turn === 0 ? r.height || Math.hypot(r.a, r.b) : Math.hypot(r.a, r.b) || r.height;
        const width = turn === 0 ? r.width : r.width || r.height;
        const [x, y] =
          turn === 90 ? [r.f - y0, w - (r.e - x0)] : turn === 270 ? [h - (r.f - y0), r.e - x0] : turn === 180 ? [w - (r.e - x0), h - (r.f - y0)] : [r.e, r.f];
        items.push({ str: r.str, x, y, width, height: size });
      }
      if (items.length) hasText = true;
      const across = turn === 90 || turn === 270;
      pages.push({ page: n, width: across ? h : w, height: across ? w : h, items });
      page.cleanup();
    }
    return { pageCount: doc.numPages, hasText, pages };
  } finally {
    await doc.destroy();
  }
}
