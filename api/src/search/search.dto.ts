import { searchFacetsSchema, searchPageSchema, searchQuerySchema } from '@shuntwise/contracts';
import { createZodDto } from 'nestjs-zod';

export class SearchQueryDto extends createZodDto(searchQuerySchema) {}
export class SearchPageDto extends createZodDto(searchPageSchema) {}
export class SearchFacetsDto extends createZodDto(searchFacetsSchema) {}
