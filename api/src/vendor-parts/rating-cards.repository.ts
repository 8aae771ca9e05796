import { Injectable } from '@nestjs/common';
import { InjectConnection, InjectModel } from '@nestjs/sequelize';
import { vzTolerance, type RatingCardFields, type Spec } from '@shuntwise/contracts';
import { QueryTypes, type Transaction } from 'sequelize';
import { Sequelize } from 'sequelize-typescript';
import { RawRows, utcDate } from '../database/raw-rows';
import { User } from '../users/user.model';
import { RatingCardVersion } from './rating-card-version.model';
import { RatingCard } from './rating-card.model';

export interface SpecBasis {
  housePartId: number;
  partNumber: string;
  specVersion: number;
  spec: Spec;
}

/** The only place that queries rating cards and their versions. */
@Injectable()
export class RatingCardsRepository {
  constructor(
    @InjectConnection() private readonly sequelize: Sequelize,
    @InjectModel(RatingCard) private readonly cards: typeof RatingCard,
    @InjectModel(RatingCardVersion) private readonly versions: typeof RatingCardVersion,
    private readonly raw: RawRows,
  ) {}

  /**
   * The vendor part's current card in one primary-key read (raw row, no model instances):
   * null when there is no such vendor part, `card: null` when it has no card yet.
   */
  async currentRow(vendorPartId: number): Promise<{
    card: { version: number; fields: RatingCardFields; note: string | null; updatedAt: Date; updatedBy: { id: number; name: string } | null } | null;
  } | null> {
    const [row] = await this.raw.select<{
      version: number | null;
      fields: string | RatingCardFields | null;
      note: string | null;
      updatedAt: string | null;
      userId: number | null;
      userName: string | null;
    }>(
      `SELECT rc.version, rc.fields, rc.note, rc.updated_at AS updatedAt, u.id AS userId, u.name AS userName
       FROM vendor_parts vp LEFT JOIN rating_cards rc ON rc.vendor_part_id = vp.id LEFT JOIN users u ON u.id = rc.updated_by_id
       WHERE vp.id = ?`,
      [vendorPartId],
    );
    if (!row) return null;
    if (row.version === null || row.fields === null) return { card: null };
    return {
      card: {
        version: row.version,
        fields: typeof row.fields === 'string' ? (JSON.parse(row.fields) as RatingCardFields) : row.fields,
        note: row.note,
        updatedAt: utcDate(row.updatedAt!),
        updatedBy: row.userId !== null ? { id: row.userId, name: row.userName ?? '' } : null,
      },
    };
  }

  findCurrent(vendorPartId: number, transaction?: Transaction): Promise<RatingCard | null> {
    return this.cards.findByPk(vendorPartId, { include: [{ model: User, attributes: ['id', 'name'] }], transaction });
  }

  findVersion(vendorPartId: number, version: number, transaction?: Transaction): Promise<RatingCardVersion | null> {
    return this.versions.findOne({ where: { vendorPartId, version }, include: [{ model: User, attributes: ['id', 'name'] }], transaction });
  }

  listVersions(vendorPartId: number): Promise<RatingCardVersion[]> {
    return this.versions.findAll({
      where: { vendorPartId },
      attributes: ['id', 'vendorPartId', 'version', 'fields', 'changedFields', 'note', 'changedById', 'createdAt'],
      include: [{ model: User, attributes: ['id', 'name'] }],
      order: [['version', 'DESC']],
    });
  }

  /** Writes the card's new current state, its version row and the vendor part's list figures (one transaction, the caller's). */
  async save(
    values: {
      vendorPartId: number;
      version: number;
      fields: RatingCardFields;
      note: string | null;
      vzNom: number;
      izt: number;
      pdMax: number | null;
      userId: number | null;
      changedFields: string[];
    },
    existing: RatingCard | null,
    transaction: Transaction,
  ): Promise<void> {
    const row = { version: values.version, fields: values.fields, note: values.note, updatedById: values.userId };
    if (existing) await existing.update(row, { transaction });
    else await this.cards.create({ vendorPartId: values.vendorPartId, ...row }, { transaction });
    await this.sequelize.query('UPDATE vendor_parts SET card_version = ?, vz_nom = ?, izt = ?, pd_max = ?, vz_tolerance = ?, updated_at = NOW() WHERE id = ?', {
      replacements: [values.version, values.vzNom, values.izt, values.pdMax, vzTolerance(values.fields), values.vendorPartId],
      type: QueryTypes.UPDATE,
      transaction,
    });
    await this.versions.create(
      {
        vendorPartId: values.vendorPartId,
        version: values.version,
        fields: values.fields,
        changedFields: values.changedFields,
        note: values.note,
        changedById: values.userId,
      },
      { transaction },
    );
  }

  /**
   * The spec to normalise a card at: the given house part's, or else the first house part
   * (by part number) this vendor part is a source of that has a spec.
   */
  async specBasis(vendorPartId: number, housePartId?: number): Promise<SpecBasis | null> {
    const rows = await this.sequelize.query<{ housePartId: number; partNumber: string; specVersion: number; spec: Spec | string }>(
      housePartId !== undefined
        ? `SELECT h.id AS housePartId, h.part_number AS partNumber, s.version AS specVersion, s.spec
           FROM house_parts h JOIN house_part_specs s ON s.house_part_id = h.id AND s.version = h.spec_version
           WHERE h.id = ?`
        : `SELECT h.id AS housePartId, h.part_number AS partNumber, s.version AS specVersion, s.spec
           FROM house_part_sources src
           JOIN house_parts h ON h.id = src.house_part_id
           JOIN house_part_specs s ON s.house_part_id = h.id AND s.version = h.spec_version
           WHERE src.vendor_part_id = ? ORDER BY h.part_number LIMIT 1`,
      { replacements: [housePartId ?? vendorPartId], type: QueryTypes.SELECT },
    );
    const row = rows[0];
    if (!row) return null;
    return { ...row, spec: typeof row.spec === 'string' ? (JSON.parse(row.spec) as Spec) : row.spec };
  }

  /** Current cards of many vendor parts (for exports and imports). */
  findCurrentMany(vendorPartIds: number[], transaction?: Transaction): Promise<RatingCard[]> {
    if (vendorPartIds.length === 0) return Promise.resolve([]);
    return this.cards.findAll({ where: { vendorPartId: vendorPartIds }, transaction });
  }

  /** Cards in vendor-part id order after `afterId`, for streaming exports (keyset paging, no OFFSET). */
  async exportBatch(afterId: number, limit: number, manufacturer?: string): Promise<CardExportRow[]> {
    const rows = await this.sequelize.query<Omit<CardExportRow, 'fields'> & { fields: RatingCardFields | string }>(
      `SELECT vp.id AS vendorPartId, m.name AS manufacturer, vp.mpn, vp.package, vp.lifecycle_note AS lifecycleNote, rc.version, rc.fields
       FROM rating_cards rc
       JOIN vendor_parts vp ON vp.id = rc.vendor_part_id
       JOIN manufacturers m ON m.id = vp.manufacturer_id
       WHERE rc.vendor_part_id > ? ${manufacturer ? 'AND m.name = ?' : ''}
       ORDER BY rc.vendor_part_id LIMIT ?`,
      { replacements: manufacturer ? [afterId, manufacturer, limit] : [afterId, limit], type: QueryTypes.SELECT },
    );
    return rows.map((r) => ({ ...r, fields: typeof r.fields === 'string' ? (JSON.parse(r.fields) as RatingCardFields) : r.fields }));
  }
}

export interface CardExportRow {
  vendorPartId: number;
  manufacturer: string;
  mpn: string;
  package: string | null;
  lifecycleNote: string | null;
  version: number;
  fields: RatingCardFields;
}
