import { Global, Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { MailService } from './mail.service';
import { OutgoingMail } from './outgoing-mail.model';
import { OutgoingMailRepository } from './outgoing-mail.repository';

@Global()
@Module({
  imports: [SequelizeModule.forFeature([OutgoingMail])],
  providers: [OutgoingMailRepository, MailService],
  exports: [MailService],
})
export class MailModule {}
