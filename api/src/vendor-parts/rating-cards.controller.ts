import { Body, Controller, Get, Param, ParseIntPipe, Put, Query } from '@nestjs/common';
import { ApiBearerAuth, ApiConflictResponse, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { CurrentUser, type AuthUser } from '../common/decorators/current-user.decorator';
import { Roles } from '../common/decorators/roles.decorator';
import { RatingCardsService } from './rating-cards.service';
import {
  PutRatingCardDto,
  RatingCardConflictDto,
  RatingCardQueryDto,
  RatingCardVersionSummaryDto,
  RatingCardViewDto,
  VendorPartModelDto,
} from './vendor-parts.dto';

@ApiTags('rating cards')
@ApiBearerAuth()
@Controller('vendor-parts/:id')
export class RatingCardsController {
  constructor(private readonly cards: RatingCardsService) {}

  @Get('rating-card')
  @Roles('engineer', 'admin', 'designer')
  @ApiOkResponse({ type: RatingCardViewDto })
  get(@Param('id', ParseIntPipe) id: number, @Query() query: RatingCardQueryDto) {
    return this.cards.view(id, query);
  }

  @Put('rating-card')
  @Roles('engineer')
  @ApiOkResponse({ type: RatingCardViewDto })
  @ApiConflictResponse({ type: RatingCardConflictDto, description: 'the card changed since `version`; the body carries the current card' })
  put(@Param('id', ParseIntPipe) id: number, @Body() body: PutRatingCardDto, @CurrentUser() user: AuthUser, @Query() query: RatingCardQueryDto) {
    return this.cards.put(id, { baseVersion: body.version, fields: body.fields, note: body.note }, user, {
      include: query.include,
      housePartId: query.housePartId,
    });
  }

  @Get('rating-card/versions')
  @Roles('engineer', 'admin', 'designer')
  @ApiOkResponse({ type: [RatingCardVersionSummaryDto] })
  versions(@Param('id', ParseIntPipe) id: number) {
    return this.cards.versions(id);
  }

  /** The SPICE diode `.model` lines fitted to the current card. */
  @Get('model')
  @Roles('engineer', 'admin', 'designer')
  @ApiOkResponse({ type: VendorPartModelDto })
  model(@Param('id', ParseIntPipe) id: number) {
    return this.cards.model(id);
  }
}
