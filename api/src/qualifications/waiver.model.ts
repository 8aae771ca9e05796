import type { CheckId, CheckQuantity, LimitKind, WaiverState } from '@shuntwise/contracts';
import { Column, DataType, Model, Table } from 'sequelize-typescript';

/** One waiver of one check of one case (house part, vendor part); the rule is in contracts' source-standing.ts. */
@Table({ tableName: 'qualification_waivers', underscored: true })
export class QualificationWaiver extends Model {
  @Column({ type: DataType.INTEGER, allowNull: false })
  declare qualificationId: number;

  @Column({ type: DataType.INTEGER, allowNull: false })
  declare housePartId: number;

  @Column({ type: DataType.INTEGER, allowNull: false })
  declare vendorPartId: number;

  @Column({ type: DataType.STRING(40), allowNull: false })
  declare checkId: CheckId;

  @Column({ type: DataType.STRING(30), allowNull: false })
  declare quantity: CheckQuantity;

  @Column({ type: DataType.STRING(10), allowNull: false })
  declare limitKind: LimitKind;

  @Column({ type: DataType.DOUBLE, allowNull: true })
  declare specLimit: number | null;

  @Column({ type: DataType.DOUBLE, allowNull: true })
  declare acceptedLimit: number | null;

  @Column({ type: DataType.DOUBLE, allowNull: true })
  declare value: number | null;

  @Column({ type: DataType.TEXT, allowNull: false })
  declare reason: string;

  /** Last day the waiver holds (YYYY-MM-DD). */
  @Column({ type: DataType.DATEONLY, allowNull: false })
  declare expiresOn: string;

  @Column({ type: DataType.ENUM('proposed', 'approved', 'refused', 'lapsed'), allowNull: false })
  declare state: WaiverState;

  @Column({ type: DataType.INTEGER, allowNull: false })
  declare preparedById: number;

  @Column({ type: DataType.INTEGER, allowNull: true })
  declare decidedById: number | null;

  @Column({ type: DataType.DATE, allowNull: true })
  declare decidedAt: Date | null;

  @Column({ type: DataType.TEXT, allowNull: true })
  declare decisionNote: string | null;

  @Column({ type: DataType.DATE, allowNull: true })
  declare lapsedAt: Date | null;

  declare createdAt: Date;
  declare updatedAt: Date;
}
