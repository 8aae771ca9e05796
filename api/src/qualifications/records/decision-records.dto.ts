import { decisionRecordMetaSchema } from '@shuntwise/contracts';
import { createZodDto } from 'nestjs-zod';

export class DecisionRecordMetaDto extends createZodDto(decisionRecordMetaSchema) {}
