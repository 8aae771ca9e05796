import contentDisposition from 'content-disposition';
import { Body, Controller, Get, HttpCode, Post, Query, Res, StreamableFile } from '@nestjs/common';
import { ApiBearerAuth, ApiCreatedResponse, ApiOkResponse, ApiProduces, ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import { CurrentUser, type AuthUser } from '../common/decorators/current-user.decorator';
import { AnyRole, Roles } from '../common/decorators/roles.decorator';
import { RateLimit } from '../rate-limits/rate-limit.decorator';
import { CardExportQueryDto, CsvImportDto, CsvImportPreviewDto, CsvImportResultDto } from './catalogue-csv.dto';
import { CatalogueCsvService } from './catalogue-csv.service';
import { CatalogueExportService, exportFileName } from './catalogue-export.service';

@ApiTags('csv')
@ApiBearerAuth()
@Controller()
export class CatalogueCsvController {
  constructor(
    private readonly imports: CatalogueCsvService,
    private readonly exports: CatalogueExportService,
  ) {}

  /** Reads the CSV and says what a confirm would do, row by row; writes nothing. */
  @Post('imports/vendor-series/preview')
  @Roles('engineer')
  @RateLimit('upload')
  @HttpCode(200)
  @ApiOkResponse({ type: CsvImportPreviewDto })
  preview(@Body() body: CsvImportDto) {
    return this.imports.preview(body);
  }

  /** Writes the same CSV: every row or none. */
  @Post('imports/vendor-series')
  @Roles('engineer')
  @RateLimit('upload')
  @ApiCreatedResponse({ type: CsvImportResultDto })
  confirm(@Body() body: CsvImportDto, @CurrentUser() user: AuthUser) {
    return this.imports.confirm(body, user);
  }

  @Get('exports/rating-cards')
  @Roles('engineer', 'admin', 'designer')
  @ApiProduces('text/csv')
  @ApiOkResponse({ description: 'one row per card, SI values with the unit in the header' })
  ratingCards(@Query() query: CardExportQueryDto, @Res({ passthrough: true }) res: Response) {
    res.setHeader('Content-Disposition', contentDisposition(exportFileName('rating-cards')));
    return new StreamableFile(this.exports.ratingCards(query.manufacturer), { type: 'text/csv; charset=utf-8' });
  }

  @Get('exports/house-parts')
  @AnyRole()
  @ApiProduces('text/csv')
  @ApiOkResponse({ description: 'one row per source of each house part' })
  async houseParts(@Res({ passthrough: true }) res: Response) {
    res.setHeader('Content-Disposition', contentDisposition(exportFileName('house-parts-and-sources')));
    return new StreamableFile(await this.exports.houseParts(), { type: 'text/csv; charset=utf-8' });
  }
}
