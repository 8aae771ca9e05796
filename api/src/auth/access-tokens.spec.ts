import { UnauthorizedException } from '@nestjs/common';
import { JwtService } from '@nestjs/jwt';
import type { Env } from '../config/env';
import type { UsersRepository } from '../users/users.repository';
import { AccessTokens, JWT_ALGORITHM, VERIFIED_TOKENS_KEPT } from './access-tokens';

// The claims and checks are RFC 7519 (exp, nbf, iss, aud) as jsonwebtoken applies them; the
// cache must not change any answer, so each case is asked twice (once verified, once kept).
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
  const tokens = new AccessTokens(env, new JwtService({}), users);
  return { rows, reads, tokens };
}

const bearer = (claims: object, options: { expiresIn?: number; secret?: string } = { expiresIn: 600 }) =>
  `Bearer ${signer.sign(claims, { ...(options.expiresIn !== undefined ? { expiresIn: options.expiresIn } : {}), ...(options.secret ? { secret: options.secret } : {}) })}`;

async function refusal(tokens: AccessTokens, header: string | undefined): Promise<string | null> {
  try {
    await tokens.userOf(header);
    return null;
  } catch (error) {
    expect(error).toBeInstanceOf(UnauthorizedException);
    return (error as UnauthorizedException).message;
  }
}

describe('AccessTokens', () => {
  afterEach(() => jest.useRealTimers());

  it('reads the users row on every request, also for a token it has already verified', async () => {
    const { tokens, reads, rows } = setup();
    const header = bearer({ sub: 7, role: 'engineer', tv: 3 });
    expect(await tokens.userOf(header)).toEqual({ id: 7, email: 'e@demo.test', name: 'Eve Engineer', role: 'engineer' });
    expect(await tokens.userOf(header)).toEqual({ id: 7, email: 'e@demo.test', name: 'Eve Engineer', role: 'engineer' });
    expect(reads).toEqual([7, 7]);
    // Logout (version bump), deactivation and a role change end the kept token at once.
    rows.get(7)!.tokenVersion = 4;
    expect(await refusal(tokens, header)).toMatch(/session has ended/);
    rows.get(7)!.tokenVersion = 3;
    rows.get(7)!.active = false;
    expect(await refusal(tokens, header)).toMatch(/session has ended/);
    rows.get(7)!.active = true;
    rows.get(7)!.role = 'admin';
    expect(await refusal(tokens, header)).toMatch(/session has ended/);
    rows.delete(7);
    expect(await refusal(tokens, header)).toMatch(/session has ended/);
  });

  it('refuses a kept token once it has expired', async () => {
    const { tokens } = setup();
    const start = Date.now();
    jest.useFakeTimers({ now: start });
    const header = bearer({ sub: 7, role: 'engineer', tv: 3 }, { expiresIn: 60 });
    expect(await refusal(tokens, header)).toBeNull();
    jest.setSystemTime(start + 59_000);
    expect(await refusal(tokens, header)).toBeNull();
    jest.setSystemTime(start + 61_000);
    expect(await refusal(tokens, header)).toMatch(/expired/);
    expect(await refusal(tokens, header)).toMatch(/expired/); // and again, now verified afresh
  });

  it('refuses a kept token before its nbf', async () => {
    const { tokens } = setup();
    const now = Math.floor(Date.now() / 1000);
    const header = bearer({ sub: 7, role: 'engineer', tv: 3, nbf: now + 120 });
    expect(await refusal(tokens, header)).toMatch(/not valid/);
  });

  it('refuses a missing header, another scheme, a wrong signature, issuer or audience, alg none, and a token without expiry, every time', async () => {
    const { tokens, reads } = setup();
    const claims = { sub: 7, role: 'engineer', tv: 3 };
    const none = `${Buffer.from('{"alg":"none","typ":"JWT"}').toString('base64url')}.${Buffer.from(JSON.stringify({ ...claims, exp: Math.floor(Date.now() / 1000) + 600, iss: env.JWT_ISSUER, aud: env.JWT_AUDIENCE })).toString('base64url')}.`;
    const cases: Array<[string | undefined, RegExp]> = [
      [undefined, /bearer token/],
      ['Basic dXNlcjpwYXNz', /bearer token/],
      [bearer(claims, { expiresIn: 600, secret: 'another-secret-another-secret-0123' }), /not valid/],
      [`Bearer ${new JwtService({ secret: env.JWT_SECRET }).sign(claims, { issuer: 'elsewhere', audience: env.JWT_AUDIENCE, expiresIn: 600 })}`, /not valid/],
      [`Bearer ${new JwtService({ secret: env.JWT_SECRET }).sign(claims, { issuer: env.JWT_ISSUER, audience: 'elsewhere', expiresIn: 600 })}`, /not valid/],
      [`Bearer ${none}`, /not valid/],
      [bearer(claims, {}), /no expiry/],
    ];
    for (const [header, message] of cases) {
      expect({ header, refusal: await refusal(tokens, header) }).toEqual({ header, refusal: expect.stringMatching(message) });
      expect({ header, refusal: await refusal(tokens, header) }).toEqual({ header, refusal: expect.stringMatching(message) });
    }
    expect(reads).toEqual([]);
  });

  it('keeps at most VERIFIED_TOKENS_KEPT tokens, the oldest going first', async () => {
    const { tokens } = setup();
    const kept = (tokens as unknown as { verified: Map<string, unknown> }).verified;
    const first = bearer({ sub: 7, role: 'engineer', tv: 3, n: 0 });
    await tokens.userOf(first);
    for (let n = 1; n <= VERIFIED_TOKENS_KEPT; n++) await tokens.userOf(bearer({ sub: 7, role: 'engineer', tv: 3, n }));
    expect(kept.size).toBe(VERIFIED_TOKENS_KEPT);
    expect(kept.has(first.slice('Bearer '.length))).toBe(false);
  });
});
