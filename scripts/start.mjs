#!/usr/bin/env node
// `npm start`: everything from a fresh clone to a running Groundwork on http://127.0.0.1:4321.
import { join } from 'node:path';
import {
  appArgs, build, ensureNodeModules, fakeServiceEnv, localSecret, log, migrate, root, runTsx, serverEntry, startChild, startDatabase, stopChildren, waitForHttp,
} from './lib/stack.mjs';

const port = Number(process.env.PORT ?? 4321);
const pgPort = Number(process.env.PGPORT ?? 54329);
const smtpPort = Number(process.env.FAKE_SMTP_PORT ?? 1025);
const mailHttpPort = Number(process.env.FAKE_MAIL_HTTP_PORT ?? 1080);
const smsPort = Number(process.env.FAKE_SMS_PORT ?? 1090);
const vehiclePort = Number(process.env.FAKE_VEHICLE_PORT ?? 1095);
const demoPassword = process.env.DEMO_PASSWORD ?? 'groundwork-demo';

ensureNodeModules();
const db = process.env.DATABASE_URL
  ? { url: process.env.DATABASE_URL, stop: () => {} }
  : await startDatabase({
      dataDir: join(root, '.data', 'pg'),
      fallbackName: 'groundwork-pg-data',
      port: pgPort,
      database: 'groundwork',
      password: localSecret('pg-password'),
      durable: true,
    });

let stopping = false;
async function shutdown(code = 0) {
  if (stopping) return;
  stopping = true;
  log('Stopping…');
  await stopChildren();
  db.stop();
  process.exit(code);
}
process.on('SIGINT', () => shutdown(0));
process.on('SIGTERM', () => shutdown(0));

try {
  await migrate(db.url);
  const appUrl = process.env.APP_URL ?? `http://127.0.0.1:${port}`;
  // Each hosted service's fake runs unless the real service's variables are set.
  const fakes = fakeServiceEnv({ appUrl, smsPort, vehiclePort });
  const realSms = Boolean(process.env.VONAGE_API_KEY);
  const realVehicles = Boolean(process.env.VEHICLE_ENQUIRY_API_KEY);
  const env = {
    ...(realSms ? {} : Object.fromEntries(Object.entries(fakes.app).filter(([k]) => k.startsWith('VONAGE_') || k === 'SMS_FROM'))),
    ...(realVehicles ? {} : Object.fromEntries(Object.entries(fakes.app).filter(([k]) => k.startsWith('VEHICLE_')))),
    DATABASE_URL: db.url,
    AUTH_SECRET: process.env.AUTH_SECRET ?? localSecret('auth-secret'),
    AUTH_TRUST_HOST: 'true',
    APP_URL: appUrl,
    SMTP_HOST: process.env.SMTP_HOST ?? '127.0.0.1',
    SMTP_PORT: String(process.env.SMTP_PORT ?? smtpPort),
    UPLOAD_DIR: process.env.UPLOAD_DIR ?? join(root, '.data', 'uploads'),
    DEMO_PASSWORD: demoPassword,
    HOST: '127.0.0.1',
    PORT: String(port),
  };
  runTsx('seeds/run.ts', { ...env, SEED_ONLY_IF_EMPTY: '1' });
  if (!process.env.SMTP_HOST) {
    startChild('fake mail', 'node', ['fake-services/mail-server.mjs'], {
      env: { FAKE_SMTP_PORT: String(smtpPort), FAKE_MAIL_HTTP_PORT: String(mailHttpPort) },
    });
  }
  if (!realSms) startChild('fake sms', 'node', ['fake-services/sms-server.mjs'], { env: fakes.sms });
  if (!realVehicles) startChild('fake vehicles', 'node', ['fake-services/vehicle-enquiry-server.mjs'], { env: fakes.vehicles });
  Object.assign(env, build('dist', env));
  startChild('app', 'node', appArgs(serverEntry), { env, quiet: true });
  startChild('worker', join(root, 'node_modules', '.bin', 'tsx'), ['scripts/worker.ts'], { env, quiet: true });
  await waitForHttp(`${appUrl}/api/health`);
  console.log(`
  Groundwork is running at ${appUrl}
  Local test inbox (every e-mail the app sends): http://127.0.0.1:${mailHttpPort}
  Texts sent (fake SMS service, JSON): http://127.0.0.1:${smsPort}/api/sms
  Vehicle look-up fake: plates GW29 EVA, GW29 PET, GW29 PHV… (http://127.0.0.1:${vehiclePort}/api/fleet)

  Demo sign-ins
    Office admin   admin@example.com      password: ${demoPassword}
    Surveyor       surveyor@example.com   password: ${demoPassword}
    Customer       customer@example.com   (e-mailed sign-in link: open the test inbox)
    Customer       customer2@example.com  (e-mailed sign-in link)

  Press Ctrl-C to stop.
`);
} catch (err) {
  console.error(err instanceof Error ? err.message : err);
  await shutdown(1);
}
