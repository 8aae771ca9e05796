import { ForbiddenException, Injectable, type CanActivate, type ExecutionContext } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import type { Role } from '@shuntwise/contracts';
import type { AuthUser } from '../decorators/current-user.decorator';
import { IS_PUBLIC_KEY } from '../decorators/public.decorator';
import { ROLES_KEY } from '../decorators/roles.decorator';

/**
 * Global, after the JWT guard: a private route must declare its roles. A route with no
 * @Roles is refused for everyone (deny by default), so a forgotten decorator fails closed.
 */
@Injectable()
export class RolesGuard implements CanActivate {
  constructor(private readonly reflector: Reflector) {}

  canActivate(context: ExecutionContext): boolean {
    const targets = [context.getHandler(), context.getClass()];
    if (this.reflector.getAllAndOverride<boolean>(IS_PUBLIC_KEY, targets)) return true;
    const roles = this.reflector.getAllAndOverride<Role[] | undefined>(ROLES_KEY, targets);
    const user = context.switchToHttp().getRequest<{ user?: AuthUser }>().user;
    if (!roles || roles.length === 0) throw new ForbiddenException('This route declares no roles and is closed');
    if (!user || !roles.includes(user.role)) throw new ForbiddenException(`Your role may not do this (allowed: ${roles.join(', ')})`);
    return true;
  }
}
