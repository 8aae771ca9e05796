import { DataTypes } from 'sequelize';
import type { Migration } from '../migration';

/**
 * Which parts of the local demo have been loaded. The demo is loaded once: a restart must not
 * put back demo rows that people have since changed or removed (a buyer who stopped following
 * a house part, a deleted demo datasheet).
 */
export const demoSeedSteps: Migration = {
  name: '2026-12-04-0300-demo-seed-steps',
  async up({ queryInterface: q }) {
    await q.createTable('demo_seed_steps', {
      name: { type: DataTypes.STRING(40), primaryKey: true },
      records: { type: DataTypes.INTEGER, allowNull: false },
      done_at: { type: DataTypes.DATE, allowNull: false },
    });
  },
  async down({ queryInterface: q }) {
    await q.dropTable('demo_seed_steps');
  },
};
