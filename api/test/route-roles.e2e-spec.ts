import { ROLES, type Role } from '@shuntwise/contracts';
import { listRoutes, type RouteInfo } from './helpers/routes';
import { ROUTE_ROLES } from './helpers/route-roles';
import { createTestApp, type TestApp } from './helpers/test-app';

// Least privilege, route by route: the table in helpers/route-roles.ts is the rule; the
// app's own route metadata must agree with it, and real requests must be let through or
// refused as it says. Ids in paths name nothing (404s are fine): only 401 and 403 count.
const key = (r: Pick<RouteInfo, 'method' | 'path'>) => `${r.method} ${r.path}`;
const MISSING_ID = '999999';

describe('role × route table (real MariaDB)', () => {
  let t: TestApp;
  let routes: RouteInfo[];
  const tokens = new Map<Role, string>();
  const ids = new Map<Role, number>();

  beforeAll(async () => {
    t = await createTestApp();
    routes = listRoutes(t.stack.app);
    for (const role of ROLES) {
      const token = await t.tokenFor(role);
      tokens.set(role, token);
      ids.set(role, (await t.http.get('/api/auth/me').set('Authorization', `Bearer ${token}`)).body.id as number);
    }
  });
  afterAll(() => t.close());

  it('has exactly one entry per registered route, with the roles the route declares', () => {
    expect(routes.length).toBeGreaterThan(60);
    const registered = routes.map(key).sort();
    expect(registered.filter((k) => !(k in ROUTE_ROLES))).toEqual([]); // a new route needs its entry
    expect(Object.keys(ROUTE_ROLES).filter((k) => !registered.includes(k))).toEqual([]); // no stale entries
    for (const r of routes) {
      const access = ROUTE_ROLES[key(r)];
      expect({ route: key(r), access: r.isPublic ? 'public' : [...(r.roles ?? [])].sort() }).toEqual({
        route: key(r),
        access: access === 'public' ? 'public' : [...access].sort(),
      });
    }
  });

  it('lets no request match two routes: none resolves by the order controllers are registered', () => {
    // Two routes of one method overlap when, segment by segment, each pair is equal or one is a parameter.
    const segments = (path: string) => path.split('/').filter(Boolean);
    const overlap = (a: string[], b: string[]) => a.length === b.length && a.every((s, i) => s === b[i] || s.startsWith(':') || b[i].startsWith(':'));
    const clashes: string[] = [];
    for (const [i, a] of routes.entries()) {
      for (const b of routes.slice(i + 1)) {
        if (a.method === b.method && overlap(segments(a.path), segments(b.path))) clashes.push(`${key(a)} ~ ${b.path}`);
      }
    }
    expect(clashes).toEqual([]);
  });

  it('keeps admins to administration and reading: no catalogue, source or case write is open to them', () => {
    const adminWrites = Object.entries(ROUTE_ROLES)
      .filter(([k, access]) => !k.startsWith('GET ') && access !== 'public' && access.includes('admin'))
      .map(([k]) => k)
      .sort();
    // logout is everyone's; the rest administer users, invitations and who is mailed; the computations store nothing
    expect(adminWrites).toEqual(
      [
        'DELETE /api/house-parts/:id/buyers/:userId',
        'PATCH /api/users/:id',
        'POST /api/auth/logout',
        'POST /api/engineering/normalize',
        'POST /api/engineering/regulator',
        'POST /api/house-parts/:id/buyers',
        'POST /api/users/invitations',
        'POST /api/users/invitations/:id/resend',
        'POST /api/users/invitations/:id/revoke',
      ].sort(),
    );
  });

  it('lets every route through to the roles the table names and refuses the others (403) and anonymous callers (401)', async () => {
    const failures: string[] = [];
    // Signing out ends the caller's tokens: those routes go last.
    const ordered = [...routes].sort((a, b) => Number(a.handler === 'logout') - Number(b.handler === 'logout'));
    for (const r of ordered) {
      const access = ROUTE_ROLES[key(r)];
      const callers: Array<Role | null> = [null, ...ROLES];
      for (const caller of callers) {
        const path = r.path
          .replace(':token', 'no-such-invitation')
          .replace(':userId', String(caller ? ids.get(caller) : MISSING_ID))
          .replace(/:[A-Za-z]+/g, MISSING_ID);
        const method = r.method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete';
        let req = t.http[method](path);
        if (caller) req = req.set('Authorization', `Bearer ${tokens.get(caller)}`);
        const res = method === 'get' || method === 'delete' ? await req : await req.send({});
        const allowed = access === 'public' || (caller !== null && access.includes(caller));
        const expected = allowed ? 'not 401/403' : caller === null ? '401' : '403';
        const ok = allowed ? res.status !== 401 && res.status !== 403 : res.status === (caller === null ? 401 : 403);
        if (!ok) failures.push(`${key(r)} as ${caller ?? 'nobody'}: ${res.status} (expected ${expected}) ${JSON.stringify(res.body?.message ?? '')}`);
        if (!allowed && caller !== null && res.status === 403) expect(res.body.message).toMatch(/Your role may not do this/);
      }
    }
    expect(failures).toEqual([]);
  });
});
