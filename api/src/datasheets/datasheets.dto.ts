import {
  createVariantsRequestSchema,
  createVariantsResponseSchema,
  datasheetSchema,
  extractionResultSchema,
  uploadDatasheetFieldsSchema,
  uploadDatasheetResponseSchema,
} from '@shuntwise/contracts';
import { createZodDto } from 'nestjs-zod';

export class UploadDatasheetFieldsDto extends createZodDto(uploadDatasheetFieldsSchema) {}
export class CreateVariantsDto extends createZodDto(createVariantsRequestSchema) {}

export class UploadDatasheetResponseDto extends createZodDto(uploadDatasheetResponseSchema) {}
export class DatasheetDto extends createZodDto(datasheetSchema) {}
export class ExtractionResultDto extends createZodDto(extractionResultSchema) {}
export class CreateVariantsResponseDto extends createZodDto(createVariantsResponseSchema) {}
