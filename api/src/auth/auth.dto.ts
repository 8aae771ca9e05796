import { acceptInvitationRequestSchema, loginRequestSchema } from '@shuntwise/contracts';
import { createZodDto } from 'nestjs-zod';

export class LoginDto extends createZodDto(loginRequestSchema) {}
export class AcceptInvitationDto extends createZodDto(acceptInvitationRequestSchema) {}
