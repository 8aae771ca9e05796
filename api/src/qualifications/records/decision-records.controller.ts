import { Controller, Get, Param, ParseIntPipe, Res, StreamableFile } from '@nestjs/common';
import { ApiBearerAuth, ApiOkResponse, ApiProduces, ApiTags } from '@nestjs/swagger';
import contentDisposition from 'content-disposition';
import type { Response } from 'express';
import { CurrentUser, type AuthUser } from '../../common/decorators/current-user.decorator';
import { Roles } from '../../common/decorators/roles.decorator';
import { DecisionRecordMetaDto } from './decision-records.dto';
import { DecisionRecordsService } from './decision-records.service';

/**
 * The PDF record of a decided case. Engineers, admins and buyers read every record;
 * designers the records of the cases they may design in (as the case route decides).
 */
@ApiTags('qualifications')
@ApiBearerAuth()
@Controller('qualifications')
export class DecisionRecordsController {
  constructor(private readonly records: DecisionRecordsService) {}

  @Get(':id/record')
  @Roles('engineer', 'admin', 'buyer', 'designer')
  @ApiProduces('application/pdf')
  @ApiOkResponse({ description: 'the PDF exactly as stored when the case was decided; X-Record-Sha256 names its sha256' })
  async file(@Param('id', ParseIntPipe) id: number, @CurrentUser() user: AuthUser, @Res({ passthrough: true }) res: Response) {
    const { bytes, fileName, sha256 } = await this.records.download(id, user);
    res.setHeader('Content-Disposition', contentDisposition(fileName));
    res.setHeader('X-Record-Sha256', sha256);
    return new StreamableFile(bytes, { type: 'application/pdf', length: bytes.byteLength });
  }

  @Get(':id/record/meta')
  @Roles('engineer', 'admin', 'buyer', 'designer')
  @ApiOkResponse({ type: DecisionRecordMetaDto })
  meta(@Param('id', ParseIntPipe) id: number, @CurrentUser() user: AuthUser) {
    return this.records.meta(id, user);
  }
}
