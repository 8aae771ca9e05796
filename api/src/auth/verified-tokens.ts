import { LRUCache } from 'lru-cache';

/** passport-jwt's verifier: `JwtStrategy.JwtVerifier(token, secretOrKey, options, done)`, by default jsonwebtoken.verify. */
export type TokenVerifier = (
  token: string,
  secretOrKey: unknown,
  options: Readonly<Record<string, unknown>>,
  done: (error: Error | null, payload?: unknown) => void,
) => void;

export interface VerifiedTokenLimits {
  /** Tokens remembered per signing key. */
  max: number;
  /** How long one is remembered at most (never past its own `exp`). */
  ttlMs: number;
}

export const VERIFIED_TOKEN_LIMITS: VerifiedTokenLimits = { max: 10_000, ttlMs: 60_000 };

// The clock jsonwebtoken reads (lru-cache's default is performance.now()).
const wallClock = { now: () => Date.now() };

type Claims = Readonly<Record<string, unknown>> & { exp: number };

/**
 * Wraps passport-jwt's verifier (its documented injection point, `Strategy.JwtVerifier`) so a
 * token whose signature and claims jsonwebtoken has already accepted, with the same key and
 * options, is not checked again (an HMAC, two base64 decodes and two JSON parses: about a tenth
 * of a card read's CPU) until it expires or a minute has passed.
 *
 * What this remembers is only "this exact string verified": the signature of a given string
 * under a given key never changes. The key is the exact token string, so nothing about another
 * token can be learnt from it, and a refused token is never remembered (each refusal runs
 * jsonwebtoken again). `exp` is checked again on every hit, as jsonwebtoken checks it (expired
 * when the current second reaches it); `nbf` cannot become false later. Only tokens with an
 * `exp` and no `maxAge` option are remembered. The per-request session check is not touched:
 * `JwtStrategy.validate` still reads the users row on every request, so logout, deactivation and
 * a role change still end a token at once on every replica.
 */
export function rememberingVerifier(verify: TokenVerifier, limits: VerifiedTokenLimits = VERIFIED_TOKEN_LIMITS): TokenVerifier {
  // Per key object and per options object: two strategies (or a new secret) never share a memory.
  const memories = new WeakMap<object, WeakMap<object, LRUCache<string, Claims>>>();
  const memoryFor = (key: object, options: object): LRUCache<string, Claims> => {
    let byOptions = memories.get(key);
    if (!byOptions) memories.set(key, (byOptions = new WeakMap()));
    let memory = byOptions.get(options);
    if (!memory) byOptions.set(options, (memory = new LRUCache<string, Claims>({ max: limits.max, ttl: limits.ttlMs, perf: wallClock })));
    return memory;
  };
  return (token, secretOrKey, options, done) => {
    if (typeof secretOrKey !== 'object' || secretOrKey === null || options.maxAge !== undefined) return verify(token, secretOrKey, options, done);
    const memory = memoryFor(secretOrKey, options);
    const now = Date.now();
    const known = memory.get(token);
    if (known && Math.floor(now / 1000) < known.exp) return done(null, known);
    verify(token, secretOrKey, options, (error, payload) => {
      if (!error && isClaims(payload)) {
        const left = payload.exp * 1000 - now;
        if (left > 0) memory.set(token, Object.freeze(payload), { ttl: Math.min(limits.ttlMs, left) });
      }
      done(error, payload);
    });
  };
}

function isClaims(payload: unknown): payload is Claims {
  return (
    typeof payload === 'object' &&
    payload !== null &&
    typeof (payload as { exp?: unknown }).exp === 'number' &&
    Number.isFinite((payload as { exp: number }).exp)
  );
}
