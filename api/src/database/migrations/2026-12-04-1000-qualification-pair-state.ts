import { QueryTypes } from 'sequelize';
import type { Migration } from '../migration';

/**
 * Where a pair stands (its latest decided case) is read by every designers' search and the
 * Board: an index that holds the state beside (vendor part, house part, revision) answers
 * "the usable cases no later decision overrode" from the index alone, without reading the
 * cases' rows (evaluation JSON and all). The unique pair index stays as the constraint.
 */
export const qualificationPairState: Migration = {
  name: '2026-12-04-1000-qualification-pair-state',
  async up({ queryInterface: q }) {
    await q.addIndex('qualifications', ['vendor_part_id', 'house_part_id', 'revision', 'state'], { name: 'qualifications_pair_state' });
  },
  async down({ sequelize }) {
    await sequelize.query('ALTER TABLE qualifications DROP INDEX qualifications_pair_state', { type: QueryTypes.BULKUPDATE });
  },
};
