import { Session } from 'node:inspector/promises';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { performance } from 'node:perf_hooks';
import { startStack } from '../api/dist/dev/stack.js';
import { freePort } from '../api/dist/dev/free-port.js';

async function main() {
  const dataDir = mkdtempSync(join(tmpdir(), 'scale-inproc-'));
  const port = await freePort();
  const stack = await startStack({ seed: 'users', quiet: true, source: { ...process.env, DATA_DIR: dataDir, PORT: String(port), DB_PORT: String(await freePort()), S3_FAKE_PORT: String(await freePort()), SMTP_PORT: String(await freePort()), LOGIN_RATE_LIMIT: '1000' } });
  const base = stack.url;
  const login = await fetch(`${base}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: 'engineer@demo.test', password: 'shuntwise-demo' }) }).then((r) => r.json() as Promise<{ accessToken: string }>);
  const auth = { authorization: `Bearer ${login.accessToken}` };
  const json = { ...auth, 'content-type': 'application/json' };
  const part = await fetch(`${base}/api/vendor-parts`, { method: 'POST', headers: json, body: JSON.stringify({ manufacturer: 'Bench Invented Devices', mpn: 'BNZ-5V1' }) }).then((r) => r.json() as Promise<{ id: number }>);
  const e = { source: 'entered' };
  await fetch(`${base}/api/vendor-parts/${part.id}/rating-card`, { method: 'PUT', headers: json, body: JSON.stringify({ version: 0, fields: { vzNom: { value: 5.1, provenance: e }, izt: { value: 0.005, provenance: e }, zzt: { value: 60, provenance: e } } }) });
  const paths = (process.env.PATHS ?? `/api/vendor-parts/${part.id}/rating-card,/api/auth/me,/api/health`).split(',').map((p) => p.replace('ID', String(part.id)));
  const session = new Session();
  session.connect();
  for (const path of paths) {
    for (let i = 0; i < 50; i++) await fetch(base + path, { headers: auth }).then((r) => r.text());
    const t: number[] = [];
    for (let i = 0; i < 300; i++) {
      const s = performance.now();
      await fetch(base + path, { headers: auth }).then((r) => r.text());
      t.push(performance.now() - s);
    }
    t.sort((a, b) => a - b);
    console.log(`${path}: sequential median ${t[150].toFixed(2)} ms p90 ${t[270].toFixed(2)} ms`);
  }
  await session.post('Profiler.enable');
  await session.post('Profiler.start');
  const s = performance.now();
  let n = 0;
  await Promise.all(Array.from({ length: 10 }, async () => { while (performance.now() - s < 4000) { await fetch(base + paths[0], { headers: auth }).then((r) => r.text()); n++; } }));
  const { profile } = await session.post('Profiler.stop');
  console.log(`${paths[0]} 10 concurrent in-process: ${(n / 4).toFixed(0)} req/s`);
  writeFileSync(join(__dirname, 'inproc.cpuprofile'), JSON.stringify(profile));
  await stack.stop();
}
main().catch((e) => { console.error(e); process.exit(1); });
