#!/usr/bin/env node
// `npm test`: the same set-up as `npm start` (packages, builds) in throw-away data folders
// on free ports — the demo data in .data is never touched — then every suite: format, lint,
// type-check, contracts (vitest), api (jest, unit + integration against a real MariaDB),
// web (vitest), the sign-in page's bundle budget, end-to-end journeys (playwright-core
// driving Debian's Chromium).
// Prints each runner's summary and the total time; exits non-zero on any failure.
import { spawn } from 'node:child_process';
import { createWriteStream, mkdirSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { join } from 'node:path';
import { RECORD_FONTS, buildAll, ensureDebianFiles, ensureDebianPackages, ensureNodeModules } from './lib/bootstrap.mjs';

const root = new URL('..', import.meta.url).pathname;
const started = Date.now();
const results = [];
const only = process.env.TEST_ONLY ? process.env.TEST_ONLY.split(',') : null;

function run(command, args, { env = {}, cwd = root } = {}) {
  return new Promise((resolve) => {
    const child = spawn(command, args, { cwd, env: { ...process.env, FORCE_COLOR: '0', NO_COLOR: '1', ...env }, stdio: ['ignore', 'pipe', 'pipe'] });
    let output = '';
    const take = (stream, sink) =>
      stream.on('data', (chunk) => {
        output += chunk;
        sink.write(chunk);
      });
    take(child.stdout, process.stdout);
    take(child.stderr, process.stderr);
    // eslint-disable-next-line no-control-regex
    child.on('close', (code) => resolve({ code: code ?? 1, output: output.replace(/\x1b\[[0-9;]*m/g, '') }));
  });
}

const summaryOf = {
  eslint: (out, ok) => (ok ? 'no problems' : (out.match(/✖ .*/g) ?? ['failed']).pop()),
  tsc: (out, ok) => (ok ? 'no type errors' : `${(out.match(/error TS\d+/g) ?? []).length} type errors`),
  jest: (out) =>
    ['Test Suites:', 'Tests:']
      .map((k) => (out.match(new RegExp(`^${k}.*$`, 'm')) ?? [''])[0].trim())
      .filter(Boolean)
      .join(' | ') || 'no summary',
  vitest: (out) =>
    ['Test Files', 'Tests']
      .map((k) => (out.match(new RegExp(`^\\s*${k}\\s.*$`, 'm')) ?? [''])[0].trim())
      .filter(Boolean)
      .join(' | ') || 'no summary',
};

async function step(name, summarise, fn) {
  if (only && !only.some((o) => name.includes(o))) return;
  console.log(`\n━━━ ${name}`);
  const t0 = Date.now();
  let ok = false;
  let summary = '';
  try {
    const r = await fn();
    ok = r.code === 0;
    summary = summarise(r.output ?? '', ok);
  } catch (error) {
    summary = error.message;
  }
  const seconds = (Date.now() - t0) / 1000;
  results.push({ name, ok, summary, seconds });
  console.log(`━━━ ${name}: ${ok ? 'passed' : 'FAILED'} in ${seconds.toFixed(1)} s — ${summary}`);
  return ok;
}

const freePort = () =>
  new Promise((resolve, reject) => {
    const s = createServer();
    s.once('error', reject);
    s.listen(0, '127.0.0.1', () => {
      const { port } = s.address();
      s.close(() => resolve(port));
    });
  });

async function endToEnd() {
  const dataDir = join(root, '.data-test', `e2e-${process.pid}`);
  rmSync(dataDir, { recursive: true, force: true });
  mkdirSync(dataDir, { recursive: true });
  const [port, dbPort, s3Port, smtpPort] = [await freePort(), await freePort(), await freePort(), await freePort()];
  const env = {
    ...process.env,
    DATA_DIR: dataDir,
    PORT: String(port),
    DB_PORT: String(dbPort),
    S3_FAKE_PORT: String(s3Port),
    SMTP_PORT: String(smtpPort),
    DB_NAME: 'shuntwise_e2e',
    LOGIN_RATE_LIMIT: '1000',
    UPLOAD_RATE_LIMIT: '1000',
    MAIL_RETRY_SECONDS: '1',
    WEB_DIST: join(root, 'web/dist'),
  };
  const log = createWriteStream(join(dataDir, 'stack.log'));
  const stack = spawn(process.execPath, [join(root, 'api/dist/dev/start.js')], { cwd: root, env, stdio: ['ignore', 'pipe', 'pipe'] });
  stack.stdout.pipe(log);
  stack.stderr.pipe(log);
  const exited = new Promise((r) => stack.on('exit', r));
  const baseUrl = `http://127.0.0.1:${port}`;
  try {
    const until = Date.now() + 300_000;
    for (;;) {
      if (stack.exitCode !== null) throw new Error(`the stack exited early; see ${join(dataDir, 'stack.log')}`);
      try {
        const res = await fetch(`${baseUrl}/api/health`);
        if (res.status === 200) break;
      } catch {
        /* not up yet */
      }
      if (Date.now() > until) throw new Error('the stack did not come up within 300 s');
      await new Promise((r) => setTimeout(r, 500));
    }
    console.log(`[e2e] stack up at ${baseUrl} after ${((Date.now() - started) / 1000).toFixed(0)} s of the run`);
    return await run(join(root, 'node_modules/.bin/vitest'), ['run', '--config', 'web/e2e/vitest.config.ts'], {
      env: { E2E_BASE_URL: baseUrl, E2E_DEMO_PASSWORD: env.DEMO_PASSWORD ?? 'shuntwise-demo', E2E_SCREENSHOTS: join(root, 'artifacts', 'screenshots') },
    });
  } finally {
    stack.kill('SIGTERM');
    await Promise.race([exited, new Promise((r) => setTimeout(r, 30_000))]);
    if (stack.exitCode === null) stack.kill('SIGKILL');
    if (!process.env.KEEP_TEST_DATA) rmSync(dataDir, { recursive: true, force: true });
  }
}

async function main() {
  await step(
    'set-up (Debian packages, npm ci, contracts build)',
    () => 'done',
    async () => {
      ensureDebianPackages(['mariadb-server', 'mariadb-client'], ['mariadbd', 'mariadb-install-db']);
      ensureDebianFiles(['fonts-dejavu-core'], RECORD_FONTS);
      ensureDebianPackages(['chromium'], ['chromium']);
      ensureNodeModules(root);
      return run('npm', ['run', 'build', '-w', 'contracts']);
    },
  );
  if (results.length && !results[0].ok) return;
  const npx = (bin) => join(root, 'node_modules/.bin', bin);
  await step(
    'format (prettier --check)',
    (out, ok) => (ok ? 'every file formatted' : `${(out.match(/^\[warn\] (?!Code style)/gm) ?? []).length} files not formatted (npm run format)`),
    () => run(npx('prettier'), ['--check', '.']),
  );
  await step('lint (eslint)', summaryOf.eslint, () => run(npx('eslint'), ['--max-warnings=0', '.']));
  await step('type-check (tsc)', summaryOf.tsc, () => run('npm', ['run', 'typecheck', '--silent']));
  await step('contracts (vitest)', summaryOf.vitest, () => run(npx('vitest'), ['run'], { cwd: join(root, 'contracts') }));
  await step('api (jest: unit + integration on MariaDB)', summaryOf.jest, () => run('npm', ['test', '--silent'], { cwd: join(root, 'api') }));
  await step('web (vitest)', summaryOf.vitest, () => run(npx('vitest'), ['run'], { cwd: join(root, 'web') }));
  const built = await step(
    'build (api, web)',
    () => 'built',
    async () => {
      buildAll(root, true);
      return { code: 0, output: '' };
    },
  );
  // The sign-in page's JavaScript budget (150 kB gzip) and the data grid kept out of it.
  await step(
    'bundle budget (sign-in page)',
    (out) => (out.match(/sign-in page JavaScript: .*/) ?? ['no figure'])[0],
    () => run('node', ['scripts/measure-bundle.mjs'], { cwd: join(root, 'web') }),
  );
  if (built !== false) await step('end-to-end (Chromium)', summaryOf.vitest, endToEnd);
}

main()
  .catch((error) => results.push({ name: 'runner', ok: false, summary: error.message, seconds: 0 }))
  .finally(() => {
    const total = (Date.now() - started) / 1000;
    const width = Math.max(...results.map((r) => r.name.length));
    console.log('\n══════ npm test summary');
    for (const r of results) console.log(`${r.ok ? 'pass' : 'FAIL'}  ${r.name.padEnd(width)}  ${r.seconds.toFixed(1).padStart(6)} s  ${r.summary}`);
    const failed = results.filter((r) => !r.ok).length;
    console.log(`══════ ${failed ? `${failed} step(s) FAILED` : 'all passed'} — total ${Math.floor(total / 60)} min ${(total % 60).toFixed(0)} s`);
    process.exit(failed ? 1 : 0);
  });
