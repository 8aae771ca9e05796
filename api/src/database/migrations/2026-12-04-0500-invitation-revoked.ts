import { DataTypes, QueryTypes } from 'sequelize';
import type { Migration } from '../migration';

/** An admin may take an invitation back: its link then stops working, and the list says so. */
export const invitationRevoked: Migration = {
  name: '2026-12-04-0500-invitation-revoked',
  async up({ queryInterface: q }) {
    await q.addColumn('invitations', 'revoked_at', { type: DataTypes.DATE, allowNull: true });
  },
  async down({ sequelize }) {
    // Plain DDL: the query interface's removeColumn runs an untyped raw query, which the mariadb driver refuses.
    await sequelize.query('ALTER TABLE invitations DROP COLUMN revoked_at', { type: QueryTypes.BULKUPDATE });
  },
};
