import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { performance } from 'node:perf_hooks';
import { QueryTypes } from 'sequelize';
import { startStack } from '../api/dist/dev/stack.js';
import { freePort } from '../api/dist/dev/free-port.js';
import { RatingCardsService } from '../api/dist/vendor-parts/rating-cards.service.js';
import { UsersRepository } from '../api/dist/users/users.repository.js';

async function time(name: string, f: () => Promise<unknown>) {
  for (let i = 0; i < 30; i++) await f();
  const t: number[] = [];
  for (let i = 0; i < 200; i++) { const s = performance.now(); await f(); t.push(performance.now() - s); }
  t.sort((a, b) => a - b);
  console.log(`${name.padEnd(40)} min ${t[0].toFixed(2)} p10 ${t[20].toFixed(2)} median ${t[100].toFixed(2)} ms  p90 ${t[180].toFixed(2)} ms`);
}
async function main() {
  const dataDir = mkdtempSync(join(tmpdir(), 'scale-parts-'));
  const port = await freePort();
  const stack = await startStack({ seed: 'users', quiet: true, source: { ...process.env, DATA_DIR: dataDir, PORT: String(port), DB_PORT: String(await freePort()), S3_FAKE_PORT: String(await freePort()), SMTP_PORT: String(await freePort()) } });
  const seq = stack.sequelize;
  await time('SELECT 1 via sequelize', () => seq.query('SELECT 1', { type: QueryTypes.SELECT }));
  await time('users.findById', () => stack.app.get(UsersRepository).findById(1));
  await time('card view (no part)', () => stack.app.get(RatingCardsService).view(1).catch(() => null));
  const base = stack.url;
  await time('GET /api/nothing 404 over http', () => fetch(base + '/api/nothing').then((r) => r.text()));
  await time('GET /api/auth/me no token 401', () => fetch(base + '/api/auth/me').then((r) => r.text()));
  const login = await fetch(`${base}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: 'engineer@demo.test', password: 'shuntwise-demo' }) }).then((r) => r.json() as Promise<{ accessToken: string }>);
  const auth = { authorization: `Bearer ${login.accessToken}` };
  await time('GET /api/auth/me', () => fetch(base + '/api/auth/me', { headers: auth }).then((r) => r.text()));
  const jwt = require('jsonwebtoken');
  await time('jsonwebtoken.verify', async () => jwt.verify(login.accessToken, stack.env.JWT_SECRET, { algorithms: ['HS256'], audience: stack.env.JWT_AUDIENCE, issuer: stack.env.JWT_ISSUER }));
  await time('GET /api/vendor-parts/1/rating-card 404', () => fetch(base + '/api/vendor-parts/1/rating-card', { headers: auth }).then((r) => r.text()));
  const http = require('node:http');
  const srv = http.createServer((req: any, res: any) => { seq.query('SELECT 1', { type: QueryTypes.SELECT }).then(() => { res.setHeader('content-type', 'application/json'); res.end('{}'); }); });
  await new Promise((r) => srv.listen(0, '127.0.0.1', r));
  const p2 = srv.address().port;
  await time('raw http + sequelize SELECT 1', () => fetch(`http://127.0.0.1:${p2}/`).then((r) => r.text()));
  const srv2 = http.createServer((req: any, res: any) => { stack.app.get(UsersRepository).findById(1).then(() => { res.end('{}'); }); });
  await new Promise((r) => srv2.listen(0, '127.0.0.1', r));
  await time('raw http + users.findById', () => fetch(`http://127.0.0.1:${srv2.address().port}/`).then((r) => r.text()));
  srv.close(); srv2.close();
  await stack.stop();
}
main().catch((e) => { console.error(e); process.exit(1); });
