import { Injectable } from '@nestjs/common';
import { InjectConnection, InjectModel } from '@nestjs/sequelize';
import { QueryTypes, type Transaction } from 'sequelize';
import { Sequelize } from 'sequelize-typescript';
import { User } from '../users/user.model';
import { HousePartBuyer } from './house-part-buyer.model';

/** The only place that queries which buyers follow a house part (house_part_buyers); their names and e-mails come joined from users. */
@Injectable()
export class HousePartBuyersRepository {
  constructor(
    @InjectModel(HousePartBuyer) private readonly buyers: typeof HousePartBuyer,
    @InjectConnection() private readonly sequelize: Sequelize,
  ) {}

  list(housePartId: number): Promise<HousePartBuyer[]> {
    return this.buyers.findAll({
      where: { housePartId },
      include: [
        { model: User, as: 'user', attributes: ['id', 'name', 'email'] },
        { model: User, as: 'addedBy', attributes: ['id', 'name'] },
      ],
      order: [['id', 'ASC']],
    });
  }

  find(housePartId: number, userId: number): Promise<HousePartBuyer | null> {
    return this.buyers.findOne({ where: { housePartId, userId } });
  }

  add(values: { housePartId: number; userId: number; addedById: number | null }, transaction?: Transaction): Promise<HousePartBuyer> {
    return this.buyers.create(values, { transaction });
  }

  async remove(row: HousePartBuyer): Promise<void> {
    await row.destroy();
  }

  /** E-mail addresses of the active buyers linked to a house part. */
  async emailsOf(housePartId: number, transaction?: Transaction): Promise<string[]> {
    const rows = await this.sequelize.query<{ email: string }>(
      `SELECT u.email FROM house_part_buyers b JOIN users u ON u.id = b.user_id WHERE b.house_part_id = ? AND u.active = 1 AND u.role = 'buyer' ORDER BY u.email`,
      { replacements: [housePartId], type: QueryTypes.SELECT, transaction },
    );
    return rows.map((r) => r.email);
  }
}
