import type { RatingCardFields } from '@shuntwise/contracts';
import { BelongsTo, Column, DataType, ForeignKey, Model, PrimaryKey, Table } from 'sequelize-typescript';
import { User } from '../users/user.model';
import { VendorPart } from './vendor-part.model';

/**
 * The current card of a vendor part. `fields` holds every value with its provenance;
 * vzNom, izt and pdMax are copied into columns of their own so lists sort and filter in SQL.
 */
@Table({ tableName: 'rating_cards', underscored: true })
export class RatingCard extends Model {
  @PrimaryKey
  @ForeignKey(() => VendorPart)
  @Column({ type: DataType.INTEGER })
  declare vendorPartId: number;

  @Column({ type: DataType.INTEGER, allowNull: false })
  declare version: number;

  @Column({ type: DataType.JSON, allowNull: false })
  declare fields: RatingCardFields;

  @Column({ type: DataType.STRING(500), allowNull: true })
  declare note: string | null;

  @Column({ type: DataType.DOUBLE, allowNull: false })
  declare vzNom: number;

  @Column({ type: DataType.DOUBLE, allowNull: false })
  declare izt: number;

  @Column({ type: DataType.DOUBLE, allowNull: true })
  declare pdMax: number | null;

  @ForeignKey(() => User)
  @Column({ type: DataType.INTEGER, allowNull: true })
  declare updatedById: number | null;

  @BelongsTo(() => User, 'updatedById')
  declare updatedBy?: User;

  declare createdAt: Date;
  declare updatedAt: Date;
}
