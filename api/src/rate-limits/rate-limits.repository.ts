import { createHash } from 'node:crypto';
import { Injectable } from '@nestjs/common';
import { InjectConnection } from '@nestjs/sequelize';
import { QueryTypes, type Sequelize } from 'sequelize';

export interface WindowCount {
  /** Hits in the current window, this one included. */
  hits: number;
  /** Whole seconds until the window ends (at least 1). */
  secondsLeft: number;
}

/**
 * Window counters in `rate_limit_windows`, on the database's clock, so that every API
 * replica counts into the same row. A window opens at a bucket's first hit and lasts
 * `windowSeconds` (no calendar boundary to slip through). The upsert is atomic (INSERT …
 * ON DUPLICATE KEY UPDATE holds the row lock); the read in the same transaction sees this
 * request's own count. MariaDB applies the assignments left to right, so each IF still
 * sees the old expires_at, which is assigned last.
 */
@Injectable()
export class RateLimitsRepository {
  private calls = 0;

  constructor(@InjectConnection() private readonly sequelize: Sequelize) {}

  async hit(limitName: string, key: string, windowSeconds: number): Promise<WindowCount> {
    const bucket = createHash('sha256').update(`${limitName}\0${key}`).digest('hex');
    const rows = await this.sequelize.transaction(async (transaction) => {
      await this.sequelize.query(
        `INSERT INTO rate_limit_windows (bucket, window_start, hits, expires_at)
         VALUES (?, NOW(3), 1, NOW(3) + INTERVAL ? SECOND)
         ON DUPLICATE KEY UPDATE
           hits = IF(expires_at <= NOW(3), 1, hits + 1),
           window_start = IF(expires_at <= NOW(3), NOW(3), window_start),
           expires_at = IF(expires_at <= NOW(3), NOW(3) + INTERVAL ? SECOND, expires_at)`,
        { replacements: [bucket, windowSeconds, windowSeconds], type: QueryTypes.INSERT, transaction },
      );
      return this.sequelize.query<{ hits: number; secondsLeft: number | string }>(
        'SELECT hits, TIMESTAMPDIFF(MICROSECOND, NOW(3), expires_at) / 1e6 AS secondsLeft FROM rate_limit_windows WHERE bucket = ?',
        { replacements: [bucket], type: QueryTypes.SELECT, transaction },
      );
    });
    if (++this.calls % 200 === 0) void this.prune();
    const row = rows[0];
    return { hits: Number(row?.hits ?? 1), secondsLeft: Math.max(1, Math.ceil(Number(row?.secondsLeft ?? windowSeconds))) };
  }

  /** Drops ended windows, a bounded batch at a time; failures only delay the clean-up. */
  async prune(): Promise<void> {
    await this.sequelize.query('DELETE FROM rate_limit_windows WHERE expires_at < NOW() LIMIT 1000', { type: QueryTypes.DELETE }).catch(() => undefined);
  }
}
