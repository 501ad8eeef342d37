import { createReadStream } from 'node:fs';
import { mkdir, rename, rm, rmdir, stat, writeFile } from 'node:fs/promises';
import { randomUUID } from 'node:crypto';
import { dirname, join, resolve } from 'node:path';
import type { Readable } from 'node:stream';
import { assertStorageKey, StorageNotFoundError, type PhotoStorage } from './photo-storage';

/** Photo files in a local folder (one sub-folder per photo); writes are atomic (temp file + rename). */
export class LocalPhotoStorage implements PhotoStorage {
  private readonly root: string;

  constructor(root: string) {
    this.root = resolve(root);
  }

  private pathOf(key: string): string {
    assertStorageKey(key);
    return join(this.root, key);
  }

  async put(key: string, data: Buffer): Promise<void> {
    const path = this.pathOf(key);
    await mkdir(dirname(path), { recursive: true });
    const temp = `${path}.${randomUUID()}.tmp`;
    try {
      await writeFile(temp, data, { flag: 'wx' });
      await rename(temp, path);
    } catch (error) {
      await rm(temp, { force: true });
      throw error;
    }
  }

  async get(key: string): Promise<Readable> {
    const path = this.pathOf(key);
    try {
      if (!(await stat(path)).isFile()) throw new StorageNotFoundError(key);
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code === 'ENOENT') throw new StorageNotFoundError(key);
      throw error;
    }
    return createReadStream(path);
  }

  async delete(key: string): Promise<void> {
    const path = this.pathOf(key);
    await rm(path, { force: true });
    // Drop the photo's folder once it is empty; a folder still holding files stays.
    await rmdir(dirname(path)).catch(() => undefined);
  }
}
