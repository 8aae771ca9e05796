import {
  addSourceRequestSchema,
  createHousePartRequestSchema,
  housePartListQuerySchema,
  housePartPageSchema,
  housePartSchema,
  putSpecRequestSchema,
  sourceSchema,
  specQuerySchema,
  specVersionSchema,
  specVersionSummarySchema,
  updateHousePartRequestSchema,
  updateSourceRequestSchema,
} from '@shuntwise/contracts';
import { createZodDto } from 'nestjs-zod';

export class HousePartListQueryDto extends createZodDto(housePartListQuerySchema) {}
export class CreateHousePartDto extends createZodDto(createHousePartRequestSchema) {}
export class UpdateHousePartDto extends createZodDto(updateHousePartRequestSchema) {}
export class SpecQueryDto extends createZodDto(specQuerySchema) {}
export class PutSpecDto extends createZodDto(putSpecRequestSchema) {}
export class AddSourceDto extends createZodDto(addSourceRequestSchema) {}
export class UpdateSourceDto extends createZodDto(updateSourceRequestSchema) {}

export class HousePartDto extends createZodDto(housePartSchema) {}
export class HousePartPageDto extends createZodDto(housePartPageSchema) {}
export class SpecVersionDto extends createZodDto(specVersionSchema) {}
export class SpecVersionSummaryDto extends createZodDto(specVersionSummarySchema) {}
export class SourceDto extends createZodDto(sourceSchema) {}
