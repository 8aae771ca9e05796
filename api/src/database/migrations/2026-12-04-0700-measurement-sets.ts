import { DataTypes } from 'sequelize';
import type { Migration } from '../migration';

/**
 * Bench measurements of a vendor part's samples: the raw file in object storage (never
 * overwritten) with its sha256, the points read from it per sample, and who measured what,
 * where and when. The analysis is computed on read against the current card and a spec.
 */
export const measurementSets: Migration = {
  name: '2026-12-04-0700-measurement-sets',
  async up({ queryInterface: q }) {
    await q.createTable('measurement_sets', {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      vendor_part_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'vendor_parts', key: 'id' }, onDelete: 'RESTRICT' },
      storage_key: { type: DataTypes.STRING(200), allowNull: false, unique: true },
      sha256: { type: DataTypes.CHAR(64), allowNull: false },
      file_name: { type: DataTypes.STRING(255), allowNull: false },
      size_bytes: { type: DataTypes.INTEGER, allowNull: false },
      lot: { type: DataTypes.STRING(60), allowNull: true },
      instrument: { type: DataTypes.STRING(120), allowNull: true },
      measured_on: { type: DataTypes.DATEONLY, allowNull: true },
      note: { type: DataTypes.TEXT, allowNull: true },
      samples: { type: DataTypes.JSON, allowNull: false },
      sample_count: { type: DataTypes.INTEGER, allowNull: false },
      point_count: { type: DataTypes.INTEGER, allowNull: false },
      uploaded_by_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
      created_at: { type: DataTypes.DATE, allowNull: false },
    });
    await q.addIndex('measurement_sets', ['vendor_part_id', 'created_at'], { name: 'measurement_sets_vendor_part' });
    // The same file twice for one part is the same evidence: refused, not stored again.
    await q.addIndex('measurement_sets', ['vendor_part_id', 'sha256'], { name: 'measurement_sets_part_sha256', unique: true });
  },
  async down({ queryInterface: q }) {
    await q.dropTable('measurement_sets');
  },
};
