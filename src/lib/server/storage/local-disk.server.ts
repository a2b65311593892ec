// Server-only: the Storage interface on the local disk, one file per key under a root folder.
import { createReadStream } from 'node:fs';
import { chmod, copyFile, link, mkdir, opendir, rm, stat, unlink, writeFile } from 'node:fs/promises';
import { dirname, join, resolve, sep } from 'node:path';
import { assertSafeKey, isSafeKey, type ListedObject, type PutSource, type Storage, type StoredObject } from './storage';

export class LocalDiskStorage implements Storage {
  readonly root: string;

  constructor(root: string) {
    this.root = resolve(root);
  }

  /** The absolute path of a key, checked to stay inside the root. */
  pathOf(key: string): string {
    assertSafeKey(key);
    const path = resolve(join(this.root, key));
    if (!path.startsWith(this.root + sep)) throw new Error(`Storage key escapes the root: ${key}`);
    return path;
  }

  async put(key: string, source: PutSource): Promise<void> {
    const path = this.pathOf(key);
    // Owner-only folders and files: another account on the machine cannot read uploads.
    await mkdir(dirname(path), { recursive: true, mode: 0o700 });
    if (Buffer.isBuffer(source)) {
      await writeFile(path, source, { flag: 'wx', mode: 0o600 });
      return;
    }
    await moveWithoutReplacing(source.file, path);
    // sharp writes its files with the default mode (often 0644); tighten whatever arrived.
    await chmod(path, 0o600);
  }

  async get(key: string): Promise<StoredObject | null> {
    const path = this.pathOf(key);
    try {
      const info = await stat(path);
      if (!info.isFile()) return null;
      return { stream: createReadStream(path), size: info.size };
    } catch (err) {
      if (isMissing(err)) return null;
      throw err;
    }
  }

  async delete(key: string): Promise<void> {
    await rm(this.pathOf(key), { force: true });
  }

  async exists(key: string): Promise<boolean> {
    try {
      return (await stat(this.pathOf(key))).isFile();
    } catch (err) {
      if (isMissing(err)) return false;
      throw err;
    }
  }

  /** Walks the folders under the root; names that are not keys (such as `.incoming/`) are skipped. */
  async *list(prefix = ''): AsyncIterable<ListedObject> {
    yield* this.walk('', prefix);
  }

  private async *walk(dir: string, prefix: string): AsyncGenerator<ListedObject> {
    let entries;
    try {
      entries = await opendir(dir ? join(this.root, dir) : this.root);
    } catch (err) {
      if (isMissing(err)) return;
      throw err;
    }
    for await (const entry of entries) {
      const key = dir ? `${dir}/${entry.name}` : entry.name;
      if (!isSafeKey(key)) continue;
      // Only descend into folders that can still hold keys with the prefix.
      if (entry.isDirectory() && (prefix.startsWith(`${key}/`) || key.startsWith(prefix))) yield* this.walk(key, prefix);
      else if (entry.isFile() && key.startsWith(prefix)) {
        try {
          const info = await stat(join(this.root, key));
          yield { key, size: info.size, modifiedAt: info.mtime };
        } catch (err) {
          if (!isMissing(err)) throw err; // removed while we walked: nothing to list
        }
      }
    }
  }
}

// link() fails if the target exists, so a key is never silently overwritten; copy across disks.
async function moveWithoutReplacing(from: string, to: string): Promise<void> {
  try {
    await link(from, to);
  } catch (err) {
    if ((err as NodeJS.ErrnoException).code !== 'EXDEV') throw err;
    await copyFile(from, to, 1 /* COPYFILE_EXCL */);
  }
  await unlink(from);
}

function isMissing(err: unknown): boolean {
  const code = (err as NodeJS.ErrnoException).code;
  return code === 'ENOENT' || code === 'ENOTDIR';
}
