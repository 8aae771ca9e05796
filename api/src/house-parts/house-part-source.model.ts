import { BelongsTo, Column, DataType, ForeignKey, Model, Table } from 'sequelize-typescript';
import { User } from '../users/user.model';
import { VendorPart } from '../vendor-parts/vendor-part.model';
import { HousePart } from './house-part.model';

/**
 * A vendor part linked to a house part as a source: a candidate until decisions on its
 * qualification cases give it a standing (the role lists show is derived, never stored).
 */
@Table({ tableName: 'house_part_sources', underscored: true })
export class HousePartSource extends Model {
  @ForeignKey(() => HousePart)
  @Column({ type: DataType.INTEGER, allowNull: false })
  declare housePartId: number;

  @BelongsTo(() => HousePart, 'housePartId')
  declare housePart?: HousePart;

  @ForeignKey(() => VendorPart)
  @Column({ type: DataType.INTEGER, allowNull: false })
  declare vendorPartId: number;

  @BelongsTo(() => VendorPart, 'vendorPartId')
  declare vendorPart?: VendorPart;

  @Column({ type: DataType.STRING(500), allowNull: true })
  declare note: string | null;

  @ForeignKey(() => User)
  @Column({ type: DataType.INTEGER, allowNull: true })
  declare addedById: number | null;

  @BelongsTo(() => User, 'addedById')
  declare addedBy?: User;

  declare createdAt: Date;
  declare updatedAt: Date;
}
