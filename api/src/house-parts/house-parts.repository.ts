import { Injectable } from '@nestjs/common';
import { InjectConnection, InjectModel } from '@nestjs/sequelize';
import type { HousePartListQuery, HousePartSort, HousePartStatus, QualificationState, SortTerm, Spec } from '@shuntwise/contracts';
import { QueryTypes, type Transaction } from 'sequelize';
import { Sequelize } from 'sequelize-typescript';
import { DECIDED_SQL, sourceRoleSql } from '../common/source-standing.sql';
import { refreshUsableSource } from '../source-standing/usable-sources.repository';
import { TextIndexRepository } from '../text-index/text-index.repository';
import { User } from '../users/user.model';
import { HousePartSource } from './house-part-source.model';
import { HousePartSpec } from './house-part-spec.model';
import { HousePart } from './house-part.model';

export interface HousePartRow {
  id: number;
  partNumber: string;
  description: string;
  status: HousePartStatus;
  specVersion: number | null;
  sourceCount: number | bigint;
  createdAt: Date;
  updatedAt: Date;
  createdById: number | null;
  createdByName: string | null;
}

export interface SourceRow {
  housePartId: number;
  vendorPartId: number;
  manufacturer: string;
  mpn: string;
  package: string | null;
  lifecycleNote: string | null;
  /** Derived from the decisions on the pair's cases (sourceRoleSql). */
  role: 'approved' | 'alternate';
  note: string | null;
  cardVersion: number | null;
  addedById: number | null;
  addedByName: string | null;
  createdAt: Date;
  updatedAt: Date;
}

const SORT_COLUMNS: Record<HousePartSort, string> = {
  partNumber: 'h.part_number',
  status: 'h.status',
  updatedAt: 'h.updated_at',
  createdAt: 'h.created_at',
};

const SELECT_ROW = `SELECT h.id, h.part_number AS partNumber, h.description, h.status, h.spec_version AS specVersion,
  (SELECT COUNT(*) FROM house_part_sources s WHERE s.house_part_id = h.id) AS sourceCount,
  h.created_at AS createdAt, h.updated_at AS updatedAt, h.created_by_id AS createdById, u.name AS createdByName
FROM house_parts h LEFT JOIN users u ON u.id = h.created_by_id`;

const SELECT_SOURCE = `SELECT s.house_part_id AS housePartId, s.vendor_part_id AS vendorPartId, m.name AS manufacturer, vp.mpn,
  vp.package, vp.lifecycle_note AS lifecycleNote, ${sourceRoleSql('s')} AS role, s.note, rc.version AS cardVersion,
  s.added_by_id AS addedById, u.name AS addedByName, s.created_at AS createdAt, s.updated_at AS updatedAt
FROM house_part_sources s
JOIN vendor_parts vp ON vp.id = s.vendor_part_id
JOIN manufacturers m ON m.id = vp.manufacturer_id
LEFT JOIN rating_cards rc ON rc.vendor_part_id = vp.id
LEFT JOIN users u ON u.id = s.added_by_id`;

/** The only place that queries house parts, their specs and their sources. */
@Injectable()
export class HousePartsRepository {
  constructor(
    @InjectConnection() private readonly sequelize: Sequelize,
    @InjectModel(HousePart) private readonly houseParts: typeof HousePart,
    @InjectModel(HousePartSpec) private readonly specs: typeof HousePartSpec,
    @InjectModel(HousePartSource) private readonly sources: typeof HousePartSource,
    private readonly textIndex: TextIndexRepository,
  ) {}

  /** `statuses`: only house parts in these (designers are not offered drafts). */
  async list(query: HousePartListQuery, statuses?: readonly HousePartStatus[]): Promise<{ rows: HousePartRow[]; total: number }> {
    const where: string[] = [];
    const params: unknown[] = [];
    if (statuses) {
      where.push(`h.status IN (${statuses.map(() => '?').join(', ')})`);
      params.push(...statuses);
    }
    if (query.q) {
      const text = this.textIndex.housePartCondition('h', query.q);
      where.push(text.sql);
      params.push(...text.params);
    }
    if (query.status) {
      where.push('h.status = ?');
      params.push(query.status);
    }
    const whereSql = where.length ? `WHERE ${where.join(' AND ')}` : '';
    const order = [...query.sort.map((t: SortTerm<HousePartSort>) => `${SORT_COLUMNS[t.field]} ${t.desc ? 'DESC' : 'ASC'}`), 'h.id ASC'].join(', ');
    const rows = await this.sequelize.query<HousePartRow>(`${SELECT_ROW} ${whereSql} ORDER BY ${order} LIMIT ? OFFSET ?`, {
      replacements: [...params, query.pageSize, query.pageIndex * query.pageSize],
      type: QueryTypes.SELECT,
    });
    const [{ total }] = await this.sequelize.query<{ total: number | bigint }>(`SELECT COUNT(*) AS total FROM house_parts h ${whereSql}`, {
      replacements: params,
      type: QueryTypes.SELECT,
    });
    return { rows, total: Number(total) };
  }

  async findRow(id: number, transaction?: Transaction): Promise<HousePartRow | null> {
    const rows = await this.sequelize.query<HousePartRow>(`${SELECT_ROW} WHERE h.id = ?`, { replacements: [id], type: QueryTypes.SELECT, transaction });
    return rows[0] ?? null;
  }

  /** All house parts in part-number order (exports). */
  listAll(): Promise<HousePartRow[]> {
    return this.sequelize.query<HousePartRow>(`${SELECT_ROW} ORDER BY h.part_number`, { type: QueryTypes.SELECT });
  }

  findById(id: number, transaction?: Transaction, lock = false): Promise<HousePart | null> {
    return this.houseParts.findByPk(id, { transaction, lock: lock && transaction ? transaction.LOCK.UPDATE : undefined });
  }

  findByPartNumber(partNumber: string, transaction?: Transaction): Promise<HousePart | null> {
    return this.houseParts.findOne({ where: { partNumber }, transaction });
  }

  /** Creates the house part and indexes its number and description in the same transaction (its own when none is given). */
  create(
    values: { partNumber: string; description: string; status: HousePartStatus; createdById: number | null },
    transaction?: Transaction,
  ): Promise<HousePart> {
    return this.within(transaction, async (t) => {
      const part = await this.houseParts.create(values, { transaction: t });
      await this.textIndex.write('housePart', part.id, [part.partNumber, part.description], t);
      return part;
    });
  }

  async update(
    part: HousePart,
    values: Partial<Pick<HousePart, 'partNumber' | 'description' | 'status' | 'specVersion'>>,
    transaction?: Transaction,
  ): Promise<void> {
    await this.within(transaction, async (t) => {
      await part.update(values, { transaction: t });
      if (values.partNumber !== undefined || values.description !== undefined)
        await this.textIndex.write('housePart', part.id, [part.partNumber, part.description], t);
    });
  }

  private within<T>(transaction: Transaction | undefined, work: (t: Transaction) => Promise<T>): Promise<T> {
    return transaction ? work(transaction) : this.sequelize.transaction(work);
  }

  findSpec(housePartId: number, version: number, transaction?: Transaction): Promise<HousePartSpec | null> {
    return this.specs.findOne({ where: { housePartId, version }, include: [{ model: User, attributes: ['id', 'name'] }], transaction });
  }

  listSpecVersions(housePartId: number): Promise<HousePartSpec[]> {
    return this.specs.findAll({
      where: { housePartId },
      attributes: ['id', 'housePartId', 'version', 'note', 'createdById', 'createdAt'],
      include: [{ model: User, attributes: ['id', 'name'] }],
      order: [['version', 'DESC']],
    });
  }

  createSpec(
    values: { housePartId: number; version: number; spec: Spec; note: string | null; createdById: number | null },
    transaction: Transaction,
  ): Promise<HousePartSpec> {
    return this.specs.create(values, { transaction });
  }

  async listSources(housePartId: number): Promise<SourceRow[]> {
    return this.sequelize.query<SourceRow>(`${SELECT_SOURCE} WHERE s.house_part_id = ? ORDER BY ${sourceRoleSql('s')} = 'approved' DESC, m.name, vp.mpn`, {
      replacements: [housePartId],
      type: QueryTypes.SELECT,
    });
  }

  async findSourceRow(housePartId: number, vendorPartId: number, transaction?: Transaction): Promise<SourceRow | null> {
    const rows = await this.sequelize.query<SourceRow>(`${SELECT_SOURCE} WHERE s.house_part_id = ? AND s.vendor_part_id = ?`, {
      replacements: [housePartId, vendorPartId],
      type: QueryTypes.SELECT,
      transaction,
    });
    return rows[0] ?? null;
  }

  /** Every source of every house part (exports), house-part-number order. */
  async listAllSources(): Promise<SourceRow[]> {
    return this.sequelize.query<SourceRow>(`${SELECT_SOURCE} ORDER BY s.house_part_id, ${sourceRoleSql('s')} = 'approved' DESC, m.name, vp.mpn`, {
      type: QueryTypes.SELECT,
    });
  }

  findSource(housePartId: number, vendorPartId: number, transaction?: Transaction, lock = false): Promise<HousePartSource | null> {
    return this.sources.findOne({ where: { housePartId, vendorPartId }, transaction, lock: lock && transaction ? transaction.LOCK.UPDATE : undefined });
  }

  /** The latest decided case of a source, the one its standing comes from (null before any decision). */
  async latestDecision(housePartId: number, vendorPartId: number, transaction?: Transaction): Promise<{ id: number; state: QualificationState } | null> {
    const [row] = await this.sequelize.query<{ id: number; state: QualificationState }>(
      `SELECT d.id, d.state FROM qualifications d WHERE d.house_part_id = ? AND d.vendor_part_id = ? AND d.state IN ${DECIDED_SQL} ORDER BY d.revision DESC LIMIT 1`,
      { replacements: [housePartId, vendorPartId], type: QueryTypes.SELECT, transaction },
    );
    return row ?? null;
  }

  /** A new link, and whether its cases (a link removed and added again keeps them) make it usable, in one transaction. */
  async createSource(
    values: { housePartId: number; vendorPartId: number; note: string | null; addedById: number | null },
    transaction?: Transaction,
  ): Promise<HousePartSource> {
    const write = async (t: Transaction) => {
      const source = await this.sources.create(values, { transaction: t });
      await refreshUsableSource(this.sequelize, values.housePartId, values.vendorPartId, t);
      return source;
    };
    return transaction ? write(transaction) : this.sequelize.transaction(write);
  }

  async updateSource(source: HousePartSource, values: Partial<Pick<HousePartSource, 'note'>>, transaction?: Transaction): Promise<void> {
    await source.update(values, { transaction });
  }

  async deleteSource(source: HousePartSource, transaction?: Transaction): Promise<void> {
    await source.destroy({ transaction });
  }
}
