import { boardPageSchema, boardQuerySchema, comparePayloadSchema, sourcesQuerySchema, sourcesViewSchema } from '@shuntwise/contracts';
import { createZodDto } from 'nestjs-zod';

export class BoardQueryDto extends createZodDto(boardQuerySchema) {}
export class BoardPageDto extends createZodDto(boardPageSchema) {}
export class ComparePayloadDto extends createZodDto(comparePayloadSchema) {}
export class SourcesQueryDto extends createZodDto(sourcesQuerySchema) {}
export class SourcesViewDto extends createZodDto(sourcesViewSchema) {}
