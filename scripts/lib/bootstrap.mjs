// Set-up steps shared by `npm start`, `npm test` and `npm run bench`. Plain Node (no
// dependencies): this runs before node_modules exists on a fresh machine.
import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync, readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';

/** Runs `npm ci` when node_modules is missing or older than the lock file. */
export function ensureNodeModules(root) {
  const lock = join(root, 'package-lock.json');
  const marker = join(root, 'node_modules', '.package-lock.json');
  if (existsSync(marker) && statSync(marker).mtimeMs >= statSync(lock).mtimeMs) return;
  console.log('[setup] installing npm packages (npm ci)…');
  const run = spawnSync('npm', ['ci', '--no-audit', '--no-fund'], { cwd: root, stdio: 'inherit' });
  if (run.status !== 0) throw new Error('npm ci failed');
}

/** True when every command is on PATH. */
export function haveCommands(...commands) {
  return commands.every((c) => spawnSync('sh', ['-c', `command -v ${c}`], { stdio: 'ignore' }).status === 0);
}

/** Installs Debian packages with apt-get when the commands (or files, e.g. a library) they provide are missing. */
export function ensureDebianPackages(packages, commands, files = []) {
  const present = () => haveCommands(...commands) && files.every((f) => existsSync(f));
  if (present()) return;
  aptInstall(packages);
  if (!present()) throw new Error(`after installing ${packages.join(' ')}, still missing: ${[...commands, ...files].join(' ')}`);
}

/** Installs Debian packages with apt-get when files they provide are missing (fonts, data). */
export function ensureDebianFiles(packages, files) {
  const missing = () => files.filter((f) => !existsSync(f));
  if (missing().length === 0) return;
  aptInstall(packages);
  if (missing().length) throw new Error(`after installing ${packages.join(' ')}, still missing: ${missing().join(' ')}`);
}

/** The DejaVu Sans files the decision-record PDFs embed (api/src/qualifications/records/record-pdf.ts). */
export const RECORD_FONTS = ['/usr/share/fonts/truetype/dejavu/DejaVuSans.ttf', '/usr/share/fonts/truetype/dejavu/DejaVuSans-Bold.ttf'];

function aptInstall(packages) {
  console.log(`[setup] installing Debian packages: ${packages.join(' ')}`);
  const sudo = process.getuid && process.getuid() === 0 ? [] : ['sudo'];
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  const run = (args) => execFileSync(sudo.length ? 'sudo' : args[0], sudo.length ? args : args.slice(1), { stdio: 'inherit', env });
  run(['apt-get', 'update', '-qq']);
  run(['apt-get', 'install', '-y', '-qq', '--no-install-recommends', ...packages]);
}

/** Newest modification time under the given paths (files only; skips node_modules and dist). */
export function newestMtime(paths) {
  let newest = 0;
  const walk = (p) => {
    let st;
    try {
      st = statSync(p);
    } catch {
      return;
    }
    if (st.isDirectory()) {
      const base = p.split('/').pop();
      if (base === 'node_modules' || base === 'dist' || base === '.scratch') return;
      for (const entry of readdirSync(p)) walk(join(p, entry));
    } else if (st.mtimeMs > newest) newest = st.mtimeMs;
  };
  paths.forEach(walk);
  return newest;
}

/** Builds one workspace when its inputs are newer than its output marker (or always with force). */
export function buildIfStale(root, { name, inputs, output, force = false }) {
  const out = join(root, output);
  const outTime = existsSync(out) ? statSync(out).mtimeMs : 0;
  if (!force && outTime > 0 && newestMtime(inputs.map((i) => join(root, i))) < outTime) return false;
  console.log(`[build] ${name}…`);
  const run = spawnSync('npm', ['run', 'build', '-w', name], { cwd: root, stdio: 'inherit' });
  if (run.status !== 0) throw new Error(`build of ${name} failed`);
  return true;
}

/** The builds that `npm start` and the end-to-end tests need, in dependency order. */
export function buildAll(root, force = false) {
  const contracts = buildIfStale(root, {
    name: 'contracts',
    inputs: ['contracts/src', 'contracts/tsconfig.json', 'contracts/tsconfig.build.json'],
    output: 'contracts/dist/index.js',
    force,
  });
  buildIfStale(root, {
    name: 'api',
    inputs: ['api/src', 'api/tsconfig.json', 'api/tsconfig.build.json', 'contracts/src'],
    output: 'api/dist/dev/start.js',
    force: force || contracts,
  });
  buildIfStale(root, {
    name: 'web',
    inputs: ['web/src', 'web/index.html', 'web/vite.config.ts', 'web/public', 'contracts/src', 'package-lock.json'],
    output: 'web/dist/index.html',
    force,
  });
}
