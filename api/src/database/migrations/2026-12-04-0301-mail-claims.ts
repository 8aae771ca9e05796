import { DataTypes, QueryTypes } from 'sequelize';
import type { Migration } from '../migration';

/**
 * Outbox claims for several API replicas: a replica takes due messages by writing its id
 * into `claimed_by` (rows read with FOR UPDATE SKIP LOCKED, so two replicas never take the
 * same row) and pushing `next_attempt_at` to the end of its lease; another replica may take
 * them only after the lease ends (the first one died).
 */
export const mailClaims: Migration = {
  name: '2026-12-04-0301-mail-claims',
  async up({ queryInterface: q }) {
    await q.addColumn('outgoing_mail', 'claimed_by', { type: DataTypes.STRING(64), allowNull: true });
  },
  async down({ sequelize }) {
    // Plain DDL with a type: the query interface's removeColumn trips over the mariadb driver's result meta.
    await sequelize.query('ALTER TABLE outgoing_mail DROP COLUMN claimed_by', { type: QueryTypes.BULKUPDATE });
  },
};
