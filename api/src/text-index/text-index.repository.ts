import { Inject, Injectable, Optional } from '@nestjs/common';
import { InjectConnection } from '@nestjs/sequelize';
import { QueryTypes, type Transaction } from 'sequelize';
import { Sequelize } from 'sequelize-typescript';
import { grams, indexRowsOf, TEXT_KINDS, type TextKind } from './text-grams';

/** An SQL fragment with its replacements, in order. */
export interface SqlPart {
  sql: string;
  params: unknown[];
}

/**
 * A piece found in more records than this is too common to narrow by (a shared prefix such
 * as a vendor's "ZX0"): the scored match skips it rather than read its whole posting list.
 */
export const COMMON_PIECE = 5000;
/**
 * Nor does a piece held by more than this share of a kind's records (the "hp0" of every house
 * part number "HP-0…", the "inv" of every description): matching it says nothing, and
 * counting it for every record costs a read of most of the kind's postings per search.
 * Kinds with few records keep every piece (COMMON_FLOOR).
 */
export const COMMON_SHARE = 0.25;
const COMMON_FLOOR = 200;
/**
 * When every piece of the text a kind holds is common, the scored match still narrows: by the
 * records holding all of the FALLBACK_PIECES least common ones (an intersection), each then
 * scored by all the pieces. Only pieces held by at most FALLBACK_COUNT_CAP times COMMON_PIECE
 * records, and never more than COMMON_SHARE of the kind (those say nothing), take part.
 */
const FALLBACK_PIECES = 2;
const FALLBACK_COUNT_CAP = 20;

/** The thresholds above, injectable so a test can make pieces common on a small catalogue. */
export interface TextIndexLimits {
  commonPiece: number;
  commonFloor: number;
  branchLimit: number;
}
export const TEXT_INDEX_LIMITS = 'TEXT_INDEX_LIMITS';
const KIND_TABLES: Record<TextKind, string> = { vendorPart: 'vendor_parts', housePart: 'house_parts', manufacturer: 'manufacturers' };
/** How long a piece's (capped) record count is reused: it only decides which pieces narrow, never what matches. */
const FREQUENCY_TTL_MS = 60_000;
const FREQUENCY_CACHE_LIMIT = 20_000;
/** The most records one source of matches (part numbers, house parts) hands on before the filters (best score first, ties by id so the cut is the same on every run). */
const BRANCH_LIMIT = 2000;

/** Escapes LIKE wildcards so a typed "%" or "_" matches itself. */
function likePrefix(text: string): string {
  return `${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}

const list = (n: number) => Array.from({ length: n }, () => '?').join(', ');

/**
 * The text index (text_grams): written with each vendor part, house part and manufacturer in
 * the caller's transaction, and read as SQL fragments the list and search queries embed, so
 * text narrows in the same statement as the other filters.
 */
@Injectable()
export class TextIndexRepository {
  private readonly frequencies = new Map<string, { n: number; at: number }>();
  private readonly kindSizes = new Map<TextKind, { n: number; at: number }>();

  private readonly limits: TextIndexLimits;

  constructor(
    @InjectConnection() private readonly sequelize: Sequelize,
    @Optional() @Inject(TEXT_INDEX_LIMITS) limits?: Partial<TextIndexLimits>,
  ) {
    this.limits = { commonPiece: COMMON_PIECE, commonFloor: COMMON_FLOOR, branchLimit: BRANCH_LIMIT, ...limits };
  }

  /** Rewrites one record's pieces inside the caller's transaction (it must be the one that writes the record). */
  async write(kind: TextKind, id: number, texts: ReadonlyArray<string | null | undefined>, transaction: Transaction): Promise<void> {
    await this.sequelize.query('DELETE FROM text_grams WHERE kind = ? AND entity_id = ?', {
      replacements: [TEXT_KINDS[kind], id],
      type: QueryTypes.DELETE,
      transaction,
    });
    await this.insertRows(indexRowsOf(kind, id, texts), transaction);
  }

  /** Adds the pieces of many new records at once (bulk loads); the records must not be indexed yet. */
  async writeNew(
    kind: TextKind,
    records: ReadonlyArray<{ id: number; texts: ReadonlyArray<string | null | undefined> }>,
    transaction?: Transaction,
  ): Promise<void> {
    await this.insertRows(
      records.flatMap((r) => indexRowsOf(kind, r.id, r.texts)),
      transaction,
    );
  }

  private async insertRows(rows: Array<[number, string, number]>, transaction?: Transaction): Promise<void> {
    for (let i = 0; i < rows.length; i += 3000) {
      const chunk = rows.slice(i, i + 3000);
      await this.sequelize.query(`INSERT IGNORE INTO text_grams (kind, gram, entity_id) VALUES ${chunk.map(() => '(?, ?, ?)').join(', ')}`, {
        replacements: chunk.flat(),
        type: QueryTypes.INSERT,
        transaction,
      });
    }
  }

  /**
   * Ids (one column, `entity_id`) of the records whose names contain the text: every piece of
   * it is among theirs. Null when the text has fewer than three characters to index.
   */
  containing(kind: TextKind, text: string): SqlPart | null {
    const pieces = grams(text);
    if (pieces.length === 0) return null;
    return {
      sql: `SELECT entity_id FROM text_grams WHERE kind = ? AND gram IN (${list(pieces.length)}) GROUP BY entity_id HAVING COUNT(*) = ?`,
      params: [TEXT_KINDS[kind], ...pieces, pieces.length],
    };
  }

  /**
   * The condition the house-part lists (Board, Sources, House parts, pickers) filter by: the
   * text is inside the part number or description, or inside the part number of one of its
   * sources. Shorter than three characters: a prefix of those part numbers (index ranges).
   */
  housePartCondition(alias: string, text: string): SqlPart {
    const own = this.containing('housePart', text);
    const sourced = this.containing('vendorPart', text);
    if (own && sourced) {
      return {
        sql: `(${alias}.id IN (${own.sql}) OR ${alias}.id IN (SELECT s.house_part_id FROM house_part_sources s WHERE s.vendor_part_id IN (${sourced.sql})))`,
        params: [...own.params, ...sourced.params],
      };
    }
    const short = text.trim();
    return {
      sql: `(${alias}.part_number LIKE ? OR ${alias}.id IN (SELECT s.house_part_id FROM house_part_sources s JOIN vendor_parts sv ON sv.id = s.vendor_part_id WHERE sv.mpn LIKE ?))`,
      params: [likePrefix(short), likePrefix(short)],
    };
  }

  /** The condition of the vendor-part list: the text is inside the part number or the manufacturer's name (a prefix of them when short). */
  vendorPartCondition(alias: string, text: string): SqlPart {
    const own = this.containing('vendorPart', text);
    const maker = this.containing('manufacturer', text);
    if (own && maker) return { sql: `(${alias}.id IN (${own.sql}) OR ${alias}.manufacturer_id IN (${maker.sql}))`, params: [...own.params, ...maker.params] };
    return { sql: `(${alias}.mpn LIKE ? OR ${alias}.manufacturer_name LIKE ?)`, params: [likePrefix(text.trim()), likePrefix(text.trim())] };
  }

  /**
   * Vendor parts whose names share the most pieces with the text, as a derived table
   * `(id, score)` with score in 0..1 (the share of the usable pieces found): through their
   * own part number, a house part they are a source of (number or description), or their
   * manufacturer's name. A record needs a third of the usable pieces, so a typo or two
   * swapped letters still match; the best few hundred go on to the fuzzy ranking. Pieces
   * too common to narrow by are skipped; when every piece a kind holds is that common, the
   * records holding all of the least common ones are taken instead (never nothing for text
   * that matches). Null when the text is too short to have pieces. `only` is a condition on
   * a vendor part id column that every branch applies before it keeps its best records (the
   * search's usable set), so the cut never drops the parts the caller wants. `keep`: the caller
   * filters nothing more and needs only the best `keep` parts by (score, id); the part-number and
   * maker branches and the union are cut there, in that order, so the parts beyond the cut are
   * never read (a part in the best `keep` overall is among the best `keep` of its own branch).
   */
  async scoredVendorParts(text: string, only?: (idColumn: string) => SqlPart, keep?: number): Promise<SqlPart | null> {
    const pieces = grams(text);
    if (pieces.length === 0) return null;
    const branches: string[] = [];
    const params: unknown[] = [];
    for (const kind of ['vendorPart', 'housePart', 'manufacturer'] as const) {
      const { common, share } = await this.commonAbove(kind);
      const counts = await this.pieceCounts(kind, pieces, common);
      // No record of the kind holds any piece: nothing to find there.
      const held = pieces.filter((p) => (counts.get(p) ?? 0) > 0);
      if (held.length === 0) continue;
      const usable = pieces.filter((p) => (counts.get(p) ?? 0) <= common);
      let hits: string;
      if (held.some((p) => (counts.get(p) ?? 0) <= common)) {
        // A third of the pieces: a typo costs up to three, two swapped letters four of a short part number's five.
        const required = Math.max(1, Math.ceil(usable.length / 3));
        hits = `SELECT entity_id, COUNT(*) / ? AS score FROM text_grams WHERE kind = ? AND gram IN (${list(usable.length)}) GROUP BY entity_id HAVING COUNT(*) >= ?`;
        params.push(usable.length, TEXT_KINDS[kind], ...usable, required);
      } else {
        // Every piece the kind holds is common (a short, everyday part number at a million parts):
        // the records holding all of the least common ones, scored by every piece they hold.
        const cap = Math.min(share, this.limits.commonPiece * FALLBACK_COUNT_CAP);
        const fuller = await this.pieceCounts(kind, held, cap);
        const telling = held.filter((p) => (fuller.get(p) ?? 0) <= cap);
        // Held by a large share of the kind (the "inv" of every "Invented …" description): matching it says nothing.
        if (telling.length === 0) continue;
        const least = telling.sort((a, b) => (fuller.get(a) ?? 0) - (fuller.get(b) ?? 0)).slice(0, FALLBACK_PIECES);
        hits = `SELECT g.entity_id, COUNT(*) / ? AS score FROM (SELECT entity_id FROM text_grams WHERE kind = ? AND gram IN (${list(least.length)}) GROUP BY entity_id HAVING COUNT(*) = ?) every
          JOIN text_grams g ON g.kind = ? AND g.entity_id = every.entity_id AND g.gram IN (${list(held.length)}) GROUP BY g.entity_id HAVING COUNT(*) > 0`;
        params.push(pieces.length, TEXT_KINDS[kind], ...least, least.length, TEXT_KINDS[kind], ...held);
      }
      // Each branch keeps its best records only, so a word many names share (an "invented" in
      // every description) cannot pull in the whole catalogue: the closest parts of a part
      // number, the closest house parts, and only the manufacturers that match best.
      if (kind === 'vendorPart') {
        // Tested per matching part (after grouping), before the best are kept.
        const own = only?.('entity_id');
        if (own) params.push(...own.params);
        branches.push(
          `SELECT entity_id AS id, score FROM (${hits}${own ? ` AND ${own.sql}` : ''} ORDER BY score DESC, entity_id LIMIT ${Math.min(this.limits.branchLimit, keep ?? Infinity)}) own`,
        );
      }
      // House parts are cut before their sources are filtered: that branch keeps its own limit.
      if (kind === 'housePart') {
        const sourced = only?.('s.vendor_part_id');
        if (sourced) params.push(...sourced.params);
        branches.push(
          `SELECT s.vendor_part_id AS id, hp.score FROM (${hits} ORDER BY score DESC, entity_id LIMIT ${this.limits.branchLimit}) hp JOIN house_part_sources s ON s.house_part_id = hp.entity_id${sourced ? ` WHERE ${sourced.sql}` : ''}`,
        );
      }
      if (kind === 'manufacturer') {
        const made = only?.('mv.id');
        if (made) params.push(...made.params);
        const makers = `SELECT mv.id, mk.score FROM (SELECT entity_id, score FROM (SELECT entity_id, score, RANK() OVER (ORDER BY score DESC) AS place FROM (${hits}) ranked) r WHERE place = 1) mk
           JOIN vendor_parts mv ON mv.manufacturer_id = mk.entity_id${made ? ` WHERE ${made.sql}` : ''}`;
        // Cut inside its own derived table: an ORDER BY … LIMIT on a union's last branch would apply to the whole union.
        branches.push(keep !== undefined ? `SELECT id, score FROM (${makers} ORDER BY mk.score DESC, mv.id LIMIT ${keep}) made` : makers);
      }
    }
    // Long enough to index, but no record holds a piece of it: an empty match, not the prefix fallback.
    if (branches.length === 0) return { sql: 'SELECT 0 AS id, 0 AS score FROM DUAL WHERE FALSE', params: [] };
    const cut = keep !== undefined ? ` ORDER BY score DESC, id LIMIT ${keep}` : '';
    return { sql: `SELECT id, MAX(score) AS score FROM (${branches.join(' UNION ALL ')}) m GROUP BY id${cut}`, params };
  }

  /**
   * Above how many records a piece of this kind is too common to narrow by (`common`):
   * COMMON_PIECE, or COMMON_SHARE of the kind's records (`share`, never under COMMON_FLOOR)
   * when that is fewer. The record count is reused for a minute, like the piece counts: it
   * only chooses pieces.
   */
  private async commonAbove(kind: TextKind): Promise<{ common: number; share: number }> {
    const now = Date.now();
    let size = this.kindSizes.get(kind);
    if (!size || now - size.at >= FREQUENCY_TTL_MS) {
      const [row] = await this.sequelize.query<{ n: number | bigint }>(`SELECT COUNT(*) AS n FROM ${KIND_TABLES[kind]}`, { type: QueryTypes.SELECT });
      size = { n: Number(row.n), at: now };
      this.kindSizes.set(kind, size);
    }
    const share = Math.max(this.limits.commonFloor, Math.floor(size.n * COMMON_SHARE));
    return { common: Math.min(this.limits.commonPiece, share), share };
  }

  /** How many records of a kind hold each piece, capped just above `cap` (more is "common"); reused for a minute. */
  private async pieceCounts(kind: TextKind, pieces: string[], cap: number): Promise<Map<string, number>> {
    const now = Date.now();
    const out = new Map<string, number>();
    const missing: string[] = [];
    for (const p of pieces) {
      const hit = this.frequencies.get(`${kind}:${cap}:${p}`);
      if (hit && now - hit.at < FREQUENCY_TTL_MS) out.set(p, hit.n);
      else missing.push(p);
    }
    if (missing.length === 0) return out;
    const limit = Math.floor(cap) + 1;
    const rows = await this.sequelize.query<{ gram: string; n: number | bigint }>(
      missing.map(() => `SELECT ? AS gram, COUNT(*) AS n FROM (SELECT 1 FROM text_grams WHERE kind = ? AND gram = ? LIMIT ${limit}) c`).join(' UNION ALL '),
      { replacements: missing.flatMap((p) => [p, TEXT_KINDS[kind], p]), type: QueryTypes.SELECT },
    );
    if (this.frequencies.size > FREQUENCY_CACHE_LIMIT) this.frequencies.clear();
    for (const r of rows) {
      out.set(r.gram, Number(r.n));
      this.frequencies.set(`${kind}:${cap}:${r.gram}`, { n: Number(r.n), at: now });
    }
    return out;
  }
}
