import { Injectable } from '@nestjs/common';
import { InjectConnection } from '@nestjs/sequelize';
import type { Sequelize } from 'sequelize-typescript';

/** The slice of the mariadb driver's connection a raw read uses. */
interface DriverConnection {
  execute(sql: { sql: string; typeCast?: undefined; dateStrings?: boolean }, values?: unknown[]): Promise<unknown>;
}

interface PooledConnections {
  getConnection(options: { type: 'read' | 'write'; useMaster?: boolean }): Promise<DriverConnection>;
  releaseConnection(connection: DriverConnection): void;
}

/**
 * Hot single-statement reads straight through the mariadb driver on a connection borrowed
 * from Sequelize's pool: no model instances, no query building, no result reshaping. A CPU
 * profile of the request path under load put most of the API's own time in Sequelize's
 * query path (see DEVELOPERS.md, "Profiling"). For reads only, outside
 * transactions; every write stays with the repositories' Sequelize calls.
 */
@Injectable()
export class RawRows {
  constructor(@InjectConnection() private readonly sequelize: Sequelize) {}

  async select<T>(sql: string, values: unknown[]): Promise<T[]> {
    const pool = this.sequelize.connectionManager as unknown as PooledConnections;
    const connection = await pool.getConnection({ type: 'read' });
    try {
      return (await connection.execute({ sql, typeCast: undefined, dateStrings: true }, values)) as T[];
    } finally {
      pool.releaseConnection(connection);
    }
  }
}
