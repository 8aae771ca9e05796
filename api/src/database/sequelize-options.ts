import type { Options } from 'sequelize';
import type { Env } from '../config/env';
import { parseDbHosts, pickNode } from './node-failover';

/**
 * Connection settings shared by the Nest module, the migrator and the seed.
 * Raw queries must pass a `type` (QueryTypes.SELECT…): the mariadb 3.x driver makes a
 * result's `meta` non-deletable and Sequelize 6's untyped raw path tries to delete it.
 */
export function sequelizeOptions(env: Env, database = env.DB_NAME): Options {
  const nodes = env.DB_HOSTS ? parseDbHosts(env.DB_HOSTS) : undefined;
  return {
    dialect: 'mariadb',
    host: env.DB_HOST,
    port: env.DB_PORT,
    database,
    username: env.DB_USER,
    password: env.DB_PASSWORD,
    logging: env.DB_LOGGING ? (sql: string) => console.log(sql) : false,
    pool: { max: env.DB_POOL_MAX, min: 0, idle: 10_000, acquire: 20_000 },
    timezone: '+00:00',
    dialectOptions: { connectTimeout: 5_000 },
    define: { underscored: true },
    // Several nodes: each new pooled connection goes to the first node that accepts one.
    hooks: nodes
      ? {
          beforeConnect: async (config) => {
            const node = await pickNode(nodes);
            config.host = node.host;
            config.port = String(node.port);
          },
        }
      : undefined,
  };
}
