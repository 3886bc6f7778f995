/**
 * Where uploaded files live: one interface, two adapters (the local disk by default, an
 * S3-compatible object store by configuration). Keys are random; names and metadata stay in
 * the database, so nothing a user typed ever becomes a path or an object key.
 */
import { randomBytes } from 'node:crypto';
import { join } from 'node:path';
import type { Readable } from 'node:stream';
import type { AppConfig } from '../config.js';
import { createLocalDiskStorage } from './local-disk.js';
import { createS3Storage } from './s3.js';

export interface FileStorage {
  /** Stores every byte of `stream` under a new random key; if the stream fails, nothing is kept. */
  put(stream: Readable): Promise<string>;
  /** The stored bytes; throws StoredFileMissingError when the key holds nothing. */
  get(key: string): Promise<Readable>;
  /** Removes the file; a key that holds nothing is not an error. */
  delete(key: string): Promise<void>;
}

export class StoredFileMissingError extends Error {
  constructor(key: string) {
    super(`No stored file under key ${key}`);
  }
}

/** A fresh storage key: 128 random bits as 32 hex digits. */
export function newStorageKey(): string {
  return randomBytes(16).toString('hex');
}

/** True for a key this module could have made (so a key never walks out of its folder). */
export function isStorageKey(key: string): boolean {
  return /^[0-9a-f]{32}$/.test(key);
}

/** The adapter the configuration names: local disk under `${dataDir}/files`, or S3. */
export function createFileStorage(config: Pick<AppConfig, 'storage' | 'dataDir'>): FileStorage {
  return config.storage.kind === 's3'
    ? createS3Storage(config.storage)
    : createLocalDiskStorage(join(config.dataDir, 'files'));
}
