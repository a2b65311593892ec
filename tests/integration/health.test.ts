import { describe, expect, it } from 'vitest';
import { spawn } from 'node:child_process';
import net from 'node:net';
import { Client } from '../helpers/http';

async function freePort(): Promise<number> {
  return new Promise((resolve) => {
    const s = net.createServer().listen(0, '127.0.0.1', () => {
      const { port } = s.address() as net.AddressInfo;
      s.close(() => resolve(port));
    });
  });
}

describe('GET /api/health', () => {
  it('reports the database up', async () => {
    const { status, body } = await new Client().json('/api/health');
    expect(status).toBe(200);
    expect(body).toEqual({ ok: true, db: 'up' });
  });

  it('answers 503 when the database cannot be reached', async () => {
    // A second copy of the built app, pointed at a port where no PostgreSQL listens.
    const [appPort, deadDbPort] = [await freePort(), await freePort()];
    const child = spawn('node', [process.env.APP_ENTRY ?? 'scripts/server.mjs'], {
      env: { ...process.env, PORT: String(appPort), HOST: '127.0.0.1', DATABASE_URL: `postgres://x:y@127.0.0.1:${deadDbPort}/none` },
      stdio: 'ignore',
    });
    try {
      let res: Response | undefined;
      for (let i = 0; i < 100 && !res; i++) {
        res = await fetch(`http://127.0.0.1:${appPort}/api/health`).catch(() => undefined);
        if (!res) await new Promise((r) => setTimeout(r, 100));
      }
      expect(res?.status).toBe(503);
      expect(await res?.json()).toEqual({ ok: false, db: 'down' });
    } finally {
      child.kill();
    }
  });
});
