import { Injectable } from '@nestjs/common';
import { InjectConnection, InjectModel } from '@nestjs/sequelize';
import type { AuditEntry, RatingCardFields, Spec } from '@shuntwise/contracts';
import { QueryTypes, type Transaction } from 'sequelize';
import { Sequelize } from 'sequelize-typescript';
import { DecisionRecord } from './decision-record.model';

const json = <T>(value: T | string): T => (typeof value === 'string' ? (JSON.parse(value) as T) : value);

/** The only place that queries decision records and the versioned rows a record freezes. */
@Injectable()
export class DecisionRecordsRepository {
  constructor(
    @InjectConnection() private readonly sequelize: Sequelize,
    @InjectModel(DecisionRecord) private readonly records: typeof DecisionRecord,
  ) {}

  private select<T extends object>(sql: string, replacements: unknown[], transaction?: Transaction): Promise<T[]> {
    return this.sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT, transaction });
  }

  find(qualificationId: number, transaction?: Transaction, lock = false): Promise<DecisionRecord | null> {
    return this.records.findOne({ where: { qualificationId }, transaction, lock: lock && transaction ? transaction.LOCK.UPDATE : undefined });
  }

  create(
    values: Pick<DecisionRecord, 'qualificationId' | 'state' | 'storageKey' | 'inputsSha256' | 'inputs' | 'createdAt'>,
    transaction: Transaction,
  ): Promise<DecisionRecord> {
    return this.records.create(values as Record<string, unknown>, { transaction });
  }

  /** Marks a pending record stored; answers false when another reader stored it first. */
  async markStored(qualificationId: number, values: { sha256: string; size: number; storedAt: Date }): Promise<boolean> {
    const [count] = await this.records.update({ state: 'stored', ...values, lastError: null }, { where: { qualificationId, state: 'pending' } });
    return count > 0;
  }

  async markFailed(qualificationId: number, error: string): Promise<void> {
    await this.records.increment('attempts', { where: { qualificationId, state: 'pending' } });
    await this.records.update({ lastError: error.slice(0, 500) }, { where: { qualificationId, state: 'pending' } });
  }

  async specVersion(housePartId: number, version: number, transaction?: Transaction): Promise<Spec | null> {
    const [row] = await this.select<{ spec: Spec | string }>(
      `SELECT spec FROM house_part_specs WHERE house_part_id = ? AND version = ?`,
      [housePartId, version],
      transaction,
    );
    return row ? json(row.spec) : null;
  }

  async cardVersion(vendorPartId: number, version: number, transaction?: Transaction): Promise<{ fields: RatingCardFields; note: string | null } | null> {
    const [row] = await this.select<{ fields: RatingCardFields | string; note: string | null }>(
      `SELECT fields, note FROM rating_card_versions WHERE vendor_part_id = ? AND version = ?`,
      [vendorPartId, version],
      transaction,
    );
    return row ? { fields: json(row.fields), note: row.note } : null;
  }

  async datasheets(
    ids: number[],
    transaction?: Transaction,
  ): Promise<Array<{ id: number; fileName: string; revision: string | null; sha256: string; pages: number }>> {
    if (ids.length === 0) return [];
    return this.select(`SELECT id, file_name AS fileName, revision, sha256, pages FROM datasheets WHERE id IN (?) ORDER BY id`, [ids], transaction);
  }

  async events(
    qualificationId: number,
    transaction?: Transaction,
  ): Promise<
    Array<{
      at: Date;
      by: string | null;
      action: AuditEntry['action'];
      fromState: AuditEntry['fromState'];
      toState: AuditEntry['toState'];
      note: string | null;
      changes: AuditEntry['changes'];
    }>
  > {
    const rows = await this.select<{
      at: Date;
      by: string | null;
      action: AuditEntry['action'];
      fromState: AuditEntry['fromState'];
      toState: AuditEntry['toState'];
      note: string | null;
      changes: AuditEntry['changes'] | string;
    }>(
      `SELECT e.created_at AS at, u.name AS \`by\`, e.action, e.from_state AS fromState, e.to_state AS toState, e.note, e.changes
       FROM qualification_events e LEFT JOIN users u ON u.id = e.user_id WHERE e.qualification_id = ? ORDER BY e.id`,
      [qualificationId],
      transaction,
    );
    return rows.map((r) => ({ ...r, changes: json(r.changes) }));
  }

  comments(qualificationId: number, transaction?: Transaction): Promise<Array<{ at: Date; by: string; text: string }>> {
    return this.select(
      `SELECT c.created_at AS at, u.name AS \`by\`, c.text FROM qualification_comments c JOIN users u ON u.id = c.user_id WHERE c.qualification_id = ? ORDER BY c.id`,
      [qualificationId],
      transaction,
    );
  }
}
