import type { RatingCardFields } from '@shuntwise/contracts';
import { BelongsTo, Column, DataType, ForeignKey, Model, PrimaryKey, Table } from 'sequelize-typescript';
import { User } from '../users/user.model';
import { VendorPart } from './vendor-part.model';

/**
 * The current card of a vendor part: `fields` holds every value with its provenance. The
 * list figures (vzNom, izt, pdMax) are copied onto the vendor part, where lists sort by them.
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

  @ForeignKey(() => User)
  @Column({ type: DataType.INTEGER, allowNull: true })
  declare updatedById: number | null;

  @BelongsTo(() => User, 'updatedById')
  declare updatedBy?: User;

  declare createdAt: Date;
  declare updatedAt: Date;
}
