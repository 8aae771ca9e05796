import { Column, DataType, ForeignKey, Model, PrimaryKey, Table } from 'sequelize-typescript';
import { Datasheet } from './datasheet.model';

/** The extraction result stored at upload (shape: contracts' datasheet extraction schema). */
@Table({ tableName: 'datasheet_extractions', underscored: true, updatedAt: false })
export class DatasheetExtraction extends Model {
  @PrimaryKey
  @ForeignKey(() => Datasheet)
  @Column({ type: DataType.INTEGER })
  declare datasheetId: number;

  @Column({ type: DataType.JSON, allowNull: false })
  declare result: unknown;

  @Column({ type: DataType.INTEGER, allowNull: false })
  declare variantCount: number;

  @Column({ type: DataType.INTEGER, allowNull: false })
  declare warningCount: number;

  /** The EXTRACTOR_VERSION that made this reading; null for readings stored before versions were kept. */
  @Column({ type: DataType.STRING(32), allowNull: true })
  declare readerVersion: string | null;

  declare createdAt: Date;
}
