import { Injectable, type CanActivate, type ExecutionContext } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import type { Request } from 'express';
import { AccessTokens } from '../../auth/access-tokens';
import type { AuthUser } from '../decorators/current-user.decorator';
import { IS_PUBLIC_KEY } from '../decorators/public.decorator';

/**
 * Global: every route needs a valid token unless marked @Public(); the check itself is
 * AccessTokens.userOf (signature, expiry, and the users row on every request). It puts the
 * user on `req.user` for RolesGuard and @CurrentUser. (It called jsonwebtoken through passport
 * and passport-jwt before; their per-request strategy objects and callbacks were about a tenth
 * of a card read's CPU and checked nothing more.)
 */
@Injectable()
export class JwtAuthGuard implements CanActivate {
  constructor(
    private readonly reflector: Reflector,
    private readonly tokens: AccessTokens,
  ) {}

  async canActivate(context: ExecutionContext): Promise<boolean> {
    const isPublic = this.reflector.getAllAndOverride<boolean>(IS_PUBLIC_KEY, [context.getHandler(), context.getClass()]);
    if (isPublic) return true;
    const req = context.switchToHttp().getRequest<Request & { user?: AuthUser }>();
    req.user = await this.tokens.userOf(req.headers.authorization);
    return true;
  }
}
