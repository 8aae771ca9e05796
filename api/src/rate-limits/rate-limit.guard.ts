import { HttpException, HttpStatus, Inject, Injectable, type CanActivate, type ExecutionContext } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import type { Request, Response } from 'express';
import type { AuthUser } from '../common/decorators/current-user.decorator';
import { ENV, type Env } from '../config/env';
import { RateLimitsRepository } from './rate-limits.repository';

export const RATE_LIMIT_KEY = 'shuntwise:rate-limit';

/**
 * The limits a route counts against:
 * - `sign-in`: per client address and per account (the e-mail in the body);
 * - `public-form`: per client address (invitation acceptance);
 * - `upload`: per signed-in user (datasheets, CSV imports and previews).
 */
export type RateLimitKind = 'sign-in' | 'public-form' | 'upload';

interface Check {
  name: string;
  key: string;
  limit: number;
  windowSeconds: number;
}

/**
 * Counts the request against its route's limits in the database (shared by every replica)
 * and answers 429 with a standard Retry-After (seconds) once any of them is spent. The
 * client address is `req.ip`, which follows X-Forwarded-For only from proxies named in
 * TRUST_PROXY. Own code rather than @nestjs/throttler: its keys cannot come from the body
 * (per account) and its Retry-After header carries the throttler's name when there are several.
 */
@Injectable()
export class RateLimitGuard implements CanActivate {
  constructor(
    private readonly reflector: Reflector,
    private readonly counters: RateLimitsRepository,
    @Inject(ENV) private readonly env: Env,
  ) {}

  async canActivate(context: ExecutionContext): Promise<boolean> {
    const kind = this.reflector.get<RateLimitKind | undefined>(RATE_LIMIT_KEY, context.getHandler());
    if (!kind) return true;
    const req = context.switchToHttp().getRequest<Request & { user?: AuthUser }>();
    const checks = this.checksFor(kind, req);
    // Every check counts (in parallel, each its own short transaction), even when one is already spent.
    const counts = await Promise.all(checks.map((c) => this.counters.hit(c.name, c.key, c.windowSeconds)));
    const retryAfter = Math.max(0, ...counts.map(({ hits, secondsLeft }, i) => (hits > checks[i].limit ? secondsLeft : 0)));
    if (retryAfter === 0) return true;
    context.switchToHttp().getResponse<Response>().setHeader('Retry-After', String(retryAfter));
    const what = kind === 'upload' ? 'uploads' : 'attempts';
    throw new HttpException(`Too many ${what}; wait ${retryAfter} s and try again`, HttpStatus.TOO_MANY_REQUESTS);
  }

  private checksFor(kind: RateLimitKind, req: Request & { user?: AuthUser }): Check[] {
    const env = this.env;
    const address = req.ip ?? req.socket.remoteAddress ?? 'unknown';
    const perAddress = env.LOGIN_RATE_LIMIT_PER_ADDRESS ?? env.LOGIN_RATE_LIMIT * 5;
    const window = env.LOGIN_RATE_WINDOW_SECONDS;
    switch (kind) {
      case 'sign-in': {
        const checks: Check[] = [{ name: 'sign-in:address', key: address, limit: perAddress, windowSeconds: window }];
        const email = (req.body as { email?: unknown } | undefined)?.email;
        if (typeof email === 'string' && email.trim()) {
          checks.push({ name: 'sign-in:account', key: email.trim().toLowerCase().slice(0, 320), limit: env.LOGIN_RATE_LIMIT, windowSeconds: window });
        }
        return checks;
      }
      case 'public-form':
        return [{ name: 'public-form:address', key: address, limit: perAddress, windowSeconds: window }];
      case 'upload':
        // Global guards ran first, so the user is known; an anonymous request never gets here.
        return [{ name: 'upload:user', key: String(req.user?.id ?? address), limit: env.UPLOAD_RATE_LIMIT, windowSeconds: env.UPLOAD_RATE_WINDOW_SECONDS }];
    }
  }
}
