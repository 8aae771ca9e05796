import { createHash, randomUUID } from 'node:crypto';
import type { Readable } from 'node:stream';
import {
  BadRequestException,
  ConflictException,
  Injectable,
  Logger,
  NotFoundException,
  ServiceUnavailableException,
  UnprocessableEntityException,
} from '@nestjs/common';
import { toEngineeringCard, type MeasuredSample, type MeasurementCsvReading, type MeasurementSet, type MeasurementSetFields } from '@shuntwise/contracts';
import { UnitOfWork } from '../database/unit-of-work';
import { CatalogueEvents } from '../catalogue-events/catalogue-events.service';
import type { AuthUser } from '../common/decorators/current-user.decorator';
import { safeFileName } from '../datasheets/datasheets.service';
import { HousePartsService } from '../house-parts/house-parts.service';
import { StorageService } from '../storage/storage.service';
import { RatingCardsService } from '../vendor-parts/rating-cards.service';
import { VendorPartsRepository } from '../vendor-parts/vendor-parts.repository';
import { analyseMeasurements } from './measurement-analysis';
import { readMeasurementCsv } from './measurement-csv';
import type { MeasurementSetRow } from './measurement-set.model';
import { MeasurementSetsRepository } from './measurement-sets.repository';

export interface UploadedFile {
  buffer: Buffer;
  originalName: string;
}

@Injectable()
export class MeasurementSetsService {
  private readonly logger = new Logger('Measurements');

  constructor(
    private readonly sets: MeasurementSetsRepository,
    private readonly vendorParts: VendorPartsRepository,
    private readonly cards: RatingCardsService,
    private readonly houseParts: HousePartsService,
    private readonly storage: StorageService,
    private readonly events: CatalogueEvents,
    private readonly unitOfWork: UnitOfWork,
  ) {}

  /** What the file would give, with every row error: nothing is stored. */
  preview(file: UploadedFile | undefined): MeasurementCsvReading {
    return readMeasurementCsv(this.text(file));
  }

  /**
   * Stores a measurement file whose every row reads cleanly: the object (with its sha256) and
   * the row commit together or not at all, and the vendor part's decided cases are flagged for
   * a re-check in the same transaction, as a new datasheet does.
   */
  async upload(file: UploadedFile | undefined, fields: MeasurementSetFields, user: AuthUser): Promise<MeasurementSet> {
    const text = this.text(file);
    if (!(await this.vendorParts.findById(fields.vendorPartId))) {
      throw new BadRequestException({
        message: `No vendor part with id ${fields.vendorPartId}`,
        errors: [{ path: 'vendorPartId', message: 'no such vendor part' }],
      });
    }
    const reading = readMeasurementCsv(text);
    if (reading.errors.length > 0) {
      throw new UnprocessableEntityException({
        message: `The measurement file has ${reading.errors.length} problem(s); nothing was stored. Correct the rows named and upload it again.`,
        errors: reading.errors.map((e) => ({ path: `row ${e.row}${e.column ? `, ${e.column}` : ''}`, message: e.message })),
      });
    }
    if (reading.samples.length === 0) throw new UnprocessableEntityException('The measurement file has no points; nothing was stored.');
    const samples: MeasuredSample[] = reading.samples.map((s) => ({ ...s, lot: s.lot ?? fields.lot ?? null }));
    const buffer = file!.buffer;
    const sha256 = createHash('sha256').update(buffer).digest('hex');
    const known = await this.sets.findBySha256(fields.vendorPartId, sha256);
    if (known)
      throw new ConflictException({
        message: `This file is already measurement set ${known.id} of this part; nothing was stored again.`,
        errors: [{ path: 'file', message: `same as measurement set ${known.id}` }],
      });

    const key = `measurements/${randomUUID()}.csv`;
    const transaction = await this.unitOfWork.begin();
    let stored = false;
    try {
      const row = await this.sets.create(
        {
          vendorPartId: fields.vendorPartId,
          storageKey: key,
          sha256,
          fileName: safeFileName(file!.originalName),
          sizeBytes: buffer.byteLength,
          lot: fields.lot ?? null,
          instrument: fields.instrument ?? null,
          measuredOn: fields.measuredOn ?? null,
          note: fields.note ?? null,
          samples,
          sampleCount: samples.length,
          pointCount: samples.reduce((n, s) => n + s.points.length, 0),
          uploadedById: user.id,
        },
        transaction,
      );
      await this.events.publish(
        { kind: 'measurements-added', vendorPartId: fields.vendorPartId, measurementSetId: row.id, samples: samples.length, userId: user.id },
        transaction,
      );
      try {
        await this.storage.put(key, buffer, 'text/csv', sha256);
      } catch (error) {
        this.logger.warn(`object store refused ${key}: ${(error as Error).message}`);
        throw new ServiceUnavailableException('The object store did not take the file; nothing was saved. Try again in a moment.');
      }
      stored = true;
      await transaction.commit();
      return this.get(row.id);
    } catch (error) {
      await transaction.rollback().catch(() => undefined);
      if (stored) await this.storage.delete(key).catch((e: Error) => this.logger.error(`could not delete orphan object ${key}: ${e.message}`));
      throw error;
    }
  }

  /** True when these very bytes are already a measurement set of the part. */
  async isStored(vendorPartId: number, buffer: Buffer): Promise<boolean> {
    return (await this.sets.findBySha256(vendorPartId, createHash('sha256').update(buffer).digest('hex'))) !== null;
  }

  async get(id: number, housePartId?: number): Promise<MeasurementSet> {
    const row = await this.sets.findById(id);
    if (!row) throw new NotFoundException(`No measurement set with id ${id}`);
    return this.view(row, housePartId);
  }

  async listForVendorPart(vendorPartId: number, housePartId?: number): Promise<MeasurementSet[]> {
    if (!(await this.vendorParts.findById(vendorPartId))) throw new NotFoundException(`No vendor part with id ${vendorPartId}`);
    const rows = await this.sets.findByVendorPart(vendorPartId);
    return Promise.all(rows.map((row) => this.view(row, housePartId)));
  }

  /** The raw file as uploaded, with the name to offer. */
  async file(id: number): Promise<{ stream: Readable; fileName: string; sizeBytes: number }> {
    const row = await this.sets.findById(id);
    if (!row) throw new NotFoundException(`No measurement set with id ${id}`);
    try {
      const { stream } = await this.storage.getStream(row.storageKey);
      return { stream, fileName: row.fileName, sizeBytes: row.sizeBytes };
    } catch (error) {
      this.logger.error(`measurement set ${id}: object ${row.storageKey} not readable: ${(error as Error).message}`);
      throw new ServiceUnavailableException('The object store did not return the file; try again in a moment');
    }
  }

  private async view(row: MeasurementSetRow, housePartId?: number): Promise<MeasurementSet> {
    const card = await this.cards.card(row.vendorPartId);
    const spec = housePartId === undefined ? null : await this.houseParts.spec(housePartId);
    const samples: MeasuredSample[] = typeof row.samples === 'string' ? JSON.parse(row.samples) : row.samples;
    const analysis = analyseMeasurements({
      samples,
      card: toEngineeringCard(card.fields),
      cardVersion: card.version || null,
      spec: spec ? { housePartId: spec.housePartId, version: spec.version, spec: spec.spec } : null,
    });
    return {
      id: row.id,
      vendorPartId: row.vendorPartId,
      fileName: row.fileName,
      sha256: row.sha256,
      sizeBytes: row.sizeBytes,
      lot: row.lot,
      instrument: row.instrument,
      measuredOn: row.measuredOn,
      note: row.note,
      uploadedBy: row.uploadedBy ? { id: row.uploadedBy.id, name: row.uploadedBy.name } : null,
      createdAt: row.createdAt.toISOString(),
      samples,
      analysis,
    };
  }

  private text(file: UploadedFile | undefined): string {
    if (!file)
      throw new BadRequestException({ message: 'No file: send the CSV in the multipart field "file"', errors: [{ path: 'file', message: 'missing' }] });
    const text = new TextDecoder('utf-8', { fatal: false }).decode(file.buffer);
    if (text.includes('\u0000'))
      throw new UnprocessableEntityException({
        message: 'The file is not text: send the measurements as CSV',
        errors: [{ path: 'file', message: 'binary content' }],
      });
    return text;
  }
}
