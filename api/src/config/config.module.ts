import { Global, Module, type DynamicModule } from '@nestjs/common';
import { ENV, type Env } from './env';

/** Provides the environment parsed once at start-up (see env.ts) under the ENV token. */
@Global()
@Module({})
export class ConfigModule {
  static forRoot(env: Env): DynamicModule {
    return { module: ConfigModule, global: true, providers: [{ provide: ENV, useValue: env }], exports: [ENV] };
  }
}
