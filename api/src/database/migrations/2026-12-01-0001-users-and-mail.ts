import { DataTypes } from 'sequelize';
import type { Migration } from '../migration';

const ROLES = ['admin', 'engineer', 'designer', 'buyer'];
const timestamps = {
  created_at: { type: DataTypes.DATE, allowNull: false },
  updated_at: { type: DataTypes.DATE, allowNull: false },
};

export const usersAndMail: Migration = {
  name: '2026-12-01-0001-users-and-mail',
  async up({ queryInterface: q }) {
    await q.createTable('users', {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
      name: { type: DataTypes.STRING(120), allowNull: false },
      password_hash: { type: DataTypes.STRING(255), allowNull: true },
      role: { type: DataTypes.ENUM(...ROLES), allowNull: false },
      active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
      token_version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      last_login_at: { type: DataTypes.DATE, allowNull: true },
      ...timestamps,
    });
    await q.createTable('invitations', {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      email: { type: DataTypes.STRING(254), allowNull: false },
      name: { type: DataTypes.STRING(120), allowNull: false },
      role: { type: DataTypes.ENUM(...ROLES), allowNull: false },
      token_hash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
      invited_by_id: {
        type: DataTypes.INTEGER,
        allowNull: true,
        references: { model: 'users', key: 'id' },
        onDelete: 'SET NULL',
      },
      expires_at: { type: DataTypes.DATE, allowNull: false },
      accepted_at: { type: DataTypes.DATE, allowNull: true },
      ...timestamps,
    });
    await q.addIndex('invitations', ['email']);
    await q.createTable('outgoing_mail', {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      recipients: { type: DataTypes.JSON, allowNull: false },
      subject: { type: DataTypes.STRING(250), allowNull: false },
      body: { type: DataTypes.TEXT, allowNull: false },
      kind: { type: DataTypes.STRING(60), allowNull: false },
      state: { type: DataTypes.ENUM('pending', 'sent', 'failed'), allowNull: false, defaultValue: 'pending' },
      attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      last_error: { type: DataTypes.STRING(500), allowNull: true },
      next_attempt_at: { type: DataTypes.DATE, allowNull: false },
      sent_at: { type: DataTypes.DATE, allowNull: true },
      ...timestamps,
    });
    await q.addIndex('outgoing_mail', ['state', 'next_attempt_at']);
    await q.createTable('captured_mail', {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      sender: { type: DataTypes.STRING(254), allowNull: false },
      recipients: { type: DataTypes.JSON, allowNull: false },
      subject: { type: DataTypes.STRING(250), allowNull: false },
      body: { type: DataTypes.TEXT('medium'), allowNull: false },
      created_at: { type: DataTypes.DATE, allowNull: false },
    });
  },
  async down({ queryInterface: q }) {
    await q.dropTable('captured_mail');
    await q.dropTable('outgoing_mail');
    await q.dropTable('invitations');
    await q.dropTable('users');
  },
};
