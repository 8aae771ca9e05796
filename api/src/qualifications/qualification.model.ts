import {
  QUALIFICATION_STATES,
  QUALIFICATION_VERDICTS,
  type Evaluation,
  type QualificationState,
  type QualificationVerdict,
  type RecheckReason,
} from '@shuntwise/contracts';
import { BelongsTo, Column, DataType, ForeignKey, Model, Table } from 'sequelize-typescript';
import { HousePart } from '../house-parts/house-part.model';
import { User } from '../users/user.model';
import { VendorPart } from '../vendor-parts/vendor-part.model';

export type DecisionState = 'approved' | 'cleared' | 'cleared-with-conditions' | 'rejected';

/**
 * One qualification case: a vendor part's card checked against a house part's spec, with
 * its state and decision. `version` is Sequelize's optimistic lock: every save checks and
 * raises it, so a change based on a stale read fails instead of overwriting.
 */
@Table({ tableName: 'qualifications', underscored: true, version: true })
export class Qualification extends Model {
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

  @Column({ type: DataType.INTEGER, allowNull: false })
  declare revision: number;

  @Column({ type: DataType.INTEGER, allowNull: true })
  declare previousId: number | null;

  @Column({ type: DataType.ENUM(...QUALIFICATION_STATES), allowNull: false })
  declare state: QualificationState;

  @Column({ type: DataType.ENUM(...QUALIFICATION_VERDICTS), allowNull: false })
  declare overall: QualificationVerdict;

  @Column({ type: DataType.INTEGER, allowNull: false })
  declare specVersion: number;

  @Column({ type: DataType.INTEGER, allowNull: false })
  declare cardVersion: number;

  @Column({ type: DataType.JSON, allowNull: false })
  declare evaluation: Evaluation;

  @Column({ type: DataType.TEXT, allowNull: false })
  declare summary: string;

  @ForeignKey(() => User)
  @Column({ type: DataType.INTEGER, allowNull: false })
  declare preparedById: number;

  @BelongsTo(() => User, 'preparedById')
  declare preparedBy?: User;

  @ForeignKey(() => User)
  @Column({ type: DataType.INTEGER, allowNull: true })
  declare reviewerId: number | null;

  @BelongsTo(() => User, 'reviewerId')
  declare reviewer?: User | null;

  @Column({ type: DataType.DATE, allowNull: true })
  declare submittedAt: Date | null;

  @Column({ type: DataType.ENUM('approved', 'cleared', 'cleared-with-conditions', 'rejected'), allowNull: true })
  declare decisionState: DecisionState | null;

  @ForeignKey(() => User)
  @Column({ type: DataType.INTEGER, allowNull: true })
  declare decidedById: number | null;

  @BelongsTo(() => User, 'decidedById')
  declare decidedBy?: User | null;

  @Column({ type: DataType.DATE, allowNull: true })
  declare decidedAt: Date | null;

  @Column({ type: DataType.TEXT, allowNull: true })
  declare decisionText: string | null;

  @ForeignKey(() => User)
  @Column({ type: DataType.INTEGER, allowNull: true })
  declare revokedById: number | null;

  @BelongsTo(() => User, 'revokedById')
  declare revokedBy?: User | null;

  @Column({ type: DataType.DATE, allowNull: true })
  declare revokedAt: Date | null;

  @Column({ type: DataType.TEXT, allowNull: true })
  declare revokeReason: string | null;

  @Column({ type: DataType.BOOLEAN, allowNull: false, defaultValue: false })
  declare needsRecheck: boolean;

  @Column({ type: DataType.JSON, allowNull: false })
  declare recheckReasons: RecheckReason[];

  declare version: number;
  declare createdAt: Date;
  declare updatedAt: Date;
}
