import { join, resolve } from 'node:path';
import { freePort } from '../../src/dev/free-port';
import { startMariaDb, type MariaDbServer } from '../../src/dev/mariadb-server';

/**
 * One throw-away MariaDB per jest run (its own folder and a free port, so parallel runs
 * never meet); every test file creates its own database inside it (see helpers/test-app.ts).
 */
export default async function globalSetup(): Promise<void> {
  const dir = resolve(__dirname, '..', '..', '..', '.data-test', `jest-${process.pid}`);
  const port = await freePort();
  const server = await startMariaDb({ dir, port, quiet: true });
  await server.admin("CREATE USER IF NOT EXISTS 'tester'@'127.0.0.1' IDENTIFIED BY 'tester-only-local'");
  await server.admin("GRANT ALL PRIVILEGES ON *.* TO 'tester'@'127.0.0.1' WITH GRANT OPTION");
  (globalThis as { __mariadb?: MariaDbServer; __mariadbDir?: string }).__mariadb = server;
  (globalThis as { __mariadbDir?: string }).__mariadbDir = dir;
  process.env.TEST_DB_PORT = String(port);
  process.env.TEST_DB_SOCKET = join(dir, 'mariadb.sock');
  process.env.TEST_DATA_DIR = dir;
}
