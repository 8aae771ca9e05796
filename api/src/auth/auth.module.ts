import { Module } from '@nestjs/common';
import { JwtModule } from '@nestjs/jwt';
import { PassportModule } from '@nestjs/passport';
import { ENV, type Env } from '../config/env';
import { UsersModule } from '../users/users.module';
import { AuthController } from './auth.controller';
import { AuthService } from './auth.service';
import { JWT_ALGORITHM, JwtStrategy } from './jwt.strategy';

@Module({
  imports: [
    UsersModule,
    PassportModule,
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
  // JwtStrategy registers itself with passport as 'jwt' for the global JwtAuthGuard (AppModule).
  providers: [AuthService, JwtStrategy],
})
export class AuthModule {}
