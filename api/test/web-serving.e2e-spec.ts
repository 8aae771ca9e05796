import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { createTestApp, type TestApp } from './helpers/test-app';

/**
 * The web app served beside the API on one origin (WEB_DIST): its files and, for client-side
 * routes, index.html; API paths never reach the files, even where a file of that name exists.
 */
describe('serving the web app beside the API (real MariaDB)', () => {
  let t: TestApp;
  beforeAll(async () => {
    const dist = mkdtempSync(join(tmpdir(), 'web-dist-'));
    writeFileSync(join(dist, 'index.html'), '<!doctype html><title>app</title>');
    mkdirSync(join(dist, 'assets'));
    writeFileSync(join(dist, 'assets', 'app.js'), 'console.log(1);');
    // A file where an API path points: it must never be served.
    mkdirSync(join(dist, 'api', 'auth'), { recursive: true });
    writeFileSync(join(dist, 'api', 'auth', 'me'), 'not the API');
    writeFileSync(join(dist, 'api', 'stray.txt'), 'not the API');
    t = await createTestApp({ env: { WEB_DIST: dist } });
  });
  afterAll(() => t.close());

  it('serves the files and index.html for client-side routes', async () => {
    const asset = await t.http.get('/assets/app.js');
    expect(asset.status).toBe(200);
    expect(asset.text).toBe('console.log(1);');
    const route = await t.http.get('/parts/42/card');
    expect(route.status).toBe(200);
    expect(route.text).toContain('<title>app</title>');
    expect(route.headers['cache-control']).toBe('no-cache');
  });

  it('answers API paths from the API only', async () => {
    const me = await t.http.get('/api/auth/me');
    expect(me.status).toBe(401);
    expect(me.headers['content-type']).toMatch(/json/);
    const stray = await t.http.get('/api/stray.txt');
    expect(stray.status).toBe(404);
    expect(stray.text).not.toContain('not the API');
    expect(stray.headers['content-type']).toMatch(/json/);
  });
});
