#!/usr/bin/env node
// Runs every benchmark script (`*/bench/*.bench.ts`) one after another and lets each print
// its own figures. Benchmarks compare ratios measured in one run; they are never tests.
import { spawnSync } from 'node:child_process';
import { readdirSync, existsSync } from 'node:fs';
import { join } from 'node:path';
import { buildIfStale, ensureNodeModules } from './lib/bootstrap.mjs';

const root = new URL('..', import.meta.url).pathname;
ensureNodeModules(root);
// Bench scripts import @shuntwise/contracts from its build; the upload bench runs the built api.
const contracts = buildIfStale(root, {
  name: 'contracts',
  inputs: ['contracts/src', 'contracts/tsconfig.json', 'contracts/tsconfig.build.json'],
  output: 'contracts/dist/index.js',
});
buildIfStale(root, { name: 'api', inputs: ['api/src', 'api/tsconfig.json', 'api/tsconfig.build.json'], output: 'api/dist/dev/start.js', force: contracts });
const only = process.argv[2];
let failed = 0;
for (const pkg of ['api', 'web', 'contracts', 'test-fixtures']) {
  const dir = join(root, pkg, 'bench');
  if (!existsSync(dir)) continue;
  for (const file of readdirSync(dir)
    .filter((f) => f.endsWith('.bench.ts'))
    .sort()) {
    if (only && !file.includes(only)) continue;
    console.log(`\n=== ${pkg}/bench/${file}`);
    const run = spawnSync(join(root, 'node_modules/.bin/tsx'), [join(dir, file)], { cwd: join(root, pkg), stdio: 'inherit' });
    if (run.status !== 0) failed++;
  }
}
process.exit(failed ? 1 : 0);
