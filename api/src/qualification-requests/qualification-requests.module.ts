import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { QualificationsModule } from '../qualifications/qualifications.module';
import { UsersModule } from '../users/users.module';
import { QualificationRequest } from './qualification-request.model';
import { QualificationRequestsController } from './qualification-requests.controller';
import { QualificationRequestsRepository } from './qualification-requests.repository';
import { QualificationRequestsService } from './qualification-requests.service';

/** Requests for a qualification; cases are opened through the qualifications module, which tells this one when any case opens. */
@Module({
  imports: [SequelizeModule.forFeature([QualificationRequest]), QualificationsModule, UsersModule],
  controllers: [QualificationRequestsController],
  providers: [QualificationRequestsRepository, QualificationRequestsService],
})
export class QualificationRequestsModule {}
