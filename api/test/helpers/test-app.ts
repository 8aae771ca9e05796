import { randomBytes } from 'node:crypto';
import { join } from 'node:path';
import type { Role } from '@shuntwise/contracts';
import { QueryTypes } from 'sequelize';
import request from 'supertest';
import type TestAgent from 'supertest/lib/agent';
import { freePort } from '../../src/dev/free-port';
import { startStack, type Stack } from '../../src/dev/stack';
import type { SeedLevel } from '../../src/seed/demo-seed.service';
import { DEMO_USERS } from '../../src/seed/demo-users';

export interface TestApp {
  /** Names this app's database, user and data folder (t_<id>, u_<id>). */
  id: string;
  stack: Stack;
  http: TestAgent;
  /** A fresh token for a demo account: by role (the first account with it) or by e-mail. */
  tokenFor(who: Role | string): Promise<string>;
  /** Mail the SMTP fake captured, oldest first. */
  capturedMail(): Promise<Array<{ sender: string; recipients: string[]; subject: string; body: string }>>;
  /** Raw SELECT against the test database. */
  select<T = Record<string, unknown>>(sql: string, replacements?: unknown[]): Promise<T[]>;
  /** Raw UPDATE/DELETE/INSERT against the test database (to set up odd states). */
  exec(sql: string, replacements?: unknown[]): Promise<void>;
  /** Stops the app and drops its database (`keepDatabase`: leaves it for a restart). */
  close(options?: { keepDatabase?: boolean }): Promise<void>;
}

export interface TestAppOptions {
  /** Extra environment (e.g. LOGIN_RATE_LIMIT). */
  env?: Record<string, string>;
  seed?: SeedLevel;
  /** Start on the database of an app started earlier (a restart); the earlier app should be closed with `keepDatabase`. */
  sameDatabaseAs?: TestApp;
  /** A MariaDB of the test's own (one it stops and starts) instead of jest's shared one. */
  database?: { port: number; socket: string };
}

/**
 * Boots the real app against its own database in jest's MariaDB, with the S3 and SMTP
 * fakes on free ports. Migrations run from empty; the demo accounts are seeded.
 */
export async function createTestApp(options: TestAppOptions = {}): Promise<TestApp> {
  const port = options.database ? String(options.database.port) : process.env.TEST_DB_PORT;
  const socket = options.database?.socket ?? process.env.TEST_DB_SOCKET;
  if (!port || !socket) throw new Error('TEST_DB_PORT is not set: run through jest (test/setup/global-setup.ts starts MariaDB)');
  const id = options.sameDatabaseAs?.id ?? randomBytes(4).toString('hex');
  const dataDir = join(process.env.TEST_DATA_DIR!, `app-${id}`);
  const stack = await startStack({
    source: {
      NODE_ENV: 'test',
      DATA_DIR: dataDir,
      DB_PORT: port,
      DB_NAME: `t_${id}`,
      DB_USER: `u_${id}`,
      DB_PASSWORD: `p_${id}_local_only`,
      JWT_SECRET: options.sameDatabaseAs?.stack.env.JWT_SECRET ?? randomBytes(32).toString('hex'),
      S3_FAKE_PORT: String(await freePort()),
      SMTP_PORT: String(await freePort()),
      MAIL_RETRY_SECONDS: '0.05',
      DEMO_PASSWORD: 'demo-password-for-tests',
      LOGIN_RATE_LIMIT: '1000',
      UPLOAD_RATE_LIMIT: '1000',
      ...options.env,
    },
    externalDatabase: { socket },
    seed: options.seed ?? 'users',
    listen: false,
    quiet: true,
  });
  const http = request(stack.app.getHttpServer());
  const select = <T>(sql: string, replacements: unknown[] = []) =>
    stack.sequelize.query(sql, { replacements, type: QueryTypes.SELECT }) as unknown as Promise<T[]>;
  return {
    id,
    stack,
    http,
    select,
    async exec(sql, replacements = []) {
      await stack.sequelize.query(sql, { replacements, type: QueryTypes.UPDATE });
    },
    async tokenFor(who) {
      const email = who.includes('@') ? who : DEMO_USERS.find((u) => u.role === who)!.email;
      const res = await http.post('/api/auth/login').send({ email, password: stack.env.DEMO_PASSWORD });
      if (res.status !== 200) throw new Error(`login as ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
      return res.body.accessToken as string;
    },
    async capturedMail() {
      const rows = await select<{ sender: string; recipients: string | string[]; subject: string; body: string }>(
        'SELECT sender, recipients, subject, body FROM captured_mail ORDER BY id',
      );
      return rows.map((r) => ({ ...r, recipients: typeof r.recipients === 'string' ? JSON.parse(r.recipients) : r.recipients }));
    },
    async close(closing = {}) {
      await stack.stop();
      if (closing.keepDatabase) return;
      await stack.database.admin(`DROP DATABASE IF EXISTS \`t_${id}\``).catch(() => undefined);
    },
  };
}

/** Waits until `check` returns a truthy value (polling), or fails after `ms`. */
export async function eventually<T>(check: () => Promise<T | undefined | null | false>, ms = 5000): Promise<T> {
  const until = Date.now() + ms;
  for (;;) {
    const value = await check();
    if (value) return value;
    if (Date.now() > until) throw new Error('condition not met in time');
    await new Promise((r) => setTimeout(r, 50));
  }
}
