/**
 * Files on the local disk, in one folder outside the web root, under random names. A file is
 * written as `<key>.part` and renamed only once complete, so an interrupted upload never leaves
 * a file that looks stored.
 */
import { createReadStream, createWriteStream } from 'node:fs';
import { mkdir, rename, stat, unlink } from 'node:fs/promises';
import { join } from 'node:path';
import type { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { isStorageKey, newStorageKey, StoredFileMissingError, type FileStorage } from './index.js';

/** Storage in `directory` (created on first write). */
export function createLocalDiskStorage(directory: string): FileStorage {
  const pathOf = (key: string): string => {
    if (!isStorageKey(key)) throw new StoredFileMissingError(key);
    return join(directory, key);
  };
  return {
    async put(stream) {
      await mkdir(directory, { recursive: true, mode: 0o700 });
      const key = newStorageKey();
      const partial = `${pathOf(key)}.part`;
      const out = createWriteStream(partial, { flags: 'wx', mode: 0o600 });
      try {
        await pipeline(stream, out);
        await rename(partial, pathOf(key));
      } catch (error) {
        // The file may still be opening when the source fails: unlink only once it is closed.
        if (!out.closed) await new Promise<void>((resolve) => out.once('close', () => resolve()));
        await unlink(partial).catch(() => undefined);
        throw error;
      }
      return key;
    },
    async get(key) {
      const path = pathOf(key);
      try {
        await stat(path);
      } catch {
        throw new StoredFileMissingError(key);
      }
      return createReadStream(path) as Readable;
    },
    async delete(key) {
      try {
        await unlink(pathOf(key));
      } catch (error) {
        if ((error as NodeJS.ErrnoException).code !== 'ENOENT') throw error;
      }
    },
  };
}
