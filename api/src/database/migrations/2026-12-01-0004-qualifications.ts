import { DataTypes } from 'sequelize';
import type { Migration } from '../migration';

const STATES = ['draft', 'in-review', 'cleared', 'cleared-with-conditions', 'rejected', 'withdrawn', 'revoked'];
const VERDICTS = ['pass', 'marginal', 'fail', 'no-data'];
const userRef = (allowNull: boolean) => ({
  type: DataTypes.INTEGER,
  allowNull,
  references: { model: 'users', key: 'id' },
  onDelete: allowNull ? 'SET NULL' : 'RESTRICT',
});

/**
 * Qualification cases with their audit trail and comments, and the buyers linked to a
 * house part (who are mailed about its sources). A case never loses its history: house
 * parts, vendor parts and users it names cannot be deleted from under it.
 */
export const qualifications: Migration = {
  name: '2026-12-01-0004-qualifications',
  async up({ queryInterface: q }) {
    await q.createTable('qualifications', {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      house_part_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'house_parts', key: 'id' }, onDelete: 'RESTRICT' },
      vendor_part_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'vendor_parts', key: 'id' }, onDelete: 'RESTRICT' },
      revision: { type: DataTypes.INTEGER, allowNull: false },
      previous_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'qualifications', key: 'id' }, onDelete: 'RESTRICT' },
      state: { type: DataTypes.ENUM(...STATES), allowNull: false },
      overall: { type: DataTypes.ENUM(...VERDICTS), allowNull: false },
      spec_version: { type: DataTypes.INTEGER, allowNull: false },
      card_version: { type: DataTypes.INTEGER, allowNull: false },
      evaluation: { type: DataTypes.JSON, allowNull: false },
      summary: { type: DataTypes.TEXT, allowNull: false },
      prepared_by_id: userRef(false),
      reviewer_id: userRef(true),
      submitted_at: { type: DataTypes.DATE, allowNull: true },
      decision_state: { type: DataTypes.ENUM('cleared', 'cleared-with-conditions', 'rejected'), allowNull: true },
      decided_by_id: userRef(true),
      decided_at: { type: DataTypes.DATE, allowNull: true },
      decision_text: { type: DataTypes.TEXT, allowNull: true },
      revoked_by_id: userRef(true),
      revoked_at: { type: DataTypes.DATE, allowNull: true },
      revoke_reason: { type: DataTypes.TEXT, allowNull: true },
      needs_recheck: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      recheck_reasons: { type: DataTypes.JSON, allowNull: false },
      version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      created_at: { type: DataTypes.DATE, allowNull: false },
      updated_at: { type: DataTypes.DATE, allowNull: false },
    });
    // Revisions of one house part and vendor part are numbered once each; a case is revised at most once.
    await q.addIndex('qualifications', ['house_part_id', 'vendor_part_id', 'revision'], { unique: true, name: 'qualifications_pair_revision' });
    await q.addIndex('qualifications', ['previous_id'], { unique: true, name: 'qualifications_previous' });
    await q.addIndex('qualifications', ['vendor_part_id'], { name: 'qualifications_vendor_part' });
    await q.addIndex('qualifications', ['state', 'updated_at'], { name: 'qualifications_state_updated' });
    await q.addIndex('qualifications', ['updated_at'], { name: 'qualifications_updated' });
    await q.addIndex('qualifications', ['prepared_by_id'], { name: 'qualifications_prepared_by' });
    await q.addIndex('qualifications', ['decided_by_id'], { name: 'qualifications_decided_by' });

    await q.createTable('qualification_events', {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      qualification_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'qualifications', key: 'id' }, onDelete: 'CASCADE' },
      user_id: userRef(true),
      action: { type: DataTypes.STRING(40), allowNull: false },
      from_state: { type: DataTypes.STRING(30), allowNull: true },
      to_state: { type: DataTypes.STRING(30), allowNull: true },
      changes: { type: DataTypes.JSON, allowNull: false },
      note: { type: DataTypes.TEXT, allowNull: true },
      created_at: { type: DataTypes.DATE, allowNull: false },
    });
    await q.addIndex('qualification_events', ['qualification_id', 'id'], { name: 'qualification_events_case' });

    await q.createTable('qualification_comments', {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      qualification_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'qualifications', key: 'id' }, onDelete: 'CASCADE' },
      user_id: userRef(false),
      text: { type: DataTypes.TEXT, allowNull: false },
      created_at: { type: DataTypes.DATE, allowNull: false },
    });
    await q.addIndex('qualification_comments', ['qualification_id', 'id'], { name: 'qualification_comments_case' });

    await q.createTable('house_part_buyers', {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      house_part_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'house_parts', key: 'id' }, onDelete: 'CASCADE' },
      user_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
      added_by_id: userRef(true),
      created_at: { type: DataTypes.DATE, allowNull: false },
    });
    await q.addIndex('house_part_buyers', ['house_part_id', 'user_id'], { unique: true, name: 'house_part_buyers_pair' });
    await q.addIndex('house_part_buyers', ['user_id'], { name: 'house_part_buyers_user' });
  },
  async down({ queryInterface: q }) {
    await q.dropTable('house_part_buyers');
    await q.dropTable('qualification_comments');
    await q.dropTable('qualification_events');
    await q.dropTable('qualifications');
  },
};
