import { BelongsTo, Column, DataType, ForeignKey, Model, Table } from 'sequelize-typescript';
import { User } from '../users/user.model';
import { Qualification } from './qualification.model';

@Table({ tableName: 'qualification_comments', underscored: true, updatedAt: false })
export class QualificationComment extends Model {
  @ForeignKey(() => Qualification)
  @Column({ type: DataType.INTEGER, allowNull: false })
  declare qualificationId: number;

  @ForeignKey(() => User)
  @Column({ type: DataType.INTEGER, allowNull: false })
  declare userId: number;

  @BelongsTo(() => User, 'userId')
  declare user?: User;

  @Column({ type: DataType.TEXT, allowNull: false })
  declare text: string;

  declare createdAt: Date;
}
