#!/usr/bin/env node
// `npm run cluster`: the scaled-out stack on loopback — a three-node MariaDB Galera cluster,
// the S3 and SMTP fakes once, three API replicas and nginx in front on one port
// (CLUSTER_PORT, default 8090). Data in .data-cluster (emptied at each start). Ctrl-C stops
// everything it started, by pid.
import { join } from 'node:path';
import { buildAll, ensureDebianPackages, ensureNodeModules } from './lib/bootstrap.mjs';
import { CLUSTER_PACKAGES, startCluster } from './lib/cluster.mjs';

const root = new URL('..', import.meta.url).pathname;
try {
  ensureDebianPackages(CLUSTER_PACKAGES.packages, CLUSTER_PACKAGES.commands, CLUSTER_PACKAGES.files);
  ensureNodeModules(root);
  buildAll(root);
} catch (error) {
  console.error(`\nnpm run cluster: ${error.message}`);
  process.exit(1);
}

const started = Date.now();
const replicas = Number(process.env.CLUSTER_REPLICAS ?? 3);
let cluster;
try {
  cluster = await startCluster({
    root,
    dir: join(root, process.env.CLUSTER_DIR ?? '.data-cluster'),
    replicas,
    seed: process.env.SEED === 'users' ? 'users' : 'demo',
    port: Number(process.env.CLUSTER_PORT ?? 8090),
  });
} catch (error) {
  console.error(`\nThe cluster did not start: ${error.message}`);
  process.exit(1);
}
console.log(
  [
    '',
    `Shuntwise (cluster) is up at ${cluster.url}  (ready in ${((Date.now() - started) / 1000).toFixed(1)} s)`,
    `  Galera nodes  ${cluster.nodes.map((n) => `127.0.0.1:${n.port}`).join(', ')}`,
    `  API replicas  ${cluster.apis.map((a) => a.url).join(', ')}`,
    `  logs          ${join(root, process.env.CLUSTER_DIR ?? '.data-cluster')}`,
    '',
    'Ctrl-C stops everything.',
  ].join('\n'),
);
let stopping = false;
const stop = async (signal) => {
  if (stopping) return;
  stopping = true;
  console.log(`\n[${signal}] stopping…`);
  await cluster.stop();
  process.exit(0);
};
process.on('SIGINT', () => void stop('SIGINT'));
process.on('SIGTERM', () => void stop('SIGTERM'));
