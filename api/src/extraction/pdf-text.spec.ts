import { readFileSync } from 'node:fs';
import { badUploads, listDatasheetFixtures } from '@shuntwise/test-fixtures';
import { CorruptPdfError, EmptyFileError, EncryptedPdfError, NotPdfError, PdfReadError } from './pdf-errors';
import { readPdf } from './pdf-text';
import { extractDatasheet, NO_TEXT_WARNING } from './rating-extractor';

/**
 * Bad uploads, each made by the fixture generator (test-fixtures/README.md). The PDF
 * structure facts used here — a file starts with "%PDF-" and ends with "%%EOF" — are from
 * ISO 32000-1 (PDF 1.7), 7.5.2 and 7.5.5 (quoted from memory).
 */

const bytes = (path: string) => new Uint8Array(readFileSync(path));

async function failure(path: string): Promise<unknown> {
  try {
    await extractDatasheet(bytes(path));
  } catch (err) {
    return err;
  }
  throw new Error(`${path} was read without an error`);
}

describe('reading uploaded files as PDFs', () => {
  it('refuses an empty file, saying it is empty', async () => {
    const err = await failure(badUploads.empty);
    expect(err).toBeInstanceOf(EmptyFileError);
    expect((err as PdfReadError).code).toBe('empty');
    expect((err as Error).message).toMatch(/empty \(0 bytes\)/);
  });

  it('refuses a PNG renamed to .pdf, saying it is not a PDF and what it looks like', async () => {
    const err = await failure(badUploads.notPdf);
    expect(err).toBeInstanceOf(NotPdfError);
    expect((err as Error).message).toMatch(/not a PDF.*%PDF-.*PNG image/);
  });

  it('refuses a truncated PDF, saying it is cut off', async () => {
    const err = await failure(badUploads.truncated);
    expect(err).toBeInstanceOf(CorruptPdfError);
    expect((err as PdfReadError).code).toBe('truncated');
    expect((err as Error).message).toMatch(/truncated.*end-of-file marker/);
  });

  it('refuses a PDF header over a garbage body, saying it is damaged', async () => {
    const err = await failure(badUploads.corrupt);
    expect(err).toBeInstanceOf(CorruptPdfError);
    expect((err as PdfReadError).code).toBe('corrupt');
    expect((err as Error).message).toMatch(/damaged and cannot be read/);
  });

  it('refuses a password-protected PDF, saying a password is needed', async () => {
    const err = await failure(badUploads.encrypted);
    expect(err).toBeInstanceOf(EncryptedPdfError);
    expect((err as Error).message).toMatch(/password-protected/);
  });

  it('keeps a scan as a document: its pages are counted and the extraction says no text was found', async () => {
    const pdf = await readPdf(bytes(badUploads.scanned));
    expect(pdf.pageCount).toBe(2);
    expect(pdf.hasText).toBe(false);
    const result = await extractDatasheet(bytes(badUploads.scanned));
    expect(result).toEqual({ variants: [], warnings: [NO_TEXT_WARNING], pages: 2, hasText: false });
    expect(NO_TEXT_WARNING).toMatch(/No text found/);
  });

  it('counts the pages and positions the text of a real datasheet, leaving the caller’s buffer intact', async () => {
    const ten = listDatasheetFixtures().find((f) => f.answers.pages === 10)!;
    const buffer = bytes(ten.pdfPath);
    const copy = Buffer.from(buffer);
    const pdf = await readPdf(buffer);
    expect(pdf.pageCount).toBe(10);
    expect(pdf.hasText).toBe(true);
    expect(pdf.pages.every((p) => p.items.length > 0)).toBe(true);
    // A4 is 595 × 842 pt (ISO 216; 210 × 297 mm at 72 pt per inch).
    expect(pdf.pages[0].width).toBeCloseTo(595.28, 1);
    expect(pdf.pages[0].height).toBeCloseTo(841.89, 1);
    const title = pdf.pages[0].items.find((i) => i.str === 'TPZ15 series' && i.height > 15)!;
    expect(title.x).toBeCloseTo(50, 0);
    expect(title.y).toBeGreaterThan(700);
    // pdfjs is given a copy: the upload's own bytes are neither detached nor changed.
    expect(buffer.byteLength).toBe(copy.byteLength);
    expect(Buffer.from(buffer).equals(copy)).toBe(true);
  });

  it('loads pdfjs once and reads several files at the same time', async () => {
    const files = listDatasheetFixtures().slice(0, 4);
    const pages = await Promise.all(files.map((f) => readPdf(bytes(f.pdfPath)).then((p) => p.pageCount)));
    expect(pages).toEqual(files.map((f) => f.answers.pages));
  });
});
