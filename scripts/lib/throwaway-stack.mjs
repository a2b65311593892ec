// A complete Groundwork on free ports with a throwaway PostgreSQL cluster: what `npm test` and
// `npm run bench` run against. stop() removes everything it made.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { appArgs, build, fakeServiceEnv, freePort, migrate, root, runTsx, serverEntry, startChild, startDatabase, startS3Fake, stopChildren, waitForHttp } from './stack.mjs';

export async function startThrowawayStack({ name = 'test', seed = true, worker = true } = {}) {
  const scratch = mkdtempSync(join(tmpdir(), `groundwork-${name}-`));
  const outDir = `.data/${name}-build-${process.pid}`;
  let db;
  const stop = async () => {
    await stopChildren();
    db?.stop();
    rmSync(scratch, { recursive: true, force: true });
    rmSync(join(root, outDir), { recursive: true, force: true });
    if (db?.dataDir && !db.dataDir.startsWith(scratch)) rmSync(db.dataDir, { recursive: true, force: true });
  };
  try {
    const [pgPort, appPort, smtpPort, mailHttpPort, smsPort, vehiclePort, s3Port] = [await freePort(), await freePort(), await freePort(), await freePort(), await freePort(), await freePort(), await freePort()];
    db = await startDatabase({
      dataDir: join(scratch, 'pg'),
      fallbackName: `groundwork-${name}-pg-${process.pid}`,
      port: pgPort,
      database: `groundwork_${name}`,
      password: `groundwork-${name}`,
      durable: false,
    });
    await migrate(db.url);
    const appUrl = `http://127.0.0.1:${appPort}`;
    const fakes = fakeServiceEnv({ appUrl, smsPort, vehiclePort });
    const env = {
      ...fakes.app,
      SMS_API_URL: `http://127.0.0.1:${smsPort}`,
      VEHICLE_API_URL: `http://127.0.0.1:${vehiclePort}`,
      DATABASE_URL: db.url,
      AUTH_SECRET: `groundwork-${name}-secret-not-for-production`,
      AUTH_TRUST_HOST: 'true',
      APP_URL: appUrl,
      SMTP_HOST: '127.0.0.1',
      SMTP_PORT: String(smtpPort),
      UPLOAD_DIR: join(scratch, 'uploads'),
      DEMO_PASSWORD: 'groundwork-demo',
      HOST: '127.0.0.1',
      PORT: String(appPort),
      GROUNDWORK_TEST: '1',
      // Tests drive reminder sweeps themselves; the background schedule stays out of their way.
      REMINDER_SWEEP_CRON: '0 4 1 1 *',
      STORAGE_SWEEP_CRON: '0 4 1 1 *',
      MAIL_API_URL: `http://127.0.0.1:${mailHttpPort}`,
      // Every test signs in from 127.0.0.1: the per-address limits would trip on the suite
      // itself. The per-e-mail limits stay as in production and are tested.
      RATE_LIMIT_LINK_PER_ADDRESS: '100000',
      RATE_LIMIT_PASSWORD_PER_ADDRESS: '100000',
    };
    // The S3 fake is there for the tests that use the S3 driver (the storage suite, the cluster
    // test); the app itself keeps the default local disk unless STORAGE_DRIVER says otherwise.
    Object.assign(env, startS3Fake({ port: s3Port, directory: join(scratch, 's3') }));
    await waitForHttp(env.S3_ENDPOINT);
    if (seed) runTsx('seeds/run.ts', env);
    startChild('fake mail', 'node', ['fake-services/mail-server.mjs'], {
      env: { FAKE_SMTP_PORT: String(smtpPort), FAKE_MAIL_HTTP_PORT: String(mailHttpPort) },
      quiet: true,
    });
    startChild('fake sms', 'node', ['fake-services/sms-server.mjs'], { env: fakes.sms, quiet: true });
    startChild('fake vehicles', 'node', ['fake-services/vehicle-enquiry-server.mjs'], { env: fakes.vehicles, quiet: true });
    Object.assign(env, build(outDir, env));
    startChild('app', 'node', appArgs(serverEntry), { env, quiet: true });
    if (worker) startChild('worker', join(root, 'node_modules', '.bin', 'tsx'), ['scripts/worker.ts'], { env, quiet: true });
    await waitForHttp(`${appUrl}/api/health`);
    return { env, stop };
  } catch (err) {
    await stop();
    throw err;
  }
}
