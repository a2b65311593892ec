// Server-only: the one Storage the app uses, chosen here so endpoints never name a backend.
import { config } from '../config.server';
import { LocalDiskStorage } from './local-disk.server';
import type { Storage } from './storage';

export type { Storage, StoredObject, PutSource } from './storage';

let instance: LocalDiskStorage | undefined;

/**
 * The upload storage: the local disk under UPLOAD_DIR.
 * @example await uploadStorage().exists('ab/ab12….jpg')
 */
export function uploadStorage(): Storage {
  instance ??= new LocalDiskStorage(config.uploadDir);
  return instance;
}
