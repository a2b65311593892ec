// Server-only: the Storage interface on the local disk, one file per key under a root folder.
import { createReadStream } from 'node:fs';
import { copyFile, link, mkdir, readdir, rm, stat, unlink, writeFile } from 'node:fs/promises';
import { dirname, join, relative, resolve, sep } from 'node:path';
import { assertSafeKey, type ListedObject, type PutSource, type Storage, type StoredObject } from './storage';

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
    await mkdir(dirname(path), { recursive: true });
    if (Buffer.isBuffer(source)) {
      await writeFile(path, source, { flag: 'wx' });
      return;
    }
    await moveWithoutReplacing(source.file, path);
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

  async *list(prefix = ''): AsyncIterable<ListedObject> {
    let entries: string[];
    try {
      entries = await readdir(this.root, { recursive: true });
    } catch (err) {
      if (isMissing(err)) return;
      throw err;
    }
    for (const entry of entries) {
      const key = relative(this.root, join(this.root, entry)).split(sep).join('/');
      // Dot-folders (the uploads' scratch folder) hold work in progress, not stored objects.
      if (!key.startsWith(prefix) || key.split('/').some((part) => part.startsWith('.'))) continue;
      const info = await stat(join(this.root, entry)).catch(() => null);
      if (info?.isFile()) yield { key, size: info.size, modifiedAt: info.mtime };
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
