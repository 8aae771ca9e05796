import { createParamDecorator, type ExecutionContext } from '@nestjs/common';
import type { Role } from '@shuntwise/contracts';

/** What the JWT strategy puts on the request after checking the token. */
export interface AuthUser {
  id: number;
  email: string;
  name: string;
  role: Role;
}

export const CurrentUser = createParamDecorator((_data: unknown, ctx: ExecutionContext): AuthUser => {
  return ctx.switchToHttp().getRequest<{ user: AuthUser }>().user;
});
