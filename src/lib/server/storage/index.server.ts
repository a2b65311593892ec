// Server-only: the one Storage the app uses, chosen here so endpoints never name a backend.
import { config } from '@/lib/server/config.server';
import { LocalDiskStorage } from './local-disk.server';
import { S3Storage } from './s3.server';
import type { Storage } from './storage';

export type { Storage, StoredObject, PutSource, ListedObject } from './storage';

let instance: Storage | undefined;

/**
 * The upload storage: the local disk under UPLOAD_DIR (the default), or an S3-compatible bucket
 * when STORAGE_DRIVER=s3.
 * @example await uploadStorage().exists('ab/ab12….jpg')
 */
export function uploadStorage(): Storage {
  instance ??= config.storage.driver === 's3' ? new S3Storage(config.storage.s3) : new LocalDiskStorage(config.uploadDir);
  return instance;
}
