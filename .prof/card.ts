import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { performance } from 'node:perf_hooks';
import { startStack } from '../api/dist/dev/stack.js';
import { freePort } from '../api/dist/dev/free-port.js';
import { RatingCardsService } from '../api/dist/vendor-parts/rating-cards.service.js';
import { checkCard } from '../api/dist/engineering/card-checks.js';
import { toEngineeringCard } from '@shuntwise/contracts';

async function time(name: string, f: () => Promise<unknown> | unknown) {
  for (let i = 0; i < 20; i++) await f();
  const t: number[] = [];
  for (let i = 0; i < 100; i++) { const s = performance.now(); await f(); t.push(performance.now() - s); }
  t.sort((a, b) => a - b);
  console.log(`${name.padEnd(40)} min ${t[0].toFixed(2)} p10 ${t[10].toFixed(2)} median ${t[50].toFixed(2)} ms`);
}
async function main() {
  const dataDir = mkdtempSync(join(tmpdir(), 'scale-card-'));
  const stack = await startStack({ seed: 'users', quiet: true, source: { ...process.env, DATA_DIR: dataDir, PORT: String(await freePort()), DB_PORT: String(await freePort()), S3_FAKE_PORT: String(await freePort()), SMTP_PORT: String(await freePort()) } });
  const base = stack.url;
  const login = await fetch(`${base}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: 'engineer@demo.test', password: 'shuntwise-demo' }) }).then((r) => r.json() as Promise<{ accessToken: string }>);
  const auth = { authorization: `Bearer ${login.accessToken}` };
  const json = { ...auth, 'content-type': 'application/json' };
  const part = await fetch(`${base}/api/vendor-parts`, { method: 'POST', headers: json, body: JSON.stringify({ manufacturer: 'Bench Invented Devices', mpn: 'BNZ-5V1' }) }).then((r) => r.json() as Promise<{ id: number }>);
  const e = { source: 'entered' };
  const fields = { vzMin: { value: 4.85, provenance: e }, vzNom: { value: 5.1, provenance: e }, vzMax: { value: 5.36, provenance: e }, izt: { value: 0.005, provenance: e }, zzt: { value: 60, provenance: e }, izk: { value: 0.00025, provenance: e }, zzk: { value: 480, provenance: e }, pdMax: { value: 0.5, provenance: e }, rthJA: { value: 250, provenance: e } };
  console.log((await fetch(`${base}/api/vendor-parts/${part.id}/rating-card`, { method: 'PUT', headers: json, body: JSON.stringify({ version: 0, fields }) })).status);
  const svc = stack.app.get(RatingCardsService);
  const card = await svc.card(part.id);
  await time('service.card', () => svc.card(part.id));
  await time('service.view', () => svc.view(part.id));
  const ec = toEngineeringCard(card.fields)!;
  await time('checkCard', () => checkCard(ec));
  await time('GET rating-card', () => fetch(`${base}/api/vendor-parts/${part.id}/rating-card`, { headers: auth }).then((r) => r.text()));
  await time('GET auth/me', () => fetch(`${base}/api/auth/me`, { headers: auth }).then((r) => r.text()));
  const q = async () => Number(((await stack.sequelize.query("SHOW GLOBAL STATUS LIKE 'Questions'", { type: 'SELECT' as never })) as unknown as Array<{ Value: string }>)[0].Value);
  for (const path of [`/api/vendor-parts/${part.id}/rating-card`, '/api/auth/me', '/api/health/live']) {
    const before = await q();
    for (let i = 0; i < 100; i++) await fetch(base + path, { headers: auth }).then((r) => r.text());
    console.log(`${path}: ${((await q()) - before - 1) / 100} statements per request`);
  }
  await stack.stop();
}
main().catch((e) => { console.error(e); process.exit(1); });
