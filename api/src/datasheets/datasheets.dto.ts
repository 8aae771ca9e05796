import { createVariantsRequestSchema, uploadDatasheetFieldsSchema } from '@shuntwise/contracts';
import { createZodDto } from 'nestjs-zod';

export class UploadDatasheetFieldsDto extends createZodDto(uploadDatasheetFieldsSchema) {}
export class CreateVariantsDto extends createZodDto(createVariantsRequestSchema) {}
