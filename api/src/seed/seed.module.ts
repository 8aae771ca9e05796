import { Module } from '@nestjs/common';
import { DatasheetsModule } from '../datasheets/datasheets.module';
import { HousePartBuyersModule } from '../house-part-buyers/house-part-buyers.module';
import { HousePartsModule } from '../house-parts/house-parts.module';
import { MeasurementsModule } from '../measurements/measurements.module';
import { QualificationsModule } from '../qualifications/qualifications.module';
import { UsersModule } from '../users/users.module';
import { VendorPartsModule } from '../vendor-parts/vendor-parts.module';
import { CatalogueSeeder } from './catalogue-seeder.service';
import { DemoSeedService } from './demo-seed.service';
import { MeasurementsSeeder } from './measurements-seeder.service';
import { QualificationsSeeder } from './qualifications-seeder.service';

@Module({
  imports: [UsersModule, HousePartBuyersModule, VendorPartsModule, HousePartsModule, DatasheetsModule, QualificationsModule, MeasurementsModule],
  providers: [DemoSeedService, CatalogueSeeder, MeasurementsSeeder, QualificationsSeeder],
  exports: [DemoSeedService],
})
export class SeedModule {}
