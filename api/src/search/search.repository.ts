import { Injectable } from '@nestjs/common';
import { InjectConnection } from '@nestjs/sequelize';
import type { HousePartStatus, QualificationState, RatingCardFields, SearchQuery, SearchSort, SourceRole } from '@shuntwise/contracts';
import { QueryTypes } from 'sequelize';
import { Sequelize } from 'sequelize-typescript';
import { likePrefix } from '../vendor-parts/vendor-parts.repository';

/** A part as the text ranking reads it: its names and the house parts it is a source of. */
export interface CandidateRow {
  id: number;
  mpn: string;
  manufacturer: string;
  package: string | null;
  vzNom: number | null;
  pdMax: number | null;
  /** "part number<TAB>description" per house part, one per line (GROUP_CONCAT). */
  houseParts: string | null;
}

export interface PartRow {
  id: number;
  manufacturer: string;
  mpn: string;
  package: string | null;
  lifecycleNote: string | null;
  cardVersion: number | null;
  fields: RatingCardFields | string | null;
  datasheetId: number | null;
}

/** One house part a vendor part is a source of, with its latest decided case and whether one is open. */
export interface PairRow {
  vendorPartId: number;
  housePartId: number;
  partNumber: string;
  description: string;
  status: HousePartStatus;
  role: SourceRole;
  sourceSince: Date;
  caseId: number | null;
  revision: number | null;
  state: QualificationState | null;
  decisionText: string | null;
  decidedAt: Date | null;
  decidedById: number | null;
  decidedByName: string | null;
  needsRecheck: number | boolean | null;
  openCaseId: number | null;
}

/** How text narrows in SQL when the filters alone leave too many parts to rank. */
export interface TextNarrowing {
  /** Each word's leading characters, matched as a prefix of the part numbers and inside names. */
  tokens: string[];
}

const DECIDED = `('cleared', 'cleared-with-conditions', 'rejected', 'revoked')`;
const CLEARED = `('cleared', 'cleared-with-conditions')`;

/**
 * The latest decided case of each house part and vendor part (the one no later revision
 * decided again): where the pair stands, as the Sources view has it. The pair index
 * (house_part_id, vendor_part_id, revision) answers the NOT EXISTS.
 */
const LATEST_DECIDED = `SELECT d.id, d.house_part_id, d.vendor_part_id, d.revision, d.state, d.decision_text, d.decided_at, d.decided_by_id, d.needs_recheck
  FROM qualifications d
  WHERE d.state IN ${DECIDED} AND NOT EXISTS (
    SELECT 1 FROM qualifications n
    WHERE n.house_part_id = d.house_part_id AND n.vendor_part_id = d.vendor_part_id AND n.revision > d.revision AND n.state IN ${DECIDED})`;

/**
 * Pairs a designer may design in: on the house part's source list and either cleared by
 * the latest decision or the approved source with no decision against it.
 */
const USABLE_PAIRS = `SELECT s.vendor_part_id, s.house_part_id FROM house_part_sources s
  LEFT JOIN (${LATEST_DECIDED}) d ON d.house_part_id = s.house_part_id AND d.vendor_part_id = s.vendor_part_id
  WHERE d.state IN ${CLEARED} OR (d.id IS NULL AND s.role = 'approved')`;

// The Zener-voltage tolerance ends live in the card's JSON; they are read only on rows the indexed conditions leave.
const VZ_MIN = `JSON_VALUE(rc.fields, '$.vzMin.value')`;
const VZ_MAX = `JSON_VALUE(rc.fields, '$.vzMax.value')`;

/** Sorts are indexed columns of vendor_parts; parts without a card go last. */
const SORT_COLUMNS: Record<SearchSort, string> = {
  relevance: 'vp.vz_nom',
  vzNom: 'vp.vz_nom',
  mpn: 'vp.mpn',
  manufacturer: 'vp.manufacturer_name',
  package: 'vp.package',
  pdMax: 'vp.pd_max',
};

interface Conditions {
  joins: string;
  where: string[];
  params: unknown[];
}

/** The only place that queries for the designers' search (read-only, raw SQL over the catalogue and the cases). */
@Injectable()
export class SearchRepository {
  constructor(@InjectConnection() private readonly sequelize: Sequelize) {}

  private select<T extends object>(sql: string, replacements: unknown[] = []): Promise<T[]> {
    return this.sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT });
  }

  /** Every parametric filter as SQL conditions on `vp` (and `rc` when the card's JSON is needed). */
  conditions(query: SearchQuery, text?: TextNarrowing): Conditions {
    const where: string[] = [];
    const params: unknown[] = [];
    let needsCard = false;
    if (!query.includeNotCleared) {
      where.push(`vp.id IN (SELECT u.vendor_part_id FROM (${USABLE_PAIRS}) u${query.housePartId !== undefined ? ' WHERE u.house_part_id = ?' : ''})`);
      if (query.housePartId !== undefined) params.push(query.housePartId);
    }
    if (query.vzFrom !== undefined) {
      where.push('vp.vz_nom >= ?');
      params.push(query.vzFrom);
    }
    if (query.vzTo !== undefined) {
      where.push('vp.vz_nom <= ?');
      params.push(query.vzTo);
    }
    if (query.vzWindow) {
      needsCard = true;
      if (query.vzFrom !== undefined) {
        where.push(`${VZ_MIN} >= ?`);
        params.push(query.vzFrom);
      }
      if (query.vzTo !== undefined) {
        where.push(`${VZ_MAX} <= ?`);
        params.push(query.vzTo);
      }
    }
    if (query.package?.length) {
      where.push(`vp.package IN (${query.package.map(() => '?').join(', ')})`);
      params.push(...query.package);
    }
    if (query.manufacturer?.length) {
      where.push(`vp.manufacturer_name IN (${query.manufacturer.map(() => '?').join(', ')})`);
      params.push(...query.manufacturer);
    }
    if (query.pdMin !== undefined) {
      where.push('vp.pd_max >= ?');
      params.push(query.pdMin);
    }
    if (query.toleranceMax !== undefined) {
      needsCard = true;
      // Without both ends the tolerance is unknown: GREATEST gives NULL and the part drops out.
      where.push(`GREATEST(vp.vz_nom - ${VZ_MIN}, ${VZ_MAX} - vp.vz_nom) <= ? * vp.vz_nom`);
      params.push(query.toleranceMax);
    }
    if (text && text.tokens.length > 0) {
      const any: string[] = [];
      for (const token of text.tokens) {
        any.push('vp.mpn LIKE ?', 'vp.manufacturer_name LIKE ?');
        params.push(likePrefix(token), `%${likePrefix(token)}`);
        any.push(
          `vp.id IN (SELECT s.vendor_part_id FROM house_part_sources s JOIN house_parts h ON h.id = s.house_part_id WHERE h.part_number LIKE ? OR h.description LIKE ?)`,
        );
        params.push(likePrefix(token), `%${likePrefix(token)}`);
      }
      where.push(`(${any.join(' OR ')})`);
    }
    return { joins: needsCard ? 'JOIN rating_cards rc ON rc.vendor_part_id = vp.id' : '', where, params };
  }

  /** One page of ids in the chosen order, and how many parts match (no text: SQL pages). */
  async page(query: SearchQuery): Promise<{ ids: number[]; total: number }> {
    const { joins, where, params } = this.conditions(query);
    const whereSql = where.length ? `WHERE ${where.join(' AND ')}` : '';
    const term = query.sort[0] ?? { field: 'relevance' as const, desc: false };
    const column = SORT_COLUMNS[term.field];
    const dir = term.desc ? 'DESC' : 'ASC';
    const order = `${column} IS NULL, ${column} ${dir}, ${term.field === 'mpn' ? '' : 'vp.mpn, '}vp.id`;
    const rows = await this.select<{ id: number }>(`SELECT vp.id FROM vendor_parts vp ${joins} ${whereSql} ORDER BY ${order} LIMIT ? OFFSET ?`, [
      ...params,
      query.pageSize,
      query.pageIndex * query.pageSize,
    ]);
    const [{ total }] = await this.select<{ total: number | bigint }>(`SELECT COUNT(*) AS total FROM vendor_parts vp ${joins} ${whereSql}`, params);
    return { ids: rows.map((r) => r.id), total: Number(total) };
  }

  /** Up to `limit` parts the filters (and the text narrowing, if any) leave, with what the text ranking reads. */
  candidates(query: SearchQuery, text: TextNarrowing | undefined, limit: number): Promise<CandidateRow[]> {
    const { joins, where, params } = this.conditions(query, text);
    const whereSql = where.length ? `WHERE ${where.join(' AND ')}` : '';
    return this.select<CandidateRow>(
      `SELECT vp.id, vp.mpn, vp.manufacturer_name AS manufacturer, vp.package, vp.vz_nom AS vzNom, vp.pd_max AS pdMax,
         (SELECT GROUP_CONCAT(h.part_number, '\t', h.description SEPARATOR '\n') FROM house_part_sources s JOIN house_parts h ON h.id = s.house_part_id WHERE s.vendor_part_id = vp.id) AS houseParts
       FROM vendor_parts vp ${joins} ${whereSql}
       ORDER BY vp.vz_nom IS NULL, vp.vz_nom, vp.id LIMIT ?`,
      [...params, limit],
    );
  }

  /** The page's parts with their current card and newest datasheet. */
  parts(ids: number[]): Promise<PartRow[]> {
    if (ids.length === 0) return Promise.resolve([]);
    return this.select<PartRow>(
      `SELECT vp.id, vp.manufacturer_name AS manufacturer, vp.mpn, vp.package, vp.lifecycle_note AS lifecycleNote, rc.version AS cardVersion, rc.fields,
         (SELECT l.datasheet_id FROM vendor_part_datasheets l JOIN datasheets ds ON ds.id = l.datasheet_id
          WHERE l.vendor_part_id = vp.id ORDER BY ds.created_at DESC, ds.id DESC LIMIT 1) AS datasheetId
       FROM vendor_parts vp LEFT JOIN rating_cards rc ON rc.vendor_part_id = vp.id
       WHERE vp.id IN (${ids.map(() => '?').join(', ')})`,
      ids,
    );
  }

  /** Every house part the page's parts are sources of, with where each pair stands. */
  pairs(ids: number[]): Promise<PairRow[]> {
    if (ids.length === 0) return Promise.resolve([]);
    return this.select<PairRow>(
      `SELECT s.vendor_part_id AS vendorPartId, s.house_part_id AS housePartId, h.part_number AS partNumber, h.description, h.status,
         s.role, s.created_at AS sourceSince, d.id AS caseId, d.revision, d.state, d.decision_text AS decisionText, d.decided_at AS decidedAt,
         d.decided_by_id AS decidedById, du.name AS decidedByName, d.needs_recheck AS needsRecheck,
         (SELECT MAX(o.id) FROM qualifications o WHERE o.house_part_id = s.house_part_id AND o.vendor_part_id = s.vendor_part_id AND o.state IN ('draft', 'in-review')) AS openCaseId
       FROM house_part_sources s
       JOIN house_parts h ON h.id = s.house_part_id
       LEFT JOIN (${LATEST_DECIDED} AND d.vendor_part_id IN (${ids.map(() => '?').join(', ')})) d ON d.house_part_id = s.house_part_id AND d.vendor_part_id = s.vendor_part_id
       LEFT JOIN users du ON du.id = d.decided_by_id
       WHERE s.vendor_part_id IN (${ids.map(() => '?').join(', ')})
       ORDER BY h.part_number`,
      [...ids, ...ids],
    );
  }

  /** Counts per package, manufacturer and house part, over usable parts and over the whole catalogue. */
  async facets(): Promise<{
    packages: Array<{ value: string; n: number | bigint }>;
    clearedPackages: Array<{ value: string; n: number | bigint }>;
    manufacturers: Array<{ value: string; n: number | bigint }>;
    clearedManufacturers: Array<{ value: string; n: number | bigint }>;
    houseParts: Array<{ id: number; partNumber: string; description: string; status: HousePartStatus; n: number | bigint }>;
    clearedParts: number;
    catalogueParts: number;
  }> {
    const usableParts = `SELECT DISTINCT u.vendor_part_id FROM (${USABLE_PAIRS}) u`;
    const [packages, clearedPackages, manufacturers, clearedManufacturers, houseParts, [cleared], [catalogue]] = await Promise.all([
      this.select<{ value: string; n: number }>(`SELECT vp.package AS value, COUNT(*) AS n FROM vendor_parts vp WHERE vp.package IS NOT NULL GROUP BY vp.package ORDER BY vp.package`),
      this.select<{ value: string; n: number }>(
        `SELECT vp.package AS value, COUNT(*) AS n FROM vendor_parts vp WHERE vp.package IS NOT NULL AND vp.id IN (${usableParts}) GROUP BY vp.package`,
      ),
      this.select<{ value: string; n: number }>(`SELECT vp.manufacturer_name AS value, COUNT(*) AS n FROM vendor_parts vp GROUP BY vp.manufacturer_name ORDER BY vp.manufacturer_name`),
      this.select<{ value: string; n: number }>(`SELECT vp.manufacturer_name AS value, COUNT(*) AS n FROM vendor_parts vp WHERE vp.id IN (${usableParts}) GROUP BY vp.manufacturer_name`),
      this.select<{ id: number; partNumber: string; description: string; status: HousePartStatus; n: number }>(
        `SELECT h.id, h.part_number AS partNumber, h.description, h.status, COUNT(u.vendor_part_id) AS n
         FROM house_parts h LEFT JOIN (${USABLE_PAIRS}) u ON u.house_part_id = h.id
         GROUP BY h.id, h.part_number, h.description, h.status ORDER BY h.part_number`,
      ),
      this.select<{ n: number | bigint }>(`SELECT COUNT(*) AS n FROM (${usableParts}) c`),
      this.select<{ n: number | bigint }>(`SELECT COUNT(*) AS n FROM vendor_parts`),
    ]);
    return {
      packages,
      clearedPackages,
      manufacturers,
      clearedManufacturers,
      houseParts,
      clearedParts: Number(cleared.n),
      catalogueParts: Number(catalogue.n),
    };
  }
}
