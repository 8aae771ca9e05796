import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { HousePartsModule } from '../house-parts/house-parts.module';
import { UsersModule } from '../users/users.module';
import { HousePartBuyer } from './house-part-buyer.model';
import { HousePartBuyersController } from './house-part-buyers.controller';
import { HousePartBuyersRepository } from './house-part-buyers.repository';
import { HousePartBuyersService } from './house-part-buyers.service';

/** Which buyers follow a house part; the cases module asks it whom to mail about a source. */
@Module({
  imports: [SequelizeModule.forFeature([HousePartBuyer]), UsersModule, HousePartsModule],
  controllers: [HousePartBuyersController],
  providers: [HousePartBuyersRepository, HousePartBuyersService],
  exports: [HousePartBuyersRepository],
})
export class HousePartBuyersModule {}
