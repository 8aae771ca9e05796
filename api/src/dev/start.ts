import { DEMO_USERS } from '../seed/demo-users';
import { startStack } from './stack';

/** `npm start`: the local stack in the foreground until Ctrl-C, which stops everything it started. */
async function main() {
  const started = Date.now();
  const seed = process.env.SEED === 'none' || process.env.SEED === 'users' ? process.env.SEED : 'demo';
  const stack = await startStack({ seed });
  const { env } = stack;
  const width = Math.max(...DEMO_USERS.map((u) => u.email.length));
  console.log(
    [
      '',
      `Shuntwise is up at ${stack.url}  (ready in ${((Date.now() - started) / 1000).toFixed(1)} s)`,
      `  API docs     ${stack.url}/api/docs`,
      `  MariaDB      127.0.0.1:${env.DB_PORT}  database ${env.DB_NAME}, data in ${env.DATA_DIR}/db`,
      `  S3 fake      http://127.0.0.1:${env.S3_FAKE_PORT}  objects in ${env.DATA_DIR}/objects`,
      `  SMTP fake    127.0.0.1:${env.SMTP_PORT}  captured mail on the Outbox screen`,
      '',
      `Demo accounts (local demo only), password "${env.DEMO_PASSWORD}":`,
      ...DEMO_USERS.map((u) => `  ${u.email.padEnd(width)}  ${u.role.padEnd(8)}  ${u.name}, ${u.note}`),
      '',
      'Ctrl-C stops everything.',
    ].join('\n'),
  );
  let stopping = false;
  const stop = async (signal: string) => {
    if (stopping) return;
    stopping = true;
    console.log(`\n[${signal}] stopping…`);
    await stack.stop();
    process.exit(0);
  };
  process.on('SIGINT', () => void stop('SIGINT'));
  process.on('SIGTERM', () => void stop('SIGTERM'));
}

main().catch((error) => {
  console.error(`\nShuntwise did not start: ${error instanceof Error ? error.message : String(error)}`);
  process.exit(1);
});
