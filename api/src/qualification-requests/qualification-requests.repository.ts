import { Injectable } from '@nestjs/common';
import { InjectConnection, InjectModel } from '@nestjs/sequelize';
import type { HousePartStatus, QualificationRequestState, QualificationState } from '@shuntwise/contracts';
import { Op, QueryTypes, type Transaction } from 'sequelize';
import { Sequelize } from 'sequelize-typescript';
import { DECIDED_SQL } from '../common/source-standing.sql';
import { QualificationRequest } from './qualification-request.model';

/** A request as lists and the detail read it: the row with the names it refers to and its case. */
export interface RequestRow {
  id: number;
  vendorPartId: number;
  manufacturer: string;
  mpn: string;
  package: string | null;
  housePartId: number | null;
  partNumber: string | null;
  housePartDescription: string | null;
  note: string;
  neededBy: string | null;
  state: QualificationRequestState;
  requestedById: number;
  requestedByName: string;
  createdAt: Date;
  closedById: number | null;
  closedByName: string | null;
  closedAt: Date | null;
  reply: string | null;
  caseId: number | null;
  caseRevision: number | null;
  caseState: QualificationState | null;
  caseHousePartId: number | null;
  casePartNumber: string | null;
  caseHousePartDescription: string | null;
  /** The latest decided case of the named pair (vendor part, house part), if any. */
  decidedCaseId: number | null;
  decidedState: QualificationState | null;
  decisionText: string | null;
  decidedAt: Date | null;
  revokeReason: string | null;
  revokedAt: Date | null;
}

export interface RequestFilter {
  openOnly: boolean;
  requestedById?: number;
  vendorPartId?: number;
}

const REQUEST_SELECT = `SELECT r.id, r.vendor_part_id AS vendorPartId, vp.manufacturer_name AS manufacturer, vp.mpn, vp.package,
  r.house_part_id AS housePartId, h.part_number AS partNumber, h.description AS housePartDescription,
  r.note, DATE_FORMAT(r.needed_by, '%Y-%m-%d') AS neededBy, r.state, r.requested_by_id AS requestedById, ru.name AS requestedByName,
  r.created_at AS createdAt, r.closed_by_id AS closedById, cu.name AS closedByName, r.closed_at AS closedAt, r.reply,
  q.id AS caseId, q.revision AS caseRevision, q.state AS caseState, q.house_part_id AS caseHousePartId,
  qh.part_number AS casePartNumber, qh.description AS caseHousePartDescription,
  ld.id AS decidedCaseId, ld.state AS decidedState, ld.decision_text AS decisionText, ld.decided_at AS decidedAt, ld.revoke_reason AS revokeReason, ld.revoked_at AS revokedAt`;

const REQUEST_FROM = `FROM qualification_requests r
JOIN vendor_parts vp ON vp.id = r.vendor_part_id
LEFT JOIN house_parts h ON h.id = r.house_part_id
JOIN users ru ON ru.id = r.requested_by_id
LEFT JOIN users cu ON cu.id = r.closed_by_id
LEFT JOIN qualifications q ON q.id = r.qualification_id
LEFT JOIN house_parts qh ON qh.id = q.house_part_id
LEFT JOIN qualifications ld ON ld.house_part_id = r.house_part_id AND ld.vendor_part_id = r.vendor_part_id AND ld.state IN ${DECIDED_SQL}
  AND NOT EXISTS (SELECT 1 FROM qualifications n WHERE n.house_part_id = ld.house_part_id AND n.vendor_part_id = ld.vendor_part_id AND n.revision > ld.revision AND n.state IN ${DECIDED_SQL})`;

/** The only place that queries qualification requests (and reads what they refer to). */
@Injectable()
export class QualificationRequestsRepository {
  constructor(
    @InjectConnection() private readonly sequelize: Sequelize,
    @InjectModel(QualificationRequest) private readonly requests: typeof QualificationRequest,
  ) {}

  private select<T extends object>(sql: string, replacements: unknown[], transaction?: Transaction): Promise<T[]> {
    return this.sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT, transaction });
  }

  async list(filter: RequestFilter, page: { pageIndex: number; pageSize: number }): Promise<{ rows: RequestRow[]; total: number }> {
    const where: string[] = [];
    const params: unknown[] = [];
    if (filter.openOnly) where.push("r.state = 'open'");
    if (filter.requestedById !== undefined) {
      where.push('r.requested_by_id = ?');
      params.push(filter.requestedById);
    }
    if (filter.vendorPartId !== undefined) {
      where.push('r.vendor_part_id = ?');
      params.push(filter.vendorPartId);
    }
    const whereSql = where.length ? `WHERE ${where.join(' AND ')}` : '';
    // Open ones oldest first (the queue an engineer works through); all, newest first.
    const order = filter.openOnly ? 'r.created_at ASC, r.id ASC' : "r.state = 'open' DESC, r.created_at DESC, r.id DESC";
    const rows = await this.select<RequestRow>(`${REQUEST_SELECT} ${REQUEST_FROM} ${whereSql} ORDER BY ${order} LIMIT ? OFFSET ?`, [
      ...params,
      page.pageSize,
      page.pageIndex * page.pageSize,
    ]);
    const [{ total }] = await this.select<{ total: number | bigint }>(`SELECT COUNT(*) AS total FROM qualification_requests r ${whereSql}`, params);
    return { rows, total: Number(total) };
  }

  async findRow(id: number): Promise<RequestRow | null> {
    const [row] = await this.select<RequestRow>(`${REQUEST_SELECT} ${REQUEST_FROM} WHERE r.id = ?`, [id]);
    return row ?? null;
  }

  findById(id: number, transaction?: Transaction, lock = false): Promise<QualificationRequest | null> {
    return this.requests.findByPk(id, { transaction, lock: lock && transaction ? transaction.LOCK.UPDATE : undefined });
  }

  create(values: Partial<QualificationRequest>, transaction: Transaction): Promise<QualificationRequest> {
    return this.requests.create(values as Record<string, unknown>, { transaction });
  }

  async save(row: QualificationRequest, values: Partial<QualificationRequest>, transaction: Transaction): Promise<void> {
    await row.update(values, { transaction });
  }

  /**
   * The caller's open request for the same vendor part and house part (none named counts as
   * one choice). A plain read: two requests at the same moment both pass it, and the unique
   * open-request index refuses the second insert (a locking read here made them deadlock).
   */
  async openDuplicate(
    requestedById: number,
    vendorPartId: number,
    housePartId: number | null,
    transaction: Transaction,
  ): Promise<{ id: number; createdAt: Date } | null> {
    const [row] = await this.select<{ id: number; createdAt: Date }>(
      `SELECT id, created_at AS createdAt FROM qualification_requests
       WHERE state = 'open' AND requested_by_id = ? AND vendor_part_id = ? AND ${housePartId === null ? 'house_part_id IS NULL' : 'house_part_id = ?'}`,
      housePartId === null ? [requestedById, vendorPartId] : [requestedById, vendorPartId, housePartId],
      transaction,
    );
    return row ?? null;
  }

  /**
   * Open requests a new case answers: the same vendor part, for its house part or for none
   * named. Locked for update, so a decline waiting on one finds it taken up.
   */
  openForCase(vendorPartId: number, housePartId: number, transaction: Transaction): Promise<QualificationRequest[]> {
    return this.requests.findAll({
      where: { state: 'open', vendorPartId, [Op.or]: [{ housePartId }, { housePartId: null }] },
      order: [['id', 'ASC']],
      transaction,
      lock: transaction.LOCK.UPDATE,
    });
  }

  async vendorPart(id: number, transaction?: Transaction): Promise<{ id: number; manufacturer: string; mpn: string } | null> {
    const [row] = await this.select<{ id: number; manufacturer: string; mpn: string }>(
      'SELECT id, manufacturer_name AS manufacturer, mpn FROM vendor_parts WHERE id = ?',
      [id],
      transaction,
    );
    return row ?? null;
  }

  async housePart(id: number, transaction?: Transaction): Promise<{ id: number; partNumber: string; description: string; status: HousePartStatus } | null> {
    const [row] = await this.select<{ id: number; partNumber: string; description: string; status: HousePartStatus }>(
      'SELECT id, part_number AS partNumber, description, status FROM house_parts WHERE id = ?',
      [id],
      transaction,
    );
    return row ?? null;
  }

  /** Every case of a vendor part for a house part (what its standing is read from), oldest revision first. */
  pairCases(housePartId: number, vendorPartId: number, transaction?: Transaction): Promise<Array<{ id: number; revision: number; state: QualificationState }>> {
    return this.select<{ id: number; revision: number; state: QualificationState }>(
      'SELECT id, revision, state FROM qualifications WHERE house_part_id = ? AND vendor_part_id = ? ORDER BY revision',
      [housePartId, vendorPartId],
      transaction,
    );
  }

  async user(id: number, transaction?: Transaction): Promise<{ id: number; name: string; email: string; active: boolean } | null> {
    const [row] = await this.select<{ id: number; name: string; email: string; active: number | boolean }>(
      'SELECT id, name, email, active FROM users WHERE id = ?',
      [id],
      transaction,
    );
    return row ? { ...row, active: Boolean(row.active) } : null;
  }
}
