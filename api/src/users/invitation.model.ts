import { ROLES, type Role } from '@shuntwise/contracts';
import { BelongsTo, Column, DataType, ForeignKey, Model, Table } from 'sequelize-typescript';
import { User } from './user.model';

@Table({ tableName: 'invitations', underscored: true })
export class Invitation extends Model {
  @Column({ type: DataType.STRING(254), allowNull: false })
  declare email: string;

  @Column({ type: DataType.STRING(120), allowNull: false })
  declare name: string;

  @Column({ type: DataType.ENUM(...ROLES), allowNull: false })
  declare role: Role;

  /** sha256 of the token sent by mail; the token itself is never stored. */
  @Column({ type: DataType.CHAR(64), allowNull: false, unique: true })
  declare tokenHash: string;

  @ForeignKey(() => User)
  @Column({ type: DataType.INTEGER, allowNull: true })
  declare invitedById: number | null;

  @BelongsTo(() => User, 'invitedById')
  declare invitedBy?: User;

  @Column({ type: DataType.DATE, allowNull: false })
  declare expiresAt: Date;

  @Column({ type: DataType.DATE, allowNull: true })
  declare acceptedAt: Date | null;

  /** Taken back by an admin: the link no longer works. */
  @Column({ type: DataType.DATE, allowNull: true })
  declare revokedAt: Date | null;

  declare createdAt: Date;
  declare updatedAt: Date;
}
