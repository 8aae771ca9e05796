import { QUALIFICATION_REQUEST_STATES, type QualificationRequestState } from '@shuntwise/contracts';
import { BelongsTo, Column, DataType, ForeignKey, Model, Table } from 'sequelize-typescript';
import { HousePart } from '../house-parts/house-part.model';
import { Qualification } from '../qualifications/qualification.model';
import { User } from '../users/user.model';
import { VendorPart } from '../vendor-parts/vendor-part.model';

/**
 * A request for a vendor part to be qualified, optionally for a named house part. Open
 * until an engineer takes it up with a case (then it points at the case) or declines it.
 * `version` is Sequelize's optimistic lock.
 */
@Table({ tableName: 'qualification_requests', underscored: true, version: true })
export class QualificationRequest extends Model {
  @ForeignKey(() => VendorPart)
  @Column({ type: DataType.INTEGER, allowNull: false })
  declare vendorPartId: number;

  @ForeignKey(() => HousePart)
  @Column({ type: DataType.INTEGER, allowNull: true })
  declare housePartId: number | null;

  @ForeignKey(() => User)
  @Column({ type: DataType.INTEGER, allowNull: false })
  declare requestedById: number;

  @BelongsTo(() => User, 'requestedById')
  declare requestedBy?: User;

  @Column({ type: DataType.TEXT, allowNull: false })
  declare note: string;

  @Column({ type: DataType.DATEONLY, allowNull: true })
  declare neededBy: string | null;

  @Column({ type: DataType.ENUM(...QUALIFICATION_REQUEST_STATES), allowNull: false })
  declare state: QualificationRequestState;

  @ForeignKey(() => Qualification)
  @Column({ type: DataType.INTEGER, allowNull: true })
  declare qualificationId: number | null;

  @ForeignKey(() => User)
  @Column({ type: DataType.INTEGER, allowNull: true })
  declare closedById: number | null;

  @Column({ type: DataType.DATE, allowNull: true })
  declare closedAt: Date | null;

  @Column({ type: DataType.TEXT, allowNull: true })
  declare reply: string | null;

  declare version: number;
  declare createdAt: Date;
  declare updatedAt: Date;
}
