import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { VendorPartsModule } from '../vendor-parts/vendor-parts.module';
import { HousePartSource } from './house-part-source.model';
import { HousePartSpec } from './house-part-spec.model';
import { HousePart } from './house-part.model';
import { HousePartsController } from './house-parts.controller';
import { HousePartsRepository } from './house-parts.repository';
import { HousePartsService } from './house-parts.service';

/** House parts, their versioned specs and their sources. */
@Module({
  imports: [SequelizeModule.forFeature([HousePart, HousePartSpec, HousePartSource]), VendorPartsModule],
  controllers: [HousePartsController],
  providers: [HousePartsRepository, HousePartsService],
  exports: [HousePartsRepository, HousePartsService],
})
export class HousePartsModule {}
