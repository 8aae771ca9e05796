import { BelongsTo, Column, DataType, ForeignKey, Model, Table } from 'sequelize-typescript';
import { HousePart } from '../house-parts/house-part.model';
import { User } from '../users/user.model';

/** A buyer linked to a house part: mailed when one of its sources is cleared, cleared with conditions or revoked. */
@Table({ tableName: 'house_part_buyers', underscored: true, updatedAt: false })
export class HousePartBuyer extends Model {
  @ForeignKey(() => HousePart)
  @Column({ type: DataType.INTEGER, allowNull: false })
  declare housePartId: number;

  @ForeignKey(() => User)
  @Column({ type: DataType.INTEGER, allowNull: false })
  declare userId: number;

  @BelongsTo(() => User, 'userId')
  declare user?: User;

  @ForeignKey(() => User)
  @Column({ type: DataType.INTEGER, allowNull: true })
  declare addedById: number | null;

  @BelongsTo(() => User, 'addedById')
  declare addedBy?: User | null;

  declare createdAt: Date;
}
