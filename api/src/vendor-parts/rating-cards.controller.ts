import { Body, Controller, Get, Param, ParseIntPipe, Put, Query, UseFilters } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { CurrentUser, type AuthUser } from '../common/decorators/current-user.decorator';
import { Roles } from '../common/decorators/roles.decorator';
import { RatingCardConflictFilter } from './rating-card-conflict.filter';
import { RatingCardsService } from './rating-cards.service';
import { PutRatingCardDto, RatingCardQueryDto } from './vendor-parts.dto';

@ApiTags('rating cards')
@ApiBearerAuth()
@UseFilters(RatingCardConflictFilter)
@Controller('vendor-parts/:id/rating-card')
export class RatingCardsController {
  constructor(private readonly cards: RatingCardsService) {}

  @Get()
  @Roles('engineer', 'admin', 'designer')
  get(@Param('id', ParseIntPipe) id: number, @Query() query: RatingCardQueryDto) {
    return this.cards.view(id, query);
  }

  @Put()
  @Roles('engineer', 'admin')
  put(@Param('id', ParseIntPipe) id: number, @Body() body: PutRatingCardDto, @CurrentUser() user: AuthUser) {
    return this.cards.put(id, { baseVersion: body.version, fields: body.fields, note: body.note }, user);
  }

  @Get('versions')
  @Roles('engineer', 'admin', 'designer')
  versions(@Param('id', ParseIntPipe) id: number) {
    return this.cards.versions(id);
  }
}
