/**
 * GET /api/search under load at 100 000 vendor parts (LARGE_PARTS=1000000 for a million):
 * 20 concurrent clients for 20 s (autocannon, loopback) cycling through typical searches —
 * a part number with a typo, a manufacturer in other case, a house part number, a middle
 * part of a part number, parametric ranges with and without text — against the built API
 * on its own large database (`.data/large-<parts>/`, loaded first when missing; see
 * seed-large.ts). Beside it, in the same run, the liveness answer as the throughput floor,
 * and the API's memory and the database's disk use. Goals: p99 < 100 ms, search throughput
 * ≥ 25 % of liveness. Figures only; never a timed test, never part of `npm test`.
 */
import { execFileSync, spawn } from 'node:child_process';
import { existsSync, readFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import autocannon from 'autocannon';
import { freePort } from '../src/dev/free-port';
import { ensureLargeData, root } from './large-data';

const PARTS = Number(process.env.LARGE_PARTS ?? 100_000);
const SECONDS = Number(process.env.BENCH_SECONDS ?? 20);
const CLIENTS = 20;

/** Typical searches, in the order each client cycles through them. */
const SEARCHES: Array<[string, string]> = [
  ['part number with a typo (ZX7-5V1)', 'q=ZX7-5V1'],
  ['manufacturer in other case', 'q=INVENTED%20MAKER%2017'],
  ['Vz 4.5…5.5 V, SOD-123, ≥ 0.5 W', 'vzFrom=4.5&vzTo=5.5&package=SOD-123&pdMin=0.5'],
  ['house part number', 'q=HP-00777'],
  ['middle of a part number, catalogue', 'q=5V1-77&includeNotCleared=true'],
  ['text and Vz range, catalogue', 'q=ZX07&vzFrom=4&vzTo=6&includeNotCleared=true'],
  ['tolerance ≤ 2 %, window in 4.5…5.5 V', 'vzFrom=4.5&vzTo=5.5&vzWindow=true&toleranceMax=0.02'],
  ['description words', 'q=gate%20protection'],
];

const rssOf = (pid: number) => Number(/VmRSS:\s+(\d+)/.exec(readFileSync(`/proc/${pid}/status`, 'utf8'))?.[1] ?? 0) * 1024;
/** CPU time (user + system) a process has used so far, in ms, from /proc (clock ticks of 10 ms). */
const cpuMsOf = (pid: number) => {
  const fields = readFileSync(`/proc/${pid}/stat`, 'utf8').split(') ')[1].split(' ');
  return (Number(fields[11]) + Number(fields[12])) * 10;
};
const mib = (bytes: number) => `${(bytes / 1024 / 1024).toFixed(0)} MiB`;

async function main(): Promise<void> {
  const start = join(root, 'api', 'dist', 'dev', 'start.js');
  if (!existsSync(start)) throw new Error('build the api first (npm run build -w api)');
  const dir = await ensureLargeData(PARTS);
  const port = await freePort();
  const env = {
    ...process.env,
    DATA_DIR: dir,
    PORT: String(port),
    DB_PORT: String(await freePort()),
    S3_FAKE_PORT: String(await freePort()),
    SMTP_PORT: String(await freePort()),
    SEED: 'users',
    LOGIN_RATE_LIMIT: '1000',
  };
  // CPU_PROF=<dir>: the API runs under `node --cpu-prof` and writes its profile there on exit (DEVELOPERS.md, "Profiling").
  const nodeArgs = process.env.CPU_PROF ? ['--cpu-prof', `--cpu-prof-dir=${resolve(process.env.CPU_PROF)}`] : [];
  const api = spawn(process.execPath, [...nodeArgs, start], { env, stdio: 'ignore' });
  const base = `http://127.0.0.1:${port}`;
  try {
    for (let i = 0; ; i++) {
      if (api.exitCode !== null) throw new Error('the api exited');
      if (
        await fetch(`${base}/api/health/live`).then(
          (r) => r.ok,
          () => false,
        )
      )
        break;
      if (i > 1800) throw new Error('the api did not come up');
      await new Promise((r) => setTimeout(r, 100));
    }
    const login = await fetch(`${base}/api/auth/login`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ email: 'designer@demo.test', password: 'shuntwise-demo' }),
    }).then((r) => r.json() as Promise<{ accessToken: string }>);
    const headers = { authorization: `Bearer ${login.accessToken}` };

    const dbPid = Number(readFileSync(join(dir, 'db', 'mariadb.pid'), 'utf8').trim());
    console.log(
      `${PARTS} vendor parts, ${CLIENTS} clients, ${SECONDS} s, autocannon over loopback; each search alone first (one client, median of 15; CPU time per request):`,
    );
    for (const [name, query] of SEARCHES) {
      const times: number[] = [];
      let info = '';
      let cpu0 = { api: 0, db: 0 };
      for (let i = 0; i < 16; i++) {
        if (i === 1) cpu0 = { api: cpuMsOf(api.pid!), db: cpuMsOf(dbPid) };
        const t0 = performance.now();
        const page = (await fetch(`${base}/api/search?${query}`, { headers }).then((r) => r.json())) as {
          total: number;
          text: { mode: string; candidates: number };
        };
        if (i > 0) times.push(performance.now() - t0);
        info = `${page.total} match, text ${page.text.mode}${page.text.mode !== 'none' ? ` over ${page.text.candidates}` : ''}`;
      }
      times.sort((a, b) => a - b);
      const apiCpu = (cpuMsOf(api.pid!) - cpu0.api) / 15;
      const dbCpu = (cpuMsOf(dbPid) - cpu0.db) / 15;
      console.log(
        `  ${name.padEnd(40)} ${times[7].toFixed(1).padStart(6)} ms   CPU: API ${apiCpu.toFixed(1).padStart(5)} ms, MariaDB ${dbCpu.toFixed(1).padStart(5)} ms   (${info})`,
      );
    }

    await autocannon({ url: `${base}/api/health/live`, connections: CLIENTS, duration: 2 });
    const live = await autocannon({ url: `${base}/api/health/live`, connections: CLIENTS, duration: Math.min(SECONDS, 10) });
    const rssBefore = rssOf(api.pid!);
    // CPU per request of each side, which a machine shared with other work does not skew the way it skews wall time.
    const cpuBefore = { api: cpuMsOf(api.pid!), db: cpuMsOf(dbPid) };
    const mixed = await autocannon({
      url: base,
      connections: CLIENTS,
      duration: SECONDS,
      headers,
      requests: SEARCHES.map(([, query]) => ({ method: 'GET', path: `/api/search?${query}` })),
    });
    const rssAfter = rssOf(api.pid!);
    const cpu = { api: cpuMsOf(api.pid!) - cpuBefore.api, db: cpuMsOf(dbPid) - cpuBefore.db };
    const dbBytes = Number(
      execFileSync('du', ['-sb', join(dir, 'db')])
        .toString()
        .split('\t')[0],
    );
    const failed = mixed.non2xx + mixed.errors + mixed.timeouts;
    console.log(
      `liveness                      ${live.requests.average.toFixed(0).padStart(6)} req/s   p50 ${live.latency.p50} ms   p99 ${live.latency.p99} ms`,
    );
    console.log(
      `search mix, ${CLIENTS} clients ${SECONDS} s   ${mixed.requests.average.toFixed(0).padStart(6)} req/s   p50 ${mixed.latency.p50} ms   p99 ${mixed.latency.p99} ms (goal < 100 ms)` +
        `   ${(mixed.requests.average / live.requests.average).toFixed(3)} of liveness (goal ≥ 0.25)${failed ? `   ${failed} failed` : ''}`,
    );
    console.log(
      `CPU per search (mix): API ${(cpu.api / mixed.requests.total).toFixed(2)} ms, MariaDB ${(cpu.db / mixed.requests.total).toFixed(2)} ms (${mixed.requests.total} requests)`,
    );
    console.log(`API memory (RSS) ${mib(rssBefore)} before, ${mib(rssAfter)} after the load; database on disk ${mib(dbBytes)} (${dir}/db)`);
  } finally {
    api.kill('SIGINT');
    await new Promise((r) => api.once('exit', r));
  }
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
