import { Global, Module } from '@nestjs/common';
import { RateLimitGuard } from './rate-limit.guard';
import { RateLimitsRepository } from './rate-limits.repository';

/** Database-counted rate limits; routes opt in with @RateLimit(kind). */
@Global()
@Module({
  providers: [RateLimitsRepository, RateLimitGuard],
  exports: [RateLimitsRepository, RateLimitGuard],
})
export class RateLimitsModule {}
