import type { HousePartStatus } from '@shuntwise/contracts';
import { HOUSE_PART_STATUSES } from '@shuntwise/contracts';
import { BelongsTo, Column, DataType, ForeignKey, Model, Table } from 'sequelize-typescript';
import { User } from '../users/user.model';

@Table({ tableName: 'house_parts', underscored: true })
export class HousePart extends Model {
  @Column({ type: DataType.STRING(64), allowNull: false, unique: true })
  declare partNumber: string;

  @Column({ type: DataType.STRING(500), allowNull: false, defaultValue: '' })
  declare description: string;

  @Column({ type: DataType.ENUM(...HOUSE_PART_STATUSES), allowNull: false, defaultValue: 'draft' })
  declare status: HousePartStatus;

  /** The current spec version (the highest), null before the first spec. */
  @Column({ type: DataType.INTEGER, allowNull: true })
  declare specVersion: number | null;

  @ForeignKey(() => User)
  @Column({ type: DataType.INTEGER, allowNull: true })
  declare createdById: number | null;

  @BelongsTo(() => User, 'createdById')
  declare createdBy?: User;

  declare createdAt: Date;
  declare updatedAt: Date;
}
