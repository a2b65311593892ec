// Server-only: the Storage interface on any S3-compatible object store, through the official
// AWS SDK. Files stream both ways; anything larger than one part goes up as a multipart upload.
import { createReadStream } from 'node:fs';
import { unlink } from 'node:fs/promises';
import type { Readable } from 'node:stream';
import {
  DeleteObjectCommand,
  GetObjectCommand,
  HeadObjectCommand,
  S3Client,
  S3ServiceException,
  paginateListObjectsV2,
} from '@aws-sdk/client-s3';
import { Upload } from '@aws-sdk/lib-storage';
import { assertSafeKey, type ListedObject, type PutSource, type Storage, type StoredObject } from './storage';

export type S3Settings = {
  bucket: string;
  region: string;
  endpoint?: string;
  accessKeyId?: string;
  secretAccessKey?: string;
  forcePathStyle?: boolean;
  /** Bytes per multipart part (S3's minimum is 5 MiB); files at most this size go up in one request. */
  partSize?: number;
  /** Keys per ListObjectsV2 request (S3 answers at most 1000). */
  listPageSize?: number;
};

const FIVE_MIB = 5 * 1024 * 1024;

export class S3Storage implements Storage {
  readonly bucket: string;
  private readonly client: S3Client;
  private readonly partSize: number;
  private readonly listPageSize: number;

  constructor(s: S3Settings) {
    this.bucket = s.bucket;
    this.partSize = Math.max(FIVE_MIB, s.partSize ?? 8 * 1024 * 1024);
    this.listPageSize = Math.min(1000, s.listPageSize ?? 1000);
    this.client = new S3Client({
      region: s.region,
      endpoint: s.endpoint,
      forcePathStyle: s.forcePathStyle ?? false,
      // Without explicit keys the SDK's default chain applies (instance role, AWS_* variables).
      credentials: s.accessKeyId && s.secretAccessKey ? { accessKeyId: s.accessKeyId, secretAccessKey: s.secretAccessKey } : undefined,
      // Checksums only when the operation requires them: several S3-compatible stores reject the
      // newer default CRC32 trailers.
      requestChecksumCalculation: 'WHEN_REQUIRED',
      responseChecksumValidation: 'WHEN_REQUIRED',
    });
  }

  async put(key: string, source: PutSource): Promise<void> {
    assertSafeKey(key);
    // Keys are fresh UUIDs, so this check is a guard against a bug, not a lock.
    if (await this.exists(key)) throw new Error(`Storage key already written: ${key}`);
    const body = Buffer.isBuffer(source) ? source : createReadStream(source.file);
    const upload = new Upload({
      client: this.client,
      params: { Bucket: this.bucket, Key: key, Body: body },
      partSize: this.partSize,
      queueSize: 2,
      leavePartsOnError: false,
    });
    await upload.done();
    // Same contract as the disk driver: a file source is consumed.
    if (!Buffer.isBuffer(source)) await unlink(source.file);
  }

  async get(key: string): Promise<StoredObject | null> {
    assertSafeKey(key);
    try {
      const out = await this.client.send(new GetObjectCommand({ Bucket: this.bucket, Key: key }));
      return { stream: out.Body as Readable, size: Number(out.ContentLength ?? 0) };
    } catch (err) {
      if (isMissing(err)) return null;
      throw err;
    }
  }

  async delete(key: string): Promise<void> {
    assertSafeKey(key);
    await this.client.send(new DeleteObjectCommand({ Bucket: this.bucket, Key: key }));
  }

  async exists(key: string): Promise<boolean> {
    assertSafeKey(key);
    try {
      await this.client.send(new HeadObjectCommand({ Bucket: this.bucket, Key: key }));
      return true;
    } catch (err) {
      if (isMissing(err)) return false;
      throw err;
    }
  }

  async *list(prefix?: string): AsyncIterable<ListedObject> {
    const pages = paginateListObjectsV2({ client: this.client, pageSize: this.listPageSize }, { Bucket: this.bucket, Prefix: prefix || undefined });
    for await (const page of pages) {
      for (const o of page.Contents ?? []) {
        if (!o.Key) continue;
        yield { key: o.Key, size: Number(o.Size ?? 0), modifiedAt: o.LastModified ?? new Date(0) };
      }
    }
  }

  /** Closes the SDK's sockets (tests and scripts that end). */
  close(): void {
    this.client.destroy();
  }
}

function isMissing(err: unknown): boolean {
  if (!(err instanceof S3ServiceException)) return false;
  return err.name === 'NoSuchKey' || err.name === 'NotFound' || err.$metadata?.httpStatusCode === 404;
}
