import { Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import { CapturedMail } from './captured-mail.model';

/** The only place that queries what the SMTP fake captured (captured_mail). */
@Injectable()
export class CapturedMailRepository {
  constructor(@InjectModel(CapturedMail) private readonly mail: typeof CapturedMail) {}

  latest(limit: number): Promise<CapturedMail[]> {
    return this.mail.findAll({ order: [['id', 'DESC']], limit });
  }
}
