import { Column, DataType, Model, Table } from 'sequelize-typescript';

/** One decided case's PDF record: frozen inputs, then the stored object (see the 0800 migration). */
@Table({ tableName: 'decision_records', underscored: true, timestamps: false })
export class DecisionRecord extends Model {
  @Column({ type: DataType.INTEGER, allowNull: false, unique: true })
  declare qualificationId: number;

  @Column({ type: DataType.ENUM('pending', 'stored'), allowNull: false })
  declare state: 'pending' | 'stored';

  @Column({ type: DataType.STRING(200), allowNull: false, unique: true })
  declare storageKey: string;

  @Column({ type: DataType.CHAR(64), allowNull: true })
  declare sha256: string | null;

  @Column({ type: DataType.CHAR(64), allowNull: false })
  declare inputsSha256: string;

  @Column({ type: DataType.TEXT('long'), allowNull: false })
  declare inputs: string;

  @Column({ type: DataType.INTEGER, allowNull: true })
  declare size: number | null;

  @Column({ type: DataType.INTEGER, allowNull: false, defaultValue: 0 })
  declare attempts: number;

  @Column({ type: DataType.STRING(500), allowNull: true })
  declare lastError: string | null;

  @Column({ type: DataType.DATE, allowNull: false })
  declare createdAt: Date;

  @Column({ type: DataType.DATE, allowNull: true })
  declare storedAt: Date | null;
}
