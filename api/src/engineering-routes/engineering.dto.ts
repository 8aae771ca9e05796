import { normalizeRequestSchema, normalizeResponseSchema, regulatorRequestSchema, regulatorResponseSchema } from '@shuntwise/contracts';
import { createZodDto } from 'nestjs-zod';

export class NormalizeRequestDto extends createZodDto(normalizeRequestSchema) {}
export class NormalizeResponseDto extends createZodDto(normalizeResponseSchema) {}
export class RegulatorRequestDto extends createZodDto(regulatorRequestSchema) {}
export class RegulatorResponseDto extends createZodDto(regulatorResponseSchema) {}
