import { SetMetadata, UseGuards, applyDecorators } from '@nestjs/common';
import { RATE_LIMIT_KEY, RateLimitGuard, type RateLimitKind } from './rate-limit.guard';

/** Counts the route's requests against the database-held limits of `kind` (see RateLimitGuard). */
export const RateLimit = (kind: RateLimitKind) => applyDecorators(SetMetadata(RATE_LIMIT_KEY, kind), UseGuards(RateLimitGuard));
