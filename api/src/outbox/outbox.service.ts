import { Injectable } from '@nestjs/common';
import type { CapturedMail as CapturedMailDto } from '@shuntwise/contracts';
import { CapturedMailRepository } from './captured-mail.repository';

@Injectable()
export class OutboxService {
  constructor(private readonly mail: CapturedMailRepository) {}

  async list(): Promise<CapturedMailDto[]> {
    const rows = await this.mail.latest(500);
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
