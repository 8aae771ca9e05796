import { UnauthorizedException } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import { ExecutionContextHost } from '@nestjs/core/helpers/execution-context-host';
import { JwtService } from '@nestjs/jwt';
import { JwtAuthGuard } from '../common/guards/jwt-auth.guard';
import type { Env } from '../config/env';
import type { UsersRepository } from '../users/users.repository';
import { JWT_ALGORITHM, JwtStrategy } from './jwt.strategy';

// The claims and checks are RFC 7519 (exp, nbf, iss, aud) as jsonwebtoken applies them, reached
// here the way a request reaches them: the global guard (AuthGuard('jwt')) → passport →
// passport-jwt → JwtStrategy.validate. Each refusal is asked twice: nothing about a token may
// be remembered between requests that changes the second answer.
const env = { JWT_SECRET: 'a-test-secret-of-some-length-0123456789', JWT_ISSUER: 'shuntwise-test', JWT_AUDIENCE: 'shuntwise-test-api' } as Env;
const signer = new JwtService({ secret: env.JWT_SECRET, signOptions: { algorithm: JWT_ALGORITHM, issuer: env.JWT_ISSUER, audience: env.JWT_AUDIENCE } });

interface Row {
  id: number;
  email: string;
  name: string;
  role: 'engineer' | 'admin' | 'designer' | 'buyer';
  active: boolean;
  tokenVersion: number;
}

class Route {
  handle() {}
}

function setup() {
  const rows = new Map<number, Row>([[7, { id: 7, email: 'e@demo.test', name: 'Eve Engineer', role: 'engineer', active: true, tokenVersion: 3 }]]);
  const reads: number[] = [];
  const users = {
    tokenHolder: (id: number) => {
      reads.push(id);
      const row = rows.get(id);
      return Promise.resolve(row ? { ...row } : null);
    },
  } as unknown as UsersRepository;
  // Registers itself with passport as 'jwt', as Nest does when AuthModule starts.
  new JwtStrategy(env, users);
  const guard = new JwtAuthGuard(new Reflector());
  /** The user the guard puts on the request for this Authorization header (it throws when it refuses). */
  const userOf = async (authorization: string | undefined) => {
    const req: { headers: Record<string, string>; user?: unknown } = { headers: authorization === undefined ? {} : { authorization } };
    const context = new ExecutionContextHost([req, {}, () => undefined], Route, Route.prototype.handle);
    expect(await guard.canActivate(context)).toBe(true);
    return req.user;
  };
  return { rows, reads, userOf };
}

const bearer = (claims: object, options: { expiresIn?: number; secret?: string } = { expiresIn: 600 }) =>
  `Bearer ${signer.sign(claims, { ...(options.expiresIn !== undefined ? { expiresIn: options.expiresIn } : {}), ...(options.secret ? { secret: options.secret } : {}) })}`;

async function refusal(userOf: (header: string | undefined) => Promise<unknown>, header: string | undefined): Promise<string | null> {
  try {
    await userOf(header);
    return null;
  } catch (error) {
    expect(error).toBeInstanceOf(UnauthorizedException);
    return (error as UnauthorizedException).message;
  }
}

describe('JwtAuthGuard over passport-jwt (JwtStrategy)', () => {
  afterEach(() => jest.useRealTimers());

  it('reads the users row on every request, and ends the token at once on logout, deactivation, role change or removal — each asked twice', async () => {
    const { userOf, reads, rows } = setup();
    const header = bearer({ sub: 7, role: 'engineer', tv: 3 });
    expect(await userOf(header)).toEqual({ id: 7, email: 'e@demo.test', name: 'Eve Engineer', role: 'engineer' });
    expect(await userOf(header)).toEqual({ id: 7, email: 'e@demo.test', name: 'Eve Engineer', role: 'engineer' });
    expect(reads).toEqual([7, 7]);
    // Logout (version bump), deactivation, a role change and a removed user.
    const changes: Array<[string, (row: Row) => void]> = [
      ['token version', (row) => (row.tokenVersion = 4)],
      ['deactivated', (row) => (row.active = false)],
      ['role', (row) => (row.role = 'admin')],
    ];
    for (const [what, change] of changes) {
      const saved = { ...rows.get(7)! };
      change(rows.get(7)!);
      expect({ what, refusal: await refusal(userOf, header) }).toEqual({ what, refusal: expect.stringMatching(/session has ended/) });
      expect({ what, refusal: await refusal(userOf, header) }).toEqual({ what, refusal: expect.stringMatching(/session has ended/) });
      rows.set(7, saved);
      expect(await refusal(userOf, header)).toBeNull(); // the row put back, the token counts again: nothing was remembered
    }
    rows.delete(7);
    expect(await refusal(userOf, header)).toMatch(/session has ended/);
    expect(await refusal(userOf, header)).toMatch(/session has ended/);
    expect(reads).toHaveLength(2 + 3 * 3 + 2);
  });

  it('refuses a token once it has expired, every time', async () => {
    const { userOf } = setup();
    const start = Date.now();
    jest.useFakeTimers({ now: start });
    const header = bearer({ sub: 7, role: 'engineer', tv: 3 }, { expiresIn: 60 });
    expect(await refusal(userOf, header)).toBeNull();
    jest.setSystemTime(start + 59_000);
    expect(await refusal(userOf, header)).toBeNull();
    jest.setSystemTime(start + 61_000);
    expect(await refusal(userOf, header)).toMatch(/expired/);
    expect(await refusal(userOf, header)).toMatch(/expired/);
  });

  it('refuses a token before its nbf', async () => {
    const { userOf } = setup();
    const now = Math.floor(Date.now() / 1000);
    const header = bearer({ sub: 7, role: 'engineer', tv: 3, nbf: now + 120 });
    expect(await refusal(userOf, header)).toMatch(/not valid yet/);
    expect(await refusal(userOf, header)).toMatch(/not valid yet/);
  });

  it('refuses a missing header, another scheme, a wrong signature, issuer or audience, alg none, and a token without expiry, every time, without reading a row', async () => {
    const { userOf, reads } = setup();
    const claims = { sub: 7, role: 'engineer', tv: 3 };
    const none = `${Buffer.from('{"alg":"none","typ":"JWT"}').toString('base64url')}.${Buffer.from(JSON.stringify({ ...claims, exp: Math.floor(Date.now() / 1000) + 600, iss: env.JWT_ISSUER, aud: env.JWT_AUDIENCE })).toString('base64url')}.`;
    const cases: Array<[string | undefined, RegExp]> = [
      [undefined, /bearer token/],
      ['Basic dXNlcjpwYXNz', /bearer token/],
      [bearer(claims, { expiresIn: 600, secret: 'another-secret-another-secret-0123' }), /not valid/],
      [`Bearer ${new JwtService({ secret: env.JWT_SECRET }).sign(claims, { issuer: 'elsewhere', audience: env.JWT_AUDIENCE, expiresIn: 600 })}`, /not valid/],
      [`Bearer ${new JwtService({ secret: env.JWT_SECRET }).sign(claims, { issuer: env.JWT_ISSUER, audience: 'elsewhere', expiresIn: 600 })}`, /not valid/],
      [
        `Bearer ${new JwtService({ secret: env.JWT_SECRET }).sign(claims, { algorithm: 'HS512', issuer: env.JWT_ISSUER, audience: env.JWT_AUDIENCE, expiresIn: 600 })}`,
        /not valid/,
      ],
      [`Bearer ${none}`, /not valid/],
      [bearer(claims, {}), /no expiry/],
    ];
    for (const [header, message] of cases) {
      expect({ header, refusal: await refusal(userOf, header) }).toEqual({ header, refusal: expect.stringMatching(message) });
      expect({ header, refusal: await refusal(userOf, header) }).toEqual({ header, refusal: expect.stringMatching(message) });
    }
    expect(reads).toEqual([]);
  });

  it('passes a database fault on as it is, not as a refusal', async () => {
    const { userOf } = setup();
    const fault = new Error('connection lost');
    const users = { tokenHolder: () => Promise.reject(fault) } as unknown as UsersRepository;
    new JwtStrategy(env, users); // replaces the registered 'jwt'
    await expect(userOf(bearer({ sub: 7, role: 'engineer', tv: 3 }))).rejects.toBe(fault);
  });
});
