import { Injectable } from '@nestjs/common';
import { InjectConnection } from '@nestjs/sequelize';
import {
  DESIGNER_HOUSE_PART_STATUSES,
  type HousePartStatus,
  type QualificationState,
  type RatingCardFields,
  type SearchQuery,
  type SearchSort,
} from '@shuntwise/contracts';
import { QueryTypes } from 'sequelize';
import { Sequelize } from 'sequelize-typescript';
import { DECIDED_SQL, OPEN_SQL } from '../common/source-standing.sql';
import { RawRows, utcDate } from '../database/raw-rows';
import type { SqlPart } from '../text-index/text-index.repository';
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
  caseId: number | null;
  revision: number | null;
  state: QualificationState | null;
  decisionText: string | null;
  decidedAt: Date | null;
  decidedById: number | null;
  decidedByName: string | null;
  needsRecheck: number | boolean | null;
  revokeReason: string | null;
  revokedAt: Date | null;
  revokedById: number | null;
  revokedByName: string | null;
  openCaseId: number | null;
}

/** How text narrows in SQL when the filters alone leave too many parts to rank. */
export interface TextNarrowing {
  /** Each word's leading characters, matched as a prefix of the part numbers and inside names (none: no narrowing by text). */
  tokens?: string[];
  /** The n-gram index's scored matches, a derived table (id, score): the parts it names drive the query, best score first. */
  scored?: SqlPart;
  /** The scored matches were already cut to the usable set (usableCondition inside the index's branches). */
  usableApplied?: boolean;
}

// The state lists come from the standing rule in contracts.
const DECIDED = DECIDED_SQL;
/** The house parts Find parts offers to choose from (contracts: no drafts); the contracts' own literals. */
const DESIGNER_STATUS_SQL = DESIGNER_HOUSE_PART_STATUSES.map((s) => `'${s}'`).join(', ');

/**
 * The latest decided case of each house part and vendor part (the one no later revision
 * decided again): where the pair stands, as the Sources view has it. The pair index
 * (house_part_id, vendor_part_id, revision) answers the NOT EXISTS.
 */
const LATEST_DECIDED = `SELECT d.id, d.house_part_id, d.vendor_part_id, d.revision, d.state, d.decision_text, d.decided_at, d.decided_by_id, d.needs_recheck, d.revoke_reason, d.revoked_at, d.revoked_by_id
  FROM qualifications d
  WHERE d.state IN ${DECIDED} AND NOT EXISTS (
    SELECT 1 FROM qualifications n
    WHERE n.house_part_id = d.house_part_id AND n.vendor_part_id = d.vendor_part_id AND n.revision > d.revision AND n.state IN ${DECIDED})`;

/**
 * Pairs (vendor_part_id, house_part_id) a designer may design in: the usable_sources table,
 * which the case and link writes keep by the standing rule of contracts in their own
 * transaction (source-standing/usable-sources.repository.ts).
 */
function usablePairs(housePartId: boolean): string {
  return `SELECT u.vendor_part_id, u.house_part_id FROM usable_sources u${housePartId ? ' WHERE u.house_part_id = ?' : ''}`;
}

/** The same set asked of one part (`vp`): one probe of the (vendor_part_id, house_part_id) index. */
function usableProbe(housePartId: boolean): string {
  return usableCondition('vp.id', housePartId ? 0 : undefined).sql;
}

/**
 * Whether the part in `column` is usable (for the house part, when given): a probe per row. A
 * scalar subquery, not EXISTS: MariaDB turns an EXISTS into a semi-join and may then start
 * from the whole usable set, reading every usable part to test the text (measured: 11 ms
 * instead of 8 ms for a manufacturer's 2 500 parts).
 */
export function usableCondition(column: string, housePartId?: number): SqlPart {
  return {
    sql: `(SELECT 1 FROM usable_sources u WHERE u.vendor_part_id = ${column}${housePartId !== undefined ? ' AND u.house_part_id = ?' : ''} LIMIT 1) IS NOT NULL`,
    params: housePartId !== undefined ? [housePartId] : [],
  };
}

/**
 * What the text index's branches test of each part before they keep their best matches:
 * usability (a designer's search) and the filters on vendor_parts' own columns (Vz range,
 * package, maker, power, tolerance), by one primary-key read per part. Tested there, a
 * branch's cut keeps the parts the filters want; tested only after it, "ZX07" with a Vz range
 * ranked the range's parts among an arbitrary 2 000 of the 2 500 that hold "x07". The card's
 * tolerance window (JSON) stays in the candidate query. Undefined when there is nothing to test.
 */
export function branchCondition(query: SearchQuery): ((column: string) => SqlPart) | undefined {
  const { where, params } = indexedConditions(query, 'f');
  const usableOnly = !query.includeNotCleared;
  if (!usableOnly && where.length === 0) return undefined;
  return (column) => {
    const parts: SqlPart[] = [];
    if (usableOnly) parts.push(usableCondition(column, query.housePartId));
    if (where.length) parts.push({ sql: `(SELECT 1 FROM vendor_parts f WHERE f.id = ${column} AND ${where.join(' AND ')}) IS NOT NULL`, params });
    return { sql: parts.map((p) => p.sql).join(' AND '), params: parts.flatMap((p) => p.params) };
  };
}

/**
 * The part's own filters on indexed columns of vendor_parts (as `alias`), written once for the
 * text branches and the candidate query: nominal Zener voltage, package, manufacturer, power,
 * and the card's tolerance as vzTolerance (contracts) wrote it (printed, or the ends less their
 * rounding; unknown drops out).
 */
function indexedConditions(query: SearchQuery, alias: string): { where: string[]; params: unknown[] } {
  const where: string[] = [];
  const params: unknown[] = [];
  const list = (n: number) => Array.from({ length: n }, () => '?').join(', ');
  if (query.vzFrom !== undefined) {
    where.push(`${alias}.vz_nom >= ?`);
    params.push(query.vzFrom);
  }
  if (query.vzTo !== undefined) {
    where.push(`${alias}.vz_nom <= ?`);
    params.push(query.vzTo);
  }
  if (query.package?.length) {
    where.push(`${alias}.package IN (${list(query.package.length)})`);
    params.push(...query.package);
  }
  if (query.manufacturer?.length) {
    where.push(`${alias}.manufacturer_name IN (${list(query.manufacturer.length)})`);
    params.push(...query.manufacturer);
  }
  if (query.pdMin !== undefined) {
    where.push(`${alias}.pd_max >= ?`);
    params.push(query.pdMin);
  }
  if (query.toleranceMax !== undefined) {
    where.push(`${alias}.vz_tolerance <= ?`);
    params.push(query.toleranceMax);
  }
  return { where, params };
}

// The Zener-voltage tolerance ends live in the card's JSON; they are read only on rows the indexed conditions leave.
const VZ_MIN = `JSON_VALUE(rc.fields, '$.vzMin.value')`;
const VZ_MAX = `JSON_VALUE(rc.fields, '$.vzMax.value')`;

/** Sorts are indexed columns of vendor_parts; parts without the figure go last. */
const SORT_COLUMNS: Record<SearchSort, string> = {
  relevance: 'vp.vz_nom',
  vzNom: 'vp.vz_nom',
  mpn: 'vp.mpn',
  manufacturer: 'vp.manufacturer_name',
  package: 'vp.package',
  pdMax: 'vp.pd_max',
};

interface Conditions {
  /** FROM clause: vendor_parts as vp, joined to the usable set, the card and the text narrowing as needed. */
  from: string;
  where: string;
  params: unknown[];
  usableOnly: boolean;
}

/** The only place that queries for the designers' search (read-only, raw SQL over the catalogue and the cases). */
@Injectable()
export class SearchRepository {
  constructor(
    @InjectConnection() private readonly sequelize: Sequelize,
    private readonly raw: RawRows,
  ) {}

  /** The facets' statements (once per page load): through Sequelize. */
  private select<T extends object>(sql: string, replacements: unknown[] = []): Promise<T[]> {
    return this.sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT });
  }

  /**
   * Every search's statements (page or candidates, the page's parts, their pairs): straight
   * through the driver (`RawRows.query`). Sequelize's query path (hooks, retry wrapper, its own
   * replacement formatting, a type-cast callback per column) cost about a third of the API's CPU
   * per search. DATETIME columns come back as stored UTC text (read with `utcDate`).
   */
  private read<T extends object>(sql: string, values: unknown[] = []): Promise<T[]> {
    return this.raw.query<T>(sql, values);
  }

  /** Every filter as SQL: the usable set and the text narrowing as derived tables joined on id, the rest as indexed conditions. */
  conditions(query: SearchQuery, text?: TextNarrowing, usable: 'join' | 'probe' = 'join'): Conditions {
    const joins: string[] = [];
    const joinParams: unknown[] = [];
    let words: string | null = null;
    const wordParams: unknown[] = [];
    const where: string[] = [];
    const params: unknown[] = [];
    let needsCard = false;
    const usableOnly = !query.includeNotCleared;
    if (usableOnly && text?.usableApplied) {
      // Nothing more: the text's matches are usable parts only.
    } else if (usableOnly && usable === 'probe') {
      where.push(usableProbe(query.housePartId !== undefined));
      if (query.housePartId !== undefined) params.push(query.housePartId);
    } else if (usableOnly && query.housePartId !== undefined) {
      // One house part's usable parts: an index range, one row per part.
      joins.push('JOIN usable_sources usable ON usable.vendor_part_id = vp.id AND usable.house_part_id = ?');
      joinParams.push(query.housePartId);
    } else if (usableOnly) {
      // Every usable part once: the (vendor_part_id, house_part_id) index read in order, a part's pairs collapsed.
      // A Zener-voltage range (a designer's window, a few % of the catalogue) is read first from the
      // filter index, the usable set probed after: MariaDB otherwise starts from the usable set and
      // reads each of its parts by primary key (5 014 at 100 000 parts) to test the range.
      const vzFirst = query.vzFrom !== undefined || query.vzTo !== undefined;
      joins.push(`${vzFirst ? 'STRAIGHT_JOIN' : 'JOIN'} (SELECT DISTINCT u.vendor_part_id FROM usable_sources u) usable ON usable.vendor_part_id = vp.id`);
    }
    if (text?.scored) {
      words = `(${text.scored.sql}) words`;
      wordParams.push(...text.scored.params);
    } else if (text?.tokens && text.tokens.length > 0) {
      // Each branch is an index range (mpn prefix, the few manufacturers and house parts whose names match).
      const branches: string[] = [];
      for (const token of text.tokens) {
        branches.push('SELECT t.id FROM vendor_parts t WHERE t.mpn LIKE ?');
        wordParams.push(likePrefix(token));
        branches.push('SELECT t.id FROM vendor_parts t WHERE t.manufacturer_name IN (SELECT m.name FROM manufacturers m WHERE m.name LIKE ?)');
        wordParams.push(`%${likePrefix(token)}`);
        branches.push(
          'SELECT s.vendor_part_id FROM house_part_sources s JOIN house_parts h ON h.id = s.house_part_id WHERE h.part_number LIKE ? OR h.description LIKE ?',
        );
        wordParams.push(likePrefix(token), `%${likePrefix(token)}`);
      }
      words = `(${branches.join(' UNION ')}) words`;
    }
    const indexed = indexedConditions(query, 'vp');
    where.push(...indexed.where);
    params.push(...indexed.params);
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
    // The card last: its JSON is read only for the parts every indexed condition left.
    if (needsCard) joins.push('STRAIGHT_JOIN rating_cards rc ON rc.vendor_part_id = vp.id');
    return {
      // The parts the words name drive the join (STRAIGHT_JOIN): otherwise MariaDB may walk the Vz index of every part and probe them.
      from: words ? `FROM ${words} STRAIGHT_JOIN vendor_parts vp ON vp.id = words.id ${joins.join(' ')}` : `FROM vendor_parts vp ${joins.join(' ')}`,
      where: where.length ? `WHERE ${where.join(' AND ')}` : '',
      params: [...wordParams, ...joinParams, ...params],
      usableOnly,
    };
  }

  /** One page of ids in the chosen order (parts without the sorted figure last), and how many parts match. */
  async page(query: SearchQuery): Promise<{ ids: number[]; total: number }> {
    // No text: the filters may leave most of the catalogue, so the usable set is built once and joined.
    const c = this.conditions(query);
    const term = query.sort[0] ?? { field: 'relevance' as const, desc: false };
    const column = SORT_COLUMNS[term.field];
    const dir = term.desc ? 'DESC' : 'ASC';
    const offset = query.pageIndex * query.pageSize;
    if (c.usableOnly) {
      // A few thousand parts at most: one query sorts them and counts them (the usable set is built once).
      const rows = await this.read<{ id: number; total: number | bigint }>(
        `SELECT vp.id, COUNT(*) OVER () AS total ${c.from} ${c.where} ORDER BY ${column} IS NULL, ${column} ${dir}, vp.id ${dir} LIMIT ? OFFSET ?`,
        [...c.params, query.pageSize, offset],
      );
      if (rows.length > 0 || offset === 0) return { ids: rows.map((r) => r.id), total: Number(rows[0]?.total ?? 0) };
      const [{ total }] = await this.read<{ total: number | bigint }>(`SELECT COUNT(*) AS total ${c.from} ${c.where}`, c.params);
      return { ids: [], total: Number(total) };
    }
    // The whole catalogue: sorting on `column IS NULL` first would sort every row; two index ranges instead,
    // the parts with the figure in its order, then those without.
    const [counts] = await this.read<{ total: number | bigint; withValue: number | bigint }>(
      `SELECT COUNT(*) AS total, COUNT(${column}) AS withValue ${c.from} ${c.where}`,
      c.params,
    );
    const total = Number(counts.total);
    const withValue = Number(counts.withValue);
    const and = c.where ? `${c.where} AND` : 'WHERE';
    const ids: number[] = [];
    if (offset < withValue) {
      const rows = await this.read<{ id: number }>(
        `SELECT vp.id ${c.from} ${and} ${column} IS NOT NULL ORDER BY ${column} ${dir}, vp.id ${dir} LIMIT ? OFFSET ?`,
        [...c.params, query.pageSize, offset],
      );
      ids.push(...rows.map((r) => r.id));
    }
    if (ids.length < query.pageSize && offset + ids.length < total) {
      const rows = await this.read<{ id: number }>(`SELECT vp.id ${c.from} ${and} ${column} IS NULL ORDER BY vp.id ${dir} LIMIT ? OFFSET ?`, [
        ...c.params,
        query.pageSize - ids.length,
        Math.max(0, offset - withValue),
      ]);
      ids.push(...rows.map((r) => r.id));
    }
    return { ids, total };
  }

  /** Up to `limit` parts the filters (and the text narrowing, if any) leave, with what the text ranking reads (best index score first). */
  async candidates(query: SearchQuery, text: TextNarrowing | undefined, limit: number): Promise<CandidateRow[]> {
    // Text drives the query with a bounded set of parts (the index's best matches or prefix ranges): usability is probed per part.
    const c = this.conditions(query, text, text?.scored || text?.tokens?.length ? 'probe' : 'join');
    // The house parts' names only for the parts kept (the limit is applied in the derived table first), in the same statement.
    // The outer query keeps the inner order (the same keys: the index score, then Vz, then id).
    return this.read<CandidateRow>(
      `SELECT c.id, c.mpn, c.manufacturer, c.package, c.vzNom, c.pdMax,
         (SELECT GROUP_CONCAT(h.part_number, '\t', h.description SEPARATOR '\n') FROM house_part_sources s JOIN house_parts h ON h.id = s.house_part_id
          WHERE s.vendor_part_id = c.id) AS houseParts
       FROM (SELECT vp.id, vp.mpn, vp.manufacturer_name AS manufacturer, vp.package, vp.vz_nom AS vzNom, vp.pd_max AS pdMax, ${text?.scored ? 'words.score' : '0'} AS score
         ${c.from} ${c.where} ORDER BY ${text?.scored ? 'words.score DESC, ' : ''}vp.vz_nom IS NULL, vp.vz_nom, vp.id LIMIT ?) c
       ORDER BY c.score DESC, c.vzNom IS NULL, c.vzNom, c.id`,
      [...c.params, limit],
    );
  }

  /** The page's parts with their current card and newest datasheet. */
  parts(ids: number[]): Promise<PartRow[]> {
    if (ids.length === 0) return Promise.resolve([]);
    return this.read<PartRow>(
      `SELECT vp.id, vp.manufacturer_name AS manufacturer, vp.mpn, vp.package, vp.lifecycle_note AS lifecycleNote, rc.version AS cardVersion, rc.fields,
         (SELECT l.datasheet_id FROM vendor_part_datasheets l JOIN datasheets ds ON ds.id = l.datasheet_id
          WHERE l.vendor_part_id = vp.id ORDER BY ds.created_at DESC, ds.id DESC LIMIT 1) AS datasheetId
       FROM vendor_parts vp LEFT JOIN rating_cards rc ON rc.vendor_part_id = vp.id
       WHERE vp.id IN (${ids.map(() => '?').join(', ')})`,
      ids,
    );
  }

  /**
   * Every house part the page's parts are sources of, with where each pair stands, by house part
   * number. Sorted here, not by the statement: sorting the joined rows (with their TEXT columns)
   * made MariaDB build an on-disk temporary table, about half the statement's time.
   */
  async pairs(ids: number[]): Promise<PairRow[]> {
    if (ids.length === 0) return [];
    const list = ids.map(() => '?').join(', ');
    const rows = await this.read<PairRow>(
      `SELECT s.vendor_part_id AS vendorPartId, s.house_part_id AS housePartId, h.part_number AS partNumber, h.description, h.status,
         d.id AS caseId, d.revision, d.state, d.decision_text AS decisionText, d.decided_at AS decidedAt,
         d.decided_by_id AS decidedById, du.name AS decidedByName, d.needs_recheck AS needsRecheck,
         d.revoke_reason AS revokeReason, d.revoked_at AS revokedAt, d.revoked_by_id AS revokedById, rvu.name AS revokedByName,
         (SELECT MAX(o.id) FROM qualifications o WHERE o.house_part_id = s.house_part_id AND o.vendor_part_id = s.vendor_part_id AND o.state IN ${OPEN_SQL}) AS openCaseId
       FROM house_part_sources s
       JOIN house_parts h ON h.id = s.house_part_id
       LEFT JOIN (${LATEST_DECIDED} AND d.vendor_part_id IN (${list})) d ON d.house_part_id = s.house_part_id AND d.vendor_part_id = s.vendor_part_id
       LEFT JOIN users du ON du.id = d.decided_by_id
       LEFT JOIN users rvu ON rvu.id = d.revoked_by_id
       WHERE s.vendor_part_id IN (${list})`,
      [...ids, ...ids],
    );
    const at = (stored: Date | string | null) => (stored === null || stored instanceof Date ? stored : utcDate(stored));
    for (const row of rows) {
      row.decidedAt = at(row.decidedAt);
      row.revokedAt = at(row.revokedAt);
    }
    const key = (row: PairRow) => row.partNumber.toUpperCase();
    return rows.sort((a, b) => (key(a) < key(b) ? -1 : key(a) > key(b) ? 1 : a.housePartId - b.housePartId || a.vendorPartId - b.vendorPartId));
  }

  /** What the facets count: the usable pairs once (with each part's package and maker), and the catalogue's totals. */
  async facets(): Promise<{
    usable: Array<{ vendorPartId: number; housePartId: number; package: string | null; manufacturer: string }>;
    packages: Array<{ value: string; n: number | bigint }>;
    manufacturers: Array<{ value: string; n: number | bigint }>;
    houseParts: Array<{ id: number; partNumber: string; description: string; status: HousePartStatus }>;
    catalogueParts: number;
  }> {
    const [usable, packages, manufacturers, houseParts, [catalogue]] = await Promise.all([
      this.select<{ vendorPartId: number; housePartId: number; package: string | null; manufacturer: string }>(
        `SELECT u.vendor_part_id AS vendorPartId, u.house_part_id AS housePartId, vp.package, vp.manufacturer_name AS manufacturer
         FROM (${usablePairs(false)}) u JOIN vendor_parts vp ON vp.id = u.vendor_part_id`,
      ),
      this.select<{ value: string; n: number }>(
        `SELECT vp.package AS value, COUNT(*) AS n FROM vendor_parts vp WHERE vp.package IS NOT NULL GROUP BY vp.package ORDER BY vp.package`,
      ),
      this.select<{ value: string; n: number }>(
        `SELECT vp.manufacturer_name AS value, COUNT(*) AS n FROM vendor_parts vp GROUP BY vp.manufacturer_name ORDER BY vp.manufacturer_name`,
      ),
      this.select<{ id: number; partNumber: string; description: string; status: HousePartStatus }>(
        `SELECT h.id, h.part_number AS partNumber, h.description, h.status FROM house_parts h WHERE h.status IN (${DESIGNER_STATUS_SQL}) ORDER BY h.part_number`,
      ),
      this.select<{ n: number | bigint }>(`SELECT COUNT(*) AS n FROM vendor_parts`),
    ]);
    return { usable, packages, manufacturers, houseParts, catalogueParts: Number(catalogue.n) };
  }
}
