// Slow phone uploads: the whole-request limit of the app's HTTP server is set by
// scripts/lib/server-timeouts.mjs (20 minutes by default, so 15 MB at 1 Mbit/s — about two
// minutes — is never cut off). Waiting minutes is not a test, so a copy of the app runs with a
// 3-second limit: an upload trickled over 1 s is kept, one trickled over 5 s is cut. Node's own
// default (300 s) would cut neither, so this shows the limit in force is the one we set.
import { spawn } from 'node:child_process';
import { request } from 'node:http';
import net from 'node:net';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { appArgs } from '../../scripts/lib/stack.mjs';
import { newCustomer } from '../helpers/people';
import { smallImage } from '../fixtures/uploads';

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** Sends a multipart upload in ten pieces spread over `overMs`; resolves with the status, or 0 if cut. */
function trickle(url: string, caseId: string, cookie: string, file: Buffer, overMs: number): Promise<number> {
  const boundary = '----groundwork-slow';
  const head = Buffer.from(
    `--${boundary}\r\nContent-Disposition: form-data; name="kind"\r\n\r\nmeter_photo\r\n` +
      `--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="meter.jpg"\r\nContent-Type: image/jpeg\r\n\r\n`,
  );
  const tail = Buffer.from(`\r\n--${boundary}--\r\n`);
  const body = Buffer.concat([head, file, tail]);
  return new Promise((resolve) => {
    const req = request(`${url}/api/cases/${caseId}/uploads`, {
      method: 'POST',
      headers: { cookie, origin: url, 'content-type': `multipart/form-data; boundary=${boundary}`, 'content-length': body.length },
    });
    req.on('response', (res) => {
      res.resume();
      resolve(res.statusCode === 408 ? 0 : res.statusCode ?? 0);
    });
    req.on('error', () => resolve(0));
    void (async () => {
      const piece = Math.ceil(body.length / 10);
      for (let i = 0; i < 10; i++) {
        if (req.destroyed) return;
        req.write(body.subarray(i * piece, (i + 1) * piece));
        await sleep(overMs / 10);
      }
      req.end();
    })();
  });
}

describe('a slow upload and the server’s request time limit', () => {
  it('keeps an upload that arrives within the limit and cuts one that does not', async () => {
    const c = await newCustomer({});
    const dir = mkdtempSync(join(tmpdir(), 'groundwork-slow-'));
    const port = await new Promise<number>((r) => {
      const s = net.createServer().listen(0, '127.0.0.1', () => {
        const { port } = s.address() as net.AddressInfo;
        s.close(() => r(port));
      });
    });
    const url = `http://127.0.0.1:${port}`;
    const app = spawn('node', appArgs(process.env.APP_ENTRY!), {
      env: { ...process.env, PORT: String(port), HOST: '127.0.0.1', UPLOAD_DIR: dir, SERVER_REQUEST_TIMEOUT_SECONDS: '3', SERVER_TIMEOUT_CHECK_SECONDS: '1' },
      stdio: 'ignore',
    });
    try {
      for (let i = 0; i < 100; i++) {
        if (await fetch(`${url}/api/health`).then((r) => r.ok, () => false)) break;
        await sleep(100);
      }
      const photo = await smallImage('jpeg', 640, 480);
      const cookie = c.client.cookieHeader();
      expect(await trickle(url, c.case!.id, cookie, photo, 1000)).toBe(201);
      expect(await trickle(url, c.case!.id, cookie, photo, 5500)).toBe(0);
    } finally {
      app.kill('SIGKILL');
      rmSync(dir, { recursive: true, force: true });
    }
  }, 30_000);
});
