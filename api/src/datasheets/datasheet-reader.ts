import { Injectable } from '@nestjs/common';
import type { ExtractionResult } from '@shuntwise/contracts';
import { extractDatasheet } from '../extraction';

/**
 * Reads an uploaded file with the extraction: throws its typed PdfReadError for a file that
 * is not a usable PDF, else returns the candidate ratings it found. The extraction keeps
 * one pdfjs instance loaded per process. A class of its own so tests can count or fail reads.
 */
@Injectable()
export class DatasheetReader {
  read(buffer: Uint8Array): Promise<ExtractionResult> {
    return extractDatasheet(buffer);
  }
}
