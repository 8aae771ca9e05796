#!/usr/bin/env node
// `npm start`: installs what is missing, builds what changed, then runs the local stack
// (MariaDB on 127.0.0.1, migrations, demo seed, S3 and SMTP fakes, API + web on one URL)
// in the foreground. Ctrl-C stops everything it started.
import { spawn } from 'node:child_process';
import { join } from 'node:path';
import { RECORD_FONTS, buildAll, ensureDebianFiles, ensureDebianPackages, ensureNodeModules } from './lib/bootstrap.mjs';

const root = new URL('..', import.meta.url).pathname;
try {
  ensureDebianPackages(['mariadb-server', 'mariadb-client'], ['mariadbd', 'mariadb-install-db']);
  ensureDebianFiles(['fonts-dejavu-core'], RECORD_FONTS);
  ensureNodeModules(root);
  buildAll(root);
} catch (error) {
  console.error(`\nnpm start: ${error.message}`);
  process.exit(1);
}

const env = { ...process.env, DATA_DIR: process.env.DATA_DIR ?? join(root, '.data'), WEB_DIST: join(root, 'web/dist') };
const child = spawn(process.execPath, [join(root, 'api/dist/dev/start.js')], { cwd: root, env, stdio: 'inherit' });
// The terminal sends Ctrl-C to both processes; the stack stops itself, we wait for it.
for (const signal of ['SIGINT', 'SIGTERM']) {
  process.on(signal, () => {
    if (child.exitCode === null) child.kill(signal);
  });
}
child.on('exit', (code, signal) => process.exit(code ?? (signal ? 0 : 1)));
