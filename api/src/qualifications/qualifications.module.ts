import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { HousePartBuyersModule } from '../house-part-buyers/house-part-buyers.module';
import { HousePartsModule } from '../house-parts/house-parts.module';
import { MeasurementsModule } from '../measurements/measurements.module';
import { UsersModule } from '../users/users.module';
import { VendorPartsModule } from '../vendor-parts/vendor-parts.module';
import { QualificationComment } from './qualification-comment.model';
import { QualificationEvent } from './qualification-event.model';
import { Qualification } from './qualification.model';
import { QualificationsController } from './qualifications.controller';
import { QualificationsRepository } from './qualifications.repository';
import { QualificationsService } from './qualifications.service';
import { DecisionRecord } from './records/decision-record.model';
import { DecisionRecordsController } from './records/decision-records.controller';
import { DecisionRecordsRepository } from './records/decision-records.repository';
import { DecisionRecordsService } from './records/decision-records.service';
import { QualificationWaiver } from './waiver.model';
import { WaiversController } from './waivers.controller';
import { WaiversRepository } from './waivers.repository';
import { WaiversService } from './waivers.service';

/** Qualification cases, their trail and comments, waivers, and decision records (the buyers of each house part: house-part-buyers/). The screens' read models are in qualification-views/; the demo cases in seed/. */
@Module({
  imports: [
    SequelizeModule.forFeature([Qualification, QualificationEvent, QualificationComment, DecisionRecord, QualificationWaiver]),
    UsersModule,
    HousePartBuyersModule,
    HousePartsModule,
    VendorPartsModule,
    MeasurementsModule,
  ],
  controllers: [QualificationsController, WaiversController, DecisionRecordsController],
  providers: [QualificationsRepository, QualificationsService, DecisionRecordsRepository, DecisionRecordsService, WaiversRepository, WaiversService],
  exports: [QualificationsService, QualificationsRepository, DecisionRecordsService, WaiversService],
})
export class QualificationsModule {}
