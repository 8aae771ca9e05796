import { createSecretKey } from 'node:crypto';
import { Inject, Injectable, UnauthorizedException } from '@nestjs/common';
import { PassportStrategy } from '@nestjs/passport';
import { ExtractJwt, Strategy } from 'passport-jwt';
import type { AuthUser } from '../common/decorators/current-user.decorator';
import { ENV, type Env } from '../config/env';
import { UsersRepository } from '../users/users.repository';

export interface JwtPayload {
  sub: number;
  role: string;
  /** The user's token version when the token was issued. */
  tv: number;
  /** Expiry (seconds since the epoch); jsonwebtoken checks it only when present, so validate() requires it. */
  exp?: number;
}

export const JWT_ALGORITHM = 'HS256' as const;

/** Checks signature (HS256 only), expiry (which must be present), issuer and audience, then that the user is still active and the token not ended. */
@Injectable()
export class JwtStrategy extends PassportStrategy(Strategy) {
  constructor(
    @Inject(ENV) env: Env,
    private readonly users: UsersRepository,
  ) {
    super({
      jwtFromRequest: ExtractJwt.fromAuthHeaderAsBearerToken(),
      // A key object, not the string: jsonwebtoken otherwise tries (and fails, with a thrown
      // error) to read the string as a public key on every request. passport-jwt hands it to
      // jsonwebtoken.verify unchanged; its types only list string and Buffer.
      secretOrKey: createSecretKey(Buffer.from(env.JWT_SECRET, 'utf8')) as unknown as Buffer,
      algorithms: [JWT_ALGORITHM],
      issuer: env.JWT_ISSUER,
      audience: env.JWT_AUDIENCE,
      ignoreExpiration: false,
    });
  }

  async validate(payload: JwtPayload): Promise<AuthUser> {
    // A correctly signed token without an expiry would be good forever: refuse it.
    if (typeof payload.exp !== 'number' || !Number.isFinite(payload.exp)) throw new UnauthorizedException('The token has no expiry; sign in again');
    const user = typeof payload.sub === 'number' ? await this.users.tokenHolder(payload.sub) : null;
    if (!user || !user.active || user.tokenVersion !== payload.tv || user.role !== payload.role) {
      throw new UnauthorizedException('Your session has ended; sign in again');
    }
    return { id: user.id, email: user.email, name: user.name, role: user.role };
  }
}
