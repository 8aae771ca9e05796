import { Column, DataType, Model, Table } from 'sequelize-typescript';

export const OUTGOING_MAIL_STATES = ['pending', 'sent', 'failed'] as const;
export type OutgoingMailState = (typeof OUTGOING_MAIL_STATES)[number];

/**
 * The persisted outbox: mail is written here in the same transaction as the change it
 * reports and sent from here, so an SMTP outage delays mail but loses none.
 */
@Table({ tableName: 'outgoing_mail', underscored: true })
export class OutgoingMail extends Model {
  @Column({ type: DataType.JSON, allowNull: false })
  declare recipients: string[];

  @Column({ type: DataType.STRING(250), allowNull: false })
  declare subject: string;

  @Column({ type: DataType.TEXT, allowNull: false })
  declare body: string;

  /** What caused it, e.g. "invitation", "qualification.cleared". */
  @Column({ type: DataType.STRING(60), allowNull: false })
  declare kind: string;

  @Column({ type: DataType.ENUM(...OUTGOING_MAIL_STATES), allowNull: false, defaultValue: 'pending' })
  declare state: OutgoingMailState;

  @Column({ type: DataType.INTEGER, allowNull: false, defaultValue: 0 })
  declare attempts: number;

  @Column({ type: DataType.STRING(500), allowNull: true })
  declare lastError: string | null;

  @Column({ type: DataType.DATE, allowNull: false })
  declare nextAttemptAt: Date;

  @Column({ type: DataType.DATE, allowNull: true })
  declare sentAt: Date | null;

  /** The replica sending it right now (until nextAttemptAt, its lease); null when nobody holds it. */
  @Column({ type: DataType.STRING(64), allowNull: true })
  declare claimedBy: string | null;

  declare createdAt: Date;
  declare updatedAt: Date;
}
