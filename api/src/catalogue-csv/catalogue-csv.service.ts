import { BadRequestException, Injectable } from '@nestjs/common';
import {
  CARD_FIELDS,
  type CsvImportPreview,
  type CsvImportRequest,
  type CsvImportResult,
  type CsvPreviewRow,
  type CsvRowAction,
  type RatingCardFields,
  type RatingCardFieldsParsed,
  type TcValue,
} from '@shuntwise/contracts';
import { UnitOfWork } from '../database/unit-of-work';
import type { AuthUser } from '../common/decorators/current-user.decorator';
import { StaleConflictException } from '../common/errors/stale-conflict.exception';
import { DatasheetsService } from '../datasheets/datasheets.service';
import { RatingCardsRepository } from '../vendor-parts/rating-cards.repository';
import { RatingCardsService, StaleCardError } from '../vendor-parts/rating-cards.service';
import { VendorPartsRepository } from '../vendor-parts/vendor-parts.repository';
import { VendorPartsService } from '../vendor-parts/vendor-parts.service';
import { parseSeriesCsv, SeriesCsvError, type ParsedSeries, type SeriesRow } from './series-csv';

interface PlannedRow extends SeriesRow {
  action: CsvRowAction | null;
  vendorPartId: number | null;
}

/** CSV import of a vendor series: a preview that writes nothing, and a confirm that writes every row or none. */
@Injectable()
export class CatalogueCsvService {
  constructor(
    private readonly vendorParts: VendorPartsRepository,
    private readonly vendorPartsService: VendorPartsService,
    private readonly cards: RatingCardsRepository,
    private readonly cardsService: RatingCardsService,
    private readonly datasheets: DatasheetsService,
    private readonly unitOfWork: UnitOfWork,
  ) {}

  async preview(request: CsvImportRequest): Promise<CsvImportPreview> {
    const { series, rows } = await this.plan(request);
    const errors = rows.flatMap((r) => r.errors);
    const count = (a: CsvRowAction) => rows.filter((r) => r.action === a).length;
    return {
      columns: series.columns.map((c) => ({ header: c.header, field: c.field === 'page' ? null : c.field, unit: c.unit })),
      rows: rows.map(toPreviewRow),
      errors,
      warnings: series.warnings,
      summary: {
        rows: rows.length,
        withErrors: rows.filter((r) => r.errors.length).length,
        create: count('create'),
        addCard: count('add-card'),
        unchanged: count('unchanged'),
        conflict: count('conflict'),
      },
    };
  }

  /**
   * Re-reads the same CSV and writes it in one transaction: new vendor parts with their first
   * card, cards for parts that had none. A row with an error stops the whole import (400);
   * a part whose card differs is left alone and reported, never overwritten.
   */
  async confirm(request: CsvImportRequest, user: AuthUser): Promise<CsvImportResult> {
    const { rows } = await this.plan(request);
    const errors = rows.flatMap((r) => r.errors);
    if (errors.length) {
      throw new BadRequestException({
        message: `Nothing imported: ${errors.length} problem${errors.length > 1 ? 's' : ''} in the CSV, first on row ${errors[0].row}, ${errors[0].column}: ${errors[0].message}`,
        errors: errors.map((e) => ({ path: `row ${e.row}, ${e.column}`, message: e.message })),
      });
    }
    if (rows.length === 0) throw new BadRequestException('Nothing imported: the CSV has no rows');
    const result: CsvImportResult = { created: 0, cardsAdded: 0, unchanged: 0, conflicts: [], vendorPartIds: [] };
    try {
      await this.unitOfWork.run(async (transaction) => {
        for (const row of rows) {
          if (row.action === 'unchanged' || row.action === 'conflict') {
            if (row.action === 'unchanged') result.unchanged++;
            else result.conflicts.push({ row: row.row, mpn: row.mpn!, vendorPartId: row.vendorPartId! });
            result.vendorPartIds.push(row.vendorPartId!);
            continue;
          }
          let vendorPartId = row.vendorPartId;
          if (row.action === 'create') {
            const part = await this.vendorPartsService.createIn(
              { manufacturer: row.manufacturer!, mpn: row.mpn!, package: row.package, lifecycleNote: row.lifecycleNote },
              user,
              transaction,
            );
            vendorPartId = part.id;
            result.created++;
          } else result.cardsAdded++;
          await this.cardsService.write(vendorPartId!, { baseVersion: 0, fields: row.fields!, note: 'imported from CSV' }, user, transaction, `row ${row.row}`);
          if (request.datasheetId) await this.datasheets.linkVendorPart(vendorPartId!, request.datasheetId, user, transaction);
          result.vendorPartIds.push(vendorPartId!);
        }
      });
    } catch (error) {
      if (error instanceof StaleCardError) {
        const row = rows.find((r) => r.vendorPartId === error.vendorPartId);
        throw new StaleConflictException(
          `A card was added to ${row?.mpn ?? `vendor part ${error.vendorPartId}`} since the preview (now version ${error.currentVersion}): preview again. Nothing was imported.`,
          {
            current: { version: error.currentVersion, vendorPartId: error.vendorPartId },
            errors: row ? [{ path: `row ${row.row}`, message: `card is now at version ${error.currentVersion}` }] : undefined,
          },
        );
      }
      throw error;
    }
    return result;
  }

  private async plan(request: CsvImportRequest): Promise<{ series: ParsedSeries; rows: PlannedRow[] }> {
    let series: ParsedSeries;
    try {
      series = parseSeriesCsv(request.csv, { manufacturer: request.manufacturer, datasheetId: request.datasheetId });
    } catch (error) {
      if (error instanceof SeriesCsvError) throw new BadRequestException({ message: error.message, errors: [{ path: 'csv', message: error.message }] });
      throw error;
    }
    if (request.datasheetId && !(await this.datasheets.exists(request.datasheetId))) {
      throw new BadRequestException({
        message: `No datasheet with id ${request.datasheetId}`,
        errors: [{ path: 'datasheetId', message: 'no such datasheet' }],
      });
    }
    const keyed = series.rows.filter((r) => r.manufacturer && r.mpn);
    const existing = await this.vendorParts.findByNames(keyed.map((r) => ({ manufacturer: r.manufacturer!, mpn: r.mpn! })));
    const byKey = new Map(existing.map((p) => [key(p.manufacturer, p.mpn), p]));
    const cards = new Map((await this.cards.findCurrentMany(existing.filter((p) => p.cardVersion !== null).map((p) => p.id))).map((c) => [c.vendorPartId, c]));
    const rows = series.rows.map((row): PlannedRow => {
      const part = row.manufacturer && row.mpn ? byKey.get(key(row.manufacturer, row.mpn)) : undefined;
      if (row.errors.length || !row.fields) return { ...row, action: null, vendorPartId: part?.id ?? null };
      if (!part) return { ...row, action: 'create', vendorPartId: null };
      const card = cards.get(part.id);
      if (!card) return { ...row, action: 'add-card', vendorPartId: part.id };
      return { ...row, action: sameValues(card.fields, row.fields) ? 'unchanged' : 'conflict', vendorPartId: part.id };
    });
    return { series, rows };
  }
}

const key = (manufacturer: string, mpn: string) => `${manufacturer}\u0000${mpn}`.toLowerCase();

/** The same card values (SI, and tc's unit) whatever their provenance. */
function sameValues(stored: RatingCardFields, row: RatingCardFieldsParsed): boolean {
  return CARD_FIELDS.every((f) => {
    const a = stored[f];
    const b = row[f];
    if (!a || !b) return !a && !b;
    const close = Math.abs(a.value - b.value) <= 1e-9 * Math.max(Math.abs(a.value), Math.abs(b.value));
    return close && (f !== 'tc' || (a as TcValue).unit === (b as { unit: string }).unit);
  });
}

function toPreviewRow(row: PlannedRow): CsvPreviewRow {
  return {
    row: row.row,
    manufacturer: row.manufacturer,
    mpn: row.mpn,
    package: row.package,
    action: row.action,
    vendorPartId: row.vendorPartId,
    values: row.values,
    errors: row.errors,
  };
}
