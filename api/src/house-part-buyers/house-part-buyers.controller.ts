import { Body, Controller, Delete, Get, HttpCode, Param, ParseIntPipe, Post } from '@nestjs/common';
import { ApiBearerAuth, ApiCreatedResponse, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { CurrentUser, type AuthUser } from '../common/decorators/current-user.decorator';
import { Roles } from '../common/decorators/roles.decorator';
import { HousePartBuyersService } from './house-part-buyers.service';
import { AddHousePartBuyerDto, HousePartBuyerDto } from './house-part-buyers.dto';

/** Buyers who follow a house part (and are mailed about its sources). */
@ApiTags('house-part buyers')
@ApiBearerAuth()
@Controller('house-parts/:id/buyers')
export class HousePartBuyersController {
  constructor(private readonly buyers: HousePartBuyersService) {}

  @Get()
  @Roles('engineer', 'admin', 'buyer')
  @ApiOkResponse({ type: [HousePartBuyerDto] })
  list(@Param('id', ParseIntPipe) id: number) {
    return this.buyers.list(id);
  }

  @Post()
  @Roles('engineer', 'admin', 'buyer')
  @ApiCreatedResponse({ type: HousePartBuyerDto })
  add(@Param('id', ParseIntPipe) id: number, @Body() body: AddHousePartBuyerDto, @CurrentUser() user: AuthUser) {
    return this.buyers.add(id, body.userId, user);
  }

  @Delete(':userId')
  @Roles('engineer', 'admin', 'buyer')
  @HttpCode(204)
  remove(@Param('id', ParseIntPipe) id: number, @Param('userId', ParseIntPipe) userId: number, @CurrentUser() user: AuthUser) {
    return this.buyers.remove(id, userId, user);
  }
}
