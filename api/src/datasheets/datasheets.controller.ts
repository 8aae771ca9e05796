import { Body, Controller, Get, HttpCode, Param, ParseIntPipe, Post, Res, StreamableFile, UploadedFile, UseInterceptors } from '@nestjs/common';
import { ApiBearerAuth, ApiBody, ApiConsumes, ApiCreatedResponse, ApiOkResponse, ApiProduces, ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import { CurrentUser, type AuthUser } from '../common/decorators/current-user.decorator';
import { AnyRole, Roles } from '../common/decorators/roles.decorator';
import { RateLimit } from '../rate-limits/rate-limit.decorator';
import { DatasheetUploadInterceptor } from './datasheet-upload.interceptor';
import {
  CreateVariantsDto,
  CreateVariantsResponseDto,
  DatasheetDto,
  ExtractionResultDto,
  UploadDatasheetFieldsDto,
  UploadDatasheetResponseDto,
} from './datasheets.dto';
import { DatasheetsService } from './datasheets.service';

@ApiTags('datasheets')
@ApiBearerAuth()
@Controller('datasheets')
export class DatasheetsController {
  constructor(private readonly datasheets: DatasheetsService) {}

  @Post()
  @Roles('engineer')
  @RateLimit('upload')
  @UseInterceptors(DatasheetUploadInterceptor)
  @ApiConsumes('multipart/form-data')
  @ApiBody({
    schema: {
      type: 'object',
      required: ['file'],
      properties: { file: { type: 'string', format: 'binary' }, vendorPartId: { type: 'integer' }, revision: { type: 'string', maxLength: 40 } },
    },
  })
  @ApiCreatedResponse({
    type: UploadDatasheetResponseDto,
    description:
      'stored; 200 with existing: true when the same file was already stored (read again when its stored reading came from another extractor version)',
  })
  async upload(
    @UploadedFile() file: Express.Multer.File | undefined,
    @Body() fields: UploadDatasheetFieldsDto,
    @CurrentUser() user: AuthUser,
    @Res({ passthrough: true }) res: Response,
  ) {
    const result = await this.datasheets.upload(file && { buffer: file.buffer, originalName: file.originalname }, fields, user);
    res.status(result.existing ? 200 : 201);
    return result;
  }

  @Get(':id')
  @AnyRole()
  @ApiOkResponse({ type: DatasheetDto })
  get(@Param('id', ParseIntPipe) id: number) {
    return this.datasheets.get(id);
  }

  /** The PDF itself; the name is the server's (sanitised), never a header taken from the upload. */
  @Get(':id/file')
  @AnyRole()
  @ApiProduces('application/pdf')
  @ApiOkResponse({ description: 'the PDF, byte for byte as uploaded' })
  async file(@Param('id', ParseIntPipe) id: number, @Res({ passthrough: true }) res: Response) {
    const { stream, fileName, sizeBytes } = await this.datasheets.file(id);
    res.setHeader('Content-Disposition', contentDisposition(fileName));
    return new StreamableFile(stream, { type: 'application/pdf', length: sizeBytes });
  }

  @Get(':id/extraction')
  @Roles('engineer', 'admin', 'designer')
  @ApiOkResponse({ type: ExtractionResultDto })
  extraction(@Param('id', ParseIntPipe) id: number) {
    return this.datasheets.extraction(id);
  }

  /** The stored file read again by the current reader, when its stored reading came from an earlier version. */
  @Post(':id/extraction')
  @Roles('engineer')
  @RateLimit('upload')
  @HttpCode(200)
  @ApiOkResponse({ type: ExtractionResultDto, description: 'the current reading (made now when the stored one was outdated)' })
  readAgain(@Param('id', ParseIntPipe) id: number) {
    return this.datasheets.readAgain(id);
  }

  @Post(':id/variants')
  @Roles('engineer')
  @ApiCreatedResponse({ type: CreateVariantsResponseDto })
  variants(@Param('id', ParseIntPipe) id: number, @Body() body: CreateVariantsDto, @CurrentUser() user: AuthUser) {
    return this.datasheets.createVariants(id, body, user);
  }
}

/** inline, with an ASCII fallback name and the exact name in RFC 5987 form. */
export function contentDisposition(fileName: string): string {
  const ascii = fileName.replace(/[^\x20-\x7e]/g, '_').replace(/["\\]/g, '_');
  const encoded = encodeURIComponent(fileName).replace(/['()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`);
  return `inline; filename="${ascii}"; filename*=UTF-8''${encoded}`;
}
