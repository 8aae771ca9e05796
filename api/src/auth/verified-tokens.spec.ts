import { createSecretKey } from 'node:crypto';
import jwt from 'jsonwebtoken';
import { rememberingVerifier, type TokenVerifier } from './verified-tokens';

// The claims are RFC 7519's (exp, iss, aud) as jsonwebtoken checks them; jsonwebtoken itself is
// the reference here: every answer from memory must equal what it answers for the same token.
const secret = 'a-test-secret-of-some-length-0123456789';
const key = createSecretKey(Buffer.from(secret, 'utf8'));
const options = { algorithms: ['HS256'], issuer: 'iss-test', audience: 'aud-test', ignoreExpiration: false };

function counted(): { verify: TokenVerifier; calls: string[] } {
  const calls: string[] = [];
  const verify: TokenVerifier = (token, k, o, done) => {
    calls.push(token);
    jwt.verify(token, k as jwt.Secret, o as jwt.VerifyOptions, (error, payload) => done(error, payload));
  };
  return { verify, calls };
}

const sign = (claims: object, expiresIn: number, withSecret = secret) =>
  jwt.sign(claims, withSecret, { algorithm: 'HS256', issuer: 'iss-test', audience: 'aud-test', expiresIn });

function answer(verify: TokenVerifier, token: string, k: unknown = key, o: Record<string, unknown> = options): { error?: string; payload?: unknown } {
  let result: { error?: string; payload?: unknown } | undefined;
  verify(token, k, o, (error, payload) => (result = error ? { error: error.name } : { payload }));
  if (!result) throw new Error('the verifier did not answer synchronously');
  return result;
}

describe('rememberingVerifier (passport-jwt JwtVerifier)', () => {
  afterEach(() => jest.useRealTimers());

  it('checks an accepted token once, then answers the same claims from memory', () => {
    const { verify, calls } = counted();
    const remembering = rememberingVerifier(verify);
    const token = sign({ sub: 7, tv: 3 }, 600);
    const first = answer(remembering, token);
    expect(first.payload).toMatchObject({ sub: 7, tv: 3, iss: 'iss-test', aud: 'aud-test' });
    expect(answer(remembering, token)).toEqual(first);
    expect(answer(remembering, token)).toEqual(first);
    expect(calls).toHaveLength(1);
  });

  it('never remembers a refusal: a bad signature, another issuer, an expired token are checked every time', () => {
    const { verify, calls } = counted();
    const remembering = rememberingVerifier(verify);
    const good = sign({ sub: 7 }, 600);
    const tampered = good.slice(0, -2) + (good.endsWith('AA') ? 'BB' : 'AA');
    const cases = [
      sign({ sub: 7 }, 600, 'another-secret-another-secret-0123'),
      tampered,
      jwt.sign({ sub: 7 }, secret, { issuer: 'elsewhere', audience: 'aud-test', expiresIn: 600 }),
      sign({ sub: 7 }, -10),
    ];
    for (const token of cases) {
      const reference = answer(verify, token);
      expect(reference.error).toBeDefined();
      expect(answer(remembering, token)).toEqual(reference);
      expect(answer(remembering, token)).toEqual(reference);
    }
    expect(calls).toHaveLength(cases.length * 3);
  });

  it('refuses a remembered token as expired from the second its exp is reached, as jsonwebtoken does', () => {
    const start = 1_900_000_000_000;
    jest.useFakeTimers({ now: start });
    const { verify, calls } = counted();
    const remembering = rememberingVerifier(verify);
    const token = sign({ sub: 7 }, 30);
    expect(answer(remembering, token).payload).toBeDefined();
    jest.setSystemTime(start + 29_999);
    expect(answer(remembering, token).payload).toBeDefined();
    expect(calls).toHaveLength(1);
    jest.setSystemTime(start + 30_000);
    expect(answer(remembering, token)).toEqual({ error: 'TokenExpiredError' });
    expect(answer(verify, token)).toEqual({ error: 'TokenExpiredError' });
  });

  it('forgets after its time limit and keeps no more than its limit of tokens', () => {
    const start = 1_900_000_000_000;
    jest.useFakeTimers({ now: start });
    const { verify, calls } = counted();
    const remembering = rememberingVerifier(verify, { max: 2, ttlMs: 1_000 });
    const [a, b, c] = [1, 2, 3].map((sub) => sign({ sub }, 600));
    answer(remembering, a);
    answer(remembering, a);
    expect(calls).toEqual([a]);
    jest.setSystemTime(start + 1_001);
    jest.advanceTimersByTime(1_001);
    answer(remembering, a);
    expect(calls).toEqual([a, a]);
    answer(remembering, b);
    answer(remembering, c); // pushes out a, the least recently used
    answer(remembering, a);
    expect(calls).toEqual([a, a, b, c, a]);
  });

  it('does not share what it knows between signing keys or option sets, and does not remember keys given as strings', () => {
    const { verify, calls } = counted();
    const remembering = rememberingVerifier(verify);
    const token = sign({ sub: 7 }, 600);
    answer(remembering, token);
    expect(answer(remembering, token, createSecretKey(Buffer.from('another-secret-another-secret-0123')))).toEqual({ error: 'JsonWebTokenError' });
    expect(answer(remembering, token, key, { ...options, audience: 'someone-else' })).toEqual({ error: 'JsonWebTokenError' });
    answer(remembering, token, secret);
    answer(remembering, token, secret);
    expect(calls).toHaveLength(5);
  });
});
