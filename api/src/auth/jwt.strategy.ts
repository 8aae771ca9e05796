import { createSecretKey } from 'node:crypto';
import { Inject, Injectable, UnauthorizedException } from '@nestjs/common';
import { PassportStrategy } from '@nestjs/passport';
import { ExtractJwt, Strategy } from 'passport-jwt';
import type { AuthUser } from '../common/decorators/current-user.decorator';
import { ENV, type Env } from '../config/env';
import { UsersRepository } from '../users/users.repository';
import { rememberingVerifier, type TokenVerifier } from './verified-tokens';

export interface JwtPayload {
  sub: number;
  role: string;
  /** The user's token version when the token was issued. */
  tv: number;
  /** Expiry (seconds since the epoch); jsonwebtoken checks it only when present, so validate() requires it. */
  exp?: number;
  /** Not before (seconds since the epoch); our tokens carry none, a hand-made one may. */
  nbf?: number;
}

export const JWT_ALGORITHM = 'HS256' as const;

// passport-jwt verifies through `Strategy.JwtVerifier` (jsonwebtoken.verify), its injection point
// for another verifier; ours remembers tokens it has already accepted (verified-tokens.ts).
const strategyClass = Strategy as unknown as { JwtVerifier: TokenVerifier & { remembers?: true } };
if (!strategyClass.JwtVerifier.remembers)
  strategyClass.JwtVerifier = Object.assign(rememberingVerifier(strategyClass.JwtVerifier), { remembers: true as const });

/** The refusal when the users row no longer matches the token (logout, deactivation, role change, user gone). */
export const SESSION_ENDED = 'Your session has ended; sign in again';

/**
 * The token check behind the global JwtAuthGuard (AuthGuard('jwt')): passport-jwt takes the
 * bearer token and has jsonwebtoken check its signature (HS256 only), expiry, nbf, issuer and
 * audience (a token already accepted is remembered for a minute, its expiry checked again on
 * each request: verified-tokens.ts); validate() then requires an expiry and reads the users row — one
 * raw primary-key read (`UsersRepository.tokenHolder`), never cached: the user must still be
 * active, hold the role the token names and the token version it was issued with. Logout (a
 * version bump), deactivation and a role change therefore end a token on the next request on
 * every replica.
 */
@Injectable()
export class JwtStrategy extends PassportStrategy(Strategy, 'jwt') {
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
      throw new UnauthorizedException(SESSION_ENDED);
    }
    return { id: user.id, email: user.email, name: user.name, role: user.role };
  }
}
