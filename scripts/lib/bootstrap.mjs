// Set-up steps shared by `npm start`, `npm test` and `npm run bench`. Plain Node (no
// dependencies): this runs before node_modules exists on a fresh machine.
import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync, statSync } from 'node:fs';
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

/** Installs Debian packages with apt-get when the commands they provide are missing. */
export function ensureDebianPackages(packages, commands) {
  if (haveCommands(...commands)) return;
  console.log(`[setup] installing Debian packages: ${packages.join(' ')}`);
  const sudo = process.getuid && process.getuid() === 0 ? [] : ['sudo'];
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  const run = (args) => execFileSync(sudo.length ? 'sudo' : args[0], sudo.length ? args : args.slice(1), { stdio: 'inherit', env });
  run(['apt-get', 'update', '-qq']);
  run(['apt-get', 'install', '-y', '-qq', '--no-install-recommends', ...packages]);
  if (!haveCommands(...commands)) throw new Error(`after installing ${packages.join(' ')}, still missing: ${commands.join(' ')}`);
}
