/**
 * The cost of the API's request path, as ratios to bare floors measured in the same run on
 * the same machine and database (all on loopback, autocannon, 10 connections):
 *   - a rating-card read (GET /api/vendor-parts/:id/rating-card) and GET /api/auth/me
 *     against a bare node:http + `mariadb` pool primary-key read of the same card row;
 *   - the liveness answer (GET /api/health/live, else GET /api/health) against a bare
 *     node:http JSON answer.
 * The API is the built one (api/dist) in its own process with a throw-away MariaDB; the
 * floors run in a second process (bench/bare-server.ts). With CPU_PROF=<dir> the API runs
 * under `node --cpu-prof` and writes its profile there on exit (DEVELOPERS.md, "Profiling").
 * Figures only; never a timed test.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import autocannon from 'autocannon';
import { freePort } from '../src/dev/free-port';

const root = join(__dirname, '..', '..');
const SECONDS = Number(process.env.BENCH_SECONDS ?? 8);
const CONNECTIONS = 10;

async function waitFor(url: string, child: ChildProcess, what: string): Promise<void> {
  for (let i = 0; ; i++) {
    if (child.exitCode !== null) throw new Error(`${what} exited`);
    if (
      await fetch(url).then(
        (r) => r.status < 500,
        () => false,
      )
    )
      return;
    if (i > 900) throw new Error(`${what} did not come up`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

/** CPU time (user + system, ms) a process and its children have used so far, from /proc (10 ms ticks). */
function cpuMsOf(pid: number): number {
  try {
    const fields = readFileSync(`/proc/${pid}/stat`, 'utf8').split(') ')[1].split(' ');
    const children = readdirSync(`/proc/${pid}/task`).flatMap((t) =>
      readFileSync(`/proc/${pid}/task/${t}/children`, 'utf8').split(' ').filter(Boolean).map(Number),
    );
    return (Number(fields[11]) + Number(fields[12])) * 10 + children.reduce((sum, child) => sum + cpuMsOf(child), 0);
  } catch {
    return 0;
  }
}

interface Load {
  rps: number;
  p50: number;
  p99: number;
  bad: number;
  /** CPU ms per request of the answering server and of MariaDB: unlike wall time, not skewed by other work on the machine. */
  cpu?: { server: number; db: number };
}

async function load(url: string, headers: Record<string, string> = {}, pids?: { server: number; db: number }): Promise<Load> {
  // A short warm-up first, so the JIT and the pools are in their steady state.
  await autocannon({ url, connections: CONNECTIONS, duration: 2, headers });
  const before = pids && { server: cpuMsOf(pids.server), db: cpuMsOf(pids.db) };
  const r = await autocannon({ url, connections: CONNECTIONS, duration: SECONDS, headers });
  const cpu = pids && before && { server: (cpuMsOf(pids.server) - before.server) / r.requests.total, db: (cpuMsOf(pids.db) - before.db) / r.requests.total };
  return { rps: r.requests.average, p50: r.latency.p50, p99: r.latency.p99, bad: r.non2xx + r.errors + r.timeouts, cpu };
}

async function main(): Promise<void> {
  const start = join(root, 'api', 'dist', 'dev', 'start.js');
  if (!existsSync(start)) throw new Error('build the api first (npm run build -w api)');
  const dataDir = mkdtempSync(join(tmpdir(), 'shuntwise-bench-path-'));
  const port = await freePort();
  const dbPort = await freePort();
  const env = {
    ...process.env,
    DATA_DIR: dataDir,
    PORT: String(port),
    DB_PORT: String(dbPort),
    S3_FAKE_PORT: String(await freePort()),
    SMTP_PORT: String(await freePort()),
    SEED: 'users',
    LOGIN_RATE_LIMIT: '1000',
  };
  const nodeArgs = process.env.CPU_PROF ? ['--cpu-prof', `--cpu-prof-dir=${resolve(process.env.CPU_PROF)}`] : [];
  const api = spawn(process.execPath, [...nodeArgs, start], { env, stdio: 'ignore' });
  let bare: ChildProcess | null = null;
  const base = `http://127.0.0.1:${port}`;
  try {
    await waitFor(`${base}/api/health`, api, 'the api');
    const login = await fetch(`${base}/api/auth/login`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ email: 'engineer@demo.test', password: 'shuntwise-demo' }),
    }).then((r) => r.json() as Promise<{ accessToken: string }>);
    const auth = { authorization: `Bearer ${login.accessToken}` };
    const json = { ...auth, 'content-type': 'application/json' };
    const part = await fetch(`${base}/api/vendor-parts`, {
      method: 'POST',
      headers: json,
      body: JSON.stringify({ manufacturer: 'Bench Invented Devices', mpn: 'BNZ-5V1', package: 'SOD-123' }),
    }).then((r) => r.json() as Promise<{ id: number }>);
    const entered = { source: 'entered' };
    const fields = {
      vzMin: { value: 4.85, printed: '4.85 V', provenance: entered },
      vzNom: { value: 5.1, printed: '5.1 V', provenance: entered },
      vzMax: { value: 5.36, printed: '5.36 V', provenance: entered },
      izt: { value: 0.005, printed: '5 mA', provenance: entered },
      zzt: { value: 60, printed: '60 Ω', provenance: entered },
      izk: { value: 0.00025, printed: '0.25 mA', provenance: entered },
      zzk: { value: 480, printed: '480 Ω', provenance: entered },
      pdMax: { value: 0.5, printed: '500 mW', provenance: entered },
      rthJA: { value: 250, printed: '250 K/W', provenance: entered },
    };
    const put = await fetch(`${base}/api/vendor-parts/${part.id}/rating-card`, { method: 'PUT', headers: json, body: JSON.stringify({ version: 0, fields }) });
    if (put.status !== 200) throw new Error(`card not saved: ${put.status} ${await put.text()}`);

    const secrets = JSON.parse(readFileSync(join(dataDir, 'secrets.json'), 'utf8')) as { dbPassword: string };
    const barePort = await freePort();
    bare = spawn(join(root, 'node_modules', '.bin', 'tsx'), [join(__dirname, 'bare-server.ts')], {
      env: {
        ...process.env,
        BARE_PORT: String(barePort),
        DB_PORT: String(dbPort),
        DB_USER: 'shuntwise',
        DB_PASSWORD: secrets.dbPassword,
        DB_NAME: 'shuntwise',
      },
      stdio: 'ignore',
    });
    const bareBase = `http://127.0.0.1:${barePort}`;
    await waitFor(`${bareBase}/json`, bare, 'the bare server');

    const liveUrl = (await fetch(`${base}/api/health/live`).then((r) => r.status)) === 200 ? '/api/health/live' : '/api/health';
    // ONLY=card,me (names below) runs a subset, e.g. to profile one route under CPU_PROF.
    const only = process.env.ONLY?.split(',');
    const skipped: Load = { rps: NaN, p50: NaN, p99: NaN, bad: 0 };
    const db = Number(readFileSync(join(dataDir, 'db', 'mariadb.pid'), 'utf8').trim());
    const apiPids = { server: api.pid!, db };
    const barePids = { server: bare.pid!, db };
    const run = (name: string, url: string, headers: Record<string, string>, pids: { server: number; db: number }) =>
      !only || only.includes(name) ? load(url, headers, pids) : Promise.resolve(skipped);
    const bareJson = await run('json', `${bareBase}/json`, {}, barePids);
    const live = await run('live', `${base}${liveUrl}`, {}, apiPids);
    const bareCard = await run('bare-card', `${bareBase}/card/${part.id}`, {}, barePids);
    const card = await run('card', `${base}/api/vendor-parts/${part.id}/rating-card`, auth, apiPids);
    const me = await run('me', `${base}/api/auth/me`, auth, apiPids);

    const row = (name: string, r: Load, ratio?: { of: Load; goal: number }) =>
      console.log(
        `${name.padEnd(50)} ${r.rps.toFixed(0).padStart(7)} req/s   p50 ${String(r.p50).padStart(3)} ms   p99 ${String(r.p99).padStart(3)} ms` +
          (r.cpu ? `   CPU/req ${r.cpu.server.toFixed(3)} ms + MariaDB ${r.cpu.db.toFixed(3)} ms` : '') +
          (r.bad ? `   (${r.bad} failed)` : '') +
          (ratio ? `   ${(r.rps / ratio.of.rps).toFixed(3)} of floor (goal ≥ ${ratio.goal})` : '') +
          (ratio?.of.cpu && r.cpu ? `; by CPU ${((ratio.of.cpu.server + ratio.of.cpu.db) / (r.cpu.server + r.cpu.db)).toFixed(3)}` : ''),
      );
    console.log(`autocannon, ${CONNECTIONS} connections, ${SECONDS} s each, loopback, one run:`);
    row('bare node:http JSON (floor)', bareJson);
    row(`API ${liveUrl}`, live, { of: bareJson, goal: 0.8 });
    row('bare node:http + mariadb PK read of the card (floor)', bareCard);
    row('API GET /vendor-parts/:id/rating-card', card, { of: bareCard, goal: 0.33 });
    row('API GET /auth/me', me, { of: bareCard, goal: 0.5 });
    console.log('"by CPU": the floor\'s CPU per request (server + MariaDB) over the route\'s, the throughput ratio on an otherwise idle machine.');
  } finally {
    if (bare) {
      bare.kill('SIGTERM');
      await new Promise((r) => bare!.once('exit', r));
    }
    // SIGINT lets the API stop its stack (MariaDB last) and, under --cpu-prof, write the profile.
    api.kill('SIGINT');
    await new Promise((r) => api.once('exit', r));
    rmSync(dataDir, { recursive: true, force: true });
  }
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
