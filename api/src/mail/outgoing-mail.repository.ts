import { Injectable } from '@nestjs/common';
import { InjectConnection, InjectModel } from '@nestjs/sequelize';
import { QueryTypes, Transaction } from 'sequelize';
import { Sequelize } from 'sequelize-typescript';
import { OutgoingMail } from './outgoing-mail.model';

/** The only place that queries the outbox (outgoing_mail): the rows, their claims and leases. */
@Injectable()
export class OutgoingMailRepository {
  constructor(
    @InjectModel(OutgoingMail) private readonly outbox: typeof OutgoingMail,
    @InjectConnection() private readonly sequelize: Sequelize,
  ) {}

  create(values: { recipients: string[]; subject: string; body: string; kind: string; nextAttemptAt: Date }, transaction?: Transaction): Promise<OutgoingMail> {
    return this.outbox.create(values, { transaction });
  }

  /**
   * Takes up to `batch` due rows for `replicaId` in one short transaction: another
   * replica's claim is skipped, never waited for. Rows this replica claimed earlier and
   * could not settle are its own again at once.
   */
  claim(replicaId: string, batch: number, now: Date, leaseUntil: Date): Promise<OutgoingMail[]> {
    // READ COMMITTED: InnoDB then locks only the rows it takes, no gaps, so a claim never blocks (or
    // deadlocks with) a transaction that is inserting a new message.
    return this.sequelize.transaction({ isolationLevel: Transaction.ISOLATION_LEVELS.READ_COMMITTED }, async (transaction) => {
      const rows = await this.sequelize.query<{ id: number }>(
        // Rows this replica claimed earlier and could not settle (the database went away mid-batch) are its own
        // again at once: only one dispatch runs per process, so nobody here is working on them.
        `SELECT id FROM outgoing_mail WHERE state = 'pending' AND (next_attempt_at <= ? OR claimed_by = ?)
         ORDER BY id LIMIT ${Number(batch)} FOR UPDATE SKIP LOCKED`,
        { replacements: [now, replicaId], type: QueryTypes.SELECT, transaction },
      );
      if (!rows.length) return [];
      const ids = rows.map((r) => r.id);
      await this.sequelize.query('UPDATE outgoing_mail SET claimed_by = ?, next_attempt_at = ? WHERE id IN (?)', {
        replacements: [replicaId, leaseUntil, ids],
        type: QueryTypes.UPDATE,
        transaction,
      });
      return this.outbox.findAll({ where: { id: ids }, order: [['id', 'ASC']], transaction });
    });
  }

  /** Extends `replicaId`'s claim on one message to `leaseUntil`; false when it no longer holds it. */
  async renew(id: number, replicaId: string, leaseUntil: Date): Promise<boolean> {
    await this.sequelize.query('UPDATE outgoing_mail SET next_attempt_at = ? WHERE id = ? AND claimed_by = ?', {
      replacements: [leaseUntil, id, replicaId],
      type: QueryTypes.UPDATE,
    });
    // Read back rather than count affected rows: the driver counts changed rows, and a lease renewed
    // within the same second as the claim leaves the row unchanged.
    const [row] = await this.sequelize.query<{ claimedBy: string | null }>(
      "SELECT claimed_by AS claimedBy FROM outgoing_mail WHERE id = ? AND state = 'pending'",
      {
        replacements: [id],
        type: QueryTypes.SELECT,
      },
    );
    return row?.claimedBy === replicaId;
  }

  /** Writes a result (column → value) and drops the claim, only while `replicaId` still holds it; false when it no longer did. */
  async release(id: number, replicaId: string, values: Record<string, unknown>): Promise<boolean> {
    const columns = Object.keys(values);
    const [, affected] = (await this.sequelize.query(
      `UPDATE outgoing_mail SET ${columns.map((c) => `${c} = ?`).join(', ')}, claimed_by = NULL, updated_at = ? WHERE id = ? AND claimed_by = ?`,
      { replacements: [...columns.map((c) => values[c]), new Date(), id, replicaId], type: QueryTypes.UPDATE },
    )) as unknown as [unknown, number];
    return affected > 0;
  }
}
