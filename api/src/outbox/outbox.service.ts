import { Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import type { CapturedMail as CapturedMailDto } from '@shuntwise/contracts';
import { CapturedMail } from './captured-mail.model';

@Injectable()
export class OutboxService {
  constructor(@InjectModel(CapturedMail) private readonly mail: typeof CapturedMail) {}

  async list(): Promise<CapturedMailDto[]> {
    const rows = await this.mail.findAll({ order: [['id', 'DESC']], limit: 500 });
    return rows.map((m) => ({
      id: m.id,
      from: m.sender,
      to: m.recipients,
      subject: m.subject,
      text: m.body,
      receivedAt: m.createdAt.toISOString(),
    }));
  }
}
