import { Module } from '@nestjs/common';
import { DatasheetsModule } from '../datasheets/datasheets.module';
import { HousePartsModule } from '../house-parts/house-parts.module';
import { VendorPartsModule } from '../vendor-parts/vendor-parts.module';
import { CatalogueCsvController } from './catalogue-csv.controller';
import { CatalogueCsvService } from './catalogue-csv.service';
import { CatalogueExportService } from './catalogue-export.service';

/** CSV import of vendor series (preview, then confirm) and CSV exports of cards and of house parts with their sources. */
@Module({
  imports: [VendorPartsModule, HousePartsModule, DatasheetsModule],
  controllers: [CatalogueCsvController],
  providers: [CatalogueCsvService, CatalogueExportService],
})
export class CatalogueCsvModule {}
