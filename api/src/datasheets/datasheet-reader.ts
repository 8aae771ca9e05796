import { Inject, Injectable, Logger, type OnModuleDestroy } from '@nestjs/common';
import type { ExtractionResult } from '@shuntwise/contracts';
import { ENV, type Env } from '../config/env';
import { extractionLimits } from '../extraction-worker/extraction-limits';
import { ExtractionPool } from '../extraction-worker/extraction-pool';

/**
 * Reads an uploaded file with the extraction (text layer, and OCR for image-only pages) in a
 * child process with a time and memory limit per file (EXTRACTION_*). Throws the typed
 * PdfReadError for a file that is not a usable PDF and ExtractionLimitError for one that
 * breaks a limit; else returns the candidate ratings it found. A class of its own so tests
 * can count or fail reads.
 */
@Injectable()
export class DatasheetReader implements OnModuleDestroy {
  private readonly logger = new Logger('DatasheetReader');
  readonly pool: ExtractionPool;

  constructor(@Inject(ENV) env: Env) {
    this.pool = new ExtractionPool(extractionLimits(env), (line) => this.logger.warn(line));
  }

  read(buffer: Uint8Array): Promise<ExtractionResult> {
    return this.pool.extract(buffer);
  }

  async onModuleDestroy(): Promise<void> {
    await this.pool.close();
  }
}
