import { QueryTypes } from 'sequelize';
import { rebuildUsableSources } from '../../source-standing/usable-sources.repository';
import type { Migration } from '../migration';

/**
 * The usable sources as a table the designers' search joins (see
 * source-standing/usable-sources.repository.ts): one row per source link whose cases make it usable by
 * the contracts' standing rule, kept in the same transaction as every case and link write.
 * The link's id is the key and goes with the link (ON DELETE CASCADE); the two pair indexes
 * answer "is this part usable (for this house part)" and "the usable parts of a house part".
 * Existing links are back-filled by the same function the repositories use.
 */
export const usableSources: Migration = {
  name: '2026-12-04-1100-usable-sources',
  async up({ sequelize }) {
    await sequelize.query(
      `CREATE TABLE usable_sources (
        source_id INT NOT NULL PRIMARY KEY,
        vendor_part_id INT NOT NULL,
        house_part_id INT NOT NULL,
        UNIQUE KEY usable_sources_vendor_house (vendor_part_id, house_part_id),
        UNIQUE KEY usable_sources_house_vendor (house_part_id, vendor_part_id),
        CONSTRAINT usable_sources_source FOREIGN KEY (source_id) REFERENCES house_part_sources (id) ON DELETE CASCADE
      ) ENGINE=InnoDB`,
      { type: QueryTypes.BULKUPDATE },
    );
    await rebuildUsableSources(sequelize);
  },
  async down({ sequelize }) {
    await sequelize.query('DROP TABLE usable_sources', { type: QueryTypes.BULKUPDATE });
  },
};
