// @ts-check
// Fake object store: a local stand-in for an S3-compatible bucket, built on s3rver (a published
// S3 emulator), so the app's S3 driver talks the real protocol — signed requests, ListObjectsV2,
// multipart uploads — to a folder on this machine. Nothing leaves 127.0.0.1.
import { createCipheriv } from 'node:crypto';
import { mkdirSync } from 'node:fs';
import { createRequire } from 'node:module';
import { resolve } from 'node:path';
import { pathToFileURL } from 'node:url';

const require = createRequire(import.meta.url);
/** @type {any} */
const S3rver = require('s3rver');

const HOST = '127.0.0.1';
/** s3rver's built-in account: requests must be signed with exactly these keys. */
export const FAKE_S3_CREDENTIALS = { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' };

/**
 * s3rver encrypts ListObjectsV2 continuation tokens with DES, which OpenSSL 3 keeps in its
 * "legacy" provider: without `node --openssl-legacy-provider` any listing past one page fails.
 */
export function continuationTokensWork() {
  try {
    createCipheriv('des', Buffer.alloc(8), Buffer.alloc(8));
    return true;
  } catch {
    return false;
  }
}

/**
 * Starts the fake store with one bucket.
 * @param {{ port?: number, directory?: string, bucket?: string, quiet?: boolean }} [options]
 * @returns {Promise<{ port: number, endpoint: string, bucket: string, close: () => Promise<void> }>}
 * @example const s3 = await startS3Server({ port: 0, directory: '/tmp/s3', bucket: 'uploads' });
 */
export async function startS3Server(options = {}) {
  const port = options.port ?? Number(process.env.FAKE_S3_PORT ?? 4569);
  const directory = resolve(options.directory ?? process.env.FAKE_S3_DIR ?? '.data/s3');
  const bucket = options.bucket ?? process.env.FAKE_S3_BUCKET ?? 'groundwork-uploads';
  if (!continuationTokensWork()) {
    throw new Error('The S3 fake needs DES for its continuation tokens: run node with --openssl-legacy-provider.');
  }
  mkdirSync(directory, { recursive: true });
  const server = new S3rver({
    address: HOST,
    port,
    directory,
    silent: true,
    // Path-style only (http://host/bucket/key): no wildcard DNS on 127.0.0.1.
    vhostBuckets: false,
    configureBuckets: [{ name: bucket }],
  });
  const address = await server.run();
  const endpoint = `http://${HOST}:${address.port}`;
  if (!options.quiet) console.log(`[fake-s3] bucket "${bucket}" at ${endpoint} (files in ${directory})`);
  return { port: address.port, endpoint, bucket, close: () => server.close() };
}

// Run it as `node --openssl-legacy-provider fake-services/s3-server.mjs` (see continuationTokensWork).
if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  const s3 = await startS3Server();
  const stop = () => s3.close().then(() => process.exit(0));
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
}
