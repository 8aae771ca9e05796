/** Datasheet extraction: pure functions (no Nest, no database); the upload route calls these. */

/**
 * Which reading of datasheets this is. Stored with each extraction; a file uploaded again
 * whose stored reading carries another version is read again (an engineer would otherwise be
 * shown what an older reader returned, wrong values it has since learnt to leave out
 * included). Change it whenever a change to the extractor changes what it returns.
 */
export const EXTRACTOR_VERSION = '2026-12-05.5';
export { extractDatasheet, extractRatings, NO_TEXT_WARNING } from './rating-extractor';
export { checkPdfBytes, loadPdfjs, readPdf } from './pdf-text';
export type { PdfPageText, PdfText, PdfTextItem } from './pdf-text';
export { CorruptPdfError, EmptyFileError, EncryptedPdfError, NotPdfError, PdfReadError } from './pdf-errors';
export type { PdfReadErrorCode } from './pdf-errors';
