import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { CapturedMail } from './captured-mail.model';
import { CapturedMailRepository } from './captured-mail.repository';
import { OutboxController } from './outbox.controller';
import { OutboxService } from './outbox.service';

@Module({
  imports: [SequelizeModule.forFeature([CapturedMail])],
  controllers: [OutboxController],
  providers: [CapturedMailRepository, OutboxService],
})
export class OutboxModule {}
