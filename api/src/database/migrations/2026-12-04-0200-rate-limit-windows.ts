import { DataTypes } from 'sequelize';
import type { Migration } from '../migration';

/**
 * Request counters for rate limits (sign-in per address and per account, uploads per user),
 * kept in the database so every API replica behind a load balancer counts the same hits.
 * One row per bucket: its window opens at the first hit and lasts the limit's window; `bucket` is a SHA-256 of the limit's name and its
 * key, so no e-mail address or client address is stored in clear.
 */
export const rateLimitWindows: Migration = {
  name: '2026-12-04-0200-rate-limit-windows',
  async up({ queryInterface: q }) {
    await q.createTable('rate_limit_windows', {
      bucket: { type: DataTypes.CHAR(64), allowNull: false, primaryKey: true },
      window_start: { type: DataTypes.DATE(3), allowNull: false },
      hits: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      expires_at: { type: DataTypes.DATE(3), allowNull: false },
    });
    await q.addIndex('rate_limit_windows', ['expires_at'], { name: 'rate_limit_windows_expires' });
  },
  async down({ queryInterface: q }) {
    await q.dropTable('rate_limit_windows');
  },
};
