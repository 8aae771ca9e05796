import { DataTypes, QueryTypes } from 'sequelize';
import type { Migration } from '../migration';

const userRef = (allowNull: boolean) => ({
  type: DataTypes.INTEGER,
  allowNull,
  references: { model: 'users', key: 'id' },
  onDelete: allowNull ? 'SET NULL' : 'RESTRICT',
});

/**
 * Requests for a qualification: a designer asks for a vendor part to be qualified
 * (optionally for a named house part); an engineer takes it up with a case or declines it.
 * `open_key` is set only while a request is open, so the unique index refuses a second
 * open request of one person for the same part and house part even when two arrive at once.
 */
export const qualificationRequests: Migration = {
  name: '2026-12-01-0005-qualification-requests',
  async up({ queryInterface: q, sequelize }) {
    await q.createTable('qualification_requests', {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      vendor_part_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'vendor_parts', key: 'id' }, onDelete: 'RESTRICT' },
      house_part_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'house_parts', key: 'id' }, onDelete: 'RESTRICT' },
      requested_by_id: userRef(false),
      note: { type: DataTypes.TEXT, allowNull: false },
      needed_by: { type: DataTypes.DATEONLY, allowNull: true },
      state: { type: DataTypes.ENUM('open', 'taken-up', 'declined'), allowNull: false },
      qualification_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'qualifications', key: 'id' }, onDelete: 'RESTRICT' },
      closed_by_id: userRef(true),
      closed_at: { type: DataTypes.DATE, allowNull: true },
      reply: { type: DataTypes.TEXT, allowNull: true },
      version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      created_at: { type: DataTypes.DATE, allowNull: false },
      updated_at: { type: DataTypes.DATE, allowNull: false },
    });
    // A generated column (plain DDL: the query interface has no generated columns).
    await sequelize.query(
      `ALTER TABLE qualification_requests ADD COLUMN open_key VARCHAR(40)
         AS (IF(state = 'open', CONCAT_WS(':', requested_by_id, vendor_part_id, IFNULL(house_part_id, 0)), NULL)) PERSISTENT,
       ADD UNIQUE INDEX qualification_requests_open_key (open_key)`,
      { type: QueryTypes.BULKUPDATE },
    );
    await q.addIndex('qualification_requests', ['state', 'created_at'], { name: 'qualification_requests_state_created' });
    await q.addIndex('qualification_requests', ['vendor_part_id', 'state'], { name: 'qualification_requests_vendor_part_state' });
    await q.addIndex('qualification_requests', ['requested_by_id', 'created_at'], { name: 'qualification_requests_requester' });
  },
  async down({ queryInterface: q }) {
    await q.dropTable('qualification_requests');
  },
};
