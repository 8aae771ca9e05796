import { Global, Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { ENV, type Env } from '../config/env';
import { RawRows } from './raw-rows';
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
  providers: [RawRows],
  exports: [RawRows],
})
export class DatabaseModule {}
