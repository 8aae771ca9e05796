import { QueryTypes } from 'sequelize';
import { indexRowsOf } from '../../text-index/text-grams';
import type { Migration } from '../migration';

/**
 * The n-gram index for substring and typo-tolerant text search: one row per distinct
 * three-character piece of a record's names (vendor part numbers, house part numbers and
 * descriptions, manufacturer names), written in the same transaction as the record. An
 * InnoDB table, so it rolls back with the write and replicates with Galera. The primary
 * key answers "which records contain this piece" as one index range; the second index
 * serves the rewrite of one record's pieces. Rows that exist already are indexed here with
 * the same function the repositories use.
 */
export const textGrams: Migration = {
  name: '2026-12-04-0400-text-grams',
  async up({ sequelize }) {
    await sequelize.query(
      `CREATE TABLE text_grams (
        kind TINYINT UNSIGNED NOT NULL,
        gram VARCHAR(3) CHARACTER SET utf8mb4 COLLATE utf8mb4_bin NOT NULL,
        entity_id INT NOT NULL,
        PRIMARY KEY (kind, gram, entity_id),
        KEY text_grams_entity (kind, entity_id)
      ) ENGINE=InnoDB`,
      { type: QueryTypes.BULKUPDATE },
    );
    const insert = async (rows: unknown[][]) => {
      for (let i = 0; i < rows.length; i += 2000) {
        const chunk = rows.slice(i, i + 2000);
        await sequelize.query(`INSERT IGNORE INTO text_grams (kind, gram, entity_id) VALUES ${chunk.map(() => '(?, ?, ?)').join(', ')}`, {
          replacements: chunk.flat(),
          type: QueryTypes.INSERT,
        });
      }
    };
    const parts = await sequelize.query<{ id: number; mpn: string }>('SELECT id, mpn FROM vendor_parts', { type: QueryTypes.SELECT });
    await insert(parts.flatMap((p) => indexRowsOf('vendorPart', p.id, [p.mpn])));
    const houseParts = await sequelize.query<{ id: number; partNumber: string; description: string }>(
      'SELECT id, part_number AS partNumber, description FROM house_parts',
      { type: QueryTypes.SELECT },
    );
    await insert(houseParts.flatMap((h) => indexRowsOf('housePart', h.id, [h.partNumber, h.description])));
    const makers = await sequelize.query<{ id: number; name: string }>('SELECT id, name FROM manufacturers', { type: QueryTypes.SELECT });
    await insert(makers.flatMap((m) => indexRowsOf('manufacturer', m.id, [m.name])));
  },
  async down({ sequelize }) {
    await sequelize.query('DROP TABLE text_grams', { type: QueryTypes.BULKUPDATE });
  },
};
