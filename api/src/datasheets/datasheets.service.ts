import { createHash, randomUUID } from 'node:crypto';
import type { Readable } from 'node:stream';
import {
  BadRequestException,
  HttpException,
  HttpStatus,
  Injectable,
  Logger,
  NotFoundException,
  ServiceUnavailableException,
  UnprocessableEntityException,
} from '@nestjs/common';
import {
  extractionResultSchema,
  type CreateVariantsRequest,
  type CreateVariantsResponse,
  type Datasheet as DatasheetDto,
  type DatasheetVariantInput,
  type ExtractionResult,
  type RatingCardFieldsParsed,
  type UploadDatasheetFields,
  type UploadDatasheetResponse,
} from '@shuntwise/contracts';
import { UniqueConstraintError, type Transaction } from 'sequelize';
import { UnitOfWork } from '../database/unit-of-work';
import { CatalogueEvents } from '../catalogue-events/catalogue-events.service';
import type { AuthUser } from '../common/decorators/current-user.decorator';
import { StaleConflictException } from '../common/errors/stale-conflict.exception';
import { EXTRACTOR_VERSION, PdfReadError } from '../extraction';
import { ExtractionLimitError } from '../extraction-worker/extraction-pool';
import { StorageService } from '../storage/storage.service';
import { RatingCardsService, StaleCardError } from '../vendor-parts/rating-cards.service';
import { VendorPartsRepository } from '../vendor-parts/vendor-parts.repository';
import { VendorPartsService } from '../vendor-parts/vendor-parts.service';
import { DatasheetReader } from './datasheet-reader';
import type { Datasheet } from './datasheet.model';
import { DatasheetsRepository } from './datasheets.repository';

/** What an upload hands over: the bytes and the name the uploader gave the file. */
export interface UploadedPdf {
  buffer: Buffer;
  originalName: string;
}

/** The status each PdfReadError gets: the request is well formed, the file is not usable. */
const READ_ERROR_STATUS: Record<PdfReadError['code'], number> = {
  empty: HttpStatus.BAD_REQUEST,
  'not-pdf': HttpStatus.UNSUPPORTED_MEDIA_TYPE,
  encrypted: HttpStatus.UNPROCESSABLE_ENTITY,
  truncated: HttpStatus.UNPROCESSABLE_ENTITY,
  corrupt: HttpStatus.UNPROCESSABLE_ENTITY,
};

@Injectable()
export class DatasheetsService {
  private readonly logger = new Logger('Datasheets');

  constructor(
    private readonly datasheets: DatasheetsRepository,
    private readonly reader: DatasheetReader,
    private readonly storage: StorageService,
    private readonly vendorParts: VendorPartsRepository,
    private readonly vendorPartsService: VendorPartsService,
    private readonly cards: RatingCardsService,
    private readonly events: CatalogueEvents,
    private readonly unitOfWork: UnitOfWork,
  ) {}

  /**
   * Stores an uploaded PDF. The same bytes again give the stored datasheet back. A new file
   * is read first (a bad file stops here with its own 4xx); then its row and extraction are
   * written in a transaction, the object is put, and the transaction commits. A failed put
   * rolls the rows back; a failed commit deletes the object. Nothing is left half done.
   */
  async upload(file: UploadedPdf | undefined, fields: UploadDatasheetFields, user: AuthUser): Promise<UploadDatasheetResponse> {
    if (!file)
      throw new BadRequestException({ message: 'No file: send the PDF in the multipart field "file"', errors: [{ path: 'file', message: 'missing' }] });
    if (fields.vendorPartId !== undefined && !(await this.vendorParts.findById(fields.vendorPartId))) {
      throw new BadRequestException({
        message: `No vendor part with id ${fields.vendorPartId}`,
        errors: [{ path: 'vendorPartId', message: 'no such vendor part' }],
      });
    }
    const sha256 = createHash('sha256').update(file.buffer).digest('hex');
    const known = await this.datasheets.findBySha256(sha256);
    if (known) return this.existing(known, fields, user, file.buffer);

    const extraction = await this.read(file.buffer);
    const key = `datasheets/${randomUUID()}.pdf`;
    const transaction = await this.unitOfWork.begin();
    let stored = false;
    try {
      const row = await this.datasheets.create(
        {
          storageKey: key,
          sha256,
          fileName: safeFileName(file.originalName),
          sizeBytes: file.buffer.byteLength,
          pages: extraction.pages,
          revision: fields.revision ?? null,
          uploadedById: user.id,
        },
        transaction,
      );
      await this.datasheets.createExtraction(extractionRow(row.id, extraction), transaction);
      if (fields.vendorPartId !== undefined) await this.linkVendorPart(fields.vendorPartId, row.id, user, transaction);
      try {
        await this.storage.put(key, file.buffer, 'application/pdf', sha256);
      } catch (error) {
        this.logger.warn(`object store refused ${key}: ${(error as Error).message}`);
        throw new ServiceUnavailableException('The object store did not take the file; nothing was saved. Try again in a moment.');
      }
      stored = true;
      await transaction.commit();
      return { ...summary(row), existing: false };
    } catch (error) {
      await rollbackQuietly(transaction);
      if (stored) await this.deleteQuietly(key);
      // The same file uploaded twice at once: the other upload won; answer with its datasheet.
      if (error instanceof UniqueConstraintError && 'sha256' in (error.fields ?? {})) {
        const winner = await this.datasheets.findBySha256(sha256);
        if (winner) return this.existing(winner, fields, user);
      }
      throw error;
    }
  }

  async get(id: number): Promise<DatasheetDto> {
    const row = await this.datasheets.findById(id);
    if (!row) throw new NotFoundException(`No datasheet with id ${id}`);
    const [vendorPartIds, counts] = await Promise.all([this.datasheets.vendorPartIds(id), this.datasheets.extractionCounts(id)]);
    return {
      ...summary(row),
      revision: row.revision,
      uploadedBy: row.uploadedBy ? { id: row.uploadedBy.id, name: row.uploadedBy.name } : null,
      vendorPartIds,
      ...counts,
    };
  }

  async exists(id: number): Promise<boolean> {
    return (await this.datasheets.findById(id)) !== null;
  }

  /** The stored PDF as a stream, with the name to offer the browser. */
  async file(id: number): Promise<{ stream: Readable; fileName: string; sizeBytes: number }> {
    const row = await this.datasheets.findById(id);
    if (!row) throw new NotFoundException(`No datasheet with id ${id}`);
    try {
      const { stream } = await this.storage.getStream(row.storageKey);
      return { stream, fileName: row.fileName, sizeBytes: row.sizeBytes };
    } catch (error) {
      this.logger.error(`datasheet ${id}: object ${row.storageKey} not readable: ${(error as Error).message}`);
      throw new ServiceUnavailableException('The object store did not return the file; try again in a moment');
    }
  }

  async extraction(id: number): Promise<ExtractionResult> {
    const row = await this.datasheets.findExtraction(id);
    if (!row) {
      if (!(await this.exists(id))) throw new NotFoundException(`No datasheet with id ${id}`);
      throw new NotFoundException(`Datasheet ${id} has no extraction result`);
    }
    const result = extractionResultSchema.parse(typeof row.result === 'string' ? JSON.parse(row.result) : row.result);
    return { ...result, outdated: row.readerVersion !== EXTRACTOR_VERSION };
  }

  /**
   * Reads a stored datasheet again with the current reader, when its stored reading came from
   * an earlier version (else the stored reading is answered as it is). The file comes from the
   * object store; a file the reader now refuses keeps the old reading and answers the reader's
   * own error.
   */
  async readAgain(id: number): Promise<ExtractionResult> {
    const row = await this.datasheets.findById(id);
    if (!row) throw new NotFoundException(`No datasheet with id ${id}`);
    const version = await this.datasheets.readerVersion(id);
    if (version !== EXTRACTOR_VERSION) {
      let bytes: Uint8Array;
      try {
        bytes = await this.storage.getBytes(row.storageKey);
      } catch (error) {
        this.logger.error(`datasheet ${id}: object ${row.storageKey} not readable: ${(error as Error).message}`);
        throw new ServiceUnavailableException('The object store did not return the file; the stored reading stays. Try again in a moment.');
      }
      const extraction = await this.read(Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength));
      await this.storeReading(id, version, extraction);
    }
    return this.extraction(id);
  }

  /**
   * Links a datasheet to a vendor part inside the caller's transaction. When the part
   * already had another datasheet this is a new revision, and subscribers hear of it.
   */
  async linkVendorPart(vendorPartId: number, datasheetId: number, user: AuthUser | null, transaction: Transaction): Promise<void> {
    const before = await this.datasheets.datasheetIdsOf(vendorPartId, transaction);
    if (before.includes(datasheetId)) return;
    await this.datasheets.link(vendorPartId, datasheetId, transaction);
    if (before.length > 0) {
      const sheet = await this.datasheets.findById(datasheetId, transaction);
      await this.events.publish(
        { kind: 'datasheet-revised', vendorPartId, datasheetId, revision: sheet?.revision ?? null, previousDatasheetIds: before, userId: user?.id ?? null },
        transaction,
      );
    }
  }

  /**
   * The reviewed variants of a series datasheet, in one transaction: each becomes a vendor
   * part (found by manufacturer and mpn, or created), linked to the datasheet, with its
   * first card. A part that already has a card is refused (409), never overwritten.
   */
  async createVariants(
    datasheetId: number,
    request: Omit<CreateVariantsRequest, 'variants'> & { variants: Array<Omit<DatasheetVariantInput, 'fields'> & { fields: RatingCardFieldsParsed }> },
    user: AuthUser,
  ): Promise<CreateVariantsResponse> {
    if (!(await this.exists(datasheetId))) throw new NotFoundException(`No datasheet with id ${datasheetId}`);
    return this.unitOfWork.run(async (transaction) => {
      const vendorParts: CreateVariantsResponse['vendorParts'] = [];
      for (const [i, variant] of request.variants.entries()) {
        const { part, created } = await this.vendorPartsService.findOrCreateIn(
          { manufacturer: request.manufacturer, mpn: variant.mpn, package: variant.package, lifecycleNote: variant.lifecycleNote },
          user,
          transaction,
        );
        await this.linkVendorPart(part.id, datasheetId, user, transaction);
        let card;
        try {
          card = await this.cards.write(
            part.id,
            { baseVersion: 0, fields: variant.fields, note: `from datasheet ${datasheetId}` },
            user,
            transaction,
            `variants.${i}.fields`,
          );
        } catch (error) {
          if (error instanceof StaleCardError) {
            throw new StaleConflictException(
              `${request.manufacturer} ${variant.mpn} already has a card (version ${error.currentVersion}): edit it on the vendor part instead. Nothing was saved.`,
              {
                current: { version: error.currentVersion, vendorPartId: error.vendorPartId },
                errors: [{ path: `variants.${i}.mpn`, message: `already has card version ${error.currentVersion}` }],
              },
            );
          }
          throw error;
        }
        vendorParts.push({ vendorPartId: part.id, mpn: part.mpn, created, cardVersion: card.version });
      }
      return { datasheetId, vendorParts };
    });
  }

  private async existing(row: Datasheet, fields: UploadDatasheetFields, user: AuthUser, buffer?: Buffer): Promise<UploadDatasheetResponse> {
    if (fields.vendorPartId !== undefined) {
      await this.unitOfWork.run((transaction) => this.linkVendorPart(fields.vendorPartId!, row.id, user, transaction));
    }
    if (buffer) await this.readAgainIfOlder(row.id, buffer);
    return { ...summary(row), existing: true };
  }

  /**
   * A stored reading made by another version of the extractor is replaced by a fresh one of
   * the same bytes (the upload's own: the file is the same by its sha256). A fresh reading
   * that fails keeps the old one, which is what the engineer saw before.
   */
  private async readAgainIfOlder(datasheetId: number, buffer: Buffer): Promise<void> {
    const version = await this.datasheets.readerVersion(datasheetId);
    if (version === EXTRACTOR_VERSION) return;
    let extraction: ExtractionResult;
    try {
      extraction = await this.read(buffer);
    } catch (error) {
      this.logger.warn(`datasheet ${datasheetId}: reading it again failed, the stored reading stays: ${(error as Error).message}`);
      return;
    }
    await this.storeReading(datasheetId, version, extraction);
  }

  /** A fresh reading stored in place of the old one (or as the first, when none was kept). */
  private async storeReading(datasheetId: number, oldVersion: string | null | undefined, extraction: ExtractionResult): Promise<void> {
    const values = extractionRow(datasheetId, extraction);
    if (oldVersion === undefined) await this.unitOfWork.run((transaction) => this.datasheets.createExtraction(values, transaction));
    else await this.datasheets.replaceExtraction(values);
  }

  private async read(buffer: Buffer): Promise<ExtractionResult> {
    try {
      return await this.reader.read(buffer);
    } catch (error) {
      if (error instanceof PdfReadError) {
        const status = READ_ERROR_STATUS[error.code];
        if (status === HttpStatus.UNPROCESSABLE_ENTITY) throw new UnprocessableEntityException(error.message);
        throw new HttpException(error.message, status);
      }
      if (error instanceof ExtractionLimitError) throw new UnprocessableEntityException(error.message);
      throw error;
    }
  }

  private async deleteQuietly(key: string): Promise<void> {
    try {
      await this.storage.delete(key);
    } catch (error) {
      // Logged with the key so an operator can remove it; the row never committed.
      this.logger.error(`could not delete orphan object ${key}: ${(error as Error).message}`);
    }
  }
}

async function rollbackQuietly(transaction: Transaction): Promise<void> {
  try {
    await transaction.rollback();
  } catch {
    // already committed or rolled back
  }
}

function summary(row: Datasheet): Omit<UploadDatasheetResponse, 'existing'> {
  return { id: row.id, sha256: row.sha256, pages: row.pages, sizeBytes: row.sizeBytes, fileName: row.fileName, createdAt: row.createdAt.toISOString() };
}

/** The uploader's name for display only: no path, no control characters, at most 255 characters. */
export function safeFileName(name: string): string {
  const base = name.split(/[\\/]/).pop() ?? '';
  // Control characters, quotes and the bidirectional controls (which can make "fdp.exe" read as "exe.pdf") go.
  const clean = base
    // eslint-disable-next-line no-control-regex
    .replace(/[\u0000-\u001f\u007f-\u009f"\u061c\u200e\u200f\u202a-\u202e\u2066-\u2069]/g, '')
    .trim()
    .slice(0, 255);
  return clean || 'datasheet.pdf';
}

/** The stored form of a reading: the result, its counts, and the extractor version that made it. */
function extractionRow(datasheetId: number, extraction: ExtractionResult) {
  return {
    datasheetId,
    result: extraction,
    variantCount: extraction.variants.length,
    warningCount: extraction.warnings.length,
    readerVersion: EXTRACTOR_VERSION,
  };
}
