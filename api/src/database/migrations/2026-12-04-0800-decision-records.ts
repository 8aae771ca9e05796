import { DataTypes } from 'sequelize';
import type { Migration } from '../migration';

/**
 * The PDF record of each decided case, written once. The row commits with the decision and
 * holds the frozen inputs (the canonical JSON the PDF is drawn from) with their sha256; the
 * object is stored right after commit and the row turns `stored` with the PDF's sha256 and
 * size. A row left `pending` (the object store was down) is completed on the next read.
 */
export const decisionRecords: Migration = {
  name: '2026-12-04-0800-decision-records',
  async up({ queryInterface: q }) {
    await q.createTable('decision_records', {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      qualification_id: { type: DataTypes.INTEGER, allowNull: false, unique: true, references: { model: 'qualifications', key: 'id' }, onDelete: 'RESTRICT' },
      state: { type: DataTypes.ENUM('pending', 'stored'), allowNull: false },
      storage_key: { type: DataTypes.STRING(200), allowNull: false, unique: true },
      sha256: { type: DataTypes.CHAR(64), allowNull: true },
      inputs_sha256: { type: DataTypes.CHAR(64), allowNull: false },
      inputs: { type: DataTypes.TEXT('long'), allowNull: false },
      size: { type: DataTypes.INTEGER, allowNull: true },
      attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      last_error: { type: DataTypes.STRING(500), allowNull: true },
      created_at: { type: DataTypes.DATE, allowNull: false },
      stored_at: { type: DataTypes.DATE, allowNull: true },
    });
  },
  async down({ queryInterface: q }) {
    await q.dropTable('decision_records');
  },
};
