import { ROLES, type Role } from '@shuntwise/contracts';
import { Column, DataType, Model, Table } from 'sequelize-typescript';

@Table({ tableName: 'users', underscored: true })
export class User extends Model {
  @Column({ type: DataType.STRING(254), allowNull: false, unique: true })
  declare email: string;

  @Column({ type: DataType.STRING(120), allowNull: false })
  declare name: string;

  /** argon2id hash; null until an invited person sets a password. */
  @Column({ type: DataType.STRING(255), allowNull: true })
  declare passwordHash: string | null;

  @Column({ type: DataType.ENUM(...ROLES), allowNull: false })
  declare role: Role;

  @Column({ type: DataType.BOOLEAN, allowNull: false, defaultValue: true })
  declare active: boolean;

  /** Raised on logout, deactivation and role change: tokens carrying an older value are refused. */
  @Column({ type: DataType.INTEGER, allowNull: false, defaultValue: 0 })
  declare tokenVersion: number;

  @Column({ type: DataType.DATE, allowNull: true })
  declare lastLoginAt: Date | null;

  declare createdAt: Date;
  declare updatedAt: Date;
}
