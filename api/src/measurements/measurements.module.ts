import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { HousePartsModule } from '../house-parts/house-parts.module';
import { VendorPartsModule } from '../vendor-parts/vendor-parts.module';
import { MeasurementSetRow } from './measurement-set.model';
import { MeasurementSetsController } from './measurement-sets.controller';
import { MeasurementSetsRepository } from './measurement-sets.repository';
import { MeasurementSetsService } from './measurement-sets.service';
import { MeasurementUploadInterceptor } from './measurement-upload.interceptor';

/** Bench measurements of vendor parts' samples: stored files, fitted curves, checks against card and spec. */
@Module({
  imports: [SequelizeModule.forFeature([MeasurementSetRow]), VendorPartsModule, HousePartsModule],
  controllers: [MeasurementSetsController],
  providers: [MeasurementSetsRepository, MeasurementSetsService, MeasurementUploadInterceptor],
  exports: [MeasurementSetsService],
})
export class MeasurementsModule {}
