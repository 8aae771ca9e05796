import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { Manufacturer } from './manufacturer.model';
import { RatingCardVersion } from './rating-card-version.model';
import { RatingCard } from './rating-card.model';
import { RatingCardsController } from './rating-cards.controller';
import { RatingCardsRepository } from './rating-cards.repository';
import { RatingCardsService } from './rating-cards.service';
import { VendorPart } from './vendor-part.model';
import { VendorPartsController } from './vendor-parts.controller';
import { VendorPartsRepository } from './vendor-parts.repository';
import { VendorPartsService } from './vendor-parts.service';

/** Vendor parts, manufacturers and rating cards (with every card version kept). */
@Module({
  imports: [SequelizeModule.forFeature([Manufacturer, VendorPart, RatingCard, RatingCardVersion])],
  controllers: [VendorPartsController, RatingCardsController],
  providers: [VendorPartsRepository, VendorPartsService, RatingCardsRepository, RatingCardsService],
  exports: [VendorPartsRepository, VendorPartsService, RatingCardsRepository, RatingCardsService],
})
export class VendorPartsModule {}
