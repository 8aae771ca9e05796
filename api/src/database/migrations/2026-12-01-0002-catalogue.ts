import { DataTypes } from 'sequelize';
import type { Migration } from '../migration';

const timestamps = {
  created_at: { type: DataTypes.DATE, allowNull: false },
  updated_at: { type: DataTypes.DATE, allowNull: false },
};
const userRef = (allowNull = true) => ({
  type: DataTypes.INTEGER,
  allowNull,
  references: { model: 'users', key: 'id' },
  onDelete: 'SET NULL',
});

/**
 * The catalogue: house parts with versioned specs, manufacturers and vendor parts, rating
 * cards with every version kept, datasheets with their extraction, and the links between.
 * Indexes follow the list filters and sorts, so lists stay fast at 100 000 vendor parts.
 */
export const catalogue: Migration = {
  name: '2026-12-01-0002-catalogue',
  async up({ queryInterface: q }) {
    await q.createTable('house_parts', {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      part_number: { type: DataTypes.STRING(64), allowNull: false, unique: true },
      description: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
      status: { type: DataTypes.ENUM('draft', 'active', 'not-for-new-designs', 'end-of-life'), allowNull: false, defaultValue: 'draft' },
      spec_version: { type: DataTypes.INTEGER, allowNull: true },
      created_by_id: userRef(),
      ...timestamps,
    });
    await q.addIndex('house_parts', ['status', 'part_number']);
    await q.addIndex('house_parts', ['updated_at']);

    await q.createTable('house_part_specs', {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      house_part_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'house_parts', key: 'id' }, onDelete: 'CASCADE' },
      version: { type: DataTypes.INTEGER, allowNull: false },
      spec: { type: DataTypes.JSON, allowNull: false },
      note: { type: DataTypes.STRING(500), allowNull: true },
      created_by_id: userRef(),
      created_at: { type: DataTypes.DATE, allowNull: false },
    });
    await q.addIndex('house_part_specs', ['house_part_id', 'version'], { unique: true });

    await q.createTable('manufacturers', {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      name: { type: DataTypes.STRING(120), allowNull: false, unique: true },
      ...timestamps,
    });

    await q.createTable('vendor_parts', {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      manufacturer_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'manufacturers', key: 'id' }, onDelete: 'RESTRICT' },
      mpn: { type: DataTypes.STRING(80), allowNull: false },
      package: { type: DataTypes.STRING(40), allowNull: true },
      lifecycle_note: { type: DataTypes.STRING(500), allowNull: true },
      created_by_id: userRef(),
      ...timestamps,
    });
    await q.addIndex('vendor_parts', ['manufacturer_id', 'mpn'], { unique: true, name: 'vendor_parts_manufacturer_mpn' });
    await q.addIndex('vendor_parts', ['mpn']);
    await q.addIndex('vendor_parts', ['package', 'mpn']);
    await q.addIndex('vendor_parts', ['updated_at']);
    await q.addIndex('vendor_parts', ['created_at']);

    // One card per vendor part; the figures lists sort and filter by are columns of their own.
    await q.createTable('rating_cards', {
      vendor_part_id: { type: DataTypes.INTEGER, primaryKey: true, references: { model: 'vendor_parts', key: 'id' }, onDelete: 'CASCADE' },
      version: { type: DataTypes.INTEGER, allowNull: false },
      fields: { type: DataTypes.JSON, allowNull: false },
      note: { type: DataTypes.STRING(500), allowNull: true },
      vz_nom: { type: DataTypes.DOUBLE, allowNull: false },
      izt: { type: DataTypes.DOUBLE, allowNull: false },
      pd_max: { type: DataTypes.DOUBLE, allowNull: true },
      updated_by_id: userRef(),
      ...timestamps,
    });
    await q.addIndex('rating_cards', ['vz_nom']);
    await q.addIndex('rating_cards', ['izt']);
    await q.addIndex('rating_cards', ['pd_max']);

    await q.createTable('rating_card_versions', {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      vendor_part_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'vendor_parts', key: 'id' }, onDelete: 'CASCADE' },
      version: { type: DataTypes.INTEGER, allowNull: false },
      fields: { type: DataTypes.JSON, allowNull: false },
      changed_fields: { type: DataTypes.JSON, allowNull: false },
      note: { type: DataTypes.STRING(500), allowNull: true },
      changed_by_id: userRef(),
      created_at: { type: DataTypes.DATE, allowNull: false },
    });
    await q.addIndex('rating_card_versions', ['vendor_part_id', 'version'], { unique: true });

    await q.createTable('house_part_sources', {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      house_part_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'house_parts', key: 'id' }, onDelete: 'CASCADE' },
      vendor_part_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'vendor_parts', key: 'id' }, onDelete: 'RESTRICT' },
      role: { type: DataTypes.ENUM('approved', 'alternate'), allowNull: false },
      note: { type: DataTypes.STRING(500), allowNull: true },
      added_by_id: userRef(),
      ...timestamps,
    });
    await q.addIndex('house_part_sources', ['house_part_id', 'vendor_part_id'], { unique: true });
    await q.addIndex('house_part_sources', ['vendor_part_id']);

    // Objects are never overwritten: a new revision is a new row and a new key.
    await q.createTable('datasheets', {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      storage_key: { type: DataTypes.STRING(200), allowNull: false, unique: true },
      sha256: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
      file_name: { type: DataTypes.STRING(255), allowNull: false },
      size_bytes: { type: DataTypes.INTEGER, allowNull: false },
      pages: { type: DataTypes.INTEGER, allowNull: false },
      revision: { type: DataTypes.STRING(40), allowNull: true },
      uploaded_by_id: userRef(),
      created_at: { type: DataTypes.DATE, allowNull: false },
    });

    await q.createTable('datasheet_extractions', {
      datasheet_id: { type: DataTypes.INTEGER, primaryKey: true, references: { model: 'datasheets', key: 'id' }, onDelete: 'CASCADE' },
      result: { type: DataTypes.JSON, allowNull: false },
      variant_count: { type: DataTypes.INTEGER, allowNull: false },
      warning_count: { type: DataTypes.INTEGER, allowNull: false },
      created_at: { type: DataTypes.DATE, allowNull: false },
    });

    await q.createTable('vendor_part_datasheets', {
      vendor_part_id: { type: DataTypes.INTEGER, primaryKey: true, references: { model: 'vendor_parts', key: 'id' }, onDelete: 'CASCADE' },
      datasheet_id: { type: DataTypes.INTEGER, primaryKey: true, references: { model: 'datasheets', key: 'id' }, onDelete: 'RESTRICT' },
      created_at: { type: DataTypes.DATE, allowNull: false },
    });
    await q.addIndex('vendor_part_datasheets', ['datasheet_id']);
  },
  async down({ queryInterface: q }) {
    for (const table of [
      'vendor_part_datasheets',
      'datasheet_extractions',
      'datasheets',
      'house_part_sources',
      'rating_card_versions',
      'rating_cards',
      'vendor_parts',
      'manufacturers',
      'house_part_specs',
      'house_parts',
    ]) {
      await q.dropTable(table);
    }
  },
};
