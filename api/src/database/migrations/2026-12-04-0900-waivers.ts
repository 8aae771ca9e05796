import { DataTypes, QueryTypes } from 'sequelize';
import type { Migration } from '../migration';

const enumOf = (values: string[]) => `ENUM(${values.map((v) => `'${v}'`).join(', ')})`;
const STATES_BEFORE = ['draft', 'in-review', 'approved', 'cleared', 'cleared-with-conditions', 'rejected', 'withdrawn', 'revoked'];
const STATES_AFTER = [
  'draft',
  'in-review',
  'approved',
  'cleared',
  'cleared-with-conditions',
  'cleared-with-waiver',
  'rejected',
  'withdrawn',
  'revoked',
  'waiver-lapsed',
];
const DECISIONS_BEFORE = ['approved', 'cleared', 'cleared-with-conditions', 'rejected'];
const DECISIONS_AFTER = ['approved', 'cleared', 'cleared-with-conditions', 'cleared-with-waiver', 'rejected'];

/**
 * Waivers: a failing or marginal check of one case accepted against a stated limit until an
 * expiry day, prepared by one engineer and approved by another. A case cleared on waivers
 * is `cleared-with-waiver`; when a waiver lapses it becomes `waiver-lapsed`.
 */
export const waivers: Migration = {
  name: '2026-12-04-0900-waivers',
  async up({ sequelize, queryInterface: q }) {
    await sequelize.query(`ALTER TABLE qualifications MODIFY state ${enumOf(STATES_AFTER)} NOT NULL, MODIFY decision_state ${enumOf(DECISIONS_AFTER)} NULL`, {
      type: QueryTypes.BULKUPDATE,
    });
    await q.createTable('qualification_waivers', {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      qualification_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'qualifications', key: 'id' }, onDelete: 'RESTRICT' },
      house_part_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'house_parts', key: 'id' }, onDelete: 'RESTRICT' },
      vendor_part_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'vendor_parts', key: 'id' }, onDelete: 'RESTRICT' },
      check_id: { type: DataTypes.STRING(40), allowNull: false },
      quantity: { type: DataTypes.STRING(30), allowNull: false },
      limit_kind: { type: DataTypes.STRING(10), allowNull: false },
      spec_limit: { type: DataTypes.DOUBLE, allowNull: true },
      accepted_limit: { type: DataTypes.DOUBLE, allowNull: true },
      value: { type: DataTypes.DOUBLE, allowNull: true },
      reason: { type: DataTypes.TEXT, allowNull: false },
      expires_on: { type: DataTypes.DATEONLY, allowNull: false },
      state: { type: DataTypes.ENUM('proposed', 'approved', 'refused', 'lapsed'), allowNull: false },
      prepared_by_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'RESTRICT' },
      decided_by_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'RESTRICT' },
      decided_at: { type: DataTypes.DATE, allowNull: true },
      decision_note: { type: DataTypes.TEXT, allowNull: true },
      lapsed_at: { type: DataTypes.DATE, allowNull: true },
      created_at: { type: DataTypes.DATE, allowNull: false },
      updated_at: { type: DataTypes.DATE, allowNull: false },
    });
    await q.addIndex('qualification_waivers', ['qualification_id'], { name: 'qualification_waivers_case' });
    // The lapse pass looks up approved waivers past their day.
    await q.addIndex('qualification_waivers', ['state', 'expires_on'], { name: 'qualification_waivers_due' });
  },
  async down({ sequelize, queryInterface: q }) {
    await q.dropTable('qualification_waivers');
    await sequelize.query(`UPDATE qualifications SET state = 'revoked' WHERE state IN ('cleared-with-waiver', 'waiver-lapsed')`, { type: QueryTypes.UPDATE });
    await sequelize.query(`UPDATE qualifications SET decision_state = 'cleared-with-conditions' WHERE decision_state = 'cleared-with-waiver'`, {
      type: QueryTypes.UPDATE,
    });
    await sequelize.query(`ALTER TABLE qualifications MODIFY state ${enumOf(STATES_BEFORE)} NOT NULL, MODIFY decision_state ${enumOf(DECISIONS_BEFORE)} NULL`, {
      type: QueryTypes.BULKUPDATE,
    });
  },
};
