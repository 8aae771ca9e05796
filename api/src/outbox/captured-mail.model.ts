import { Column, DataType, Model, Table } from 'sequelize-typescript';

/** Mail the local SMTP fake received; the Outbox screen shows it. */
@Table({ tableName: 'captured_mail', underscored: true, updatedAt: false })
export class CapturedMail extends Model {
  @Column({ type: DataType.STRING(254), allowNull: false })
  declare sender: string;

  @Column({ type: DataType.JSON, allowNull: false })
  declare recipients: string[];

  @Column({ type: DataType.STRING(250), allowNull: false })
  declare subject: string;

  @Column({ type: DataType.TEXT('medium'), allowNull: false })
  declare body: string;

  declare createdAt: Date;
}
