#!/usr/bin/env node
// `npm run test:cluster`: starts the scaled-out stack (scripts/lib/cluster.mjs) in a throw-away
// folder, drives writes through nginx, kills one API replica and one Galera node with SIGKILL
// mid-burst, then checks on the surviving nodes that every acknowledged write is there (none
// half-written), that no message was sent twice (beyond the one the killed replica may have had
// in flight), and that the balancer kept answering. Prints its figures; exits non-zero on a failure.
// Not part of `npm test` (about 3–4 minutes on 2 cores, most of it the cluster's start).
import { rmSync } from 'node:fs';
import { join } from 'node:path';
import { buildAll, ensureDebianPackages, ensureNodeModules } from './lib/bootstrap.mjs';
import { CLUSTER_PACKAGES, sleep, sql, startCluster, waitFor } from './lib/cluster.mjs';

const root = new URL('..', import.meta.url).pathname;
const started = Date.now();
const failures = [];
const check = (ok, what) => {
  console.log(`${ok ? 'ok  ' : 'FAIL'}  ${what}`);
  if (!ok) failures.push(what);
};
const quantile = (values, q) => {
  const s = [...values].sort((a, b) => a - b);
  return s.length ? s[Math.min(s.length - 1, Math.floor(q * s.length))] : NaN;
};

ensureDebianPackages(CLUSTER_PACKAGES.packages, CLUSTER_PACKAGES.commands, CLUSTER_PACKAGES.files);
ensureNodeModules(root);
buildAll(root);

const dir = join(root, '.data-test', `cluster-${process.pid}`);
let cluster;
try {
  cluster = await startCluster({
    root,
    dir,
    replicas: 3,
    seed: 'users',
    env: { MAIL_RETRY_SECONDS: '0.2', MAIL_CLAIM_SECONDS: '5', LOGIN_RATE_LIMIT: '1000' },
  });
  const startSeconds = (Date.now() - started) / 1000;
  const lb = cluster.url;
  const login = await fetch(`${lb}/api/auth/login`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email: 'admin@demo.test', password: process.env.DEMO_PASSWORD ?? 'shuntwise-demo' }),
  });
  const { accessToken } = await login.json();

  // The burst: invitations (an invitation row and its outbox row in one transaction) from 8 workers,
  // and a liveness poller, all through nginx.
  const writes = [];
  const polls = [];
  let stopped = false;
  let n = 0;
  const t0 = Date.now();
  const writer = async () => {
    while (!stopped) {
      const email = `cluster-${n++}@demo.test`;
      const at = Date.now();
      let status;
      try {
        const res = await fetch(`${lb}/api/users/invitations`, {
          method: 'POST',
          headers: { 'content-type': 'application/json', authorization: `Bearer ${accessToken}` },
          body: JSON.stringify({ email, name: 'Cluster Test', role: 'designer' }),
          signal: AbortSignal.timeout(30_000),
        });
        status = res.status;
        await res.arrayBuffer();
      } catch {
        status = 'no answer';
      }
      writes.push({ email, status, at: at - t0, ms: Date.now() - at });
    }
  };
  const poller = async () => {
    while (!stopped) {
      let status;
      try {
        status = (await fetch(`${lb}/api/health/live`, { signal: AbortSignal.timeout(10_000) })).status;
      } catch {
        status = 'no answer';
      }
      polls.push(status);
      await sleep(50);
    }
  };
  const acked = () => writes.filter((w) => w.status === 201);
  const loops = [...Array.from({ length: 8 }, writer), poller()];

  await waitFor('80 writes before the kills', () => acked().length >= 80, 90_000);
  const victimApi = cluster.apis[1];
  const apiKilledAt = Date.now() - t0;
  await victimApi.kill('SIGKILL');
  // What the killed replica held at that moment (its id in claimed_by has its pid): the only mail that may go out twice.
  const inFlight = sql(cluster.nodes[0].socket, `SELECT recipients FROM outgoing_mail WHERE state = 'pending' AND claimed_by LIKE '%:${victimApi.pid}:%'`, {
    database: 'shuntwise',
  }).map((r) => JSON.parse(r[0])[0]);
  console.log(`[kill] API replica 2 (pid ${victimApi.pid}) at ${(apiKilledAt / 1000).toFixed(1)} s; it held ${inFlight.length} outbox message(s)`);

  const afterApi = acked().length;
  await waitFor('80 writes after the API kill', () => acked().length >= afterApi + 80, 90_000);
  const victimNode = cluster.nodes[2];
  const nodeKilledAt = Date.now() - t0;
  await victimNode.kill('SIGKILL');
  console.log(`[kill] Galera node 3 (pid ${victimNode.pid}) at ${(nodeKilledAt / 1000).toFixed(1)} s`);
  const afterNode = acked().length;
  await waitFor('80 writes after the node kill', () => acked().length >= afterNode + 80, 120_000);
  stopped = true;
  await Promise.all(loops);
  const burstSeconds = (Date.now() - t0) / 1000;

  // Figures
  const ok = acked();
  const statuses = {};
  for (const w of writes) statuses[w.status] = (statuses[w.status] ?? 0) + 1;
  const pollStatuses = {};
  for (const p of polls) pollStatuses[p] = (pollStatuses[p] ?? 0) + 1;
  const gapAfter = (t) => {
    const next = ok.filter((w) => w.at + w.ms > t).map((w) => w.at + w.ms);
    return next.length ? (Math.min(...next) - t) / 1000 : NaN;
  };
  const lat = ok.map((w) => w.ms);
  console.log(
    `\n[figures] cluster start ${startSeconds.toFixed(1)} s (nodes ${Object.values(cluster.timings)
      .map((ms) => (ms / 1000).toFixed(1))
      .join(' / ')} s)`,
  );
  console.log(
    `[figures] ${writes.length} writes in ${burstSeconds.toFixed(1)} s through nginx, ${ok.length} acknowledged (${(ok.length / burstSeconds).toFixed(0)}/s); statuses ${JSON.stringify(statuses)}`,
  );
  console.log(`[figures] write latency p50 ${quantile(lat, 0.5)} ms, p95 ${quantile(lat, 0.95)} ms, max ${Math.max(...lat)} ms`);
  console.log(
    `[figures] first acknowledged write ${gapAfter(apiKilledAt).toFixed(2)} s after the API kill, ${gapAfter(nodeKilledAt).toFixed(2)} s after the node kill`,
  );
  console.log(`[figures] liveness through nginx: ${JSON.stringify(pollStatuses)}\n`);

  // Checks
  check(
    !writes.some((w) => w.status === 'no answer') && !polls.some((p) => p === 'no answer'),
    'the balancer answered every request (no connection refused or time-out)',
  );
  check(
    writes.every((w) => [201, 502, 503].includes(w.status)),
    `writes answered 201, or 502/503 while a replica or node went away (${JSON.stringify(statuses)})`,
  );
  check(acked().filter((w) => w.at > nodeKilledAt).length >= 80, 'writes kept being acknowledged after both kills');

  const emails = new Set(ok.map((w) => w.email));
  for (const node of [cluster.nodes[0], cluster.nodes[1]]) {
    const invited = sql(node.socket, "SELECT email FROM invitations WHERE email LIKE 'cluster-%'", { database: 'shuntwise' }).map((r) => r[0]);
    const mails = sql(node.socket, "SELECT recipients FROM outgoing_mail WHERE kind = 'invitation'", { database: 'shuntwise' }).map((r) => JSON.parse(r[0])[0]);
    const missing = [...emails].filter((e) => !invited.includes(e));
    check(
      missing.length === 0,
      `node ${node.index}: every acknowledged write is there (${emails.size} acknowledged, ${invited.length} rows${missing.length ? `, missing ${missing.slice(0, 5).join(' ')}` : ''})`,
    );
    const halves = invited.filter((e) => mails.filter((m) => m === e).length !== 1);
    check(
      new Set(invited).size === invited.length && halves.length === 0,
      `node ${node.index}: none half-written (each invitation has exactly one outbox message)`,
    );
  }

  // Mail: every message goes out (the killed replica's claims after their lease), once.
  const sentAll = await waitFor(
    'every outbox message sent',
    () =>
      Number(
        sql(cluster.nodes[0].socket, "SELECT COUNT(*) FROM outgoing_mail WHERE kind = 'invitation' AND state <> 'sent'", { database: 'shuntwise' })[0][0],
      ) === 0,
    90_000,
  ).catch(() => false);
  check(sentAll, 'every outbox message was sent');
  const captured = sql(cluster.nodes[1].socket, "SELECT recipients FROM captured_mail WHERE recipients LIKE '%cluster-%'", { database: 'shuntwise' }).map(
    (r) => JSON.parse(r[0])[0],
  );
  const counts = new Map();
  for (const r of captured) counts.set(r, (counts.get(r) ?? 0) + 1);
  const twice = [...counts].filter(([, c]) => c > 1).map(([r]) => r);
  console.log(
    `[figures] ${captured.length} messages received by the SMTP fake for ${counts.size} recipients; sent twice: ${twice.length ? twice.join(' ') : 'none'}`,
  );
  check(twice.every((r) => inFlight.includes(r)) && twice.length <= 1, 'no message sent twice (at most the one the killed replica was handing to SMTP)');
} catch (error) {
  failures.push(error.message);
  console.error(`\ncluster test: ${error.stack ?? error.message}`);
} finally {
  await cluster?.stop();
  if (!process.env.KEEP_TEST_DATA && !failures.length) rmSync(dir, { recursive: true, force: true });
  else console.log(`logs kept in ${dir}`);
}
const total = (Date.now() - started) / 1000;
console.log(`\n══════ cluster test ${failures.length ? `FAILED (${failures.length})` : 'passed'} — ${Math.floor(total / 60)} min ${(total % 60).toFixed(0)} s`);
process.exit(failures.length ? 1 : 0);
