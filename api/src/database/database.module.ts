import { Global, Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { ENV, type Env } from '../config/env';
import { DatabaseProbe } from './database-probe';
import { RawRows } from './raw-rows';
import { UnitOfWork } from './unit-of-work';
import { sequelizeOptions } from './sequelize-options';

/** MariaDB through Sequelize. Models register themselves with SequelizeModule.forFeature; the schema comes from migrations only. */
@Global()
@Module({
  imports: [
    SequelizeModule.forRootAsync({
      inject: [ENV],
      useFactory: (env: Env) => ({
        ...sequelizeOptions(env),
        autoLoadModels: true,
        synchronize: false,
      }),
    }),
  ],
  providers: [RawRows, UnitOfWork, DatabaseProbe],
  exports: [RawRows, UnitOfWork, DatabaseProbe],
})
export class DatabaseModule {}
