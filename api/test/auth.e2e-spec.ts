import { createTestApp, type TestApp } from './helpers/test-app';
import { listRoutes } from './helpers/routes';

describe('sign-in and roles (real MariaDB)', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  it('every registered route is public or declares its roles', () => {
    const routes = listRoutes(t.stack.app);
    // The enumeration must see the routes we know exist, or the check proves nothing.
    expect(routes.map((r) => `${r.method} ${r.path}`)).toEqual(
      expect.arrayContaining(['POST /api/auth/login', 'GET /api/auth/me', 'GET /api/users', 'PATCH /api/users/:id', 'GET /api/health', 'GET /api/outbox']),
    );
    const undeclared = routes.filter((r) => !r.isPublic && !(r.roles && r.roles.length));
    expect(undeclared).toEqual([]);
    const publicRoutes = routes
      .filter((r) => r.isPublic)
      .map((r) => `${r.method} ${r.path}`)
      .sort();
    expect(publicRoutes).toEqual([
      'GET /api/auth/invitations/:token',
      'GET /api/health',
      'GET /api/health/live',
      'GET /api/health/ready',
      'POST /api/auth/invitations/accept',
      'POST /api/auth/login',
    ]);
  });

  it('signs in with the right password and returns the user', async () => {
    const res = await t.http.post('/api/auth/login').send({ email: 'Engineer@Demo.test', password: t.stack.env.DEMO_PASSWORD });
    expect(res.status).toBe(200);
    expect(res.body.user).toMatchObject({ email: 'engineer@demo.test', role: 'engineer' });
    const me = await t.http.get('/api/auth/me').set('Authorization', `Bearer ${res.body.accessToken}`);
    expect(me.status).toBe(200);
    expect(me.body.email).toBe('engineer@demo.test');
  });

  it('answers a wrong password and an unknown user with the same 401', async () => {
    const wrong = await t.http.post('/api/auth/login').send({ email: 'engineer@demo.test', password: 'not-the-password' });
    const unknown = await t.http.post('/api/auth/login').send({ email: 'nobody@demo.test', password: 'not-the-password' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body.message).toBe(unknown.body.message);
    expect(wrong.body.correlationId).toEqual(expect.any(String));
  });

  it('names the bad field when the body is invalid', async () => {
    const res = await t.http.post('/api/auth/login').send({ email: 'not-an-email', password: '' });
    expect(res.status).toBe(400);
    expect(res.body.errors.map((e: { path: string }) => e.path)).toEqual(expect.arrayContaining(['email', 'password']));
  });

  it('refuses a request without a token or with a forged one', async () => {
    expect((await t.http.get('/api/auth/me')).status).toBe(401);
    const forged = 'eyJhbGciOiJub25lIiwidHlwIjoiSldUIn0.eyJzdWIiOjEsInJvbGUiOiJhZG1pbiIsInR2IjowfQ.';
    expect((await t.http.get('/api/users').set('Authorization', `Bearer ${forged}`)).status).toBe(401);
  });

  it('gives a buyer 403 on an admin route and an admin 200', async () => {
    const buyer = await t.tokenFor('buyer');
    const res = await t.http.get('/api/users').set('Authorization', `Bearer ${buyer}`);
    expect(res.status).toBe(403);
    const admin = await t.tokenFor('admin');
    expect((await t.http.get('/api/users').set('Authorization', `Bearer ${admin}`)).status).toBe(200);
  });

  it('refuses a token issued before logout', async () => {
    const token = await t.tokenFor('designer');
    expect((await t.http.get('/api/auth/me').set('Authorization', `Bearer ${token}`)).status).toBe(200);
    expect((await t.http.post('/api/auth/logout').set('Authorization', `Bearer ${token}`)).status).toBe(204);
    expect((await t.http.get('/api/auth/me').set('Authorization', `Bearer ${token}`)).status).toBe(401);
  });

  it('refuses a token issued before deactivation or a role change', async () => {
    const admin = await t.tokenFor('admin');
    const users = (await t.http.get('/api/users').set('Authorization', `Bearer ${admin}`)).body as Array<{ id: number; email: string }>;
    const reviewer = users.find((u) => u.email === 'reviewer@demo.test')!;
    const buyer = users.find((u) => u.email === 'buyer@demo.test')!;

    const reviewerToken = await t.tokenFor('reviewer@demo.test');
    const off = await t.http.patch(`/api/users/${reviewer.id}`).set('Authorization', `Bearer ${admin}`).send({ active: false });
    expect(off.status).toBe(200);
    expect((await t.http.get('/api/auth/me').set('Authorization', `Bearer ${reviewerToken}`)).status).toBe(401);
    // and a deactivated user cannot sign in again
    expect((await t.http.post('/api/auth/login').send({ email: 'reviewer@demo.test', password: t.stack.env.DEMO_PASSWORD })).status).toBe(401);
    await t.http.patch(`/api/users/${reviewer.id}`).set('Authorization', `Bearer ${admin}`).send({ active: true });

    const buyerToken = await t.tokenFor('buyer');
    const role = await t.http.patch(`/api/users/${buyer.id}`).set('Authorization', `Bearer ${admin}`).send({ role: 'designer' });
    expect(role.status).toBe(200);
    expect((await t.http.get('/api/auth/me').set('Authorization', `Bearer ${buyerToken}`)).status).toBe(401);
    await t.http.patch(`/api/users/${buyer.id}`).set('Authorization', `Bearer ${admin}`).send({ role: 'buyer' });
  });

  it('stops an admin from locking themselves out', async () => {
    const admin = await t.tokenFor('admin');
    const me = (await t.http.get('/api/auth/me').set('Authorization', `Bearer ${admin}`)).body as { id: number };
    const res = await t.http.patch(`/api/users/${me.id}`).set('Authorization', `Bearer ${admin}`).send({ active: false });
    expect(res.status).toBe(409);
  });
});

describe('sign-in rate limit', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp({ env: { LOGIN_RATE_LIMIT: '5', LOGIN_RATE_WINDOW_SECONDS: '60' } });
  });
  afterAll(() => t.close());

  it('answers 429 after the allowed attempts, even with the right password', async () => {
    const statuses: number[] = [];
    for (let i = 0; i < 5; i++) {
      statuses.push((await t.http.post('/api/auth/login').send({ email: 'engineer@demo.test', password: 'wrong-password' })).status);
    }
    expect(statuses).toEqual([401, 401, 401, 401, 401]);
    const limited = await t.http.post('/api/auth/login').send({ email: 'engineer@demo.test', password: t.stack.env.DEMO_PASSWORD });
    expect(limited.status).toBe(429);
    expect(limited.body.message).toMatch(/too many/i);
  });
});
