/**
 * Why a file cannot be read as a PDF. The messages are written for the person who uploaded
 * the file: they become the 4xx messages of the upload route.
 */
export type PdfReadErrorCode = 'empty' | 'not-pdf' | 'encrypted' | 'truncated' | 'corrupt';

export class PdfReadError extends Error {
  constructor(
    readonly code: PdfReadErrorCode,
    message: string,
  ) {
    super(message);
    this.name = new.target.name;
  }
}

export class EmptyFileError extends PdfReadError {
  constructor() {
    super('empty', 'The file is empty (0 bytes): there is nothing to read. Choose the datasheet file again.');
  }
}

export class NotPdfError extends PdfReadError {
  constructor(looksLike?: string) {
    const what = looksLike ? ` It looks like ${looksLike}.` : '';
    super('not-pdf', `The file is not a PDF: it does not start with the PDF signature (%PDF-).${what} Upload the datasheet as a PDF.`);
  }
}

export class EncryptedPdfError extends PdfReadError {
  constructor() {
    super('encrypted', 'The PDF is password-protected: it cannot be opened without its password. Upload a copy without password protection.');
  }
}

/** Damaged files: cut off (truncated) or with a body that does not parse. */
export class CorruptPdfError extends PdfReadError {
  constructor(code: 'truncated' | 'corrupt', detail: string) {
    super(
      code,
      code === 'truncated'
        ? `The PDF is truncated: ${detail} Upload the complete file.`
        : `The PDF is damaged and cannot be read: ${detail} Upload an undamaged copy.`,
    );
  }
}
