import { Injectable } from '@nestjs/common';
import { InjectConnection, InjectModel } from '@nestjs/sequelize';
import type {
  AuditEntry,
  Evaluation,
  HousePartStatus,
  QualificationListQuery,
  QualificationSort,
  QualificationState,
  QualificationVerdict,
  RatingCardFields,
  RecheckReason,
  SortTerm,
  SourceRole,
  Spec,
} from '@shuntwise/contracts';
import { QueryTypes, type Transaction } from 'sequelize';
import { Sequelize } from 'sequelize-typescript';
import { sourceRoleSql } from '../common/source-standing.sql';
import { refreshUsableSource } from '../source-standing/usable-sources.repository';
import { User } from '../users/user.model';
import { QualificationComment } from './qualification-comment.model';
import { QualificationEvent } from './qualification-event.model';
import { Qualification, type DecisionState } from './qualification.model';

/** A case as lists and the detail read it: the row with the names it refers to. */
export interface CaseRow {
  id: number;
  housePartId: number;
  partNumber: string;
  housePartDescription: string;
  vendorPartId: number;
  manufacturer: string;
  mpn: string;
  package: string | null;
  sourceRole: SourceRole | null;
  revision: number;
  previousId: number | null;
  nextId: number | null;
  state: QualificationState;
  overall: QualificationVerdict;
  specVersion: number;
  cardVersion: number;
  summary: string;
  preparedById: number;
  preparedByName: string;
  reviewerId: number | null;
  reviewerName: string | null;
  submittedAt: Date | null;
  decisionState: DecisionState | null;
  decidedById: number | null;
  decidedByName: string | null;
  decidedAt: Date | null;
  decisionText: string | null;
  revokedById: number | null;
  revokedByName: string | null;
  revokedAt: Date | null;
  revokeReason: string | null;
  needsRecheck: boolean;
  recheckReasons: RecheckReason[];
  version: number;
  createdAt: Date;
  updatedAt: Date;
}

/** The catalogue as a case reads it, under a shared lock so it cannot change until the case commits. */
export interface CatalogueBasis {
  housePart: { id: number; partNumber: string; description: string; status: HousePartStatus; specVersion: number | null; spec: Spec | null };
  vendorPart: { id: number; manufacturer: string; mpn: string; package: string | null; cardVersion: number; fields: RatingCardFields };
  sourceRole: SourceRole | null;
}

const SORT_COLUMNS: Record<QualificationSort, string> = { updatedAt: 'q.updated_at', createdAt: 'q.created_at', state: 'q.state', id: 'q.id' };

const CASE_SELECT = `SELECT q.id, q.house_part_id AS housePartId, h.part_number AS partNumber, h.description AS housePartDescription,
  q.vendor_part_id AS vendorPartId, vp.manufacturer_name AS manufacturer, vp.mpn, vp.package, IF(src.id IS NULL, NULL, ${sourceRoleSql('src')}) AS sourceRole,
  q.revision, q.previous_id AS previousId, nx.id AS nextId, q.state, q.overall, q.spec_version AS specVersion, q.card_version AS cardVersion,
  q.summary, q.prepared_by_id AS preparedById, pu.name AS preparedByName, q.reviewer_id AS reviewerId, ru.name AS reviewerName,
  q.submitted_at AS submittedAt, q.decision_state AS decisionState, q.decided_by_id AS decidedById, du.name AS decidedByName,
  q.decided_at AS decidedAt, q.decision_text AS decisionText, q.revoked_by_id AS revokedById, vu.name AS revokedByName,
  q.revoked_at AS revokedAt, q.revoke_reason AS revokeReason, q.needs_recheck AS needsRecheck, q.recheck_reasons AS recheckReasons,
  q.version, q.created_at AS createdAt, q.updated_at AS updatedAt`;

const CASE_FROM = `FROM qualifications q
JOIN house_parts h ON h.id = q.house_part_id
JOIN vendor_parts vp ON vp.id = q.vendor_part_id
LEFT JOIN house_part_sources src ON src.house_part_id = q.house_part_id AND src.vendor_part_id = q.vendor_part_id
JOIN users pu ON pu.id = q.prepared_by_id
LEFT JOIN users ru ON ru.id = q.reviewer_id
LEFT JOIN users du ON du.id = q.decided_by_id
LEFT JOIN users vu ON vu.id = q.revoked_by_id
LEFT JOIN qualifications nx ON nx.previous_id = q.id`;

/** The only place that queries qualification cases, their trail, comments and buyer links. */
@Injectable()
export class QualificationsRepository {
  constructor(
    @InjectConnection() private readonly sequelize: Sequelize,
    @InjectModel(Qualification) private readonly cases: typeof Qualification,
    @InjectModel(QualificationEvent) private readonly events: typeof QualificationEvent,
    @InjectModel(QualificationComment) private readonly comments: typeof QualificationComment,
  ) {}

  private select<T extends object>(sql: string, replacements: unknown[], transaction?: Transaction): Promise<T[]> {
    return this.sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT, transaction });
  }

  /**
   * Reads the house part with its current spec and the vendor part with its current card,
   * holding shared locks on both rows: a spec or card save (which locks them for update)
   * waits until this transaction ends, so a case never records versions that changed under it.
   * Every read here is a locking read, so it sees the latest commit rather than the
   * transaction's snapshot.
   */
  async catalogueBasis(
    housePartId: number,
    vendorPartId: number,
    transaction: Transaction,
  ): Promise<CatalogueBasis | { missing: 'house part' | 'vendor part' }> {
    const [hp] = await this.select<{ id: number; partNumber: string; description: string; status: HousePartStatus; specVersion: number | null }>(
      `SELECT id, part_number AS partNumber, description, status, spec_version AS specVersion FROM house_parts WHERE id = ? LOCK IN SHARE MODE`,
      [housePartId],
      transaction,
    );
    if (!hp) return { missing: 'house part' };
    const [vp] = await this.select<{ id: number; manufacturer: string; mpn: string; package: string | null }>(
      `SELECT id, manufacturer_name AS manufacturer, mpn, package FROM vendor_parts WHERE id = ? LOCK IN SHARE MODE`,
      [vendorPartId],
      transaction,
    );
    if (!vp) return { missing: 'vendor part' };
    let spec: Spec | null = null;
    if (hp.specVersion !== null) {
      const [row] = await this.select<{ spec: Spec | string }>(
        `SELECT spec FROM house_part_specs WHERE house_part_id = ? AND version = ? LOCK IN SHARE MODE`,
        [housePartId, hp.specVersion],
        transaction,
      );
      spec = row ? json<Spec>(row.spec) : null;
    }
    const [card] = await this.select<{ version: number; fields: RatingCardFields | string }>(
      `SELECT version, fields FROM rating_cards WHERE vendor_part_id = ? LOCK IN SHARE MODE`,
      [vendorPartId],
      transaction,
    );
    const [source] = await this.select<{ role: SourceRole }>(
      `SELECT ${sourceRoleSql('s')} AS role FROM house_part_sources s WHERE s.house_part_id = ? AND s.vendor_part_id = ? LOCK IN SHARE MODE`,
      [housePartId, vendorPartId],
      transaction,
    );
    return {
      housePart: { ...hp, spec },
      vendorPart: { ...vp, cardVersion: card?.version ?? 0, fields: card ? json<RatingCardFields>(card.fields) : {} },
      sourceRole: source?.role ?? null,
    };
  }

  /** The newest case of a house part and vendor part, locked for update inside a transaction. */
  latestForPair(housePartId: number, vendorPartId: number, transaction: Transaction): Promise<Qualification | null> {
    return this.cases.findOne({ where: { housePartId, vendorPartId }, order: [['revision', 'DESC']], transaction, lock: transaction.LOCK.UPDATE });
  }

  findById(id: number, transaction?: Transaction, lock = false): Promise<Qualification | null> {
    return this.cases.findByPk(id, { transaction, lock: lock && transaction ? transaction.LOCK.UPDATE : undefined });
  }

  /** The case this one revises into, if any. */
  findNext(id: number, transaction?: Transaction): Promise<Qualification | null> {
    return this.cases.findOne({ where: { previousId: id }, transaction });
  }

  /** Every case write goes through here or `save`: the pair's usable row is rewritten in the same transaction. */
  async create(values: Partial<Qualification>, transaction: Transaction): Promise<Qualification> {
    const row = await this.cases.create(values as Record<string, unknown>, { transaction });
    await refreshUsableSource(this.sequelize, row.housePartId, row.vendorPartId, transaction);
    return row;
  }

  async save(row: Qualification, values: Partial<Qualification>, transaction: Transaction): Promise<void> {
    const stateChanged = values.state !== undefined && values.state !== row.state;
    await row.update(values, { transaction });
    if (stateChanged) await refreshUsableSource(this.sequelize, row.housePartId, row.vendorPartId, transaction);
  }

  async addEvent(
    values: {
      qualificationId: number;
      userId: number | null;
      action: AuditEntry['action'];
      fromState?: QualificationState | null;
      toState?: QualificationState | null;
      changes?: AuditEntry['changes'];
      note?: string | null;
    },
    transaction: Transaction,
  ): Promise<void> {
    await this.events.create({ fromState: null, toState: null, note: null, ...values, changes: values.changes ?? [] }, { transaction });
  }

  listEvents(qualificationId: number): Promise<QualificationEvent[]> {
    return this.events.findAll({ where: { qualificationId }, include: [{ model: User, attributes: ['id', 'name'] }], order: [['id', 'ASC']] });
  }

  async addComment(values: { qualificationId: number; userId: number; text: string }, transaction: Transaction): Promise<QualificationComment> {
    return this.comments.create(values, { transaction });
  }

  listComments(qualificationId: number): Promise<QualificationComment[]> {
    return this.comments.findAll({ where: { qualificationId }, include: [{ model: User, attributes: ['id', 'name'] }], order: [['id', 'ASC']] });
  }

  async findRow(id: number, transaction?: Transaction): Promise<(CaseRow & { evaluation: Evaluation }) | null> {
    const [row] = await this.select<CaseRow & { evaluation: Evaluation | string }>(
      `${CASE_SELECT}, q.evaluation ${CASE_FROM} WHERE q.id = ?`,
      [id],
      transaction,
    );
    return row ? { ...caseRow(row), evaluation: json<Evaluation>(row.evaluation) } : null;
  }

  async list(query: QualificationListQuery, restrictStates?: readonly QualificationState[]): Promise<{ rows: CaseRow[]; total: number }> {
    const where: string[] = [];
    const params: unknown[] = [];
    const states = restrictStates ? (query.state ?? [...restrictStates]).filter((s) => restrictStates.includes(s)) : query.state;
    if (states) {
      if (states.length === 0) return { rows: [], total: 0 };
      where.push(`q.state IN (${states.map(() => '?').join(', ')})`);
      params.push(...states);
    }
    if (query.housePartId !== undefined) {
      where.push('q.house_part_id = ?');
      params.push(query.housePartId);
    }
    if (query.vendorPartId !== undefined) {
      where.push('q.vendor_part_id = ?');
      params.push(query.vendorPartId);
    }
    if (query.engineerId !== undefined) {
      where.push('(q.prepared_by_id = ? OR q.decided_by_id = ?)');
      params.push(query.engineerId, query.engineerId);
    }
    if (query.needsRecheck !== undefined) {
      where.push('q.needs_recheck = ?');
      params.push(query.needsRecheck);
    }
    if (query.latest ?? true) where.push('nx.id IS NULL');
    const whereSql = where.length ? `WHERE ${where.join(' AND ')}` : '';
    const order = [...query.sort.map((t: SortTerm<QualificationSort>) => `${SORT_COLUMNS[t.field]} ${t.desc ? 'DESC' : 'ASC'}`), 'q.id DESC'].join(', ');
    const rows = await this.select<CaseRow>(`${CASE_SELECT} ${CASE_FROM} ${whereSql} ORDER BY ${order} LIMIT ? OFFSET ?`, [
      ...params,
      query.pageSize,
      query.pageIndex * query.pageSize,
    ]);
    const [{ total }] = await this.select<{ total: number | bigint }>(`SELECT COUNT(*) AS total ${CASE_FROM} ${whereSql}`, params);
    return { rows: rows.map(caseRow), total: Number(total) };
  }

  /**
   * Flags the latest case of every pair a catalogue change touches: decided cases need a
   * re-check, open ones a new evaluation. Withdrawn cases are left alone. Runs in the
   * transaction of the change; returns the ids flagged.
   */
  async flagForRecheck(
    target: { housePartId: number } | { vendorPartId: number },
    reason: RecheckReason,
    transaction: Transaction,
    onlyIf?: { cardVersionBelow?: number; specVersionBelow?: number },
  ): Promise<number[]> {
    const column = 'housePartId' in target ? 'house_part_id' : 'vendor_part_id';
    const id = 'housePartId' in target ? target.housePartId : target.vendorPartId;
    const extra: string[] = [];
    const params: unknown[] = [id];
    if (onlyIf?.cardVersionBelow !== undefined) {
      extra.push('q.card_version < ?');
      params.push(onlyIf.cardVersionBelow);
    }
    if (onlyIf?.specVersionBelow !== undefined) {
      extra.push('q.spec_version < ?');
      params.push(onlyIf.specVersionBelow);
    }
    const rows = await this.select<{ id: number }>(
      `SELECT q.id FROM qualifications q LEFT JOIN qualifications nx ON nx.previous_id = q.id
       WHERE q.${column} = ? AND nx.id IS NULL AND q.state <> 'withdrawn' ${extra.map((e) => `AND ${e}`).join(' ')}
       ORDER BY q.id FOR UPDATE`,
      params,
      transaction,
    );
    const flagged: number[] = [];
    for (const { id: caseId } of rows) {
      const row = await this.cases.findByPk(caseId, { transaction });
      if (!row) continue;
      await row.update({ needsRecheck: true, recheckReasons: [...(row.recheckReasons ?? []), reason] }, { transaction });
      flagged.push(caseId);
    }
    return flagged;
  }

  /** The spec and card versions the catalogue holds now (null when there is none). */
  async currentVersions(housePartId: number, vendorPartId: number): Promise<{ specVersion: number | null; cardVersion: number | null }> {
    const [row] = await this.select<{ specVersion: number | null; cardVersion: number | null }>(
      `SELECT (SELECT spec_version FROM house_parts WHERE id = ?) AS specVersion, (SELECT card_version FROM vendor_parts WHERE id = ?) AS cardVersion`,
      [housePartId, vendorPartId],
    );
    return row ?? { specVersion: null, cardVersion: null };
  }

  /** Active engineers other than `exceptId` (who is told a case waits for review). */
}

function json<T>(value: T | string): T {
  return typeof value === 'string' ? (JSON.parse(value) as T) : value;
}

function caseRow<T extends CaseRow>(row: T): T {
  return { ...row, needsRecheck: Boolean(row.needsRecheck), recheckReasons: json<RecheckReason[]>(row.recheckReasons as RecheckReason[] | string) };
}
