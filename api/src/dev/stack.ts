import 'reflect-metadata';
import { join, resolve } from 'node:path';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { QueryTypes, Sequelize } from 'sequelize';
import { createApp } from '../app.factory';
import { parseEnv, publicUrl, type Env } from '../config/env';
import { migrateUp } from '../database/migrator';
import { sequelizeOptions } from '../database/sequelize-options';
import { StorageService } from '../storage/storage.service';
import { DemoSeedService, type SeedLevel } from '../seed/demo-seed.service';
import { attachMariaDb, ensureDatabase, startMariaDb, type MariaDbServer } from './mariadb-server';
import { startS3Fake, type RunningFake } from './s3-fake';
import { loadOrCreateSecrets } from './secrets';
import { startSmtpFake, type ReceivedMail } from './smtp-fake';

export interface StackOptions {
  /** Environment to read (default process.env); DATA_DIR and the ports come from here. */
  source?: NodeJS.ProcessEnv;
  /** What to load: the whole demo, only the demo accounts, or nothing (default 'demo'). */
  seed?: SeedLevel;
  /** Use a MariaDB that is already running (reached as root over this socket) instead of starting one. */
  externalDatabase?: { socket: string };
  /** Serve HTTP (default true). */
  listen?: boolean;
  quiet?: boolean;
}

export interface Stack {
  env: Env;
  url: string;
  app: NestExpressApplication;
  database: MariaDbServer;
  sequelize: Sequelize;
  s3: RunningFake;
  /** The S3 fake can be stopped and started again (same port and folder) to test uploads while it is away. */
  stopS3(): Promise<void>;
  startS3(): Promise<void>;
  /** The SMTP fake can be stopped and started again to test the mail outbox. */
  stopSmtp(): Promise<void>;
  startSmtp(): Promise<void>;
  stop(): Promise<void>;
}

/**
 * The whole local stack in one process: MariaDB (child process, by pid), migrations, the
 * S3 and SMTP fakes in-process on loopback, the API and the built web app, the demo seed.
 */
export async function startStack(options: StackOptions = {}): Promise<Stack> {
  const source = { ...(options.source ?? process.env) };
  const dataDir = resolve(source.DATA_DIR ?? '.data');
  const secrets = loadOrCreateSecrets(dataDir);
  source.DATA_DIR = dataDir;
  source.JWT_SECRET ??= secrets.jwtSecret;
  source.DB_PASSWORD ??= secrets.dbPassword;
  const env = parseEnv(source);
  const log = (line: string) => options.quiet || console.log(line);
  const stopped: Array<() => Promise<void>> = [];
  const stopAll = async () => {
    for (const stop of stopped.reverse()) await stop().catch((e: Error) => console.error(`[stop] ${e.message}`));
    stopped.length = 0;
  };

  try {
    const database = options.externalDatabase
      ? attachMariaDb({ socket: options.externalDatabase.socket, port: env.DB_PORT })
      : await startMariaDb({ dir: join(dataDir, 'db'), port: env.DB_PORT, quiet: options.quiet });
    stopped.push(() => database.stop());
    await ensureDatabase(database, env.DB_NAME, env.DB_USER, env.DB_PASSWORD);

    const sequelize = new Sequelize(sequelizeOptions(env));
    stopped.push(() => sequelize.close());
    const applied = await migrateUp(sequelize);
    log(`[migrate] ${applied.length ? `applied ${applied.join(', ')}` : 'schema up to date'}`);

    const startS3 = () => startS3Fake({ port: env.S3_FAKE_PORT, directory: join(dataDir, 'objects'), bucket: env.S3_BUCKET });
    let s3Running: RunningFake | undefined = await startS3();
    const s3: RunningFake = { port: s3Running.port, stop: async () => stopS3() };
    const stopS3 = async () => {
      await s3Running?.stop();
      s3Running = undefined;
    };
    stopped.push(stopS3);
    log(`[s3 fake] http://127.0.0.1:${s3.port} bucket ${env.S3_BUCKET}`);

    const capture = (mail: ReceivedMail) =>
      sequelize
        .query('INSERT INTO captured_mail (sender, recipients, subject, body, created_at) VALUES (?, ?, ?, ?, ?)', {
          replacements: [mail.from, JSON.stringify(mail.to), mail.subject.slice(0, 250), mail.text, new Date()],
          type: QueryTypes.INSERT,
        })
        .then(() => undefined);
    let smtp: RunningFake | undefined = await startSmtpFake({ port: env.SMTP_PORT, onMessage: capture });
    log(`[smtp fake] 127.0.0.1:${smtp.port}`);
    const stopSmtp = async () => {
      await smtp?.stop();
      smtp = undefined;
    };
    const startSmtp = async () => {
      smtp ??= await startSmtpFake({ port: env.SMTP_PORT, onMessage: capture });
    };
    stopped.push(stopSmtp);

    const app = await createApp(env, { logger: options.quiet ? ['error'] : ['error', 'warn', 'log'] });
    stopped.push(() => app.close());
    await app.init();
    await app.get(StorageService).ensureBucket();
    const seed = options.seed ?? 'demo';
    if (seed !== 'none') await app.get(DemoSeedService).run(seed);
    if (options.listen ?? true) await app.listen(env.PORT, env.HOST);

    return {
      env,
      url: publicUrl(env),
      app,
      database,
      sequelize,
      s3,
      stopS3,
      async startS3() {
        s3Running ??= await startS3();
      },
      stopSmtp,
      startSmtp,
      stop: stopAll,
    };
  } catch (error) {
    await stopAll();
    throw error;
  }
}
