// The scaled-out stack on loopback, for `npm run cluster` and `npm run test:cluster`:
// a three-node MariaDB Galera cluster, the S3 and SMTP fakes once (their own process),
// N API replicas (api/dist/dev/replica.js) and nginx in front on one port.
// Every process is started here and stopped by its pid.
import { spawn, spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, openSync, closeSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { createServer } from 'node:net';
import { join } from 'node:path';
import { randomBytes } from 'node:crypto';

const GALERA = '/usr/lib/galera/libgalera_smm.so';
export const CLUSTER_PACKAGES = {
  packages: ['mariadb-server', 'mariadb-client', 'galera-4', 'mariadb-backup', 'rsync', 'nginx-light'],
  commands: ['mariadbd', 'mariabackup', 'rsync', 'nginx'],
  files: [GALERA],
};

const sleep = (ms) => new Promise((r) => setTimeout(r, ms));

export const freePort = () =>
  new Promise((resolve, reject) => {
    const s = createServer();
    s.once('error', reject);
    s.listen(0, '127.0.0.1', () => {
      const { port } = s.address();
      s.close(() => resolve(port));
    });
  });

/** Runs SQL as root over a node's socket with the mariadb client; returns the tab-separated rows. */
export function sql(socket, statement, { database } = {}) {
  const r = spawnSync('mariadb', ['--no-defaults', '-S', socket, '-uroot', '-N', '-B', ...(database ? [database] : []), '-e', statement], { encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`mariadb -S ${socket}: ${r.stderr.trim()}`);
  return r.stdout.trim()
    ? r.stdout
        .trim()
        .split('\n')
        .map((l) => l.split('\t'))
    : [];
}

function trySql(socket, statement) {
  try {
    return sql(socket, statement);
  } catch {
    return null;
  }
}

function alive(pid) {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
}

async function waitFor(what, check, ms, log) {
  const until = Date.now() + ms;
  for (;;) {
    const value = await check();
    if (value) return value;
    if (Date.now() > until) throw new Error(`${what}: not within ${ms / 1000} s${log ? `; see ${log}` : ''}`);
    await sleep(200);
  }
}

function tail(file, lines = 20) {
  try {
    return readFileSync(file, 'utf8').split('\n').slice(-lines).join('\n');
  } catch {
    return '';
  }
}

class GaleraNode {
  constructor(dir, index, ports, clusterAddress) {
    Object.assign(this, { index, ports, dir: join(dir, `node${index}`) });
    this.socket = join(this.dir, 'mariadb.sock');
    this.cnf = join(this.dir, 'node.cnf');
    this.log = join(this.dir, 'mariadb.log');
    this.datadir = join(this.dir, 'data');
    this.clusterAddress = clusterAddress;
    this.port = ports.mysql;
    this.proc = null;
  }

  writeConfig() {
    mkdirSync(join(this.dir, 'sst-logs'), { recursive: true });
    const { mysql, gmcast, ist, sst } = this.ports;
    writeFileSync(
      this.cnf,
      [
        '[mysqld]',
        `datadir=${this.datadir}`,
        `socket=${this.socket}`,
        `pid-file=${join(this.dir, 'mariadb.pid')}`,
        `log-error=${this.log}`,
        `port=${mysql}`,
        'bind-address=127.0.0.1',
        'user=root',
        'skip-name-resolve',
        'character-set-server=utf8mb4',
        'collation-server=utf8mb4_unicode_ci',
        'innodb-buffer-pool-size=64M',
        // durable commits on every node (the binary log is not on; sync_binlog would matter if it were)
        'innodb_flush_log_at_trx_commit=1',
        'sync_binlog=1',
        'max-connections=200',
        'binlog_format=ROW',
        'innodb_autoinc_lock_mode=2',
        'wsrep_on=ON',
        `wsrep_provider=${GALERA}`,
        `wsrep_cluster_name=shuntwise-local`,
        `wsrep_cluster_address=${this.clusterAddress}`,
        `wsrep_node_address=127.0.0.1:${gmcast}`,
        `wsrep_node_name=node${this.index}`,
        // distinct group, IST and SST ports per node on one host; a killed node is noticed in about 3 s
        `wsrep_provider_options="gmcast.listen_addr=tcp://127.0.0.1:${gmcast};ist.recv_addr=127.0.0.1:${ist};gcache.size=256M;evs.keepalive_period=PT0.5S;evs.suspect_timeout=PT2S;evs.inactive_timeout=PT4S"`,
        `wsrep_sst_receive_address=127.0.0.1:${sst}`,
        'wsrep_sst_method=mariabackup',
        'wsrep_sst_auth=root:',
        '',
        '[sst]',
        `sst-log-archive-dir=${join(this.dir, 'sst-logs')}`,
        '',
      ].join('\n'),
    );
  }

  /** Starts mariadbd (the first node of a new cluster bootstraps it) and waits until it is Synced. */
  async start({ bootstrap = false, timeoutMs = 120_000 } = {}) {
    this.writeConfig();
    if (bootstrap && !existsSync(join(this.datadir, 'mysql'))) {
      const init = spawnSync(
        'mariadb-install-db',
        ['--no-defaults', `--datadir=${this.datadir}`, '--user=root', '--auth-root-authentication-method=normal', '--skip-test-db'],
        { encoding: 'utf8' },
      );
      if (init.status !== 0) throw new Error(`mariadb-install-db failed:\n${init.stderr || init.stdout}`);
    }
    mkdirSync(this.datadir, { recursive: true });
    const out = openSync(join(this.dir, 'mariadbd.out'), 'a');
    this.proc = spawn('mariadbd', [`--defaults-file=${this.cnf}`, ...(bootstrap ? ['--wsrep-new-cluster'] : [])], { stdio: ['ignore', out, out] });
    closeSync(out);
    this.pid = this.proc.pid;
    this.exited = new Promise((r) => this.proc.once('exit', r));
    const started = Date.now();
    await waitFor(
      `Galera node ${this.index} synced`,
      () => {
        if (this.proc.exitCode !== null) throw new Error(`mariadbd node ${this.index} exited; see ${this.log}:\n${tail(this.log)}`);
        const rows = trySql(this.socket, "SHOW STATUS LIKE 'wsrep_local_state_comment'");
        return rows?.[0]?.[1] === 'Synced';
      },
      timeoutMs,
      this.log,
    );
    return Date.now() - started;
  }

  kill(signal = 'SIGKILL') {
    if (this.proc && this.proc.exitCode === null) this.proc.kill(signal);
    return this.exited;
  }

  async stop() {
    if (!this.proc || this.proc.exitCode !== null) return;
    this.proc.kill('SIGTERM');
    const timer = setTimeout(() => this.proc.kill('SIGKILL'), 30_000);
    await this.exited;
    clearTimeout(timer);
  }
}

class Managed {
  constructor(name, command, args, { env, log }) {
    Object.assign(this, { name, command, args, env, log });
    this.proc = null;
  }

  async start(readyWhen, timeoutMs = 120_000) {
    const out = openSync(this.log, 'a');
    this.proc = spawn(this.command, this.args, { env: this.env, stdio: ['ignore', out, out] });
    closeSync(out);
    this.pid = this.proc.pid;
    this.exited = new Promise((r) => this.proc.once('exit', r));
    await waitFor(
      `${this.name} ready`,
      async () => {
        if (this.proc.exitCode !== null) throw new Error(`${this.name} exited (${this.proc.exitCode}); see ${this.log}:\n${tail(this.log)}`);
        return readyWhen();
      },
      timeoutMs,
      this.log,
    );
  }

  kill(signal = 'SIGKILL') {
    if (this.proc && this.proc.exitCode === null) this.proc.kill(signal);
    return this.exited;
  }

  async stop() {
    if (!this.proc || this.proc.exitCode !== null) return;
    this.proc.kill('SIGTERM');
    const timer = setTimeout(() => this.proc.kill('SIGKILL'), 20_000);
    await this.exited;
    clearTimeout(timer);
  }
}

async function httpOk(url) {
  try {
    const res = await fetch(url, { signal: AbortSignal.timeout(2000) });
    return res.status === 200;
  } catch {
    return false;
  }
}

/**
 * Starts the whole cluster under `dir` (emptied first). Returns the handles and `stop()`.
 * `replicas`: API processes; `seed`: what the first replica loads ('users' or 'demo').
 */
export async function startCluster({ root, dir, replicas = 3, seed = 'demo', port, env: extraEnv = {}, log = console.log }) {
  rmSync(dir, { recursive: true, force: true });
  mkdirSync(dir, { recursive: true });
  const handles = { nodes: [], apis: [], fakes: null, nginx: null };
  const stop = async () => {
    await handles.nginx?.stop();
    for (const api of handles.apis) await api.stop();
    await handles.fakes?.stop();
    // the last node standing stops last
    for (const node of [...handles.nodes].reverse()) await node.stop();
  };
  try {
    const nodePorts = [];
    for (let i = 0; i < 3; i++) nodePorts.push({ mysql: await freePort(), gmcast: await freePort(), ist: await freePort(), sst: await freePort() });
    const clusterAddress = `gcomm://${nodePorts.map((p) => `127.0.0.1:${p.gmcast}`).join(',')}`;
    const timings = {};
    for (let i = 0; i < 3; i++) {
      const node = new GaleraNode(dir, i + 1, nodePorts[i], clusterAddress);
      handles.nodes.push(node);
      const ms = await node.start({ bootstrap: i === 0 });
      timings[`node${i + 1}`] = ms;
      log(
        `[galera] node ${i + 1} synced on 127.0.0.1:${node.port} (pid ${node.pid}) in ${(ms / 1000).toFixed(1)} s${i === 0 ? ' (bootstrap)' : ' (joined by SST)'}`,
      );
      if (i === 0) {
        const password = randomBytes(12).toString('hex');
        sql(node.socket, 'CREATE DATABASE IF NOT EXISTS shuntwise CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci');
        sql(node.socket, `CREATE USER IF NOT EXISTS 'shuntwise'@'127.0.0.1' IDENTIFIED BY '${password}'`);
        sql(node.socket, "GRANT ALL PRIVILEGES ON shuntwise.* TO 'shuntwise'@'127.0.0.1'");
        handles.dbPassword = password;
      }
    }
    const hosts = (first) => [...nodePorts.slice(first), ...nodePorts.slice(0, first)].map((p) => `127.0.0.1:${p.mysql}`).join(',');
    const [s3Port, smtpPort] = [await freePort(), await freePort()];
    const baseEnv = {
      ...process.env,
      NODE_ENV: 'production',
      DATA_DIR: dir,
      DB_NAME: 'shuntwise',
      DB_USER: 'shuntwise',
      DB_PASSWORD: handles.dbPassword,
      DB_HOST: '127.0.0.1',
      DB_PORT: String(nodePorts[0].mysql),
      DB_HOSTS: hosts(0),
      JWT_SECRET: randomBytes(32).toString('hex'),
      S3_ENDPOINT: `http://127.0.0.1:${s3Port}`,
      S3_FAKE_PORT: String(s3Port),
      SMTP_PORT: String(smtpPort),
      MAIL_RETRY_SECONDS: '1',
      // nginx is the one proxy in front: believe its X-Forwarded-For, so per-address limits see the client
      TRUST_PROXY: 'loopback',
      WEB_DIST: join(root, 'web/dist'),
      ...extraEnv,
    };

    handles.fakes = new Managed('fakes', process.execPath, [join(root, 'api/dist/dev/fakes.js')], { env: baseEnv, log: join(dir, 'fakes.log') });
    await handles.fakes.start(() => readFileSync(handles.fakes.log, 'utf8').includes('ready:'), 60_000);
    log(`[fakes] S3 on 127.0.0.1:${s3Port}, SMTP on 127.0.0.1:${smtpPort} (pid ${handles.fakes.pid})`);

    for (let i = 0; i < replicas; i++) {
      const apiPort = await freePort();
      const env = {
        ...baseEnv,
        PORT: String(apiPort),
        DB_PORT: String(nodePorts[i % 3].mysql),
        DB_HOSTS: hosts(i % 3),
        MIGRATE: i === 0 ? '1' : '0',
        SEED: i === 0 ? seed : 'none',
      };
      const api = new Managed(`api${i + 1}`, process.execPath, [join(root, 'api/dist/dev/replica.js')], { env, log: join(dir, `api${i + 1}.log`) });
      api.port = apiPort;
      api.url = `http://127.0.0.1:${apiPort}`;
      handles.apis.push(api);
      const t0 = Date.now();
      await api.start(() => httpOk(`${api.url}/api/health`), 300_000);
      log(`[api] replica ${i + 1} on ${api.url} (pid ${api.pid}, database node ${(i % 3) + 1} first) in ${((Date.now() - t0) / 1000).toFixed(1)} s`);
    }

    const lbPort = port ?? (await freePort());
    const nginxDir = join(dir, 'nginx');
    mkdirSync(join(nginxDir, 'tmp'), { recursive: true });
    const conf = join(nginxDir, 'nginx.conf');
    writeFileSync(
      conf,
      `# generated by scripts/lib/cluster.mjs
user root root;
daemon off;
worker_processes 1;
pid ${nginxDir}/nginx.pid;
error_log ${nginxDir}/error.log warn;
events { worker_connections 1024; }
http {
  access_log off;
  client_body_temp_path ${nginxDir}/tmp/body;
  proxy_temp_path ${nginxDir}/tmp/proxy;
  fastcgi_temp_path ${nginxDir}/tmp/fastcgi;
  uwsgi_temp_path ${nginxDir}/tmp/uwsgi;
  scgi_temp_path ${nginxDir}/tmp/scgi;
  client_max_body_size 25m;
  upstream api {
${handles.apis.map((a) => `    server 127.0.0.1:${a.port} max_fails=1 fail_timeout=5s;`).join('\n')}
    keepalive 32;
  }
  server {
    listen 127.0.0.1:${lbPort};
    location / {
      proxy_pass http://api;
      proxy_http_version 1.1;
      proxy_set_header Connection "";
      proxy_set_header Host $host;
      proxy_set_header X-Forwarded-For $proxy_add_x_forwarded_for;
      proxy_set_header X-Forwarded-Proto $scheme;
      # a replica that refuses the connection is skipped; a request already sent is never re-sent
      proxy_next_upstream error timeout;
      proxy_connect_timeout 2s;
      proxy_read_timeout 60s;
    }
  }
}
`,
    );
    handles.nginx = new Managed('nginx', 'nginx', ['-e', join(nginxDir, 'error.log'), '-p', nginxDir, '-c', conf], {
      env: process.env,
      log: join(nginxDir, 'nginx.out'),
    });
    handles.url = `http://127.0.0.1:${lbPort}`;
    await handles.nginx.start(() => httpOk(`${handles.url}/api/health`), 30_000);
    log(`[nginx] balancing ${handles.apis.length} replicas on ${handles.url} (pid ${handles.nginx.pid})`);
    handles.timings = timings;
    handles.stop = stop;
    return handles;
  } catch (error) {
    await stop();
    throw error;
  }
}

export { alive, waitFor, sleep };
