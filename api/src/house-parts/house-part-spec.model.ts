import type { Spec } from '@shuntwise/contracts';
import { BelongsTo, Column, DataType, ForeignKey, Model, Table } from 'sequelize-typescript';
import { User } from '../users/user.model';
import { HousePart } from './house-part.model';

/** One version of a house part's spec; a new spec is a new row, old ones stay readable. */
@Table({ tableName: 'house_part_specs', underscored: true, updatedAt: false })
export class HousePartSpec extends Model {
  @ForeignKey(() => HousePart)
  @Column({ type: DataType.INTEGER, allowNull: false })
  declare housePartId: number;

  @Column({ type: DataType.INTEGER, allowNull: false })
  declare version: number;

  @Column({ type: DataType.JSON, allowNull: false })
  declare spec: Spec;

  @Column({ type: DataType.STRING(500), allowNull: true })
  declare note: string | null;

  @ForeignKey(() => User)
  @Column({ type: DataType.INTEGER, allowNull: true })
  declare createdById: number | null;

  @BelongsTo(() => User, 'createdById')
  declare createdBy?: User;

  declare createdAt: Date;
}
