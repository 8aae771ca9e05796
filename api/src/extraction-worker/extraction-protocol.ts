import type { ExtractionResult } from '@shuntwise/contracts';

/** Messages between the API and its extraction child process (serialization: 'advanced'). */

export interface OcrSettings {
  enabled: boolean;
  dpi: number;
  maxPages: number;
}

export interface ExtractRequest {
  type: 'extract';
  id: number;
  bytes: Uint8Array;
  ocr: OcrSettings;
}

export type ChildMessage =
  | { type: 'ready' }
  /** An OCR page is about to be read: the supervisor extends the file's deadline by one page. */
  | { type: 'ocr-page'; id: number; page: number }
  | { type: 'done'; id: number; result: ExtractionResult; rssBytes: number }
  | { type: 'failed'; id: number; error: { name: string; code?: string; message: string }; rssBytes: number };
