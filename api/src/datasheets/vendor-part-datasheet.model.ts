import { BelongsTo, Column, DataType, ForeignKey, Model, PrimaryKey, Table } from 'sequelize-typescript';
import { VendorPart } from '../vendor-parts/vendor-part.model';
import { Datasheet } from './datasheet.model';

/** Which datasheets describe which vendor parts (a series datasheet describes many). */
@Table({ tableName: 'vendor_part_datasheets', underscored: true, updatedAt: false })
export class VendorPartDatasheet extends Model {
  @PrimaryKey
  @ForeignKey(() => VendorPart)
  @Column({ type: DataType.INTEGER })
  declare vendorPartId: number;

  @PrimaryKey
  @ForeignKey(() => Datasheet)
  @Column({ type: DataType.INTEGER })
  declare datasheetId: number;

  @BelongsTo(() => Datasheet, 'datasheetId')
  declare datasheet?: Datasheet;

  declare createdAt: Date;
}
