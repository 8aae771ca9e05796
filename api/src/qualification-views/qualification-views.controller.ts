import contentDisposition from 'content-disposition';
import { Controller, Get, Param, ParseIntPipe, Query, Res, StreamableFile } from '@nestjs/common';
import { ApiBearerAuth, ApiOkResponse, ApiProduces, ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import { CurrentUser, type AuthUser } from '../common/decorators/current-user.decorator';
import { Roles } from '../common/decorators/roles.decorator';
import { BoardPageDto, BoardQueryDto, ComparePayloadDto, SourcesQueryDto, SourcesViewDto } from './qualification-views.dto';
import { QualificationViewsService } from './qualification-views.service';

/** Read models for the screens, under their own prefix: no path here can be read as a case id. */
@ApiTags('qualifications')
@ApiBearerAuth()
@Controller('qualification-views')
export class QualificationViewsController {
  constructor(private readonly views: QualificationViewsService) {}

  @Get('board')
  @Roles('engineer', 'admin')
  @ApiOkResponse({ type: BoardPageDto })
  board(@Query() query: BoardQueryDto) {
    return this.views.board(query);
  }

  @Get('compare/:housePartId')
  @Roles('engineer', 'admin', 'designer')
  @ApiOkResponse({ type: ComparePayloadDto })
  compare(@Param('housePartId', ParseIntPipe) housePartId: number) {
    return this.views.compare(housePartId);
  }

  @Get('sources')
  @Roles('buyer', 'engineer', 'admin', 'designer')
  @ApiOkResponse({ type: SourcesViewDto })
  sources(@Query() query: SourcesQueryDto, @CurrentUser() user: AuthUser) {
    return this.views.sources(query, user);
  }

  @Get('sources.csv')
  @Roles('buyer', 'engineer', 'admin', 'designer')
  @ApiProduces('text/csv')
  @ApiOkResponse({ description: 'one row per source of each house part: standing, conditions, since, who decided' })
  async sourcesCsv(@Query() query: SourcesQueryDto, @CurrentUser() user: AuthUser, @Res({ passthrough: true }) res: Response) {
    res.setHeader('Content-Disposition', contentDisposition(`sources-${new Date().toISOString().slice(0, 10)}.csv`));
    return new StreamableFile(await this.views.sourcesCsv(query, user), { type: 'text/csv; charset=utf-8' });
  }
}
