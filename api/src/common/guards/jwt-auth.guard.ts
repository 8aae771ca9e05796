import { Injectable, UnauthorizedException, type ExecutionContext } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import { AuthGuard } from '@nestjs/passport';
import { NotBeforeError, TokenExpiredError } from '@nestjs/jwt';
import { IS_PUBLIC_KEY } from '../decorators/public.decorator';

/**
 * Global: every route needs a valid token unless marked @Public(). The check is passport-jwt's
 * (JwtStrategy, api/src/auth/jwt.strategy.ts); it puts the user on `req.user` for RolesGuard
 * and @CurrentUser. A refusal names why (no token, expired, not valid) instead of a bare
 * "Unauthorized".
 */
@Injectable()
export class JwtAuthGuard extends AuthGuard('jwt') {
  constructor(private readonly reflector: Reflector) {
    super();
  }

  override canActivate(context: ExecutionContext) {
    const isPublic = this.reflector.getAllAndOverride<boolean>(IS_PUBLIC_KEY, [context.getHandler(), context.getClass()]);
    if (isPublic) return true;
    return super.canActivate(context);
  }

  /** err: what validate() threw (a refusal naming why, or a database fault, passed on as is); info: passport-jwt's reason when the token itself failed. */
  override handleRequest<TUser>(err: unknown, user: TUser | false, info: unknown): TUser {
    if (err) throw err;
    if (user) return user;
    if (info instanceof TokenExpiredError) throw new UnauthorizedException('The token has expired; sign in again');
    if (info instanceof NotBeforeError) throw new UnauthorizedException('The token is not valid yet; sign in again');
    // passport-jwt's own words when ExtractJwt found no bearer token.
    if (info instanceof Error && info.message === 'No auth token') throw new UnauthorizedException('Sign in first: this route needs a bearer token');
    throw new UnauthorizedException('The token is not valid; sign in again');
  }
}
