import { Injectable } from '@nestjs/common';
import { InjectConnection } from '@nestjs/sequelize';
import { QueryTypes } from 'sequelize';
import type { Sequelize } from 'sequelize-typescript';

/** Whether the database answers at all (the readiness report's one query). */
@Injectable()
export class DatabaseProbe {
  constructor(@InjectConnection() private readonly sequelize: Sequelize) {}

  async ping(): Promise<void> {
    await this.sequelize.query('SELECT 1', { type: QueryTypes.SELECT });
  }
}
