import { Injectable } from '@nestjs/common';
import { InjectConnection } from '@nestjs/sequelize';
import type { Health } from '@shuntwise/contracts';
import { QueryTypes } from 'sequelize';
import { Sequelize } from 'sequelize-typescript';
import { MailService } from '../mail/mail.service';
import { StorageService } from '../storage/storage.service';

const withTimeout = <T>(p: Promise<T>, ms: number, fallback: T): Promise<T> =>
  Promise.race([p, new Promise<T>((resolve) => setTimeout(() => resolve(fallback), ms).unref())]);

@Injectable()
export class HealthService {
  constructor(
    @InjectConnection() private readonly sequelize: Sequelize,
    private readonly storage: StorageService,
    private readonly mail: MailService,
  ) {}

  async report(): Promise<Health> {
    const [database, objectStore, mail] = await Promise.all([
      withTimeout(this.sequelize.query('SELECT 1', { type: QueryTypes.SELECT }).then(() => true, () => false), 3000, false),
      withTimeout(this.storage.isUp(), 3000, false),
      withTimeout(this.mail.isUp(), 3000, false),
    ]);
    const up = (b: boolean) => (b ? 'up' : 'down') as 'up' | 'down';
    const status = !database ? 'down' : objectStore && mail ? 'ok' : 'degraded';
    return { status, services: { database: up(database), objectStore: up(objectStore), mail: up(mail) } };
  }
}
