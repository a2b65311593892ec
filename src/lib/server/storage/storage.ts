// Server-only: where upload bytes live. Endpoints talk to this interface only, so an object
// store can replace the local disk without touching them (see docs/decisions/004).
import type { Readable } from 'node:stream';

/** A stored object opened for reading. */
export interface StoredObject {
  stream: Readable;
  size: number;
}

/** One stored object as a listing reports it. */
export interface ListedObject {
  key: string;
  size: number;
  modifiedAt: Date;
}

/** What `put` stores: a finished file on local disk (consumed: moved, not copied) or bytes. */
export type PutSource = { file: string } | Buffer;

export interface Storage {
  /** Stores the source under key, replacing nothing: a key is written once. */
  put(key: string, source: PutSource): Promise<void>;
  /** Opens a stored object, or null when there is none. */
  get(key: string): Promise<StoredObject | null>;
  /** Removes an object; removing one that is not there is not an error. */
  delete(key: string): Promise<void>;
  exists(key: string): Promise<boolean>;
  /**
   * Every stored object whose key starts with `prefix` (all when omitted), in no set order, for
   * the sweep that removes files no row refers to. Temporary files are not objects: never listed.
   */
  list(prefix?: string): AsyncIterable<ListedObject>;
}

// Keys are made by the app (ids, never user input), but refuse anything path-like regardless.
const KEY = /^[a-z0-9][a-z0-9-]*(\/[a-z0-9][a-z0-9.-]*)*$/;

/**
 * Throws unless the key is a plain relative name such as `ab/ab12…-thumb.webp`.
 * @example assertSafeKey('../etc/passwd') // throws
 */
export function assertSafeKey(key: string): void {
  if (!isSafeKey(key)) throw new Error(`Unsafe storage key: ${JSON.stringify(key)}`);
}

/** @example isSafeKey('.incoming/x.part') // false */
export function isSafeKey(key: string): boolean {
  return KEY.test(key) && !key.includes('..') && key.length <= 200;
}
