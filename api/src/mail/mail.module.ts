import { Global, Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { MailService } from './mail.service';
import { OutgoingMail } from './outgoing-mail.model';

@Global()
@Module({
  imports: [SequelizeModule.forFeature([OutgoingMail])],
  providers: [MailService],
  exports: [MailService],
})
export class MailModule {}
