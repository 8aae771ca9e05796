import { DataTypes, QueryTypes } from 'sequelize';
import type { Migration } from '../migration';

/**
 * The extractor version each stored reading was made with (`EXTRACTOR_VERSION`): a file
 * uploaded again is read again when its reading is older. Readings stored before this have
 * none, and count as older.
 */
export const extractionReaderVersion: Migration = {
  name: '2026-12-05-2030-extraction-reader-version',
  async up({ queryInterface: q }) {
    await q.addColumn('datasheet_extractions', 'reader_version', { type: DataTypes.STRING(32), allowNull: true });
  },
  async down({ sequelize }) {
    // Raw: the query interface's removeColumn trips over the mariadb driver's result shape.
    await sequelize.query('ALTER TABLE datasheet_extractions DROP COLUMN reader_version', { type: QueryTypes.BULKUPDATE });
  },
};
