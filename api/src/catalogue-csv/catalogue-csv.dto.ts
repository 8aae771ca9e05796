import { csvImportPreviewSchema, csvImportRequestSchema, csvImportResultSchema } from '@shuntwise/contracts';
import { createZodDto } from 'nestjs-zod';
import { z } from 'zod';

export class CsvImportDto extends createZodDto(csvImportRequestSchema) {}
export class CsvImportPreviewDto extends createZodDto(csvImportPreviewSchema) {}
export class CsvImportResultDto extends createZodDto(csvImportResultSchema) {}
export class CardExportQueryDto extends createZodDto(z.object({ manufacturer: z.string().trim().min(1).max(120).optional() })) {}
