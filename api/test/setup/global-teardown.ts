import { rmSync } from 'node:fs';
import type { MariaDbServer } from '../../src/dev/mariadb-server';

export default async function globalTeardown(): Promise<void> {
  const g = globalThis as { __mariadb?: MariaDbServer; __mariadbDir?: string };
  await g.__mariadb?.stop();
  if (g.__mariadbDir && !process.env.KEEP_TEST_DATA) rmSync(g.__mariadbDir, { recursive: true, force: true });
}
