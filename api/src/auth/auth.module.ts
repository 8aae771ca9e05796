import { Module } from '@nestjs/common';
import { JwtModule } from '@nestjs/jwt';
import { ENV, type Env } from '../config/env';
import { UsersModule } from '../users/users.module';
import { AuthController } from './auth.controller';
import { AuthService } from './auth.service';
import { AccessTokens, JWT_ALGORITHM } from './access-tokens';

@Module({
  imports: [
    UsersModule,
    JwtModule.registerAsync({
      inject: [ENV],
      useFactory: (env: Env) => ({
        secret: env.JWT_SECRET,
        signOptions: { algorithm: JWT_ALGORITHM, expiresIn: env.JWT_TTL_SECONDS, issuer: env.JWT_ISSUER, audience: env.JWT_AUDIENCE },
        verifyOptions: { algorithms: [JWT_ALGORITHM], issuer: env.JWT_ISSUER, audience: env.JWT_AUDIENCE },
      }),
    }),
  ],
  controllers: [AuthController],
  providers: [AuthService, AccessTokens],
  // For the global JwtAuthGuard (AppModule).
  exports: [AccessTokens],
})
export class AuthModule {}
