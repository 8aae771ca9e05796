import { join, resolve } from 'node:path';
import * as mariadb from 'mariadb';
import { parseEnv } from '../config/env';
import { parseDbHosts } from '../database/node-failover';
import { startS3Fake } from './s3-fake';
import { startSmtpFake } from './smtp-fake';

/**
 * The S3 and SMTP fakes as one process of their own, shared by every API replica of
 * `npm run cluster` (under `npm start` they live inside the single API process instead).
 * Captured mail goes to the `captured_mail` table through a pool that fails over between
 * the database nodes (DB_HOSTS); when no node takes it the SMTP answer is an error, so the
 * sending replica keeps the message and retries.
 */
async function main() {
  const env = parseEnv();
  const dataDir = resolve(env.DATA_DIR);
  const nodes = env.DB_HOSTS ? parseDbHosts(env.DB_HOSTS) : [{ host: env.DB_HOST, port: env.DB_PORT }];
  const cluster = mariadb.createPoolCluster({ removeNodeErrorCount: Infinity, restoreNodeTimeout: 1000 });
  nodes.forEach((node, i) =>
    cluster.add(`node${i + 1}`, {
      host: node.host,
      port: node.port,
      user: env.DB_USER,
      password: env.DB_PASSWORD,
      database: env.DB_NAME,
      connectionLimit: 2,
      connectTimeout: 2000,
    }),
  );
  const database = cluster.of(null, 'ORDER'); // the first node that answers
  const s3 = await startS3Fake({ port: env.S3_FAKE_PORT, directory: join(dataDir, 'objects'), bucket: env.S3_BUCKET });
  const smtp = await startSmtpFake({
    port: env.SMTP_PORT,
    onMessage: async (mail) => {
      await database.query('INSERT INTO captured_mail (sender, recipients, subject, body, created_at) VALUES (?, ?, ?, ?, ?)', [
        mail.from,
        JSON.stringify(mail.to),
        mail.subject.slice(0, 250),
        mail.text,
        new Date(),
      ]);
    },
  });
  console.log(`ready: S3 fake http://127.0.0.1:${s3.port}, SMTP fake 127.0.0.1:${smtp.port} (pid ${process.pid})`);
  const stop = async () => {
    await Promise.allSettled([s3.stop(), smtp.stop(), cluster.end()]);
    process.exit(0);
  };
  process.once('SIGTERM', () => void stop());
  process.once('SIGINT', () => void stop());
}

main().catch((error: Error) => {
  console.error(`fakes did not start: ${error.stack ?? error.message}`);
  process.exit(1);
});
