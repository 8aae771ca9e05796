import type { Env } from '../config/env';
import type { ExtractionLimits } from './extraction-pool';

/** The per-file limits of datasheet reading, from the environment (EXTRACTION_*). */
export function extractionLimits(env: Env): ExtractionLimits {
  return {
    timeLimitMs: env.EXTRACTION_TIME_LIMIT_SECONDS * 1000,
    memoryLimitBytes: env.EXTRACTION_MEMORY_LIMIT_MB * 1024 * 1024,
    ocrMsPerPage: env.EXTRACTION_OCR_SECONDS_PER_PAGE * 1000,
    workers: env.EXTRACTION_WORKERS,
    ocr: { enabled: env.EXTRACTION_OCR, dpi: env.EXTRACTION_OCR_DPI, maxPages: env.EXTRACTION_OCR_MAX_PAGES },
  };
}
