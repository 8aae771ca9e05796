/**
 * Upload → extraction result over HTTP, for the ten-page demo datasheet: the time an
 * engineer waits between dropping the PDF and seeing the suggestions. It runs the built
 * API (api/dist, started as its own process with a throw-away MariaDB, S3 and SMTP fakes)
 * and posts multipart uploads through fetch, beside two floors measured in the same run:
 * an authenticated GET of a small JSON route (HTTP + auth + database round trip) and the
 * in-process extraction of the same bytes. Each upload gets distinct bytes (a comment
 * appended after %%EOF, which PDF readers ignore) so the duplicate check cannot short-cut it.
 * Figures only; never a timed test.
 */
import { spawn } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { performance } from 'node:perf_hooks';
import { listDatasheetFixtures } from '@shuntwise/test-fixtures';
import { extractDatasheet } from '../src/extraction';
import { median, p90 } from './bench-support';
import { freePort } from '../src/dev/free-port';

const RUNS = 15;
const root = join(__dirname, '..', '..');

async function main(): Promise<void> {
  const start = join(root, 'api', 'dist', 'dev', 'start.js');
  if (!existsSync(start)) throw new Error('build the api first (npm run build -w api)');
  const fixture = listDatasheetFixtures().find((f) => f.answers.pages >= 10);
  if (!fixture) throw new Error('no ten-page fixture datasheet');
  const bytes = new Uint8Array(readFileSync(fixture.pdfPath));
  const dataDir = mkdtempSync(join(tmpdir(), 'shuntwise-bench-'));
  const port = await freePort();
  const env = {
    ...process.env,
    DATA_DIR: dataDir,
    PORT: String(port),
    DB_PORT: String(await freePort()),
    S3_FAKE_PORT: String(await freePort()),
    SMTP_PORT: String(await freePort()),
    SEED: 'users',
    LOGIN_RATE_LIMIT: '1000',
  };
  const api = spawn(process.execPath, [start], { env, stdio: 'ignore' });
  const base = `http://127.0.0.1:${port}`;
  try {
    for (let i = 0; ; i++) {
      if (api.exitCode !== null) throw new Error('the api exited');
      const ok = await fetch(`${base}/api/health`).then(
        (r) => r.ok,
        () => false,
      );
      if (ok) break;
      if (i > 600) throw new Error('the api did not come up');
      await new Promise((r) => setTimeout(r, 100));
    }
    const login = await fetch(`${base}/api/auth/login`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ email: 'engineer@demo.test', password: 'shuntwise-demo' }),
    }).then((r) => r.json() as Promise<{ accessToken: string }>);
    const auth = { authorization: `Bearer ${login.accessToken}` };

    const upload = async (i: number) => {
      const tagged = new Uint8Array(bytes.length + 32);
      tagged.set(bytes);
      tagged.set(new TextEncoder().encode(`\n%bench-${i}-${Date.now()}\n`.padEnd(32, ' ')), bytes.length);
      const form = new FormData();
      form.append('file', new Blob([tagged], { type: 'application/pdf' }), fixture.name.replace(/\.pdf$/, '') + `-${i}.pdf`);
      const t0 = performance.now();
      const res = await fetch(`${base}/api/datasheets`, { method: 'POST', headers: auth, body: form });
      const body = (await res.json()) as { id?: number; message?: string };
      if (res.status !== 201) throw new Error(`upload ${i}: ${res.status} ${body.message}`);
      const extraction = await fetch(`${base}/api/datasheets/${body.id}/extraction`, { headers: auth }).then(
        (r) => r.json() as Promise<{ variants: unknown[] }>,
      );
      const ms = performance.now() - t0;
      if (!extraction.variants.length) throw new Error('extraction found no variants');
      return ms;
    };
    await upload(-1); // warm: the API's first document loads pdfjs
    const uploads: number[] = [];
    for (let i = 0; i < RUNS; i++) uploads.push(await upload(i));

    const gets: number[] = [];
    for (let i = 0; i < RUNS * 4; i++) {
      const t0 = performance.now();
      await fetch(`${base}/api/auth/me`, { headers: auth }).then((r) => r.json());
      gets.push(performance.now() - t0);
    }
    await extractDatasheet(bytes);
    const inProcess: number[] = [];
    for (let i = 0; i < RUNS; i++) {
      const t0 = performance.now();
      await extractDatasheet(new Uint8Array(bytes));
      inProcess.push(performance.now() - t0);
    }

    const mu = median(uploads);
    console.log(`ten-page datasheet ${fixture.name} (${(bytes.length / 1024).toFixed(0)} KiB), ${RUNS} uploads, warm:`);
    console.log(`  upload → extraction result over HTTP   median ${mu.toFixed(1)} ms, p90 ${p90(uploads).toFixed(1)} ms`);
    console.log(`  extraction alone, in this process     median ${median(inProcess).toFixed(1)} ms`);
    console.log(`  authenticated small GET (floor)       median ${median(gets).toFixed(2)} ms`);
    console.log(`  upload / extraction alone: ${(mu / median(inProcess)).toFixed(2)}× (the rest is multipart, sha256, S3 put, MariaDB rows)`);
  } finally {
    api.kill('SIGTERM');
    await new Promise((r) => api.once('exit', r));
    rmSync(dataDir, { recursive: true, force: true });
  }
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
