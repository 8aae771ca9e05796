import { BelongsTo, Column, DataType, ForeignKey, Model, Table } from 'sequelize-typescript';
import { User } from '../users/user.model';

/** An uploaded PDF: the object in the store under `storageKey` (made from an internal id), never overwritten. */
@Table({ tableName: 'datasheets', underscored: true, updatedAt: false })
export class Datasheet extends Model {
  @Column({ type: DataType.STRING(200), allowNull: false, unique: true })
  declare storageKey: string;

  @Column({ type: DataType.CHAR(64), allowNull: false, unique: true })
  declare sha256: string;

  /** The uploader's file name, for display and Content-Disposition only. */
  @Column({ type: DataType.STRING(255), allowNull: false })
  declare fileName: string;

  @Column({ type: DataType.INTEGER, allowNull: false })
  declare sizeBytes: number;

  @Column({ type: DataType.INTEGER, allowNull: false })
  declare pages: number;

  @Column({ type: DataType.STRING(40), allowNull: true })
  declare revision: string | null;

  @ForeignKey(() => User)
  @Column({ type: DataType.INTEGER, allowNull: true })
  declare uploadedById: number | null;

  @BelongsTo(() => User, 'uploadedById')
  declare uploadedBy?: User;

  declare createdAt: Date;
}
