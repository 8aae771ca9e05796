import { BelongsTo, Column, DataType, ForeignKey, Model, Table } from 'sequelize-typescript';
import { User } from '../users/user.model';
import { Manufacturer } from './manufacturer.model';

@Table({ tableName: 'vendor_parts', underscored: true })
export class VendorPart extends Model {
  @ForeignKey(() => Manufacturer)
  @Column({ type: DataType.INTEGER, allowNull: false })
  declare manufacturerId: number;

  @BelongsTo(() => Manufacturer, 'manufacturerId')
  declare manufacturer?: Manufacturer;

  /** A copy of the manufacturer's name, so lists sort by it on an index (set with manufacturerId). */
  @Column({ type: DataType.STRING(120), allowNull: false, defaultValue: '' })
  declare manufacturerName: string;

  @Column({ type: DataType.STRING(80), allowNull: false })
  declare mpn: string;

  @Column({ type: DataType.STRING(40), allowNull: true })
  declare package: string | null;

  @Column({ type: DataType.STRING(500), allowNull: true })
  declare lifecycleNote: string | null;

  @ForeignKey(() => User)
  @Column({ type: DataType.INTEGER, allowNull: true })
  declare createdById: number | null;

  @BelongsTo(() => User, 'createdById')
  declare createdBy?: User;

  /** The card's list figures (SI), written with each card version; null without a card. */
  @Column({ type: DataType.INTEGER, allowNull: true })
  declare cardVersion: number | null;

  @Column({ type: DataType.DOUBLE, allowNull: true })
  declare vzNom: number | null;

  @Column({ type: DataType.DOUBLE, allowNull: true })
  declare izt: number | null;

  @Column({ type: DataType.DOUBLE, allowNull: true })
  declare pdMax: number | null;

  declare createdAt: Date;
  declare updatedAt: Date;
}
