/** Datasheet extraction: pure functions (no Nest, no database); the upload route calls these. */
export { extractDatasheet, extractRatings, NO_TEXT_WARNING } from './rating-extractor';
export { checkPdfBytes, loadPdfjs, readPdf } from './pdf-text';
export type { PdfPageText, PdfText, PdfTextItem } from './pdf-text';
export { CorruptPdfError, EmptyFileError, EncryptedPdfError, NotPdfError, PdfReadError } from './pdf-errors';
export type { PdfReadErrorCode } from './pdf-errors';
