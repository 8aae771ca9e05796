import { Sequelize } from 'sequelize';
import { SequelizeStorage, Umzug } from 'umzug';
import type { MigrationContext } from './migration';
import { MIGRATIONS } from './migrations';

/** The only way the schema changes: umzug over the explicit list in migrations/index.ts. */
export function createMigrator(sequelize: Sequelize, log = false): Umzug<MigrationContext> {
  return new Umzug<MigrationContext>({
    migrations: MIGRATIONS.map((m) => ({
      name: m.name,
      up: ({ context }) => m.up(context),
      down: ({ context }) => m.down(context),
    })),
    context: { queryInterface: sequelize.getQueryInterface(), sequelize },
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
    logger: log ? console : undefined,
  });
}

export async function migrateUp(sequelize: Sequelize, log = false): Promise<string[]> {
  const done = await createMigrator(sequelize, log).up();
  return done.map((m) => m.name);
}
