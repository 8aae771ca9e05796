import { Module } from '@nestjs/common';
import { HousePartsModule } from '../house-parts/house-parts.module';
import { QualificationsModule } from '../qualifications/qualifications.module';
import { VendorPartsModule } from '../vendor-parts/vendor-parts.module';
import { QualificationViewsController } from './qualification-views.controller';
import { QualificationViewsRepository } from './qualification-views.repository';
import { QualificationViewsService } from './qualification-views.service';

/**
 * The read models the screens draw: Board, Compare and the buyers' Sources view (with its
 * CSV). Reads only; the cases, waivers and catalogue it shows are written by their own modules.
 */
@Module({
  imports: [QualificationsModule, HousePartsModule, VendorPartsModule],
  controllers: [QualificationViewsController],
  providers: [QualificationViewsRepository, QualificationViewsService],
})
export class QualificationViewsModule {}
