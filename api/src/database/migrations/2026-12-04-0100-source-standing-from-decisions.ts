import { DataTypes, QueryTypes } from 'sequelize';
import type { Migration } from '../migration';

const enumOf = (values: string[]) => `ENUM(${values.map((v) => `'${v}'`).join(', ')})`;
const STATES_BEFORE = ['draft', 'in-review', 'cleared', 'cleared-with-conditions', 'rejected', 'withdrawn', 'revoked'];
const STATES_AFTER = ['draft', 'in-review', 'approved', 'cleared', 'cleared-with-conditions', 'rejected', 'withdrawn', 'revoked'];
const DECISIONS_BEFORE = ['cleared', 'cleared-with-conditions', 'rejected'];
const DECISIONS_AFTER = ['approved', 'cleared', 'cleared-with-conditions', 'rejected'];

/** Put in front of the note of a link that was marked approved by hand, so nothing is lost and `down` can restore it. */
export const LEGACY_APPROVED_MARK = '[was marked approved without a decision; qualify it to approve it] ';

/**
 * A source's standing comes only from decisions. The `role` column of a source link is
 * dropped (a link only makes a candidate); a case gains the decided state `approved`,
 * which a second engineer gives to make the part the house part's approved source.
 * Links that were marked approved by hand keep that fact in their note, and show as
 * alternates until a decision approves them (the demo seed does so through the workflow).
 */
export const sourceStandingFromDecisions: Migration = {
  name: '2026-12-04-0100-source-standing-from-decisions',
  async up({ sequelize }) {
    await sequelize.query(`ALTER TABLE qualifications MODIFY state ${enumOf(STATES_AFTER)} NOT NULL, MODIFY decision_state ${enumOf(DECISIONS_AFTER)} NULL`, {
      type: QueryTypes.BULKUPDATE,
    });
    await sequelize.query(`UPDATE house_part_sources SET note = LEFT(CONCAT(?, COALESCE(note, '')), 500) WHERE role = 'approved'`, {
      replacements: [LEGACY_APPROVED_MARK],
      type: QueryTypes.UPDATE,
    });
    // A raw ALTER with a type: the untyped path of removeColumn trips on the mariadb driver's result.
    await sequelize.query('ALTER TABLE house_part_sources DROP COLUMN role', { type: QueryTypes.BULKUPDATE });
  },
  async down({ queryInterface: q, sequelize }) {
    await q.addColumn('house_part_sources', 'role', { type: DataTypes.ENUM('approved', 'alternate'), allowNull: false, defaultValue: 'alternate' });
    // Approved by a decision, or marked by hand before: the role as it was kept.
    await sequelize.query(
      `UPDATE house_part_sources s SET s.role = 'approved' WHERE EXISTS (
         SELECT 1 FROM qualifications d WHERE d.house_part_id = s.house_part_id AND d.vendor_part_id = s.vendor_part_id AND d.state = 'approved')`,
      { type: QueryTypes.UPDATE },
    );
    await sequelize.query(`UPDATE house_part_sources SET role = 'approved', note = NULLIF(SUBSTRING(note, ?), '') WHERE note LIKE CONCAT(?, '%')`, {
      replacements: [LEGACY_APPROVED_MARK.length + 1, LEGACY_APPROVED_MARK.replace(/[\\%_]/g, '\\$&')],
      type: QueryTypes.UPDATE,
    });
    // The older schema knows no approval decision: those cases read as cleared there.
    await sequelize.query(`UPDATE qualifications SET state = 'cleared' WHERE state = 'approved'`, { type: QueryTypes.UPDATE });
    await sequelize.query(`UPDATE qualifications SET decision_state = 'cleared' WHERE decision_state = 'approved'`, { type: QueryTypes.UPDATE });
    await sequelize.query(`ALTER TABLE qualifications MODIFY state ${enumOf(STATES_BEFORE)} NOT NULL, MODIFY decision_state ${enumOf(DECISIONS_BEFORE)} NULL`, {
      type: QueryTypes.BULKUPDATE,
    });
  },
};
