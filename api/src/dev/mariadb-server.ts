import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { closeSync, existsSync, mkdirSync, openSync, readFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import * as mariadb from 'mariadb';

export interface MariaDbServer {
  port: number;
  socket: string;
  dataDir: string;
  pid: number;
  /** Runs statements as root over the socket. */
  admin(sql: string, values?: unknown[]): Promise<unknown>;
  stop(): Promise<void>;
}

const isRoot = () => typeof process.getuid === 'function' && process.getuid() === 0;

/**
 * Starts a private MariaDB bound to 127.0.0.1 with its data under `dir` (created and
 * initialised the first time). No system service is involved; `stop` ends it by pid.
 */
export async function startMariaDb(options: { dir: string; port: number; quiet?: boolean }): Promise<MariaDbServer> {
  const dir = resolve(options.dir);
  const dataDir = join(dir, 'mysql');
  const socket = join(dir, 'mariadb.sock');
  const pidFile = join(dir, 'mariadb.pid');
  const logFile = join(dir, 'mariadb.log');
  // A private temporary folder: servers of parallel runs sharing /tmp trip over each other's temporary tables.
  const tmpDir = join(dir, 'tmp');
  mkdirSync(tmpDir, { recursive: true });
  stopStale(pidFile, dataDir);

  if (!existsSync(join(dataDir, 'mysql'))) {
    const init = spawnSync(
      'mariadb-install-db',
      [
        '--no-defaults',
        `--datadir=${dataDir}`,
        ...(isRoot() ? ['--user=root'] : []),
        '--auth-root-authentication-method=normal',
        '--skip-test-db',
        '--skip-name-resolve',
        `--tmpdir=${tmpDir}`,
      ],
      { encoding: 'utf8' },
    );
    if (init.status !== 0) throw new Error(`mariadb-install-db failed (is mariadb-server installed?):\n${init.stderr || init.stdout || init.error}`);
  }

  const log = openSync(logFile, 'a');
  const child: ChildProcess = spawn(
    'mariadbd',
    [
      '--no-defaults',
      `--datadir=${dataDir}`,
      `--socket=${socket}`,
      `--port=${options.port}`,
      `--pid-file=${pidFile}`,
      `--tmpdir=${tmpDir}`,
      '--bind-address=127.0.0.1',
      '--skip-name-resolve',
      '--character-set-server=utf8mb4',
      '--collation-server=utf8mb4_unicode_ci',
      '--innodb-buffer-pool-size=128M',
      // Durable commits: an acknowledged write survives a crash of the server or the machine
      // (2 would lose up to a second of commits on power loss). sync_binlog matters once the
      // binary log is on (replication, Galera SST); it costs nothing while it is off.
      '--innodb-flush-log-at-trx-commit=1',
      '--sync-binlog=1',
      '--max-connections=200',
      ...(isRoot() ? ['--user=root'] : []),
    ],
    { stdio: ['ignore', log, log], detached: false },
  );
  closeSync(log);
  let exited = false;
  child.once('exit', () => (exited = true));

  const started = Date.now();
  let lastError: unknown;
  for (;;) {
    if (exited) throw new Error(`mariadbd exited at start; see ${logFile}:\n${tail(logFile)}`);
    try {
      const conn = await mariadb.createConnection({ socketPath: socket, user: 'root', connectTimeout: 1000 });
      await conn.query('SELECT 1');
      await conn.end();
      break;
    } catch (error) {
      lastError = error;
    }
    if (Date.now() - started > 60_000) {
      child.kill('SIGKILL');
      throw new Error(`MariaDB did not answer within 60 s: ${String(lastError)}\n${tail(logFile)}`);
    }
    await new Promise((r) => setTimeout(r, 150));
  }
  if (!options.quiet) console.log(`[mariadb] up on 127.0.0.1:${options.port} (pid ${child.pid}, data ${dataDir}) in ${Date.now() - started} ms`);

  const admin = adminOverSocket(socket);

  const stop = async () => {
    if (exited) return;
    const done = new Promise<void>((r) => child.once('exit', () => r()));
    child.kill('SIGTERM');
    const timer = setTimeout(() => child.kill('SIGKILL'), 20_000);
    await done;
    clearTimeout(timer);
  };

  return { port: options.port, socket, dataDir, pid: child.pid!, admin, stop };
}

/** A server someone else started (e.g. jest's global set-up): used, never stopped. */
export function attachMariaDb(options: { socket: string; port: number }): MariaDbServer {
  return { port: options.port, socket: options.socket, dataDir: '', pid: 0, admin: adminOverSocket(options.socket), stop: async () => undefined };
}

function adminOverSocket(socket: string) {
  return async (sql: string, values?: unknown[]) => {
    const conn = await mariadb.createConnection({ socketPath: socket, user: 'root', multipleStatements: false });
    try {
      return await conn.query(sql, values);
    } finally {
      await conn.end();
    }
  };
}

/** Creates the database and an app user that may use only it (idempotent; keeps the password in step). */
export async function ensureDatabase(server: MariaDbServer, database: string, user: string, password: string): Promise<void> {
  if (!/^[A-Za-z0-9_]+$/.test(database) || !/^[A-Za-z0-9_]+$/.test(user)) throw new Error('database and user names: letters, digits and _ only');
  await server.admin(`CREATE DATABASE IF NOT EXISTS \`${database}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
  await server.admin(`CREATE USER IF NOT EXISTS '${user}'@'127.0.0.1' IDENTIFIED BY ?`, [password]);
  await server.admin(`ALTER USER '${user}'@'127.0.0.1' IDENTIFIED BY ?`, [password]);
  await server.admin(`GRANT ALL PRIVILEGES ON \`${database}\`.* TO '${user}'@'127.0.0.1'`);
}

/** A mariadbd left running on this data folder by a killed earlier run is stopped by its pid. */
function stopStale(pidFile: string, dataDir: string): void {
  if (!existsSync(pidFile)) return;
  const pid = Number(readFileSync(pidFile, 'utf8').trim());
  if (!Number.isInteger(pid) || pid <= 1) return;
  let cmdline = '';
  try {
    cmdline = readFileSync(`/proc/${pid}/cmdline`, 'utf8');
  } catch {
    return; // not running
  }
  if (!cmdline.includes('mariadbd') || !cmdline.includes(dataDir)) return;
  console.log(`[mariadb] stopping a server left running from an earlier run (pid ${pid})`);
  process.kill(pid, 'SIGTERM');
  const until = Date.now() + 20_000;
  while (Date.now() < until) {
    try {
      process.kill(pid, 0);
    } catch {
      return;
    }
    spawnSync('sleep', ['0.2']);
  }
  process.kill(pid, 'SIGKILL');
}

function tail(file: string): string {
  try {
    return readFileSync(file, 'utf8').split('\n').slice(-15).join('\n');
  } catch {
    return '';
  }
}
