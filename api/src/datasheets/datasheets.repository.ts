import { Injectable } from '@nestjs/common';
import { InjectConnection, InjectModel } from '@nestjs/sequelize';
import { QueryTypes, type Transaction } from 'sequelize';
import { Sequelize } from 'sequelize-typescript';
import { User } from '../users/user.model';
import { DatasheetExtraction } from './datasheet-extraction.model';
import { Datasheet } from './datasheet.model';
import { VendorPartDatasheet } from './vendor-part-datasheet.model';

/** The only place that queries datasheets, their extraction results and their links to vendor parts. */
@Injectable()
export class DatasheetsRepository {
  constructor(
    @InjectConnection() private readonly sequelize: Sequelize,
    @InjectModel(Datasheet) private readonly datasheets: typeof Datasheet,
    @InjectModel(DatasheetExtraction) private readonly extractions: typeof DatasheetExtraction,
    @InjectModel(VendorPartDatasheet) private readonly links: typeof VendorPartDatasheet,
  ) {}

  findById(id: number, transaction?: Transaction): Promise<Datasheet | null> {
    return this.datasheets.findByPk(id, { include: [{ model: User, attributes: ['id', 'name'] }], transaction });
  }

  findBySha256(sha256: string, transaction?: Transaction): Promise<Datasheet | null> {
    return this.datasheets.findOne({ where: { sha256 }, transaction });
  }

  create(
    values: Pick<Datasheet, 'storageKey' | 'sha256' | 'fileName' | 'sizeBytes' | 'pages' | 'revision' | 'uploadedById'>,
    transaction: Transaction,
  ): Promise<Datasheet> {
    return this.datasheets.create(values, { transaction });
  }

  async createExtraction(
    values: { datasheetId: number; result: unknown; variantCount: number; warningCount: number; readerVersion: string },
    transaction: Transaction,
  ): Promise<void> {
    await this.extractions.create(values, { transaction });
  }

  /** A new reading of a stored file in place of the old one. */
  async replaceExtraction(values: { datasheetId: number; result: unknown; variantCount: number; warningCount: number; readerVersion: string }): Promise<void> {
    const { datasheetId, ...rest } = values;
    await this.extractions.update(rest, { where: { datasheetId } });
  }

  /** The extractor version of a datasheet's stored reading (null: none kept, undefined: no reading). */
  async readerVersion(datasheetId: number): Promise<string | null | undefined> {
    const row = await this.extractions.findByPk(datasheetId, { attributes: ['datasheetId', 'readerVersion'] });
    return row ? row.readerVersion : undefined;
  }

  findExtraction(datasheetId: number): Promise<DatasheetExtraction | null> {
    return this.extractions.findByPk(datasheetId);
  }

  async extractionCounts(datasheetId: number): Promise<{ variantCount: number; warningCount: number }> {
    const row = await this.extractions.findByPk(datasheetId, { attributes: ['datasheetId', 'variantCount', 'warningCount'] });
    return { variantCount: row?.variantCount ?? 0, warningCount: row?.warningCount ?? 0 };
  }

  async vendorPartIds(datasheetId: number): Promise<number[]> {
    const rows = await this.links.findAll({ where: { datasheetId }, attributes: ['vendorPartId'], order: [['vendorPartId', 'ASC']] });
    return rows.map((r) => r.vendorPartId);
  }

  /** Datasheets already linked to a vendor part (to tell a new revision from a first datasheet). */
  async datasheetIdsOf(vendorPartId: number, transaction?: Transaction): Promise<number[]> {
    const rows = await this.links.findAll({ where: { vendorPartId }, attributes: ['datasheetId'], transaction });
    return rows.map((r) => r.datasheetId);
  }

  /** Links a datasheet to a vendor part; true when the link is new. */
  async link(vendorPartId: number, datasheetId: number, transaction: Transaction): Promise<boolean> {
    const [, affected] = (await this.sequelize.query(
      'INSERT IGNORE INTO vendor_part_datasheets (vendor_part_id, datasheet_id, created_at) VALUES (?, ?, NOW())',
      { replacements: [vendorPartId, datasheetId], type: QueryTypes.INSERT, transaction },
    )) as unknown as [unknown, number];
    return affected > 0;
  }
}
