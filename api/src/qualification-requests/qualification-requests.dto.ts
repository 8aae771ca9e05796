import {
  createQualificationRequestRequestSchema,
  declineQualificationRequestSchema,
  openCaseFromRequestSchema,
  qualificationRequestListQuerySchema,
  qualificationRequestPageSchema,
  qualificationRequestSchema,
} from '@shuntwise/contracts';
import { createZodDto } from 'nestjs-zod';

export class QualificationRequestListQueryDto extends createZodDto(qualificationRequestListQuerySchema) {}
export class QualificationRequestPageDto extends createZodDto(qualificationRequestPageSchema) {}
export class QualificationRequestDto extends createZodDto(qualificationRequestSchema) {}
export class CreateQualificationRequestDto extends createZodDto(createQualificationRequestRequestSchema) {}
export class OpenCaseFromRequestDto extends createZodDto(openCaseFromRequestSchema) {}
export class DeclineQualificationRequestDto extends createZodDto(declineQualificationRequestSchema) {}
