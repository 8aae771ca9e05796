import { createHmac } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { createTestApp, type TestApp } from './helpers/test-app';

// Invented datasheets from @shuntwise/test-fixtures (see its README).
const fixtures = require('@shuntwise/test-fixtures') as typeof import('@shuntwise/test-fixtures');
const samplePdf = () => readFileSync(fixtures.listDatasheetFixtures()[0].pdfPath);

const b64url = (s: string | Buffer) => Buffer.from(s).toString('base64url');
/** HS256 by hand (RFC 7515), so the test does not depend on the library it checks. */
function signHs256(payload: object, secret: string): string {
  const head = `${b64url(JSON.stringify({ alg: 'HS256', typ: 'JWT' }))}.${b64url(JSON.stringify(payload))}`;
  return `${head}.${createHmac('sha256', secret).update(head).digest('base64url')}`;
}
const auth = (token: string) => ({ Authorization: `Bearer ${token}` });

describe('security headers, tokens and bad text (real MariaDB)', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  it('sends a CSP without inline scripts, refuses framing and hides the framework', async () => {
    for (const path of ['/api/health', '/api/auth/me', '/api/no-such-route']) {
      const res = await t.http.get(path);
      const csp = String(res.headers['content-security-policy']);
      expect(csp).toMatch(/default-src 'self'/);
      expect(csp).toMatch(/script-src 'self'(;|$)/);
      expect(csp).toMatch(/frame-ancestors 'none'/);
      expect(csp).toMatch(/object-src 'none'/);
      expect(res.headers['x-frame-options']).toBe('DENY');
      expect(res.headers['x-content-type-options']).toBe('nosniff');
      expect(res.headers['x-powered-by']).toBeUndefined();
      // Off by default: the local site is plain http on loopback.
      expect(res.headers['strict-transport-security']).toBeUndefined();
    }
  });

  it('refuses a correctly signed token that has no expiry', async () => {
    const user = (await t.select<{ id: number; token_version: number }>("SELECT id, token_version FROM users WHERE email = 'engineer@demo.test'"))[0];
    const claims = {
      sub: user.id,
      role: 'engineer',
      tv: user.token_version,
      iss: t.stack.env.JWT_ISSUER,
      aud: t.stack.env.JWT_AUDIENCE,
      iat: Math.floor(Date.now() / 1000),
    };
    const withExp = await t.http.get('/api/auth/me').set(auth(signHs256({ ...claims, exp: claims.iat + 600 }, t.stack.env.JWT_SECRET)));
    expect(withExp.status).toBe(200); // the hand-made token is otherwise right
    const noExp = await t.http.get('/api/auth/me').set(auth(signHs256(claims, t.stack.env.JWT_SECRET)));
    expect(noExp.status).toBe(401);
  });

  it('answers 400 naming the field for a lone surrogate in the spec, the rating card and a case summary', async () => {
    const engineer = await t.tokenFor('engineer');
    const lone = 'Zener \ud800 note';
    const cases: Array<[string, string, object, string]> = [
      ['put', '/api/house-parts/1/spec', { baseVersion: 0, spec: {}, note: lone }, 'note'],
      ['put', '/api/vendor-parts/1/rating-card', { version: 0, fields: {}, note: lone }, 'note'],
      ['patch', '/api/qualifications/1', { version: 0, summary: `x\udc00` }, 'summary'],
      ['post', '/api/house-parts', { partNumber: 'HP-1', description: lone }, 'description'],
    ];
    for (const [method, path, body, field] of cases) {
      // supertest would re-encode the string; send the JSON escape itself.
      const raw = JSON.stringify(body).replace(/[\ud800-\udfff]/g, (c) => `\\u${c.charCodeAt(0).toString(16)}`);
      const send = (t.http as unknown as Record<string, (p: string) => import('supertest').Test>)[method];
      const res = await send.call(t.http, path).set(auth(engineer)).set('Content-Type', 'application/json').send(raw);
      expect({ path, status: res.status }).toEqual({ path, status: 400 });
      expect(res.body.errors).toEqual(expect.arrayContaining([expect.objectContaining({ path: field, message: expect.stringMatching(/surrogate/) })]));
    }
  });

  it('refuses a datasheet whose file name holds control bytes, and stores names without bidi controls', async () => {
    const engineer = await t.tokenFor('engineer');
    const before = (await t.select<{ n: number }>('SELECT COUNT(*) AS n FROM datasheets'))[0].n;
    const bad = await t.http.post('/api/datasheets').set(auth(engineer)).attach('file', samplePdf(), 'sheet\u0001\u0007.pdf');
    expect(bad.status).toBe(400);
    expect(bad.body.message).toMatch(/file name/i);
    expect((await t.select<{ n: number }>('SELECT COUNT(*) AS n FROM datasheets'))[0].n).toBe(before);

    const bidi = await t.http.post('/api/datasheets').set(auth(engineer)).attach('file', samplePdf(), 'invoice\u202Efdp.exe\u200F.pdf');
    expect([200, 201]).toContain(bidi.status);
    const stored = (await t.select<{ file_name: string }>('SELECT file_name FROM datasheets WHERE id = ?', [bidi.body.id]))[0];
    expect(stored.file_name).toBe('invoicefdp.exe.pdf');
  });

  it('refuses a form-encoded body with a 415 that asks for JSON and names the request, storing nothing', async () => {
    const engineer = await t.tokenFor('engineer');
    const count = async () => Number((await t.select<{ n: number }>('SELECT COUNT(*) AS n FROM vendor_parts'))[0].n);
    const before = await count();
    const res = await t.http
      .post('/api/vendor-parts')
      .set(auth(engineer))
      .set('Content-Type', 'application/x-www-form-urlencoded')
      .send('manufacturer=Form%20Invented%20Devices&mpn=FRM-1&package=SOD-123');
    expect(res.status).toBe(415);
    expect(res.body.message).toMatch(/JSON/);
    expect(res.body.correlationId).toMatch(/^[0-9a-f-]{36}$/);
    expect(await count()).toBe(before);
  });
});

describe('API description in production', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp({ env: { NODE_ENV: 'production', HSTS: 'true' } });
  });
  afterAll(() => t.close());

  it('is not served, and HSTS is sent when configured', async () => {
    expect((await t.http.get('/api/docs')).status).toBe(404);
    expect((await t.http.get('/api/docs-json')).status).toBe(404);
    const res = await t.http.get('/api/health');
    expect(res.headers['strict-transport-security']).toMatch(/max-age=\d+/);
  });
});

describe('sign-in and upload limits, counted in the database', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp({ env: { LOGIN_RATE_LIMIT: '3', LOGIN_RATE_LIMIT_PER_ADDRESS: '8', LOGIN_RATE_WINDOW_SECONDS: '600', UPLOAD_RATE_LIMIT: '2' } });
  });
  afterAll(() => t.close());
  const login = (email: string, forwarded?: string) => {
    const req = t.http.post('/api/auth/login');
    if (forwarded) req.set('X-Forwarded-For', forwarded);
    return req.send({ email, password: 'wrong-password' });
  };

  it('limits one account, with a standard Retry-After, without locking out others behind the same address', async () => {
    const statuses: number[] = [];
    for (let i = 0; i < 4; i++) statuses.push((await login('designer@demo.test')).status);
    expect(statuses).toEqual([401, 401, 401, 429]);
    const limited = await t.http.post('/api/auth/login').send({ email: 'designer@demo.test', password: t.stack.env.DEMO_PASSWORD });
    expect(limited.status).toBe(429);
    expect(Number(limited.headers['retry-after'])).toBeGreaterThan(0);
    expect(Number(limited.headers['retry-after'])).toBeLessThanOrEqual(600);
    expect(limited.body.message).toMatch(/too many/i);
    // Someone else at the same address still signs in.
    const other = await t.http.post('/api/auth/login').send({ email: 'buyer@demo.test', password: t.stack.env.DEMO_PASSWORD });
    expect(other.status).toBe(200);
    // The counts live in the database (so every replica shares them), hashed.
    const rows = await t.select<{ bucket: string; hits: number }>('SELECT bucket, hits FROM rate_limit_windows');
    expect(rows.length).toBeGreaterThanOrEqual(2);
    expect(rows.every((r) => /^[0-9a-f]{64}$/.test(r.bucket))).toBe(true);
  });

  it('cannot be dodged by rotating X-Forwarded-For (no proxy is trusted by default)', async () => {
    const statuses: number[] = [];
    for (let i = 0; i < 12; i++) statuses.push((await login(`nobody${i}@demo.test`, `203.0.113.${i + 1}`)).status);
    // The address limit (8, with the 5 attempts above already counted) applies to the socket address.
    expect(statuses.filter((s) => s === 429).length).toBeGreaterThanOrEqual(4);
    expect(statuses.slice(-1)).toEqual([429]);
  });

  it('limits uploads per user', async () => {
    const engineer = await t.tokenFor('engineer').catch(() => null);
    // The address limit may be spent by the cases above: sign in through the database-free path.
    const token = engineer ?? (await signedToken(t, 'engineer@demo.test'));
    const statuses: number[] = [];
    for (let i = 0; i < 3; i++) statuses.push((await t.http.post('/api/imports/vendor-series/preview').set(auth(token)).send({ csv: '' })).status);
    expect(statuses.slice(0, 2).every((s) => s !== 429)).toBe(true);
    expect(statuses[2]).toBe(429);
    const admin = await signedToken(t, 'admin@demo.test');
    expect((await t.http.post('/api/imports/vendor-series/preview').set(auth(admin)).send({ csv: '' })).status).not.toBe(429);
  });
});

/** A valid token made with the app's own secret (when sign-in itself is rate-limited in the test). */
async function signedToken(t: TestApp, email: string): Promise<string> {
  const user = (await t.select<{ id: number; role: string; token_version: number }>('SELECT id, role, token_version FROM users WHERE email = ?', [email]))[0];
  const iat = Math.floor(Date.now() / 1000);
  return signHs256(
    { sub: user.id, role: user.role, tv: user.token_version, iss: t.stack.env.JWT_ISSUER, aud: t.stack.env.JWT_AUDIENCE, iat, exp: iat + 600 },
    t.stack.env.JWT_SECRET,
  );
}
