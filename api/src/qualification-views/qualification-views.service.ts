import { Readable } from 'node:stream';
import { Injectable, NotFoundException, UnprocessableEntityException } from '@nestjs/common';
import {
  BOARD_STATES,
  SOURCE_STANDING_LABELS,
  SOURCES_CSV_COLUMNS,
  isUsableStanding,
  sourceRoleOf,
  sourceStanding,
  standingConditions,
  toEngineeringCard,
  type BoardPage,
  type BoardQuery,
  type BoardState,
  type ComparePayload,
  type CompareSource,
  type SourceStanding,
  type SourceStandingRow,
  type SourcesQuery,
  type SourcesView,
  type SourcesViewItem,
  type WaiverBrief,
} from '@shuntwise/contracts';
import type { AuthUser } from '../common/decorators/current-user.decorator';
import { DESIGN_CAUTION } from '../engineering/caution';
import { EngineeringInputError } from '../engineering/engineering-input.error';
import { HousePartsRepository } from '../house-parts/house-parts.repository';
import { RatingCardsRepository } from '../vendor-parts/rating-cards.repository';
import { compareCurves, comparePowerLimit, compareTemperatures, currentGrid } from '../qualifications/evaluation/compare-curves';
import { evaluateCard } from '../qualifications/evaluation/evaluate';
import { WaiversService } from '../qualifications/waivers.service';
import { QualificationViewsRepository, type PairCaseRow } from './qualification-views.repository';
import { csvExportStringifier } from '../common/csv/csv-export';

const DAY_MS = 86_400_000;

/** The read models the screens draw: Board, Compare and the buyers' Sources view (with its CSV). */
@Injectable()
export class QualificationViewsService {
  constructor(
    private readonly cases: QualificationViewsRepository,
    private readonly houseParts: HousePartsRepository,
    private readonly cards: RatingCardsRepository,
    private readonly waivers: WaiversService,
  ) {}

  async board(query: BoardQuery): Promise<BoardPage> {
    const now = new Date();
    const { heads, sources, total, counts, engineers } = await this.cases.board(query, now);
    const byPart = new Map<number, BoardPage['items'][number]['sources']>();
    for (const s of sources) {
      const list = byPart.get(s.housePartId) ?? [];
      list.push({
        vendorPart: { id: s.vendorPartId, manufacturer: s.manufacturer, mpn: s.mpn, package: s.package },
        role: s.role,
        cardVersion: s.cardVersion,
        state: s.state ?? 'none',
        latestCase:
          s.caseId !== null && s.state !== null && s.overall !== null && s.revision !== null && s.preparedById !== null && s.updatedAt !== null
            ? {
                id: s.caseId,
                revision: s.revision,
                state: s.state,
                overall: s.overall,
                preparedBy: { id: s.preparedById, name: s.preparedByName ?? '' },
                decidedBy: s.decidedById !== null ? { id: s.decidedById, name: s.decidedByName ?? '' } : null,
                needsRecheck: Boolean(s.needsRecheck),
                updatedAt: new Date(s.updatedAt).toISOString(),
                ageDays: Math.max(0, Math.floor((now.getTime() - new Date(s.updatedAt).getTime()) / DAY_MS)),
              }
            : null,
      });
      byPart.set(s.housePartId, list);
    }
    const tally = Object.fromEntries(BOARD_STATES.map((s) => [s, 0])) as Record<BoardState, number>;
    for (const c of counts) tally[c.state as BoardState] = Number(c.n);
    return {
      items: heads.map((h) => ({ housePart: h, sources: byPart.get(h.id) ?? [] })),
      total,
      pageIndex: query.pageIndex,
      pageSize: query.pageSize,
      counts: tally,
      engineers,
    };
  }

  /** Per house part, every source with where it stands, its conditions, since when and who decided. */
  async sources(query: SourcesQuery, user: AuthUser): Promise<SourcesView> {
    // Waivers past their day end before the standing is read (every replica may run it; it happens once).
    await this.waivers.lapseBeforeRead();
    const heads = await this.cases.sourceHeads({ housePartId: query.housePartId, q: query.q, buyerId: query.mine ? user.id : undefined });
    if (query.housePartId !== undefined && heads.length === 0 && !query.mine && !query.q)
      throw new NotFoundException(`No house part with id ${query.housePartId}`);
    const ids = heads.map((h) => h.id);
    const [sources, cases] = await Promise.all([this.cases.sourcesOf(ids), this.cases.casesOf(ids)]);
    const waivers = await this.waivers.briefsOf(cases.filter((c) => c.state === 'cleared-with-waiver' || c.state === 'waiver-lapsed').map((c) => c.id));
    const casesByPair = new Map<string, PairCaseRow[]>();
    for (const c of cases) {
      const key = `${c.housePartId}/${c.vendorPartId}`;
      casesByPair.set(key, [...(casesByPair.get(key) ?? []), c]);
    }
    // Designers see the sources they may design in: the approved ones and the cleared alternates.
    const visible = (row: SourceStandingRow) => user.role !== 'designer' || isUsableStanding(row.standing);
    const items: SourcesViewItem[] = heads.map((h) => ({
      housePart: { id: h.id, partNumber: h.partNumber, description: h.description, status: h.status },
      sources: sources
        .filter((s) => s.housePartId === h.id)
        .map((s): SourceStandingRow => {
          const row = standing(casesByPair.get(`${h.id}/${s.vendorPartId}`) ?? [], waivers);
          return { vendorPart: { id: s.vendorPartId, manufacturer: s.manufacturer, mpn: s.mpn, package: s.package }, role: sourceRoleOf(row.standing), ...row };
        })
        .filter(visible),
    }));
    return { items };
  }

  /** The Sources view as CSV (UTF-8 with a BOM so spreadsheets read µ and Ω), one row per source. */
  async sourcesCsv(query: SourcesQuery, user: AuthUser): Promise<Readable> {
    const { items } = await this.sources(query, user);
    const rows: unknown[][] = [[...SOURCES_CSV_COLUMNS]];
    for (const item of items) {
      for (const s of item.sources) {
        rows.push([
          item.housePart.partNumber,
          item.housePart.description,
          item.housePart.status,
          s.vendorPart.manufacturer,
          s.vendorPart.mpn,
          s.vendorPart.package ?? '',
          s.role,
          SOURCE_STANDING_LABELS[s.standing],
          s.conditions ?? '',
          s.since ?? '',
          s.decidedBy?.name ?? '',
          s.caseId ?? '',
          s.revision ?? '',
          s.openCase ? `#${s.openCase.id} ${s.openCase.state}` : '',
          s.needsRecheck ? 'yes' : 'no',
        ]);
      }
    }
    return Readable.from(rows).pipe(csvExportStringifier());
  }

  /** The approved source and the alternates side by side, each evaluated now on the current spec and card. */
  async compare(housePartId: number): Promise<ComparePayload> {
    const part = await this.houseParts.findRow(housePartId);
    if (!part) throw new NotFoundException(`No house part with id ${housePartId}`);
    const specRow = part.specVersion !== null ? await this.houseParts.findSpec(housePartId, part.specVersion) : null;
    if (!specRow) throw new UnprocessableEntityException(`House part ${part.partNumber} has no spec yet: there is nothing to compare against`);
    const spec = specRow.spec;
    const [sources, cases] = await Promise.all([this.houseParts.listSources(housePartId), this.cases.casesOf([housePartId])]);
    const cards = new Map((await this.cards.findCurrentMany(sources.map((s) => s.vendorPartId))).map((c) => [c.vendorPartId, c]));
    const temperaturesC = compareTemperatures(spec);
    const currents = currentGrid(spec);

    const compared: CompareSource[] = sources.map((s) => {
      const latest = cases.filter((c) => c.vendorPartId === s.vendorPartId).at(-1) ?? null;
      const stored = cards.get(s.vendorPartId);
      const card = stored ? toEngineeringCard(stored.fields) : null;
      const head = {
        vendorPart: { id: s.vendorPartId, manufacturer: s.manufacturer, mpn: s.mpn, package: s.package },
        role: s.role,
        cardVersion: stored?.version ?? null,
        latestCase: latest ? { id: latest.id, revision: latest.revision, state: latest.state, overall: latest.overall } : null,
      };
      if (!card) return { ...head, evaluation: null, curves: [], powerLimit: null, reason: 'no rating card with vzNom and izt yet' };
      try {
        return {
          ...head,
          evaluation: evaluateCard({ spec, specVersion: specRow.version, card, cardVersion: stored!.version, vendorPackage: s.package }),
          curves: compareCurves(card, currents, temperaturesC),
          powerLimit: comparePowerLimit(card, spec),
          reason: null,
        };
      } catch (error) {
        if (!(error instanceof EngineeringInputError)) throw error;
        return { ...head, evaluation: null, curves: [], powerLimit: null, reason: error.message };
      }
    });

    return {
      housePart: { id: part.id, partNumber: part.partNumber, description: part.description, status: part.status },
      specVersion: specRow.version,
      spec,
      envelope: spec.envelope,
      temperaturesC,
      currents,
      specWindow: { current: spec.iRef, min: spec.vz.min, nom: spec.vz.nom, max: spec.vz.max },
      outputWindow: spec.outputWindow,
      sources: compared,
      caution: DESIGN_CAUTION,
    };
  }
}

/**
 * A source's row in the Sources view from its cases: the standing `sourceStanding` (in
 * contracts) reads from them, with the decision it comes from (who, when, on what
 * conditions) and any newer case still open beside it.
 */
export function standing(
  cases: readonly PairCaseRow[],
  waiversOf: ReadonlyMap<number, WaiverBrief[]> = new Map(),
): Omit<SourceStandingRow, 'vendorPart' | 'role'> {
  const { standing: value, basis, openCase } = sourceStanding(cases);
  if (!basis)
    return {
      standing: 'not-qualified',
      caseId: null,
      revision: null,
      conditions: null,
      since: null,
      decidedBy: null,
      openCase: null,
      needsRecheck: false,
      waivers: [],
    };
  const iso = (d: Date | null) => (d === null ? null : new Date(d).toISOString());
  const revoked = basis.state === 'revoked';
  return {
    standing: value as SourceStanding,
    caseId: basis.id,
    revision: basis.revision,
    conditions: standingConditions(value, basis.decisionText, basis.revokeReason),
    since: revoked ? iso(basis.revokedAt) : iso(basis.decidedAt),
    decidedBy: revoked
      ? basis.revokedById !== null
        ? { id: basis.revokedById, name: basis.revokedByName ?? '' }
        : null
      : basis.decidedById !== null
        ? { id: basis.decidedById, name: basis.decidedByName ?? '' }
        : null,
    openCase: openCase ? { id: openCase.id, state: openCase.state } : null,
    needsRecheck: Boolean(basis.needsRecheck),
    waivers: waiversOf.get(basis.id) ?? [],
  };
}
