import type { AuditAction, AuditEntry, QualificationState } from '@shuntwise/contracts';
import { BelongsTo, Column, DataType, ForeignKey, Model, Table } from 'sequelize-typescript';
import { User } from '../users/user.model';
import { Qualification } from './qualification.model';

/** One entry of a case's audit trail: written with the change it records, never changed. */
@Table({ tableName: 'qualification_events', underscored: true, updatedAt: false })
export class QualificationEvent extends Model {
  @ForeignKey(() => Qualification)
  @Column({ type: DataType.INTEGER, allowNull: false })
  declare qualificationId: number;

  @ForeignKey(() => User)
  @Column({ type: DataType.INTEGER, allowNull: true })
  declare userId: number | null;

  @BelongsTo(() => User, 'userId')
  declare user?: User | null;

  @Column({ type: DataType.STRING(40), allowNull: false })
  declare action: AuditAction;

  @Column({ type: DataType.STRING(30), allowNull: true })
  declare fromState: QualificationState | null;

  @Column({ type: DataType.STRING(30), allowNull: true })
  declare toState: QualificationState | null;

  @Column({ type: DataType.JSON, allowNull: false })
  declare changes: AuditEntry['changes'];

  @Column({ type: DataType.TEXT, allowNull: true })
  declare note: string | null;

  declare createdAt: Date;
}
