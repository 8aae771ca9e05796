/**
 * A separate local database holding the large invented catalogue (`.data/large-<parts>/`,
 * git-ignored, kept between runs): MariaDB, migrations, the demo accounts, then
 * loadLargeCatalogue. Used by seed-large.ts and search-load.bench.ts. Runs the built api
 * (api/dist: Nest's dependency injection needs the compiler's decorator metadata).
 */
import { existsSync, mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { performance } from 'node:perf_hooks';
import type { Sequelize } from 'sequelize';
import { freePort } from '../src/dev/free-port';
import { loadLargeCatalogue } from './large-catalogue';

export const root = join(__dirname, '..', '..');

export function largeDataDir(parts: number): string {
  return join(root, '.data', `large-${parts}`);
}

/** The data folder with `parts` vendor parts loaded; loads it first when it is not there yet. */
export async function ensureLargeData(parts: number): Promise<string> {
  const dir = largeDataDir(parts);
  const marker = join(dir, 'catalogue-loaded');
  if (existsSync(marker)) return dir;
  const start = join(root, 'api', 'dist', 'dev', 'stack.js');
  if (!existsSync(start)) throw new Error('build the api first (npm run build -w api)');
  mkdirSync(dir, { recursive: true });
  const { startStack } = require(start) as typeof import('../src/dev/stack');
  const stack = await startStack({
    seed: 'users',
    listen: false,
    quiet: true,
    source: {
      ...process.env,
      DATA_DIR: dir,
      PORT: String(await freePort()),
      DB_PORT: String(await freePort()),
      S3_FAKE_PORT: String(await freePort()),
      SMTP_PORT: String(await freePort()),
    },
  });
  try {
    const t0 = performance.now();
    let last = 0;
    await loadLargeCatalogue(stack.sequelize as unknown as Sequelize, parts, (done) => {
      if (done - last >= parts / 10 || done === parts) {
        last = done;
        console.log(`  ${done} / ${parts} vendor parts (${((performance.now() - t0) / 1000).toFixed(0)} s)`);
      }
    });
    writeFileSync(marker, new Date().toISOString());
    console.log(`loaded ${parts} vendor parts into ${dir} in ${((performance.now() - t0) / 1000).toFixed(1)} s`);
  } finally {
    await stack.stop();
  }
  return dir;
}
