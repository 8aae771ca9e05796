import { Injectable, Optional } from '@nestjs/common';
import {
  SEARCH_TEXT_CANDIDATES,
  isRuledOutState,
  isUsableState,
  toEngineeringCard,
  standingConditions,
  vzTolerance,
  type Clearance,
  type RatingCardFields,
  type RuledOut,
  type SearchCard,
  type SearchFacets,
  type SearchItem,
  type SearchPage,
  type SearchQuery,
  type SearchSort,
  type WaiverBrief,
} from '@shuntwise/contracts';
import { WaiversService } from '../qualifications/waivers.service';
import { TextIndexRepository } from '../text-index/text-index.repository';
import { SearchRepository, branchCondition, type CandidateRow, type PairRow, type PartRow } from './search.repository';
import { rankByText, splitHouseParts, textTokens } from './text-ranking';

/**
 * The designers' search. Without text, SQL filters, sorts and pages on indexed columns.
 * With text, one SQL statement takes the parts the n-gram index scores closest, applies the
 * filters and keeps the best SEARCH_TEXT_CANDIDATES; fuse.js re-ranks those and the page is
 * cut from the ranking. Only the page's parts are then read in full.
 */
@Injectable()
export class SearchService {
  constructor(
    private readonly repository: SearchRepository,
    private readonly textIndex: TextIndexRepository,
    // Optional so the service can be built bare over a repository (unit tests, the bench).
    @Optional() private readonly waivers?: WaiversService,
  ) {}

  async search(query: SearchQuery): Promise<SearchPage> {
    // Waivers past their day end before usability is read (see WaiversService.lapseDue).
    await this.waivers?.lapseBeforeRead();
    if (!query.q) {
      const { ids, total } = await this.repository.page(query);
      return {
        items: await this.items(ids, new Map()),
        total,
        pageIndex: query.pageIndex,
        pageSize: query.pageSize,
        text: { mode: 'none', candidates: total, truncated: false, note: null },
      };
    }
    const { candidates, mode, truncated } = await this.textCandidates(query, query.q);
    const ranked = rankByText(
      candidates.map((c) => {
        const { numbers, descriptions } = splitHouseParts(c.houseParts);
        return { id: c.id, mpn: c.mpn, manufacturer: c.manufacturer, package: c.package, houseParts: numbers, descriptions };
      }),
      query.q,
    );
    const ordered = sortMatches(ranked, new Map(candidates.map((c) => [c.id, c])), query.sort[0]);
    const start = query.pageIndex * query.pageSize;
    const pageIds = ordered.slice(start, start + query.pageSize);
    const scores = new Map(ranked.map((r) => [r.id, r.score]));
    let note: string | null = null;
    if (mode === 'prefix')
      note = 'Text this short is matched as the start of part numbers and names; type three characters or more to match anywhere inside them.';
    if (truncated)
      note = `More than ${SEARCH_TEXT_CANDIDATES} parts match the text: the ${SEARCH_TEXT_CANDIDATES} closest were ranked. Narrow the filters or the text.`;
    return {
      items: await this.items(pageIds, scores),
      total: ordered.length,
      pageIndex: query.pageIndex,
      pageSize: query.pageSize,
      text: { mode, candidates: candidates.length, truncated, note },
    };
  }

  /**
   * The parts text is ranked over: the filters and the n-gram index's best matches in one
   * statement (at most SEARCH_TEXT_CANDIDATES, closest first); text too short to index
   * narrows by the start of the part numbers and names instead.
   */
  private async textCandidates(query: SearchQuery, text: string): Promise<{ candidates: CandidateRow[]; mode: 'fuzzy' | 'prefix'; truncated: boolean }> {
    const limit = SEARCH_TEXT_CANDIDATES;
    // Usability and the part's own filters are tested inside the index's branches, before each keeps its best matches.
    // Every filter but the card's tolerance window is tested inside the index's branches: without
    // a window nothing is filtered after them, so only the best limit + 1 parts are read at all.
    const scored = await this.textIndex.scoredVendorParts(text, branchCondition(query), query.vzWindow ? undefined : limit + 1);
    const rows = await this.repository.candidates(
      query,
      scored ? { scored, usableApplied: !query.includeNotCleared } : { tokens: textTokens(text) },
      limit + 1,
    );
    return { candidates: rows.slice(0, limit), mode: scored ? 'fuzzy' : 'prefix', truncated: rows.length > limit };
  }

  async facets(): Promise<SearchFacets> {
    const f = await this.repository.facets();
    // Distinct usable parts per package, manufacturer and house part, counted from the pairs read once.
    const parts = new Map<number, { package: string | null; manufacturer: string }>();
    const perHousePart = new Map<number, number>();
    for (const u of f.usable) {
      parts.set(u.vendorPartId, u);
      perHousePart.set(u.housePartId, (perHousePart.get(u.housePartId) ?? 0) + 1);
    }
    const perPackage = new Map<string, number>();
    const perMaker = new Map<string, number>();
    for (const p of parts.values()) {
      if (p.package !== null) perPackage.set(p.package, (perPackage.get(p.package) ?? 0) + 1);
      perMaker.set(p.manufacturer, (perMaker.get(p.manufacturer) ?? 0) + 1);
    }
    return {
      packages: f.packages.map((p) => ({ value: p.value, cleared: perPackage.get(p.value) ?? 0, total: Number(p.n) })),
      manufacturers: f.manufacturers.map((m) => ({ value: m.value, cleared: perMaker.get(m.value) ?? 0, total: Number(m.n) })),
      houseParts: f.houseParts.map((h) => ({ ...h, cleared: perHousePart.get(h.id) ?? 0 })),
      clearedParts: parts.size,
      catalogueParts: f.catalogueParts,
    };
  }

  /** The page's parts in the given order, each with its card and where it stands for every house part. */
  private async items(ids: number[], scores: Map<number, number>): Promise<SearchItem[]> {
    const [parts, pairs] = await Promise.all([this.repository.parts(ids), this.repository.pairs(ids)]);
    const usedWaivers = pairs.filter((p) => p.state === 'cleared-with-waiver' && p.caseId !== null).map((p) => p.caseId!);
    const waivers = this.waivers ? await this.waivers.briefsOf(usedWaivers) : new Map<number, WaiverBrief[]>();
    const partById = new Map(parts.map((p) => [p.id, p]));
    const pairsByPart = new Map<number, PairRow[]>();
    for (const pair of pairs) pairsByPart.set(pair.vendorPartId, [...(pairsByPart.get(pair.vendorPartId) ?? []), pair]);
    return ids.flatMap((id) => {
      const part = partById.get(id);
      return part ? [toItem(part, pairsByPart.get(id) ?? [], scores.get(id) ?? null, waivers)] : [];
    });
  }
}

function toItem(part: PartRow, pairs: PairRow[], score: number | null, waivers: ReadonlyMap<number, WaiverBrief[]>): SearchItem {
  const clearances = pairs.map((p) => toClearance(p, waivers)).filter((c): c is Clearance => c !== null);
  return {
    vendorPart: { id: part.id, manufacturer: part.manufacturer, mpn: part.mpn, package: part.package, lifecycleNote: part.lifecycleNote },
    card: toSearchCard(part),
    datasheetId: part.datasheetId,
    cleared: clearances.length > 0,
    clearances,
    ruledOut: pairs.map(toRuledOut).filter((r): r is RuledOut => r !== null),
    qualificationOpen: clearances.length === 0 && pairs.some((p) => p.openCaseId !== null),
    score: score === null ? null : Number(score.toPrecision(4)),
  };
}

/** A pair its latest decision ruled out (isRuledOutState in contracts): the reason, who and when; else null. */
export function toRuledOut(pair: PairRow): RuledOut | null {
  if (pair.caseId === null || !isRuledOutState(pair.state)) return null;
  const iso = (d: Date | null) => (d === null ? null : new Date(d).toISOString());
  const revoked = pair.state === 'revoked';
  const byId = revoked ? pair.revokedById : pair.decidedById;
  return {
    housePart: { id: pair.housePartId, partNumber: pair.partNumber, description: pair.description, status: pair.status },
    state: pair.state,
    caseId: pair.caseId,
    reason: revoked ? pair.revokeReason : pair.decisionText,
    at: iso(revoked ? pair.revokedAt : pair.decidedAt),
    by: byId !== null ? { id: byId, name: (revoked ? pair.revokedByName : pair.decidedByName) ?? '' } : null,
  };
}

/** A pair the designer may design in, or null: approved or cleared by its latest decision (isUsableState in contracts). */
export function toClearance(pair: PairRow, waivers: ReadonlyMap<number, WaiverBrief[]> = new Map()): Clearance | null {
  if (!isUsableState(pair.state)) return null;
  const housePart = { id: pair.housePartId, partNumber: pair.partNumber, description: pair.description, status: pair.status };
  const iso = (d: Date | null) => (d === null ? null : new Date(d).toISOString());
  return {
    housePart,
    standing: pair.state,
    conditions: standingConditions(pair.state, pair.decisionText),
    since: iso(pair.decidedAt),
    decidedBy: pair.decidedById !== null ? { id: pair.decidedById, name: pair.decidedByName ?? '' } : null,
    caseId: pair.caseId,
    revision: pair.revision,
    needsRecheck: Boolean(pair.needsRecheck),
    recheckOpen: pair.openCaseId !== null,
    waivers: pair.caseId !== null ? (waivers.get(pair.caseId) ?? []) : [],
  };
}

/** The search result's card: the engineering card as the one mapping (contracts' toEngineeringCard) reads it, its version and VZ tolerance. */
export function toSearchCard(part: Pick<PartRow, 'cardVersion' | 'fields'>): SearchCard | null {
  if (part.cardVersion === null || part.fields === null) return null;
  const fields: RatingCardFields = typeof part.fields === 'string' ? (JSON.parse(part.fields) as RatingCardFields) : part.fields;
  const card = toEngineeringCard(fields);
  if (!card) return null;
  const n = (x: number | null | undefined) => x ?? null;
  return {
    version: part.cardVersion,
    vzMin: n(card.vzMin),
    vzNom: card.vzNom,
    vzMax: n(card.vzMax),
    izt: card.izt,
    zzt: n(card.zzt),
    izk: n(card.izk),
    zzk: n(card.zzk),
    irMax: n(card.irMax),
    vr: n(card.vr),
    tc: n(card.tc),
    pdMax: n(card.pdMax),
    pdRefC: n(card.pdRefC),
    tjMax: n(card.tjMax),
    rthJA: n(card.rthJA),
    izm: n(card.izm),
    tolerance: vzTolerance(fields),
  };
}

/** Ranked matches in the order asked for: by score, or by a field with the score breaking ties; parts without the field last. */
export function sortMatches(
  ranked: Array<{ id: number; score: number }>,
  rows: Map<number, Pick<CandidateRow, 'mpn' | 'manufacturer' | 'package' | 'vzNom' | 'pdMax'>>,
  term?: { field: SearchSort; desc: boolean },
): number[] {
  if (!term || term.field === 'relevance') return ranked.map((r) => r.id);
  const key = (id: number): string | number | null => {
    const row = rows.get(id)!;
    switch (term.field) {
      case 'vzNom':
        return row.vzNom;
      case 'pdMax':
        return row.pdMax;
      case 'mpn':
        return row.mpn;
      case 'manufacturer':
        return row.manufacturer;
      case 'package':
        return row.package;
      default:
        return null;
    }
  };
  const sign = term.desc ? -1 : 1;
  const position = new Map(ranked.map((r, i) => [r.id, i]));
  return [...ranked]
    .sort((a, b) => {
      const ka = key(a.id);
      const kb = key(b.id);
      if (ka === null || kb === null) return ka === kb ? position.get(a.id)! - position.get(b.id)! : ka === null ? 1 : -1;
      const c = typeof ka === 'number' && typeof kb === 'number' ? ka - kb : String(ka).localeCompare(String(kb), 'en', { numeric: true, sensitivity: 'base' });
      return c !== 0 ? sign * c : position.get(a.id)! - position.get(b.id)!;
    })
    .map((r) => r.id);
}
