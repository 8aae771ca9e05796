import type { MeasuredSample } from '@shuntwise/contracts';
import { BelongsTo, Column, DataType, ForeignKey, Model, Table } from 'sequelize-typescript';
import { User } from '../users/user.model';

/** A measurement file of one vendor part's samples: the object under `storageKey`, the points read from it. */
@Table({ tableName: 'measurement_sets', underscored: true, updatedAt: false })
export class MeasurementSetRow extends Model {
  @Column({ type: DataType.INTEGER, allowNull: false })
  declare vendorPartId: number;

  @Column({ type: DataType.STRING(200), allowNull: false, unique: true })
  declare storageKey: string;

  @Column({ type: DataType.CHAR(64), allowNull: false })
  declare sha256: string;

  @Column({ type: DataType.STRING(255), allowNull: false })
  declare fileName: string;

  @Column({ type: DataType.INTEGER, allowNull: false })
  declare sizeBytes: number;

  @Column({ type: DataType.STRING(60), allowNull: true })
  declare lot: string | null;

  @Column({ type: DataType.STRING(120), allowNull: true })
  declare instrument: string | null;

  @Column({ type: DataType.DATEONLY, allowNull: true })
  declare measuredOn: string | null;

  @Column({ type: DataType.TEXT, allowNull: true })
  declare note: string | null;

  @Column({ type: DataType.JSON, allowNull: false })
  declare samples: MeasuredSample[];

  @Column({ type: DataType.INTEGER, allowNull: false })
  declare sampleCount: number;

  @Column({ type: DataType.INTEGER, allowNull: false })
  declare pointCount: number;

  @ForeignKey(() => User)
  @Column({ type: DataType.INTEGER, allowNull: true })
  declare uploadedById: number | null;

  @BelongsTo(() => User, 'uploadedById')
  declare uploadedBy?: User;

  declare createdAt: Date;
}
