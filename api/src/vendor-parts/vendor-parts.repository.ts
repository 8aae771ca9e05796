import { Injectable } from '@nestjs/common';
import { InjectConnection, InjectModel } from '@nestjs/sequelize';
import type { SortTerm, VendorPartListQuery, VendorPartSort } from '@shuntwise/contracts';
import { QueryTypes, type Transaction } from 'sequelize';
import { Sequelize } from 'sequelize-typescript';
import { sourceRoleSql } from '../common/source-standing.sql';
import { TextIndexRepository } from '../text-index/text-index.repository';
import { User } from '../users/user.model';
import { Manufacturer } from './manufacturer.model';
import { VendorPart } from './vendor-part.model';

/** A vendor part row as lists read it (raw, no model instances: lists can be long). */
export interface VendorPartRow {
  id: number;
  manufacturer: string;
  mpn: string;
  package: string | null;
  lifecycleNote: string | null;
  createdAt: Date;
  updatedAt: Date;
  cardVersion: number | null;
  vzNom: number | null;
  izt: number | null;
  pdMax: number | null;
}

/** Every sort is one indexed column of vendor_parts (then id, which each secondary index ends with). */
const SORT_COLUMNS: Record<VendorPartSort, string> = {
  mpn: 'vp.mpn',
  manufacturer: 'vp.manufacturer_name',
  package: 'vp.package',
  vzNom: 'vp.vz_nom',
  izt: 'vp.izt',
  pdMax: 'vp.pd_max',
  updatedAt: 'vp.updated_at',
  createdAt: 'vp.created_at',
};

// One table, no join: the manufacturer's name and the card's list figures live on the row.
const SELECT_ROW = `SELECT vp.id, vp.manufacturer_name AS manufacturer, vp.mpn, vp.package, vp.lifecycle_note AS lifecycleNote,
  vp.created_at AS createdAt, vp.updated_at AS updatedAt,
  vp.card_version AS cardVersion, vp.vz_nom AS vzNom, vp.izt AS izt, vp.pd_max AS pdMax
FROM vendor_parts vp`;

/** Escapes LIKE wildcards so a typed "%" or "_" matches itself. */
export function likePrefix(text: string): string {
  return `${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}

/** The only place that queries vendor parts and manufacturers. */
@Injectable()
export class VendorPartsRepository {
  constructor(
    @InjectConnection() private readonly sequelize: Sequelize,
    @InjectModel(VendorPart) private readonly vendorParts: typeof VendorPart,
    @InjectModel(Manufacturer) private readonly manufacturers: typeof Manufacturer,
    private readonly textIndex: TextIndexRepository,
  ) {}

  /** One page, narrowed and sorted in SQL on indexed columns; the count uses the same conditions. */
  async list(query: VendorPartListQuery): Promise<{ rows: VendorPartRow[]; total: number }> {
    const where: string[] = [];
    const params: unknown[] = [];
    if (query.q) {
      const text = this.textIndex.vendorPartCondition('vp', query.q);
      where.push(text.sql);
      params.push(...text.params);
    }
    if (query.mpn) {
      where.push(`vp.mpn LIKE ?`);
      params.push(likePrefix(query.mpn));
    }
    if (query.manufacturer) {
      const names = query.manufacturer
        .split(',')
        .map((s) => s.trim())
        .filter(Boolean);
      where.push(`vp.manufacturer_name IN (${names.map(() => '?').join(', ')})`);
      params.push(...names);
    }
    if (query.package) {
      where.push('vp.package = ?');
      params.push(query.package);
    }
    if (query.vzNomMin !== undefined) {
      where.push('vp.vz_nom >= ?');
      params.push(query.vzNomMin);
    }
    if (query.vzNomMax !== undefined) {
      where.push('vp.vz_nom <= ?');
      params.push(query.vzNomMax);
    }
    if (query.hasCard !== undefined) where.push(query.hasCard ? 'vp.card_version IS NOT NULL' : 'vp.card_version IS NULL');
    if (query.housePartId !== undefined) {
      where.push('EXISTS (SELECT 1 FROM house_part_sources s WHERE s.vendor_part_id = vp.id AND s.house_part_id = ?)');
      params.push(query.housePartId);
    }
    const whereSql = where.length ? `WHERE ${where.join(' AND ')}` : '';
    const order = orderBy(query.sort);
    // Deferred join: the page's ids come from the index alone, so a deep OFFSET skips index
    // entries rather than whole rows; only the page's rows are then read.
    const rows = await this.sequelize.query<VendorPartRow>(
      `${SELECT_ROW} JOIN (SELECT vp.id FROM vendor_parts vp ${whereSql} ORDER BY ${order} LIMIT ? OFFSET ?) page ON page.id = vp.id ORDER BY ${order}`,
      { replacements: [...params, query.pageSize, query.pageIndex * query.pageSize], type: QueryTypes.SELECT },
    );
    const [{ total }] = await this.sequelize.query<{ total: number | bigint }>(`SELECT COUNT(*) AS total FROM vendor_parts vp ${whereSql}`, {
      replacements: params,
      type: QueryTypes.SELECT,
    });
    return { rows, total: Number(total) };
  }

  async findRow(id: number, transaction?: Transaction): Promise<VendorPartRow | null> {
    const rows = await this.sequelize.query<VendorPartRow>(`${SELECT_ROW} WHERE vp.id = ?`, { replacements: [id], type: QueryTypes.SELECT, transaction });
    return rows[0] ?? null;
  }

  findById(id: number, transaction?: Transaction, lock = false): Promise<VendorPart | null> {
    return this.vendorParts.findByPk(id, {
      include: [{ model: Manufacturer }, { model: User, attributes: ['id', 'name'] }],
      transaction,
      lock: lock && transaction ? transaction.LOCK.UPDATE : undefined,
    });
  }

  /** Row lock on the vendor part: card writes for one part queue behind each other. */
  async lock(id: number, transaction: Transaction): Promise<boolean> {
    const rows = await this.sequelize.query('SELECT id FROM vendor_parts WHERE id = ? FOR UPDATE', {
      replacements: [id],
      type: QueryTypes.SELECT,
      transaction,
    });
    return rows.length > 0;
  }

  findByManufacturerAndMpn(manufacturerId: number, mpn: string, transaction?: Transaction): Promise<VendorPart | null> {
    return this.vendorParts.findOne({ where: { manufacturerId, mpn }, transaction });
  }

  /** Vendor parts by (manufacturer name, mpn), for imports: one query for the whole file. */
  async findByNames(keys: Array<{ manufacturer: string; mpn: string }>, transaction?: Transaction): Promise<VendorPartRow[]> {
    if (keys.length === 0) return [];
    const rows: VendorPartRow[] = [];
    for (let i = 0; i < keys.length; i += 500) {
      const chunk = keys.slice(i, i + 500);
      rows.push(
        ...(await this.sequelize.query<VendorPartRow>(`${SELECT_ROW} WHERE (vp.manufacturer_name, vp.mpn) IN (${chunk.map(() => '(?, ?)').join(', ')})`, {
          replacements: chunk.flatMap((k) => [k.manufacturer, k.mpn]),
          type: QueryTypes.SELECT,
          transaction,
        })),
      );
    }
    return rows;
  }

  /** Creates the part and indexes its part number in the same transaction. */
  async create(
    values: { manufacturer: Manufacturer; mpn: string; package: string | null; lifecycleNote: string | null; createdById: number | null },
    transaction: Transaction,
  ): Promise<VendorPart> {
    const { manufacturer, ...rest } = values;
    const part = await this.vendorParts.create({ ...rest, manufacturerId: manufacturer.id, manufacturerName: manufacturer.name }, { transaction });
    await this.textIndex.write('vendorPart', part.id, [part.mpn], transaction);
    return part;
  }

  async update(
    part: VendorPart,
    values: { manufacturer?: Manufacturer } & Partial<Pick<VendorPart, 'mpn' | 'package' | 'lifecycleNote'>>,
    transaction: Transaction,
  ): Promise<void> {
    const { manufacturer, ...rest } = values;
    await part.update({ ...rest, ...(manufacturer ? { manufacturerId: manufacturer.id, manufacturerName: manufacturer.name } : {}) }, { transaction });
    if (values.mpn !== undefined) await this.textIndex.write('vendorPart', part.id, [part.mpn], transaction);
  }

  findManufacturerByName(name: string, transaction?: Transaction): Promise<Manufacturer | null> {
    return this.manufacturers.findOne({ where: { name }, transaction });
  }

  /** The manufacturer by name, created when new (names compare case-insensitively). */
  async findOrCreateManufacturer(name: string, transaction: Transaction): Promise<Manufacturer> {
    const existing = await this.findManufacturerByName(name, transaction);
    if (existing) return existing;
    // INSERT IGNORE: two imports naming the same new manufacturer do not fail each other.
    const [, inserted] = await this.sequelize.query('INSERT IGNORE INTO manufacturers (name, created_at, updated_at) VALUES (?, NOW(), NOW())', {
      replacements: [name],
      type: QueryTypes.INSERT,
      transaction,
    });
    const manufacturer = (await this.findManufacturerByName(name, transaction))!;
    // Indexed by whichever transaction inserted the row (the other found it already there).
    if (Number(inserted) > 0) await this.textIndex.write('manufacturer', manufacturer.id, [manufacturer.name], transaction);
    return manufacturer;
  }

  async listManufacturers(): Promise<Array<{ id: number; name: string; vendorPartCount: number }>> {
    const rows = await this.sequelize.query<{ id: number; name: string; vendorPartCount: number | bigint }>(
      `SELECT m.id, m.name, (SELECT COUNT(*) FROM vendor_parts vp WHERE vp.manufacturer_id = m.id) AS vendorPartCount
       FROM manufacturers m ORDER BY m.name`,
      { type: QueryTypes.SELECT },
    );
    return rows.map((r) => ({ id: r.id, name: r.name, vendorPartCount: Number(r.vendorPartCount) }));
  }

  async datasheetsOf(vendorPartId: number): Promise<Array<{ id: number; fileName: string; revision: string | null; pages: number; createdAt: Date }>> {
    return this.sequelize.query(
      `SELECT d.id, d.file_name AS fileName, d.revision, d.pages, d.created_at AS createdAt
       FROM vendor_part_datasheets l JOIN datasheets d ON d.id = l.datasheet_id
       WHERE l.vendor_part_id = ? ORDER BY d.created_at, d.id`,
      { replacements: [vendorPartId], type: QueryTypes.SELECT },
    );
  }

  async sourceOf(vendorPartId: number): Promise<Array<{ housePartId: number; partNumber: string; role: 'approved' | 'alternate' }>> {
    return this.sequelize.query(
      `SELECT s.house_part_id AS housePartId, h.part_number AS partNumber, ${sourceRoleSql('s')} AS role
       FROM house_part_sources s JOIN house_parts h ON h.id = s.house_part_id
       WHERE s.vendor_part_id = ? ORDER BY h.part_number`,
      { replacements: [vendorPartId], type: QueryTypes.SELECT },
    );
  }

  /** Which of these datasheet ids exist. */
  async existingDatasheetIds(ids: number[], transaction?: Transaction): Promise<Set<number>> {
    if (ids.length === 0) return new Set();
    const rows = await this.sequelize.query<{ id: number }>(`SELECT id FROM datasheets WHERE id IN (${ids.map(() => '?').join(', ')})`, {
      replacements: ids,
      type: QueryTypes.SELECT,
      transaction,
    });
    return new Set(rows.map((r) => r.id));
  }
}

function orderBy(sort: SortTerm<VendorPartSort>[]): string {
  const terms = sort.map((t) => `${SORT_COLUMNS[t.field]} ${t.desc ? 'DESC' : 'ASC'}`);
  const last = sort[sort.length - 1];
  terms.push(`vp.id ${last?.desc ? 'DESC' : 'ASC'}`);
  return terms.join(', ');
}
