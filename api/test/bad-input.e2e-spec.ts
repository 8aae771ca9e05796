import { ListObjectsV2Command } from '@aws-sdk/client-s3';
import fc from 'fast-check';
import { StorageService } from '../src/storage/storage.service';
import { malformedBodies, namesPoison, type MalformedBody } from './helpers/malformed-bodies';
import { createTestApp, type TestApp } from './helpers/test-app';
import { listWriteRoutes, type WriteRoute } from './helpers/write-routes';

/**
 * Bad input everywhere: for every write route (enumerated from the running app), bodies
 * derived from its contracts schema with at least one certain defect. The API must answer
 * 4xx (400, or 404/409/413/422 where honest), never 5xx; a 400/422 names the field in
 * `errors`; and nothing is stored (row counts of every table, the bucket's object count).
 * The seed is fresh each run and printed; FC_SEED=<n> replays it, FC_RUNS sets bodies per route.
 */
const SEED = process.env.FC_SEED ? Number(process.env.FC_SEED) : Math.floor(Math.random() * 2 ** 31);
const RUNS = Number(process.env.FC_RUNS ?? 20);
const HONEST = [400, 404, 409, 413, 422];
/** Counters that count every request by design (rate limits), not data the request stored. */
const COUNTERS = new Set(['rate_limit_windows']);

describe('bad input on every write route (property-based, real MariaDB and S3 fake)', () => {
  let t: TestApp;
  let tokens: Record<string, string>;
  beforeAll(async () => {
    console.log(`bad-input suite: FC_SEED=${SEED} FC_RUNS=${RUNS} (replay with FC_SEED=${SEED})`);
    t = await createTestApp();
    tokens = {};
    for (const role of ['engineer', 'admin', 'designer', 'buyer']) tokens[role] = await t.tokenFor(role);
  });
  afterAll(() => t?.close());

  async function snapshot(): Promise<Record<string, number>> {
    const tables = await t.select<{ name: string }>(
      "SELECT table_name AS name FROM information_schema.tables WHERE table_schema = DATABASE() AND table_type = 'BASE TABLE'",
    );
    const out: Record<string, number> = {};
    for (const { name } of tables) {
      if (COUNTERS.has(name)) continue;
      out[name] = Number((await t.select<{ n: number }>(`SELECT COUNT(*) AS n FROM \`${name}\``))[0].n);
    }
    const storage = t.stack.app.get(StorageService);
    const listed = await storage.client.send(new ListObjectsV2Command({ Bucket: storage.bucket }));
    out['(s3 objects)'] = listed.KeyCount ?? listed.Contents?.length ?? 0;
    return out;
  }

  const tokenFor = (route: WriteRoute) => {
    if (route.isPublic) return null;
    const role = ['engineer', 'admin', 'designer', 'buyer'].find((r) => route.roles?.includes(r)) ?? 'engineer';
    return tokens[role];
  };
  const pathOf = (route: WriteRoute) => route.path.replace(/:[A-Za-z]+/g, '1');

  it('answers 4xx naming the field and stores nothing', async () => {
    const routes = listWriteRoutes(t.stack.app);
    // The enumeration must see the write routes we know, or the suite proves nothing.
    expect(routes.map((r) => `${r.method} ${r.path}`)).toEqual(
      expect.arrayContaining([
        'POST /api/auth/login',
        'PUT /api/house-parts/:id/spec',
        'PUT /api/vendor-parts/:id/rating-card',
        'POST /api/qualifications/:id/clear',
        'POST /api/imports/vendor-series',
      ]),
    );
    const withoutBody = routes.filter((r) => !r.takesBody).map((r) => `${r.method} ${r.path}`);
    const fuzzed = routes.filter((r) => r.takesBody && r.bodySchema);
    // A body route whose DTO is not a zod schema would escape the suite (and the contracts).
    expect(routes.filter((r) => r.takesBody && !r.bodySchema).map((r) => `${r.method} ${r.path}`)).toEqual([]);
    console.log(`bad-input suite: ${fuzzed.length} write routes with a body; no body taken by ${withoutBody.join(', ') || 'none'}`);

    const failures: string[] = [];
    const statusCounts: Record<number, number> = {};
    for (const route of fuzzed) {
      const before = await snapshot();
      const token = tokenFor(route);
      const outcome = await fc.check(
        fc.asyncProperty(malformedBodies(route.bodySchema!), async (body: MalformedBody) => {
          const req = t.http[route.method.toLowerCase() as 'post' | 'put' | 'patch'](pathOf(route)).set('Content-Type', 'application/json');
          if (token) req.set('Authorization', `Bearer ${token}`);
          const res = await req.send(body.text);
          statusCounts[res.status] = (statusCounts[res.status] ?? 0) + 1;
          const what = () =>
            `${route.method} ${route.path} with ${body.poisons.map((p) => `${p.kind} at "${p.path.join('.')}"`).join(', ')} (body ${body.text.slice(0, 200)}${body.text.length > 200 ? '…' : ''}) → ${res.status} ${JSON.stringify(res.body).slice(0, 300)}`;
          if (!HONEST.includes(res.status)) throw new Error(`not an honest 4xx: ${what()}`);
          if (res.status === 400 || res.status === 422) {
            const errors = (res.body.errors ?? []) as Array<{ path: unknown; message: unknown }>;
            if (!errors.length || !errors.every((e) => typeof e.path === 'string' && typeof e.message === 'string'))
              throw new Error(`no field named: ${what()}`);
            if (!errors.some((e) => body.poisons.some((p) => namesPoison(e.path as string, p))))
              throw new Error(`the errors do not name the bad field: ${what()}`);
          }
        }),
        { seed: SEED, numRuns: RUNS, endOnFailure: true },
      );
      if (outcome.failed)
        failures.push(`${(outcome.errorInstance as Error)?.message ?? String(outcome.errorInstance)} [seed ${SEED}, path ${outcome.counterexamplePath}]`);
      const after = await snapshot();
      const changed = Object.keys(before).filter((k) => before[k] !== after[k]);
      if (changed.length) failures.push(`${route.method} ${route.path} stored something: ${changed.map((k) => `${k} ${before[k]} → ${after[k]}`).join(', ')}`);
    }
    console.log(`bad-input suite: statuses ${JSON.stringify(statusCounts)}`);
    expect(failures).toEqual([]);
  }, 240_000);
});
