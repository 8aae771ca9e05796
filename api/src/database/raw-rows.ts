import { Injectable, type OnModuleDestroy } from '@nestjs/common';
import { InjectConnection } from '@nestjs/sequelize';
import type { Sequelize } from 'sequelize-typescript';

/** The slice of the mariadb driver's connection a raw read uses. */
interface DriverConnection {
  execute(sql: { sql: string; typeCast?: undefined; dateStrings?: boolean }, values?: unknown[]): Promise<unknown>;
  query(sql: { sql: string; typeCast?: undefined; dateStrings?: boolean }, values?: unknown[]): Promise<unknown>;
  isValid(): boolean;
}

interface PooledConnections {
  getConnection(options: { type: 'read' | 'write'; useMaster?: boolean }): Promise<DriverConnection>;
  releaseConnection(connection: DriverConnection): void;
}

/**
 * How many of Sequelize's pooled connections the raw reads keep for themselves. Each carries
 * many reads at once (the driver pipelines them: sent back to back, answered in order), so one
 * per process would do for primary-key reads; the second keeps one slow read from holding up
 * every request's token check behind it.
 */
export const RAW_READ_CONNECTIONS = 2;

/**
 * Hot single-statement reads straight through the mariadb driver: no model instances, no query
 * building, no result reshaping. A CPU profile of the request path under load put most of the
 * API's own time in Sequelize's query path (see DEVELOPERS.md, "Profiling"). For reads only,
 * outside transactions; every write stays with the repositories' Sequelize calls.
 *
 * - Prepared statements (`execute`): MariaDB parses each statement once per connection.
 * - No Sequelize type-cast callback per column: the driver's own decoders. DATETIME columns
 *   come back as the stored text (UTC, as Sequelize writes them); read them with `utcDate`.
 * - The reads keep RAW_READ_CONNECTIONS connections borrowed from Sequelize's pool and share
 *   them (round robin) instead of borrowing one per read: the pool's acquire and release (three
 *   awaits, hooks and a timer each) and a socket write and read per statement were about a
 *   quarter of a card read's CPU; pipelined reads share writes and reads. A connection that
 *   fails is given back (the pool's validation drops a dead one) and the next read borrows
 *   afresh, so a database restart or a node failover costs the reads in flight, as before.
 *   They go back to the pool when the app closes (before Sequelize drains it).
 */
@Injectable()
export class RawRows implements OnModuleDestroy {
  private readonly held: Array<Promise<DriverConnection> | null> = new Array<Promise<DriverConnection> | null>(RAW_READ_CONNECTIONS).fill(null);
  private next = 0;
  private closed = false;

  constructor(@InjectConnection() private readonly sequelize: Sequelize) {}

  async select<T>(sql: string, values: unknown[]): Promise<T[]> {
    const slot = this.next;
    this.next = (slot + 1) % RAW_READ_CONNECTIONS;
    const connection = await this.connection(slot);
    try {
      return (await connection.execute({ sql, typeCast: undefined, dateStrings: true }, values)) as T[];
    } catch (error) {
      if (!connection.isValid()) this.giveBack(slot, connection);
      throw error;
    }
  }

  /**
   * A longer read whose text varies with its input (lists of ids, optional filters), such as the
   * designers' search: through the driver's text protocol (no prepared statement kept per text)
   * on a connection borrowed from the pool for this statement alone, so it never holds up the
   * primary-key reads pipelined on the held connections. Same decoding as `select`.
   */
  async query<T>(sql: string, values: unknown[]): Promise<T[]> {
    if (this.closed) throw new Error('The database connections are closed');
    const connection = await this.pool.getConnection({ type: 'read' });
    try {
      return (await connection.query({ sql, typeCast: undefined, dateStrings: true }, values)) as T[];
    } finally {
      this.pool.releaseConnection(connection);
    }
  }

  onModuleDestroy(): Promise<void> {
    this.closed = true;
    return this.releaseAll();
  }

  private get pool(): PooledConnections {
    return this.sequelize.connectionManager as unknown as PooledConnections;
  }

  private connection(slot: number): Promise<DriverConnection> {
    const held = this.held[slot];
    if (held) return held;
    if (this.closed) return Promise.reject(new Error('The database connections are closed'));
    const borrowed = this.pool.getConnection({ type: 'read' });
    this.held[slot] = borrowed;
    // A failed borrow (database away) is not kept: the next read tries again.
    borrowed.catch(() => {
      if (this.held[slot] === borrowed) this.held[slot] = null;
    });
    return borrowed;
  }

  private giveBack(slot: number, connection: DriverConnection): void {
    const held = this.held[slot];
    if (!held) return;
    void held.then(
      (current) => {
        if (current !== connection || this.held[slot] !== held) return;
        this.held[slot] = null;
        this.pool.releaseConnection(connection);
      },
      () => undefined,
    );
  }

  private async releaseAll(): Promise<void> {
    const held = this.held.splice(0, this.held.length, ...new Array<null>(this.held.length).fill(null));
    for (const borrowed of held) {
      const connection = borrowed && (await borrowed.catch(() => null));
      if (connection) this.pool.releaseConnection(connection);
    }
  }
}

/** A DATETIME read by RawRows (the stored UTC text, `YYYY-MM-DD HH:MM:SS[.ffffff]`) as a Date. */
export function utcDate(stored: string): Date {
  return new Date(`${stored.replace(' ', 'T')}Z`);
}
