// One suite, both upload stores: the local disk and an S3-compatible bucket (the s3rver fake the
// test stack starts, reached through the AWS SDK with signed requests, as a real bucket would be).
import { createHash, randomBytes, randomUUID } from 'node:crypto';
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Readable } from 'node:stream';
import { afterAll, describe, expect, it, vi } from 'vitest';
import { S3Client } from '@aws-sdk/client-s3';
import { LocalDiskStorage } from '@/lib/server/storage/local-disk.server';
import { S3Storage } from '@/lib/server/storage/s3.server';
import type { Storage } from '@/lib/server/storage/storage';

const MIB = 1024 * 1024;
const s3Settings = () => {
  const endpoint = process.env.S3_ENDPOINT;
  if (!endpoint) throw new Error('S3_ENDPOINT is not set: run this through `npm test`, which starts the S3 fake.');
  return {
    endpoint,
    bucket: process.env.S3_BUCKET!,
    region: process.env.S3_REGION ?? 'us-east-1',
    accessKeyId: process.env.S3_ACCESS_KEY_ID,
    secretAccessKey: process.env.S3_SECRET_ACCESS_KEY,
    forcePathStyle: true,
  };
};

const scratch = mkdtempSync(join(tmpdir(), 'groundwork-storage-'));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

type Driver = { name: string; make: () => Storage };
const drivers: Driver[] = [
  { name: 'local disk', make: () => new LocalDiskStorage(join(scratch, `disk-${randomUUID()}`)) },
  // The smallest part S3 allows (5 MiB), so a 12 MiB file goes up in three parts.
  { name: 'S3 bucket', make: () => new S3Storage({ ...s3Settings(), partSize: 5 * MIB }) },
];

async function readAll(stream: Readable): Promise<Buffer> {
  const chunks: Buffer[] = [];
  for await (const c of stream) chunks.push(Buffer.from(c));
  return Buffer.concat(chunks);
}

const sha = (b: Buffer) => createHash('sha256').update(b).digest('hex');

function tempFile(bytes: Buffer): string {
  const path = join(scratch, `${randomUUID()}.part`);
  writeFileSync(path, bytes);
  return path;
}

describe.each(drivers)('upload storage on the $name', ({ make }) => {
  const storage = make();
  // Each run writes under its own prefix, so the shared fake bucket never mixes runs.
  const prefix = `t${randomUUID().slice(0, 8)}`;
  const key = (name: string) => `${prefix}/${name}`;

  it('stores bytes and streams them back with their size', async () => {
    const bytes = Buffer.from('a photo of the cut-out, pretend');
    await storage.put(key('a.jpg'), bytes);
    const got = await storage.get(key('a.jpg'));
    expect(got?.size).toBe(bytes.length);
    expect(await readAll(got!.stream)).toEqual(bytes);
    expect(await storage.exists(key('a.jpg'))).toBe(true);
  });

  it('moves a finished file in (the temporary file is consumed)', async () => {
    const bytes = Buffer.alloc(300 * 1024, 7);
    const path = tempFile(bytes);
    await storage.put(key('b.png'), { file: path });
    expect(existsSync(path)).toBe(false);
    const got = await storage.get(key('b.png'));
    expect(sha(await readAll(got!.stream))).toBe(sha(bytes));
  });

  it('streams a file larger than one part intact', async () => {
    // Random bytes, so a part sent twice or out of order changes the checksum.
    const bytes = randomBytes(12 * MIB);
    const path = tempFile(bytes);
    await storage.put(key('big.pdf'), { file: path });
    const got = await storage.get(key('big.pdf'));
    expect(got?.size).toBe(12 * MIB);
    expect(sha(await readAll(got!.stream))).toBe(sha(bytes));
  });

  it('writes a key once: a second put of the same key is refused and the first stays', async () => {
    await storage.put(key('once.jpg'), Buffer.from('first'));
    await expect(storage.put(key('once.jpg'), Buffer.from('second'))).rejects.toThrow();
    expect((await readAll((await storage.get(key('once.jpg')))!.stream)).toString()).toBe('first');
  });

  it('answers null and false for a key that was never stored', async () => {
    expect(await storage.get(key('never.jpg'))).toBeNull();
    expect(await storage.exists(key('never.jpg'))).toBe(false);
  });

  it('deletes, and deleting what is not there is not an error', async () => {
    await storage.put(key('gone.jpg'), Buffer.from('x'));
    await storage.delete(key('gone.jpg'));
    expect(await storage.exists(key('gone.jpg'))).toBe(false);
    expect(await storage.get(key('gone.jpg'))).toBeNull();
    await expect(storage.delete(key('gone.jpg'))).resolves.toBeUndefined();
  });

  it('refuses path-like keys before touching the store', async () => {
    for (const bad of ['../etc/passwd', '/abs/key', 'a/../../b', 'A/Upper.jpg', '']) {
      await expect(storage.put(bad, Buffer.from('x'))).rejects.toThrow(/Unsafe storage key/);
      await expect(storage.get(bad)).rejects.toThrow(/Unsafe storage key/);
    }
  });

  it('lists what is stored under a prefix, with sizes and times', async () => {
    const listed = [];
    for await (const o of storage.list(`${prefix}/`)) listed.push(o);
    const byKey = Object.fromEntries(listed.map((o) => [o.key, o]));
    expect(Object.keys(byKey).sort()).toEqual([key('a.jpg'), key('b.png'), key('big.pdf'), key('once.jpg')].sort());
    expect(byKey[key('b.png')]!.size).toBe(300 * 1024);
    expect(byKey[key('a.jpg')]!.modifiedAt.getTime()).toBeGreaterThan(Date.now() - 10 * 60_000);
    const none = [];
    for await (const o of storage.list(`${prefix}-other/`)) none.push(o);
    expect(none).toEqual([]);
  });
});

describe('S3 bucket details', () => {
  it('pages through a listing longer than one page (ListObjectsV2 continuation)', async () => {
    // 25 keys a page: 103 keys take five requests, each after the first carrying a continuation token.
    const storage = new S3Storage({ ...s3Settings(), listPageSize: 25 });
    const prefix = `p${randomUUID().slice(0, 8)}`;
    const keys = Array.from({ length: 103 }, (_, i) => `${prefix}/${String(i).padStart(4, '0')}.jpg`);
    for (let i = 0; i < keys.length; i += 10) await Promise.all(keys.slice(i, i + 10).map((k) => storage.put(k, Buffer.from(k))));
    const seen: string[] = [];
    const send = vi.spyOn(S3Client.prototype, 'send');
    try {
      for await (const o of storage.list(`${prefix}/`)) seen.push(o.key);
      expect(send.mock.calls.filter(([c]) => c.constructor.name === 'ListObjectsV2Command')).toHaveLength(5);
    } finally {
      send.mockRestore();
    }
    expect(seen.sort()).toEqual(keys);
  });

  it('sends a large file as a multipart upload, a small one in a single request', async () => {
    const storage = new S3Storage({ ...s3Settings(), partSize: 5 * MIB });
    const prefix = `m${randomUUID().slice(0, 8)}`;
    const send = vi.spyOn(S3Client.prototype, 'send');
    const commandsFor = async (k: string, bytes: number) => {
      send.mockClear();
      await storage.put(`${prefix}/${k}`, { file: tempFile(Buffer.alloc(bytes, 1)) });
      return send.mock.calls.map(([command]) => command.constructor.name).filter((n) => n !== 'HeadObjectCommand');
    };
    try {
      expect(await commandsFor('small.jpg', 1024)).toEqual(['PutObjectCommand']);
      // 11 MiB in 5 MiB parts: 5 + 5 + 1.
      expect(await commandsFor('large.pdf', 11 * MIB)).toEqual([
        'CreateMultipartUploadCommand',
        'UploadPartCommand',
        'UploadPartCommand',
        'UploadPartCommand',
        'CompleteMultipartUploadCommand',
      ]);
    } finally {
      send.mockRestore();
    }
    expect((await storage.get(`${prefix}/large.pdf`))?.size).toBe(11 * MIB);
  });
});
