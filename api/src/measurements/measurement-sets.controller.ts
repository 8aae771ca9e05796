import { Body, Controller, Get, HttpCode, Param, ParseIntPipe, Post, Query, Res, StreamableFile, UploadedFile, UseInterceptors } from '@nestjs/common';
import { ApiBearerAuth, ApiBody, ApiConsumes, ApiCreatedResponse, ApiOkResponse, ApiProduces, ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import { CurrentUser, type AuthUser } from '../common/decorators/current-user.decorator';
import { Roles } from '../common/decorators/roles.decorator';
import { contentDisposition } from '../datasheets/datasheets.controller';
import { MeasurementUploadInterceptor } from './measurement-upload.interceptor';
import { MeasurementCsvReadingDto, MeasurementSetDto, MeasurementSetFieldsDto, MeasurementSetQueryDto } from './measurement-sets.dto';
import { MeasurementSetsService } from './measurement-sets.service';

const FILE_BODY = {
  schema: {
    type: 'object',
    required: ['file'],
    properties: {
      file: { type: 'string', format: 'binary' },
      vendorPartId: { type: 'integer' },
      lot: { type: 'string', maxLength: 60 },
      instrument: { type: 'string', maxLength: 120 },
      measuredOn: { type: 'string', format: 'date' },
      note: { type: 'string', maxLength: 2000 },
    },
  },
};

@ApiTags('measurements')
@ApiBearerAuth()
@Controller()
export class MeasurementSetsController {
  constructor(private readonly measurements: MeasurementSetsService) {}

  @Post('measurement-sets/preview')
  @HttpCode(200)
  @Roles('engineer')
  @UseInterceptors(MeasurementUploadInterceptor)
  @ApiConsumes('multipart/form-data')
  @ApiBody({ schema: { type: 'object', required: ['file'], properties: { file: { type: 'string', format: 'binary' } } } })
  @ApiOkResponse({ type: MeasurementCsvReadingDto, description: 'what the file gives, with every row error; nothing is stored' })
  preview(@UploadedFile() file: Express.Multer.File | undefined) {
    return this.measurements.preview(file && { buffer: file.buffer, originalName: file.originalname });
  }

  @Post('measurement-sets')
  @Roles('engineer')
  @UseInterceptors(MeasurementUploadInterceptor)
  @ApiConsumes('multipart/form-data')
  @ApiBody(FILE_BODY)
  @ApiCreatedResponse({ type: MeasurementSetDto })
  upload(@UploadedFile() file: Express.Multer.File | undefined, @Body() fields: MeasurementSetFieldsDto, @CurrentUser() user: AuthUser) {
    return this.measurements.upload(file && { buffer: file.buffer, originalName: file.originalname }, fields, user);
  }

  @Get('measurement-sets/:id')
  @Roles('engineer', 'admin')
  @ApiOkResponse({ type: MeasurementSetDto })
  get(@Param('id', ParseIntPipe) id: number, @Query() query: MeasurementSetQueryDto) {
    return this.measurements.get(id, query.housePartId);
  }

  @Get('measurement-sets/:id/file')
  @Roles('engineer', 'admin')
  @ApiProduces('text/csv')
  @ApiOkResponse({ description: 'the measurement file, byte for byte as uploaded' })
  async file(@Param('id', ParseIntPipe) id: number, @Res({ passthrough: true }) res: Response) {
    const { stream, fileName, sizeBytes } = await this.measurements.file(id);
    res.setHeader('Content-Disposition', contentDisposition(fileName));
    return new StreamableFile(stream, { type: 'text/csv', length: sizeBytes });
  }

  @Get('vendor-parts/:id/measurement-sets')
  @Roles('engineer', 'admin')
  @ApiOkResponse({ type: [MeasurementSetDto] })
  list(@Param('id', ParseIntPipe) id: number, @Query() query: MeasurementSetQueryDto) {
    return this.measurements.listForVendorPart(id, query.housePartId);
  }
}
