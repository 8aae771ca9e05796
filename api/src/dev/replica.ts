import 'reflect-metadata';
import { Logger } from '@nestjs/common';
import { Sequelize } from 'sequelize';
import { createApp } from '../app.factory';
import { parseEnv, publicUrl } from '../config/env';
import { migrateUp } from '../database/migrator';
import { sequelizeOptions } from '../database/sequelize-options';
import { DemoSeedService } from '../seed/demo-seed.service';
import { StorageService } from '../storage/storage.service';

/**
 * One API replica of `npm run cluster`, production-like: it talks to services that are
 * already up (the database cluster through DB_HOSTS, the shared S3 and SMTP fakes). With
 * MIGRATE=1 it first migrates the schema, makes sure of the bucket and loads SEED (users or
 * demo) — the cluster script starts one replica that way, then the others without.
 */
async function main() {
  const env = parseEnv();
  const log = new Logger('Replica');
  if (process.env.MIGRATE === '1') {
    const sequelize = new Sequelize(sequelizeOptions(env));
    try {
      const applied = await migrateUp(sequelize);
      log.log(applied.length ? `applied ${applied.join(', ')}` : 'schema up to date');
    } finally {
      await sequelize.close();
    }
  }
  const app = await createApp(env, { shutdownHooks: true, logger: ['error', 'warn', 'log'] });
  await app.init();
  if (process.env.MIGRATE === '1') {
    await app.get(StorageService).ensureBucket();
    const seed = process.env.SEED === 'demo' || process.env.SEED === 'users' ? process.env.SEED : 'none';
    if (seed !== 'none') await app.get(DemoSeedService).run(seed);
  }
  await app.listen(env.PORT, env.HOST);
  log.log(`ready on ${publicUrl(env)} (pid ${process.pid})`);
}

main().catch((error: Error) => {
  console.error(`replica did not start: ${error.stack ?? error.message}`);
  process.exit(1);
});
