import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { VendorPartsModule } from '../vendor-parts/vendor-parts.module';
import { DatasheetExtraction } from './datasheet-extraction.model';
import { DatasheetReader } from './datasheet-reader';
import { DatasheetUploadInterceptor } from './datasheet-upload.interceptor';
import { Datasheet } from './datasheet.model';
import { DatasheetsController } from './datasheets.controller';
import { DatasheetsRepository } from './datasheets.repository';
import { DatasheetsService } from './datasheets.service';
import { VendorPartDatasheet } from './vendor-part-datasheet.model';

/** Uploaded PDFs in object storage, their extraction results, and series datasheets turned into vendor parts. */
@Module({
  imports: [SequelizeModule.forFeature([Datasheet, DatasheetExtraction, VendorPartDatasheet]), VendorPartsModule],
  controllers: [DatasheetsController],
  providers: [DatasheetsRepository, DatasheetsService, DatasheetReader, DatasheetUploadInterceptor],
  exports: [DatasheetsService, DatasheetsRepository],
})
export class DatasheetsModule {}
