import { createSecretKey, type KeyObject } from 'node:crypto';
import { Inject, Injectable, UnauthorizedException } from '@nestjs/common';
import { JwtService } from '@nestjs/jwt';
import type { AuthUser } from '../common/decorators/current-user.decorator';
import { ENV, type Env } from '../config/env';
import { UsersRepository } from '../users/users.repository';

export interface JwtPayload {
  sub: number;
  role: string;
  /** The user's token version when the token was issued. */
  tv: number;
  /** Expiry (seconds since the epoch); jsonwebtoken checks it only when present, so the check here requires it. */
  exp?: number;
  /** Not before (seconds since the epoch); our tokens carry none, a hand-made one may. */
  nbf?: number;
}

export const JWT_ALGORITHM = 'HS256' as const;

/** How many verified tokens' claims are kept (a few hundred bytes each); the oldest go first. */
export const VERIFIED_TOKENS_KEPT = 10_000;

const BEARER = /^\s*bearer\s+(\S+)\s*$/i;

/**
 * The token check behind the global JwtAuthGuard: signature (HS256 only), expiry (which must be
 * present), issuer and audience by jsonwebtoken, then — on every request — the users row: the
 * user must still be active, hold the role the token names and the token version it was issued
 * with. Logout (a version bump), deactivation and a role change therefore end a token on the
 * next request on every replica.
 *
 * The claims of a token whose signature checked out are kept in memory (at most
 * VERIFIED_TOKENS_KEPT, keyed by the whole token, until its expiry): a signed token's claims
 * cannot change, so re-checking the HMAC and re-parsing the claims on every request bought
 * nothing. Only the signature check is saved; the row read above is not cached. A token that
 * fails is never kept.
 */
@Injectable()
export class AccessTokens {
  /** A key object, not the string: jsonwebtoken otherwise tries (and fails) to read the string as a public key on every check. */
  private readonly key: KeyObject;
  private readonly verified = new Map<string, JwtPayload & { exp: number }>();

  constructor(
    @Inject(ENV) private readonly env: Env,
    private readonly jwt: JwtService,
    private readonly users: UsersRepository,
  ) {
    this.key = createSecretKey(Buffer.from(env.JWT_SECRET, 'utf8'));
  }

  /** The user a request's `Authorization: Bearer …` header stands for, or a 401 naming why not. */
  async userOf(authorization: string | undefined): Promise<AuthUser> {
    const token = authorization === undefined ? null : BEARER.exec(authorization)?.[1];
    if (!token) throw new UnauthorizedException('Sign in first: this route needs a bearer token');
    const claims = this.claimsOf(token);
    const user = typeof claims.sub === 'number' ? await this.users.tokenHolder(claims.sub) : null;
    if (!user || !user.active || user.tokenVersion !== claims.tv || user.role !== claims.role) {
      throw new UnauthorizedException('Your session has ended; sign in again');
    }
    return { id: user.id, email: user.email, name: user.name, role: user.role };
  }

  /** The token's claims once its signature, algorithm, issuer, audience and times check out. */
  private claimsOf(token: string): JwtPayload & { exp: number } {
    const now = Math.floor(Date.now() / 1000);
    const known = this.verified.get(token);
    if (known) {
      // The same time checks jsonwebtoken makes, against this moment.
      if (now < known.exp && (known.nbf === undefined || known.nbf <= now)) return known;
      this.verified.delete(token);
      throw new UnauthorizedException('The token has expired; sign in again');
    }
    let claims: JwtPayload;
    try {
      claims = this.jwt.verify<JwtPayload>(token, {
        secret: this.key as unknown as string, // jsonwebtoken takes a KeyObject; @nestjs/jwt's types list only string and Buffer
        algorithms: [JWT_ALGORITHM],
        issuer: this.env.JWT_ISSUER,
        audience: this.env.JWT_AUDIENCE,
      });
    } catch {
      throw new UnauthorizedException('The token is not valid or has expired; sign in again');
    }
    // A correctly signed token without an expiry would be good forever: refuse it.
    if (typeof claims.exp !== 'number' || !Number.isFinite(claims.exp)) throw new UnauthorizedException('The token has no expiry; sign in again');
    const kept = claims as JwtPayload & { exp: number };
    if (this.verified.size >= VERIFIED_TOKENS_KEPT) this.verified.delete(this.verified.keys().next().value!);
    this.verified.set(token, kept);
    return kept;
  }
}
