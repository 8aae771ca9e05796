import { Column, DataType, Model, Table } from 'sequelize-typescript';

@Table({ tableName: 'manufacturers', underscored: true })
export class Manufacturer extends Model {
  @Column({ type: DataType.STRING(120), allowNull: false, unique: true })
  declare name: string;

  declare createdAt: Date;
  declare updatedAt: Date;
}
