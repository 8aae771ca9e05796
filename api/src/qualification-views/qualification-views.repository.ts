import { Injectable } from '@nestjs/common';
import { InjectConnection } from '@nestjs/sequelize';
import type { BoardQuery, HousePartStatus, QualificationState, QualificationVerdict, SourceRole } from '@shuntwise/contracts';
import { QueryTypes } from 'sequelize';
import { Sequelize } from 'sequelize-typescript';
import { sourceRoleSql } from '../common/source-standing.sql';
import { TextIndexRepository } from '../text-index/text-index.repository';

export interface BoardSourceRow {
  housePartId: number;
  vendorPartId: number;
  manufacturer: string;
  mpn: string;
  package: string | null;
  role: SourceRole;
  cardVersion: number | null;
  caseId: number | null;
  revision: number | null;
  state: QualificationState | null;
  overall: QualificationVerdict | null;
  preparedById: number | null;
  preparedByName: string | null;
  decidedById: number | null;
  decidedByName: string | null;
  needsRecheck: number | boolean | null;
  updatedAt: Date | null;
}

export interface HousePartHead {
  id: number;
  partNumber: string;
  description: string;
  status: HousePartStatus;
  specVersion: number | null;
}

/** A case without its evaluation, as the Sources view folds them per source. */
export interface PairCaseRow {
  id: number;
  housePartId: number;
  vendorPartId: number;
  revision: number;
  state: QualificationState;
  overall: QualificationVerdict;
  decisionText: string | null;
  decidedAt: Date | null;
  decidedById: number | null;
  decidedByName: string | null;
  revokedAt: Date | null;
  revokedById: number | null;
  revokedByName: string | null;
  revokeReason: string | null;
  needsRecheck: number | boolean;
}

/** The latest case of each house part and vendor part: the one nobody revised. */
const LATEST_CASES = `(SELECT l.* FROM qualifications l LEFT JOIN qualifications lx ON lx.previous_id = l.id WHERE lx.id IS NULL)`;

/**
 * A declared read model: the SQL behind the Board, Compare and Sources screens. It reads
 * across modules' tables (house_parts, house_part_sources, house_part_buyers, vendor_parts,
 * qualifications, users) in a few joined queries and never writes; every write to those
 * tables stays with the owning module's repository. The state lists come from the
 * contracts (source-standing.sql.ts), never spelled here.
 */
@Injectable()
export class QualificationViewsRepository {
  constructor(
    @InjectConnection() private readonly sequelize: Sequelize,
    private readonly textIndex: TextIndexRepository,
  ) {}

  private select<T extends object>(sql: string, replacements: unknown[]): Promise<T[]> {
    return this.sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT });
  }

  /** House parts for the Board, one page, with the sources that match the filters. */
  async board(
    query: BoardQuery,
    now: Date,
  ): Promise<{
    heads: HousePartHead[];
    sources: BoardSourceRow[];
    total: number;
    counts: Array<{ state: string; n: number | bigint }>;
    engineers: Array<{ id: number; name: string }>;
  }> {
    const where: string[] = [];
    const params: unknown[] = [];
    if (query.q) {
      const text = this.textIndex.housePartCondition('h', query.q);
      where.push(text.sql);
      params.push(...text.params);
    }
    // The state tallies ignore the state filter (a state left out still shows how many it
    // has), so the other source filters are kept apart from it.
    const otherWhere: string[] = [];
    const otherParams: unknown[] = [];
    const stateWhere: string[] = [];
    const stateParams: unknown[] = [];
    if (query.state) {
      const states = query.state.filter((s) => s !== 'none');
      const parts: string[] = [];
      if (states.length) {
        parts.push(`q.state IN (${states.map(() => '?').join(', ')})`);
        stateParams.push(...states);
      }
      if (query.state.includes('none')) parts.push('(s.id IS NOT NULL AND q.id IS NULL)');
      stateWhere.push(`(${parts.join(' OR ')})`);
    }
    if (query.engineerId !== undefined) {
      otherWhere.push('(q.prepared_by_id = ? OR q.decided_by_id = ?)');
      otherParams.push(query.engineerId, query.engineerId);
    }
    if (query.minAgeDays !== undefined) {
      otherWhere.push('q.updated_at <= ?');
      otherParams.push(new Date(now.getTime() - query.minAgeDays * 86_400_000));
    }
    if (query.needsRecheck !== undefined) {
      otherWhere.push(query.needsRecheck ? 'q.needs_recheck = 1' : '(s.id IS NOT NULL AND (q.id IS NULL OR q.needs_recheck = 0))');
    }
    const sourceWhere = [...stateWhere, ...otherWhere];
    const sourceParams = [...stateParams, ...otherParams];
    const filtered = sourceWhere.length > 0;
    const from = `FROM house_parts h
      LEFT JOIN house_part_sources s ON s.house_part_id = h.id
      LEFT JOIN ${LATEST_CASES} q ON q.house_part_id = s.house_part_id AND q.vendor_part_id = s.vendor_part_id`;
    const allWhere = [...where, ...sourceWhere];
    const whereSql = allWhere.length ? `WHERE ${allWhere.join(' AND ')}` : '';
    const allParams = [...params, ...sourceParams];

    const heads = await this.select<HousePartHead>(
      `SELECT h.id, h.part_number AS partNumber, h.description, h.status, h.spec_version AS specVersion
       FROM house_parts h WHERE h.id IN (SELECT DISTINCT h.id ${from} ${whereSql})
       ORDER BY h.part_number LIMIT ? OFFSET ?`,
      [...allParams, query.pageSize, query.pageIndex * query.pageSize],
    );
    const [{ total }] = await this.select<{ total: number | bigint }>(`SELECT COUNT(DISTINCT h.id) AS total ${from} ${whereSql}`, allParams);
    const countWhere = [...where, ...otherWhere, 's.id IS NOT NULL'];
    const counts = await this.select<{ state: string; n: number | bigint }>(
      `SELECT COALESCE(q.state, 'none') AS state, COUNT(*) AS n ${from} WHERE ${countWhere.join(' AND ')} GROUP BY COALESCE(q.state, 'none')`,
      [...params, ...otherParams],
    );
    // Everyone the engineer filter can name: every engineer, and whoever prepared or decided a case.
    const engineers = await this.select<{ id: number; name: string }>(
      `SELECT u.id, u.name FROM users u
       WHERE u.role = 'engineer'
          OR u.id IN (SELECT prepared_by_id FROM qualifications)
          OR u.id IN (SELECT decided_by_id FROM qualifications WHERE decided_by_id IS NOT NULL)
       ORDER BY u.name, u.id`,
      [],
    );
    if (heads.length === 0) return { heads, sources: [], total: Number(total), counts, engineers };
    const ids = heads.map((h) => h.id);
    const sources = await this.select<BoardSourceRow>(
      `SELECT s.house_part_id AS housePartId, s.vendor_part_id AS vendorPartId, vp.manufacturer_name AS manufacturer, vp.mpn, vp.package,
         ${sourceRoleSql('s')} AS role, vp.card_version AS cardVersion, q.id AS caseId, q.revision, q.state, q.overall,
         q.prepared_by_id AS preparedById, pu.name AS preparedByName, q.decided_by_id AS decidedById, du.name AS decidedByName,
         q.needs_recheck AS needsRecheck, q.updated_at AS updatedAt
       ${from}
       JOIN vendor_parts vp ON vp.id = s.vendor_part_id
       LEFT JOIN users pu ON pu.id = q.prepared_by_id
       LEFT JOIN users du ON du.id = q.decided_by_id
       WHERE h.id IN (${ids.map(() => '?').join(', ')}) ${filtered ? `AND ${sourceWhere.join(' AND ')}` : ''}
       ORDER BY h.part_number, ${sourceRoleSql('s')} = 'approved' DESC, vp.manufacturer_name, vp.mpn`,
      [...ids, ...sourceParams],
    );
    return { heads, sources, total: Number(total), counts, engineers };
  }

  /** House parts for the Sources view, with every source (one query for the parts, one for the sources). */
  async sourceHeads(filter: { housePartId?: number; q?: string; buyerId?: number }): Promise<HousePartHead[]> {
    const where: string[] = [];
    const params: unknown[] = [];
    if (filter.housePartId !== undefined) {
      where.push('h.id = ?');
      params.push(filter.housePartId);
    }
    if (filter.q) {
      const text = this.textIndex.housePartCondition('h', filter.q);
      where.push(text.sql);
      params.push(...text.params);
    }
    if (filter.buyerId !== undefined) {
      where.push('EXISTS (SELECT 1 FROM house_part_buyers b WHERE b.house_part_id = h.id AND b.user_id = ?)');
      params.push(filter.buyerId);
    }
    return this.select<HousePartHead>(
      `SELECT h.id, h.part_number AS partNumber, h.description, h.status, h.spec_version AS specVersion FROM house_parts h
       ${where.length ? `WHERE ${where.join(' AND ')}` : ''} ORDER BY h.part_number`,
      params,
    );
  }

  async sourcesOf(
    housePartIds: number[],
  ): Promise<
    Array<
      Omit<
        BoardSourceRow,
        'caseId' | 'revision' | 'state' | 'overall' | 'preparedById' | 'preparedByName' | 'decidedById' | 'decidedByName' | 'needsRecheck' | 'updatedAt'
      >
    >
  > {
    if (housePartIds.length === 0) return [];
    return this.select(
      `SELECT s.house_part_id AS housePartId, s.vendor_part_id AS vendorPartId, vp.manufacturer_name AS manufacturer, vp.mpn, vp.package,
         ${sourceRoleSql('s')} AS role, vp.card_version AS cardVersion
       FROM house_part_sources s JOIN vendor_parts vp ON vp.id = s.vendor_part_id
       WHERE s.house_part_id IN (${housePartIds.map(() => '?').join(', ')})
       ORDER BY ${sourceRoleSql('s')} = 'approved' DESC, vp.manufacturer_name, vp.mpn`,
      housePartIds,
    );
  }

  /** Every case (without its evaluation) of the given house parts, oldest revision first. */
  async casesOf(housePartIds: number[]): Promise<PairCaseRow[]> {
    if (housePartIds.length === 0) return [];
    return this.select<PairCaseRow>(
      `SELECT q.id, q.house_part_id AS housePartId, q.vendor_part_id AS vendorPartId, q.revision, q.state, q.overall, q.decision_text AS decisionText,
         q.decided_at AS decidedAt, q.decided_by_id AS decidedById, du.name AS decidedByName,
         q.revoked_at AS revokedAt, q.revoked_by_id AS revokedById, vu.name AS revokedByName, q.revoke_reason AS revokeReason,
         q.needs_recheck AS needsRecheck
       FROM qualifications q LEFT JOIN users du ON du.id = q.decided_by_id LEFT JOIN users vu ON vu.id = q.revoked_by_id
       WHERE q.house_part_id IN (${housePartIds.map(() => '?').join(', ')})
       ORDER BY q.house_part_id, q.vendor_part_id, q.revision`,
      housePartIds,
    );
  }
}
