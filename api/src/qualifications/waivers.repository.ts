import { Injectable } from '@nestjs/common';
import { InjectConnection, InjectModel } from '@nestjs/sequelize';
import type { CheckId, Waiver, WaiverBrief } from '@shuntwise/contracts';
import { QueryTypes, type Transaction } from 'sequelize';
import { Sequelize } from 'sequelize-typescript';
import { QualificationWaiver } from './waiver.model';

export type WaiverRow = Omit<Waiver, 'preparedBy' | 'decidedBy' | 'checkLabel' | 'expiresOn' | 'decidedAt' | 'lapsedAt' | 'createdAt'> & {
  expiresOn: string | Date;
  preparedById: number;
  preparedByName: string;
  decidedById: number | null;
  decidedByName: string | null;
  decidedAt: Date | null;
  lapsedAt: Date | null;
  createdAt: Date;
};

const WAIVER_SELECT = `SELECT w.id, w.qualification_id AS qualificationId, w.house_part_id AS housePartId, w.vendor_part_id AS vendorPartId, w.check_id AS checkId,
  w.quantity, w.limit_kind AS limitKind, w.spec_limit AS specLimit, w.accepted_limit AS acceptedLimit, w.value, w.reason, w.expires_on AS expiresOn, w.state,
  w.prepared_by_id AS preparedById, pu.name AS preparedByName, w.decided_by_id AS decidedById, du.name AS decidedByName, w.decided_at AS decidedAt,
  w.decision_note AS decisionNote, w.lapsed_at AS lapsedAt, w.created_at AS createdAt
  FROM qualification_waivers w JOIN users pu ON pu.id = w.prepared_by_id LEFT JOIN users du ON du.id = w.decided_by_id`;

export interface WaiverBriefRow {
  id: number;
  qualificationId: number;
  checkId: CheckId;
  quantity: WaiverBrief['quantity'];
  acceptedLimit: number | null;
  expiresOn: string | Date;
  state: WaiverBrief['state'];
}

/** The only place that queries waivers (qualification_waivers); the names of who prepared and decided come along joined from users. */
@Injectable()
export class WaiversRepository {
  constructor(
    @InjectModel(QualificationWaiver) private readonly waivers: typeof QualificationWaiver,
    @InjectConnection() private readonly sequelize: Sequelize,
  ) {}

  /** A case's waivers as the API shows them, oldest first. */
  rowsOf(qualificationId: number, transaction?: Transaction): Promise<WaiverRow[]> {
    return this.sequelize.query<WaiverRow>(`${WAIVER_SELECT} WHERE w.qualification_id = ? ORDER BY w.id`, {
      replacements: [qualificationId],
      type: QueryTypes.SELECT,
      transaction,
    });
  }

  /** Approved and lapsed waivers of these cases. */
  briefRowsOf(caseIds: readonly number[]): Promise<WaiverBriefRow[]> {
    return this.sequelize.query<WaiverBriefRow>(
      `SELECT id, qualification_id AS qualificationId, check_id AS checkId, quantity, accepted_limit AS acceptedLimit, expires_on AS expiresOn, state
       FROM qualification_waivers WHERE qualification_id IN (?) AND state IN ('approved', 'lapsed') ORDER BY id`,
      { replacements: [caseIds], type: QueryTypes.SELECT },
    );
  }

  findAllOf(qualificationId: number, transaction?: Transaction): Promise<QualificationWaiver[]> {
    return this.waivers.findAll({ where: { qualificationId }, transaction });
  }

  /** One waiver of a case, locked for update. */
  findOfCaseLocked(waiverId: number, qualificationId: number, transaction: Transaction): Promise<QualificationWaiver | null> {
    return this.waivers.findOne({ where: { id: waiverId, qualificationId }, transaction, lock: transaction.LOCK.UPDATE });
  }

  findLocked(waiverId: number, transaction: Transaction): Promise<QualificationWaiver | null> {
    return this.waivers.findByPk(waiverId, { transaction, lock: transaction.LOCK.UPDATE });
  }

  create(values: Partial<QualificationWaiver>, transaction: Transaction): Promise<QualificationWaiver> {
    return this.waivers.create(values as Record<string, unknown>, { transaction });
  }

  async save(waiver: QualificationWaiver, values: Partial<QualificationWaiver>, transaction: Transaction): Promise<void> {
    await waiver.update(values, { transaction });
  }

  /** Approved waivers whose expiry day is before `today` (YYYY-MM-DD). */
  due(today: string): Promise<Array<{ id: number; qualificationId: number }>> {
    return this.sequelize.query<{ id: number; qualificationId: number }>(
      `SELECT id, qualification_id AS qualificationId FROM qualification_waivers WHERE state = 'approved' AND expires_on < ? ORDER BY id`,
      { replacements: [today], type: QueryTypes.SELECT },
    );
  }
}
