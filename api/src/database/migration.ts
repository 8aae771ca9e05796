import type { QueryInterface, Sequelize } from 'sequelize';

/** One schema step. `up` and `down` get the same context; `down` undoes `up` exactly. */
export interface Migration {
  name: string;
  up(ctx: MigrationContext): Promise<void>;
  down(ctx: MigrationContext): Promise<void>;
}

export interface MigrationContext {
  queryInterface: QueryInterface;
  sequelize: Sequelize;
}
