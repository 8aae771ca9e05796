import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { HousePartsModule } from '../house-parts/house-parts.module';
import { MeasurementsModule } from '../measurements/measurements.module';
import { User } from '../users/user.model';
import { VendorPartsModule } from '../vendor-parts/vendor-parts.module';
import { HousePartBuyer } from './house-part-buyer.model';
import { HousePartBuyersController } from './house-part-buyers.controller';
import { HousePartBuyersService } from './house-part-buyers.service';
import { QualificationComment } from './qualification-comment.model';
import { QualificationEvent } from './qualification-event.model';
import { QualificationViewsController } from './qualification-views.controller';
import { QualificationViewsService } from './qualification-views.service';
import { Qualification } from './qualification.model';
import { QualificationsController } from './qualifications.controller';
import { QualificationsRepository } from './qualifications.repository';
import { QualificationsSeeder } from './qualifications-seeder.service';
import { QualificationsService } from './qualifications.service';
import { DecisionRecord } from './records/decision-record.model';
import { DecisionRecordsController } from './records/decision-records.controller';
import { DecisionRecordsRepository } from './records/decision-records.repository';
import { DecisionRecordsService } from './records/decision-records.service';
import { QualificationWaiver } from './waiver.model';
import { WaiversController } from './waivers.controller';
import { WaiversService } from './waivers.service';

/** Qualification cases, their trail and comments, waivers, the buyers of each house part, and the Board, Compare and Sources read models. */
@Module({
  imports: [SequelizeModule.forFeature([Qualification, QualificationEvent, QualificationComment, HousePartBuyer, User, DecisionRecord, QualificationWaiver]), HousePartsModule, VendorPartsModule, MeasurementsModule],
  // The views controller first: its fixed paths (board, sources, compare) must match before `:id`.
  controllers: [QualificationViewsController, QualificationsController, WaiversController, HousePartBuyersController, DecisionRecordsController],
  providers: [QualificationsRepository, QualificationsService, DecisionRecordsRepository, DecisionRecordsService, QualificationViewsService, HousePartBuyersService, QualificationsSeeder, WaiversService],
  exports: [QualificationsService, QualificationsRepository, QualificationsSeeder, DecisionRecordsService, WaiversService],
})
export class QualificationsModule {}
