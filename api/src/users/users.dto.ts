import { createInvitationRequestSchema, updateUserRequestSchema } from '@shuntwise/contracts';
import { createZodDto } from 'nestjs-zod';

export class CreateInvitationDto extends createZodDto(createInvitationRequestSchema) {}
export class UpdateUserDto extends createZodDto(updateUserRequestSchema) {}
