import { spawn, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { freePort } from '../src/dev/free-port';
import { startMariaDb, type MariaDbServer } from '../src/dev/mariadb-server';
import { createTestApp, eventually, type TestApp } from './helpers/test-app';

/**
 * Faults, on loopback with the real services: the database stopped (cleanly and with SIGKILL)
 * and started again during reads and writes, the object store away during an upload, the mail
 * server away during a decision, and the API process killed with SIGKILL during a burst of writes.
 * This file runs its own MariaDB (it stops it), never jest's shared one.
 * Alone: `cd api && npm test -- test/faults`.
 */

const fixtures = require('@shuntwise/test-fixtures') as typeof import('@shuntwise/test-fixtures');

interface Outcome {
  kind: 'write' | 'read';
  status: number | 'network';
  email?: string;
  retryAfter?: string;
  message?: string;
}

/** Writes (invitations: one invitation row and one outbox row in one transaction) and reads until `stop()`. */
function burst(send: (kind: 'write' | 'read', email: string) => Promise<Omit<Outcome, 'kind' | 'email'>>, tag: string, workers = 3) {
  const outcomes: Outcome[] = [];
  let stopped = false;
  let n = 0;
  const loops = Array.from({ length: workers }, async () => {
    while (!stopped) {
      const email = `fault-${tag}-${n++}@demo.test`;
      outcomes.push({ kind: 'write', email, ...(await send('write', email)) });
      outcomes.push({ kind: 'read', ...(await send('read', email)) });
    }
  });
  return {
    outcomes,
    acked: () => outcomes.filter((o) => o.kind === 'write' && o.status === 201).map((o) => o.email!),
    async stop() {
      stopped = true;
      await Promise.all(loops);
    },
  };
}

/** Every invitation of this burst has its outbox row, once; every acknowledged one is there. */
async function checkInvitations(select: TestApp['select'], tag: string, acked: string[]) {
  const invitations = await select<{ email: string }>('SELECT email FROM invitations WHERE email LIKE ?', [`fault-${tag}-%`]);
  const mails = await select<{ recipients: string | string[] }>("SELECT recipients FROM outgoing_mail WHERE kind = 'invitation'");
  const mailed = mails.flatMap((m) => (typeof m.recipients === 'string' ? (JSON.parse(m.recipients) as string[]) : m.recipients));
  const invited = invitations.map((i) => i.email);
  for (const email of acked) expect(invited).toContain(email);
  expect(new Set(invited).size).toBe(invited.length);
  for (const email of invited) expect(mailed.filter((m) => m === email)).toHaveLength(1);
  for (const email of mailed.filter((m) => m.startsWith(`fault-${tag}-`))) expect(invited).toContain(email);
  return invited;
}

describe('faults (own MariaDB, loopback)', () => {
  let db: MariaDbServer;
  let dbDir: string;
  let dbPort: number;
  let t: TestApp;
  let admin: string;
  let engineer: string;

  const startDb = async () => {
    db = await startMariaDb({ dir: dbDir, port: dbPort, quiet: true });
  };

  beforeAll(async () => {
    dbDir = join(process.env.TEST_DATA_DIR!, `faults-${randomBytes(3).toString('hex')}`);
    dbPort = await freePort();
    await startDb();
    t = await createTestApp({ seed: 'demo', database: { port: dbPort, socket: db.socket }, env: { HEALTH_PROBE_SECONDS: '0.1' } });
    admin = await t.tokenFor('admin');
    engineer = await t.tokenFor('engineer');
  }, 180_000);
  afterAll(async () => {
    await t?.close().catch(() => undefined);
    await db?.stop();
  });

  const send = async (kind: 'write' | 'read', email: string) => {
    const res =
      kind === 'write'
        ? await t.http
            .post('/api/users/invitations')
            .set({ Authorization: `Bearer ${admin}` })
            .send({ email, name: 'Fault Test', role: 'designer' })
        : await t.http.get('/api/house-parts?pageSize=5').set({ Authorization: `Bearer ${engineer}` });
    return { status: res.status, retryAfter: res.headers['retry-after'] as string | undefined, message: res.body?.message as string | undefined };
  };

  for (const signal of ['SIGTERM', 'SIGKILL'] as const) {
    it(`answers 503 while the database is stopped (${signal}) during reads and writes, and recovers without a restart`, async () => {
      const tag = signal.toLowerCase();
      const load = burst(send, tag);
      try {
        await eventually(async () => load.acked().length >= 5, 30_000);
        const pid = db.pid;
        if (signal === 'SIGKILL') process.kill(pid, 'SIGKILL');
        else await db.stop();
        await eventually(async () => {
          try {
            process.kill(pid, 0);
            return false;
          } catch {
            return true;
          }
        }, 30_000);
        const downFrom = load.outcomes.length;
        await eventually(async () => load.outcomes.slice(downFrom).filter((o) => o.status === 503).length >= 6, 30_000);

        const health = await t.http.get('/api/health');
        expect(health.status).toBe(503);
        expect(health.body).toMatchObject({ status: 'down', services: { database: 'down' } });
        expect((await t.http.get('/api/health/live')).status).toBe(200);

        await startDb();
        await eventually(async () => (await t.http.get('/api/health')).status === 200, 60_000);
        const upAt = load.acked().length;
        await eventually(async () => load.acked().length >= upAt + 5, 30_000);
      } finally {
        await load.stop();
      }

      const statuses = [...new Set(load.outcomes.map((o) => o.status))].sort();
      console.log(`database ${signal}: ${load.outcomes.length} requests, statuses ${JSON.stringify(statuses)}, ${load.acked().length} writes acknowledged`);
      // Only success or "unavailable": never a 500, never a hang.
      for (const o of load.outcomes) expect([200, 201, 503]).toContain(o.status);
      const unavailable = load.outcomes.filter((o) => o.status === 503);
      expect(unavailable.length).toBeGreaterThan(0);
      for (const o of unavailable) {
        expect(o.message).toMatch(/database is unavailable/);
        expect(o.retryAfter).toBe('5');
      }
      await checkInvitations(t.select, tag, load.acked());
    }, 180_000);
  }

  it('answers 503 to an upload while the object store is away, keeps no row, and takes the upload once it is back', async () => {
    const sheet = fixtures.loadDemoCatalogue().datasheets[0];
    // The same invented datasheet with a trailing comment: new bytes (a new file to the app), same content.
    const pdf = Buffer.concat([readFileSync(join(fixtures.paths.datasheets, sheet.file)), Buffer.from(`\n% fault test ${randomBytes(4).toString('hex')}\n`)]);
    const count = async () => Number((await t.select<{ n: number }>('SELECT COUNT(*) AS n FROM datasheets'))[0].n);
    const before = await count();
    const upload = () =>
      t.http
        .post('/api/datasheets')
        .set({ Authorization: `Bearer ${engineer}` })
        .attach('file', pdf, { filename: 'fault-test.pdf', contentType: 'application/pdf' });

    await t.stack.stopS3();
    let refused;
    try {
      refused = await upload();
    } finally {
      await t.stack.startS3();
    }
    expect(refused.status).toBe(503);
    expect(refused.body.message).toMatch(/object store/);
    expect(await count()).toBe(before);

    const accepted = await upload();
    expect(accepted.status).toBe(201);
    expect(await count()).toBe(before + 1);
  }, 120_000);

  it('commits a decision while the mail server is away; its mail waits and goes out once the server is back', async () => {
    const reviewer = await t.tokenFor('reviewer@demo.test');
    const list = await t.http.get('/api/qualifications?state=in-review').set({ Authorization: `Bearer ${reviewer}` });
    expect(list.status).toBe(200);
    const id = list.body.items[0].id as number;
    const version = (await t.http.get(`/api/qualifications/${id}`).set({ Authorization: `Bearer ${reviewer}` })).body.version as number;

    await t.stack.stopSmtp();
    const [{ decidedAt }] = await t.select<{ decidedAt: Date }>('SELECT NOW() AS decidedAt');
    let decided;
    let waiting;
    try {
      decided = await t.http
        .post(`/api/qualifications/${id}/clear`)
        .set({ Authorization: `Bearer ${reviewer}` })
        .send({ version, note: 'Cleared while the mail server was away.' });
      expect(decided.status).toBe(200);
      // the outbox keeps the message and has tried the mail server (and failed) since the decision
      waiting = await eventually(async () => {
        const [row] = await t.select<{ id: number; subject: string; state: string }>(
          "SELECT id, subject, state FROM outgoing_mail WHERE kind = 'qualification.cleared' ORDER BY id DESC LIMIT 1",
        );
        const [refused] = await t.select("SELECT id FROM outgoing_mail WHERE last_error IS NOT NULL AND state = 'pending' AND updated_at >= ? LIMIT 1", [
          decidedAt,
        ]);
        return refused && row;
      }, 20_000);
    } finally {
      await t.stack.startSmtp();
    }
    expect(decided.status).toBe(200);
    expect(decided.body.state).toBe('cleared');
    expect(waiting.state).toBe('pending');

    const sent = await eventually(async () => {
      const [row] = await t.select<{ state: string }>('SELECT state FROM outgoing_mail WHERE id = ?', [waiting.id]);
      return row?.state === 'sent' && row;
    }, 30_000);
    expect(sent.state).toBe('sent');
    const captured = await t.capturedMail();
    expect(captured.filter((m) => m.subject === waiting.subject && m.recipients.includes('buyer@demo.test'))).toHaveLength(1);
  }, 120_000);

  describe('the API process killed with SIGKILL during a burst of writes', () => {
    let child: ChildProcess | undefined;
    afterAll(() => {
      if (child && child.exitCode === null) child.kill('SIGKILL');
    });

    it('keeps every acknowledged write, none half-written, and sends each message', async () => {
      const id = randomBytes(3).toString('hex');
      const port = await freePort();
      const env: NodeJS.ProcessEnv = {
        ...process.env,
        NODE_ENV: 'test',
        NODE_OPTIONS: '',
        DATA_DIR: join(dbDir, `api-${id}`),
        PORT: String(port),
        DB_PORT: String(dbPort),
        DB_NAME: `k_${id}`,
        DB_USER: `k_${id}`,
        DB_PASSWORD: `k_${id}_local_only`,
        JWT_SECRET: randomBytes(32).toString('hex'),
        S3_FAKE_PORT: String(await freePort()),
        SMTP_PORT: String(await freePort()),
        MAIL_RETRY_SECONDS: '0.05',
        MAIL_CLAIM_SECONDS: '2',
        LOGIN_RATE_LIMIT: '1000',
        DEMO_PASSWORD: 'demo-password-for-tests',
        FAULT_DB_SOCKET: db.socket,
        SEED: 'users',
      };
      const base = `http://127.0.0.1:${port}`;
      const start = async () => {
        const proc = spawn(process.execPath, ['-r', join(__dirname, 'faults', 'register-ts.cjs'), join(__dirname, 'faults', 'api-process.ts')], {
          env,
          stdio: ['ignore', 'pipe', 'pipe'],
        });
        let output = '';
        proc.stderr!.on('data', (c: Buffer) => (output += c));
        proc.stdout!.on('data', (c: Buffer) => (output += c));
        proc.once('exit', () => process.env.KEEP_TEST_DATA && console.log(`API process output:\n${output.slice(-5000)}`));
        await new Promise<void>((resolve, reject) => {
          proc.stdout!.on('data', (c: Buffer) => String(c).includes('ready') && resolve());
          proc.once('exit', (code) => reject(new Error(`the API process exited (${code}) before it was ready:\n${output.slice(-3000)}`)));
        });
        return proc;
      };
      const api = async (path: string, init: RequestInit = {}) => {
        const res = await fetch(`${base}${path}`, { ...init, headers: { 'content-type': 'application/json', ...(init.headers ?? {}) } });
        return { status: res.status, body: (await res.json().catch(() => null)) as Record<string, unknown> | null };
      };

      child = await start();
      const login = await api('/api/auth/login', { method: 'POST', body: JSON.stringify({ email: 'admin@demo.test', password: env.DEMO_PASSWORD }) });
      const token = login.body!.accessToken as string;
      const load = burst(
        async (kind, email) => {
          try {
            const res =
              kind === 'write'
                ? await api('/api/users/invitations', {
                    method: 'POST',
                    headers: { authorization: `Bearer ${token}` },
                    body: JSON.stringify({ email, name: 'Kill Test', role: 'designer' }),
                  })
                : await api('/api/health/live');
            return { status: res.status, message: res.status >= 300 ? String(res.body?.message) : undefined };
          } catch {
            return { status: 'network' as const };
          }
        },
        'kill',
        6,
      );
      try {
        await eventually(async () => load.acked().length >= 30, 60_000);
        child.kill('SIGKILL');
        await new Promise((r) => child!.once('exit', r));
        await eventually(async () => load.outcomes.some((o) => o.status === 'network'), 10_000);
      } finally {
        await load.stop();
      }
      const restarted = await start();
      child = restarted;

      const acked = load.acked();
      const lost = load.outcomes.filter((o) => o.kind === 'write' && o.status === 'network').length;
      console.log(`API SIGKILL: ${acked.length} writes acknowledged before the kill, ${lost} cut off in flight`);
      const odd = load.outcomes.filter((o) => ![200, 201, 'network'].includes(o.status));
      expect(odd).toEqual([]);

      const { Sequelize, QueryTypes } = await import('sequelize');
      const sequelize = new Sequelize({
        dialect: 'mariadb',
        host: '127.0.0.1',
        port: dbPort,
        database: env.DB_NAME,
        username: env.DB_USER,
        password: env.DB_PASSWORD,
        logging: false,
      });
      try {
        const select = <T>(sql: string, replacements: unknown[] = []) =>
          sequelize.query(sql, { replacements, type: QueryTypes.SELECT }) as unknown as Promise<T[]>;
        const invited = await checkInvitations(select, 'kill', acked);
        expect(invited.length).toBeGreaterThanOrEqual(acked.length);
        // Every message goes out; only one the killed process had claimed may have been handed to SMTP twice.
        const rows = await eventually(async () => {
          const r = await select<{ id: number; state: string; recipients: string | string[] }>(
            "SELECT id, state, recipients FROM outgoing_mail WHERE kind = 'invitation'",
          );
          return r.every((m) => m.state === 'sent') && r;
        }, 60_000);
        const captured = await select<{ recipients: string | string[] }>('SELECT recipients FROM captured_mail');
        const received = captured.flatMap((c) => (typeof c.recipients === 'string' ? (JSON.parse(c.recipients) as string[]) : c.recipients));
        const twice = invited.filter((e) => received.filter((r) => r === e).length > 1);
        for (const email of invited) expect(received).toContain(email);
        console.log(`API SIGKILL: ${rows.length} messages sent after the restart, ${twice.length} handed to SMTP twice (in flight at the kill)`);
        expect(twice.length).toBeLessThanOrEqual(1);
      } finally {
        await sequelize.close();
        restarted.kill('SIGTERM');
        await new Promise((r) => restarted.once('exit', r));
        child = undefined;
        await db.admin(`DROP DATABASE IF EXISTS \`${env.DB_NAME}\``).catch(() => undefined);
      }
    }, 240_000);
  });
});
