import type { RatingCardFields } from '@shuntwise/contracts';
import { BelongsTo, Column, DataType, ForeignKey, Model, Table } from 'sequelize-typescript';
import { User } from '../users/user.model';
import { VendorPart } from './vendor-part.model';

/** Every version a card ever had, written in the same transaction as the card; never changed. */
@Table({ tableName: 'rating_card_versions', underscored: true, updatedAt: false })
export class RatingCardVersion extends Model {
  @ForeignKey(() => VendorPart)
  @Column({ type: DataType.INTEGER, allowNull: false })
  declare vendorPartId: number;

  @Column({ type: DataType.INTEGER, allowNull: false })
  declare version: number;

  @Column({ type: DataType.JSON, allowNull: false })
  declare fields: RatingCardFields;

  @Column({ type: DataType.JSON, allowNull: false })
  declare changedFields: string[];

  @Column({ type: DataType.STRING(500), allowNull: true })
  declare note: string | null;

  @ForeignKey(() => User)
  @Column({ type: DataType.INTEGER, allowNull: true })
  declare changedById: number | null;

  @BelongsTo(() => User, 'changedById')
  declare changedBy?: User;

  declare createdAt: Date;
}
