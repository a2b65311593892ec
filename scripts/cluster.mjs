#!/usr/bin/env node
// `npm run cluster`: Groundwork as it runs past one machine, on this one — PostgreSQL, the S3
// fake, the fake mail service, two stateless app nodes on their own ports, one worker, and
// HAProxy (deploy/haproxy.cfg) on http://127.0.0.1:4321 in front. Ctrl-C stops everything.
import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { ensureHaproxy, startHaproxy, writeHaproxyConfig } from './lib/haproxy.mjs';
import {
  build, ensureNodeModules, localSecret, log, migrate, root, runTsx, startChild, startDatabase, startS3Fake, stopChildren, waitForHttp,
} from './lib/stack.mjs';

const num = (name, fallback) => Number(process.env[name] ?? fallback);
const lbPort = num('PORT', 4321);
const nodePorts = [num('NODE_A_PORT', 4331), num('NODE_B_PORT', 4332)];
const pgPort = num('CLUSTER_PGPORT', 54339);
const s3Port = num('FAKE_S3_PORT', 4569);
const smtpPort = num('FAKE_SMTP_PORT', 1025);
const mailHttpPort = num('FAKE_MAIL_HTTP_PORT', 1080);
const demoPassword = process.env.DEMO_PASSWORD ?? 'groundwork-demo';
// Its own data, apart from `npm start`'s: a second `npm run cluster` keeps it.
const dataDir = join(root, '.data', 'cluster');

ensureNodeModules();
const haproxy = ensureHaproxy();
mkdirSync(dataDir, { recursive: true });
const db = await startDatabase({
  dataDir: join(dataDir, 'pg'),
  fallbackName: 'groundwork-cluster-pg-data',
  port: pgPort,
  database: 'groundwork',
  password: localSecret('pg-password'),
  durable: true,
});

let stopping = false;
async function shutdown(code = 0) {
  if (stopping) return;
  stopping = true;
  log('Stopping the cluster…');
  await stopChildren();
  db.stop();
  process.exit(code);
}
process.on('SIGINT', () => shutdown(0));
process.on('SIGTERM', () => shutdown(0));

try {
  // Migrations run once per release, here, never from the nodes themselves.
  await migrate(db.url);
  const lbUrl = `http://127.0.0.1:${lbPort}`;
  const env = {
    DATABASE_URL: db.url,
    // Every node signs and checks sessions with the same secret: a session from one works on all.
    AUTH_SECRET: process.env.AUTH_SECRET ?? localSecret('auth-secret'),
    AUTH_TRUST_HOST: 'true',
    APP_URL: lbUrl,
    SMTP_HOST: '127.0.0.1',
    SMTP_PORT: String(smtpPort),
    DEMO_PASSWORD: demoPassword,
    HOST: '127.0.0.1',
    STORAGE_DRIVER: 's3',
    ...startS3Fake({ port: s3Port, directory: join(dataDir, 's3'), quiet: false }),
  };
  await waitForHttp(env.S3_ENDPOINT);
  startChild('fake mail', 'node', ['fake-services/mail-server.mjs'], {
    env: { FAKE_SMTP_PORT: String(smtpPort), FAKE_MAIL_HTTP_PORT: String(mailHttpPort) },
  });
  runTsx('seeds/run.ts', { ...env, UPLOAD_DIR: join(dataDir, 'scratch-seed'), SEED_ONLY_IF_EMPTY: '1' });
  // One build, two processes: the nodes differ only in their port and their scratch folder.
  const built = build('dist', env);
  // build() answers the server entry's path, or the variables (APP_ENTRY, …) that point at it.
  Object.assign(env, typeof built === 'string' ? { APP_ENTRY: built } : built);
  const nodes = nodePorts.map((port, i) => ({ name: `node-${'ab'[i]}`, port }));
  for (const n of nodes) {
    startChild(n.name, 'node', [env.APP_ENTRY], { env: { ...env, PORT: String(n.port), UPLOAD_DIR: join(dataDir, `scratch-${n.name}`) }, quiet: true });
  }
  startChild('worker', join(root, 'node_modules', '.bin', 'tsx'), ['scripts/worker.ts'], { env: { ...env, UPLOAD_DIR: join(dataDir, 'scratch-worker') }, quiet: true });
  await Promise.all(nodes.map((n) => waitForHttp(`http://127.0.0.1:${n.port}/api/health`)));
  const cfg = writeHaproxyConfig({ file: join(dataDir, 'haproxy.cfg'), listen: `127.0.0.1:${lbPort}`, nodes });
  startHaproxy(cfg);
  await waitForHttp(`${lbUrl}/api/health`);
  console.log(`
  Groundwork cluster is running at ${lbUrl} (HAProxy, ${haproxy})
    ${nodes.map((n) => `${n.name}: http://127.0.0.1:${n.port}`).join('\n    ')}
    worker: reminders and readiness recomputes
    PostgreSQL 127.0.0.1:${pgPort} · S3 fake ${env.S3_ENDPOINT}/${env.S3_BUCKET} · test inbox http://127.0.0.1:${mailHttpPort}

  Each answer carries X-Groundwork-Node: the node that served it. Stop a node's process and the
  balancer sends everything to the other within two health checks.

  Demo sign-ins: admin@example.com / surveyor@example.com, password ${demoPassword};
  customer@example.com by e-mailed link (open the test inbox).

  Press Ctrl-C to stop.
`);
} catch (err) {
  console.error(err instanceof Error ? err.message : err);
  await shutdown(1);
}
