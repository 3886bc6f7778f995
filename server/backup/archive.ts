/**
 * One backup file: a .tar.gz holding manifest.json, database.sql (mariadb-dump, one snapshot)
 * and files/<key> (the documents on the local disk), each with its size and sha-256 in the
 * manifest. Written under a temporary name and renamed once complete, so a backup that exists
 * is a whole one. The S3 store is not copied: the manifest says so.
 *
 * Files and dump agree: the stored files are hard-linked before the dump (a file deleted during
 * the dump keeps its bytes through the link) and listed again after it (a file uploaded during
 * the dump is taken too). Files are written before their row and removed before the row's
 * delete commits, so every document the dump holds has its bytes in one of the two passes.
 */
import { spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { chmodSync, copyFileSync, createReadStream, existsSync, linkSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, renameSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { Writable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { createGunzip } from 'node:zlib';
import { basename, dirname, join, resolve } from 'node:path';
import { z } from 'zod';
import type { AppConfig } from '../config.js';
import { databaseName, dropAllTables, dumpDatabase, loadDump, tableRowCounts } from '../db/dump.js';
import { isStorageKey } from '../storage/index.js';
import type { CommandDatabase } from './command-database.js';

export const BACKUP_FORMAT = 'byrecast-backup';

const entrySchema = z.object({ key: z.string().refine(isStorageKey, 'not a storage key'), bytes: z.number().int().min(0), sha256: z.string().length(64) });
const manifestSchema = z.object({
  format: z.literal(BACKUP_FORMAT),
  formatVersion: z.literal(1),
  createdAt: z.string(),
  database: z.object({ name: z.string(), source: z.string(), file: z.literal('database.sql'), bytes: z.number().int(), sha256: z.string().length(64), rows: z.record(z.string(), z.number()) }),
  files: z.discriminatedUnion('storage', [
    z.object({ storage: z.literal('local'), included: z.literal(true), count: z.number().int(), bytes: z.number().int(), entries: z.array(entrySchema), missing: z.array(z.string()) }),
    z.object({ storage: z.literal('s3'), included: z.literal(false), bucket: z.string(), note: z.string() }),
  ]),
});
export type BackupManifest = z.infer<typeof manifestSchema>;

/** A backup or restore that was refused or failed: the message says why and what (not) changed. */
export class BackupError extends Error {}

function sha256File(path: string): Promise<string> {
  return new Promise((resolvePromise, reject) => {
    const hash = createHash('sha256');
    createReadStream(path)
      .on('data', (chunk) => hash.update(chunk))
      .on('error', reject)
      .on('end', () => resolvePromise(hash.digest('hex')));
  });
}

function storedKeys(filesDir: string): string[] {
  return existsSync(filesDir) ? readdirSync(filesDir).filter(isStorageKey).sort() : [];
}

/** A hard link where the file system allows one (instant, no second copy), else a copy. */
function linkOrCopy(from: string, to: string): void {
  try {
    linkSync(from, to);
  } catch {
    copyFileSync(from, to);
  }
}

/** Storage keys named in the dump's rows of `documents`. */
export function referencedKeys(sql: string): string[] {
  const keys = new Set<string>();
  for (const line of sql.split('\n')) {
    if (!line.startsWith('INSERT INTO `documents`')) continue;
    for (const match of line.matchAll(/'([0-9a-f]{32})'/g)) keys.add(match[1]!);
  }
  return [...keys].sort();
}

function tar(args: string[]): void {
  const result = spawnSync('tar', args, { encoding: 'utf8' });
  if (result.status !== 0) throw new BackupError(`tar ${args[0]} failed: ${result.stderr || result.error?.message}`);
}

export interface BackupResult {
  file: string;
  manifest: BackupManifest;
}

/** Writes the backup to `out` (a file name, or a directory to put a dated one in). */
export async function createBackup(config: Pick<AppConfig, 'dataDir' | 'storage'>, database: CommandDatabase, out: string, now = new Date()): Promise<BackupResult> {
  const stamp = now.toISOString().replace(/[-:]/g, '').replace(/\..*$/, '').replace('T', '-');
  const file = resolve(out.endsWith('.tar.gz') ? out : join(out, `byrecast-${stamp}.tar.gz`));
  if (existsSync(file)) throw new BackupError(`${file} exists already: nothing written`);
  mkdirSync(dirname(file), { recursive: true });
  const dataDir = resolve(config.dataDir);
  mkdirSync(dataDir, { recursive: true });
  // Inside the data directory, so the files can be hard-linked (same file system).
  const staging = mkdtempSync(join(dataDir, '.backup-'));
  const partial = `${file}.partial`;
  try {
    const filesDir = join(dataDir, 'files');
    const stagedFiles = join(staging, 'files');
    mkdirSync(stagedFiles);
    const local = config.storage.kind === 'local';
    const take = () => {
      for (const key of storedKeys(filesDir)) if (!existsSync(join(stagedFiles, key))) linkOrCopy(join(filesDir, key), join(stagedFiles, key));
    };
    if (local) take();
    const sqlFile = join(staging, 'database.sql');
    await dumpDatabase(database.target, sqlFile);
    if (local) take();
    const rows = await tableRowCounts(database.target);

    let files: BackupManifest['files'];
    if (config.storage.kind === 'local') {
      const entries = [];
      for (const key of storedKeys(stagedFiles)) entries.push({ key, bytes: statSync(join(stagedFiles, key)).size, sha256: await sha256File(join(stagedFiles, key)) });
      const have = new Set(entries.map((e) => e.key));
      const missing = referencedKeys(readFileSync(sqlFile, 'utf8')).filter((key) => !have.has(key));
      files = { storage: 'local', included: true, count: entries.length, bytes: entries.reduce((sum, e) => sum + e.bytes, 0), entries, missing };
    } else {
      files = { storage: 's3', included: false, bucket: config.storage.bucket, note: 'Documents in the S3 bucket are not in this backup: back the bucket up with the store\'s own tools (versioning or replication).' };
    }
    const manifest: BackupManifest = {
      format: BACKUP_FORMAT,
      formatVersion: 1,
      createdAt: now.toISOString(),
      database: { name: databaseName(database.target), source: database.description, file: 'database.sql', bytes: statSync(sqlFile).size, sha256: await sha256File(sqlFile), rows },
      files,
    };
    writeFileSync(join(staging, 'manifest.json'), `${JSON.stringify(manifest, null, 2)}\n`);
    tar(['-czf', partial, '-C', staging, 'manifest.json', 'database.sql', 'files']);
    renameSync(partial, file);
    return { file, manifest };
  } finally {
    rmSync(staging, { recursive: true, force: true });
    rmSync(partial, { force: true });
  }
}

export interface OpenedBackup {
  manifest: BackupManifest;
  dir: string;
  close(): void;
}

/**
 * Reads the whole gzip stream and checks its CRC: tar stops at the archive's end marker, so a
 * damaged byte in the padding after it (or a damage the entries' checks cannot see) would
 * otherwise pass.
 */
async function assertWholeGzip(file: string): Promise<void> {
  try {
    await pipeline(createReadStream(file), createGunzip(), new Writable({ write: (_chunk, _encoding, done) => done() }));
  } catch (error) {
    throw new BackupError(`${basename(file)} is damaged (${error instanceof Error ? error.message : String(error)})`);
  }
}

/** Unpacks a backup into a temporary directory and checks every part against the manifest. */
export async function openBackup(file: string): Promise<OpenedBackup> {
  if (!existsSync(file)) throw new BackupError(`No backup at ${file}`);
  const dir = mkdtempSync(join(tmpdir(), 'byrecast-restore-'));
  const close = () => rmSync(dir, { recursive: true, force: true });
  try {
    await assertWholeGzip(file);
    tar(['-xzf', resolve(file), '-C', dir, '--no-same-owner', '--no-same-permissions']);
    const manifestPath = join(dir, 'manifest.json');
    if (!existsSync(manifestPath)) throw new BackupError(`${basename(file)} is not a Byrecast backup (no manifest.json)`);
    const parsed = manifestSchema.safeParse(JSON.parse(readFileSync(manifestPath, 'utf8')));
    if (!parsed.success) throw new BackupError(`${basename(file)} is not a Byrecast backup this version reads: ${parsed.error.issues[0]?.message}`);
    const manifest = parsed.data;
    const sqlFile = join(dir, 'database.sql');
    if (!existsSync(sqlFile) || (await sha256File(sqlFile)) !== manifest.database.sha256) throw new BackupError('database.sql is missing or damaged (its sha-256 differs from the manifest)');
    if (manifest.files.storage === 'local') {
      for (const entry of manifest.files.entries) {
        const path = join(dir, 'files', entry.key);
        if (!existsSync(path) || (await sha256File(path)) !== entry.sha256) throw new BackupError(`stored file ${entry.key} is missing or damaged in the backup`);
      }
    }
    return { manifest, dir, close };
  } catch (error) {
    close();
    throw error;
  }
}

export interface RestoreResult {
  rows: Record<string, number>;
  filesRestored: number;
  filesBytes: number;
  /** Where the tables (as a dump) and files that were there before went (kept, not deleted), if any. */
  setAside: string | null;
  notes: string[];
}

/** What is in the target now: tables with rows, stored files. */
export async function currentContents(config: Pick<AppConfig, 'dataDir' | 'storage'>, database: CommandDatabase): Promise<{ rows: Record<string, number>; files: number }> {
  const rows = Object.fromEntries(Object.entries(await tableRowCounts(database.target)).filter(([, n]) => n > 0));
  const files = config.storage.kind === 'local' ? storedKeys(join(resolve(config.dataDir), 'files')).length : 0;
  return { rows, files };
}

/**
 * Replaces the database's tables by the backup's and, on the local disk, the stored files by
 * the backup's. What was there is kept (a dump of the tables, the files folder) in
 * DATA_DIR/before-restore-<time>/. Refuses a database or files
 * folder that holds anything unless `force`.
 */
export async function restoreBackup(config: Pick<AppConfig, 'dataDir' | 'storage'>, database: CommandDatabase, backup: OpenedBackup, force: boolean, now = new Date()): Promise<RestoreResult> {
  const { manifest } = backup;
  const notes: string[] = [];
  if (database.inUseBy) {
    throw new BackupError(`The app (pid ${database.inUseBy}) is running on ${database.description}: stop it (Ctrl-C) and run the restore again. Nothing changed.`);
  }
  const before = await currentContents(config, database);
  const holds = Object.entries(before.rows).map(([t, n]) => `${n} ${t}`);
  if (before.files > 0) holds.push(`${before.files} stored files`);
  if (holds.length > 0 && !force) {
    throw new BackupError(`${database.description} is not empty (${holds.join(', ')}). Nothing changed. Add --force to replace it with the backup.`);
  }
  if (manifest.files.storage === 'local' && manifest.files.count > 0 && config.storage.kind !== 'local') {
    if (!force) throw new BackupError(`The backup holds ${manifest.files.count} stored files but STORAGE=s3: copying them into the bucket is not covered. Nothing changed. Add --force to restore the database alone.`);
    notes.push(`${manifest.files.count} stored files in the backup were not copied into the S3 bucket.`);
  }
  if (manifest.files.storage === 's3') notes.push(`The backup holds no documents (they were in S3 bucket ${manifest.files.bucket}); their bytes must come from the bucket.`);
  if (manifest.files.storage === 'local' && manifest.files.missing.length > 0) notes.push(`${manifest.files.missing.length} documents had no stored file when the backup was made: ${manifest.files.missing.join(', ')}`);

  // What was there is kept: a dump of the tables and the files folder, in one dated folder.
  let setAside: string | null = null;
  const filesDir = join(resolve(config.dataDir), 'files');
  const replacesFiles = config.storage.kind === 'local';
  if (holds.length > 0) {
    setAside = join(resolve(config.dataDir), `before-restore-${now.toISOString().replace(/[-:]/g, '').replace(/\..*$/, '')}`);
    mkdirSync(setAside, { recursive: true, mode: 0o700 });
    if (Object.keys(before.rows).length > 0) await dumpDatabase(database.target, join(setAside, 'database.sql'));
  }

  await dropAllTables(database.target);
  try {
    await loadDump(database.target, join(backup.dir, 'database.sql'));
  } catch (error) {
    const kept = setAside ? ` The tables as they were are in ${setAside}/database.sql.` : '';
    throw new BackupError(`Loading the dump failed; the database may be partly restored.${kept}\n${(error as Error).message}`);
  }

  let filesRestored = 0;
  let filesBytes = 0;
  if (replacesFiles && manifest.files.storage === 'local') {
    if (existsSync(filesDir) && readdirSync(filesDir).length > 0) renameSync(filesDir, join(setAside ?? mkdtempSync(join(resolve(config.dataDir), 'before-restore-')), 'files'));
    rmSync(filesDir, { recursive: true, force: true });
    mkdirSync(filesDir, { recursive: true, mode: 0o700 });
    for (const entry of manifest.files.entries) {
      copyFileSync(join(backup.dir, 'files', entry.key), join(filesDir, entry.key));
      chmodSync(join(filesDir, entry.key), 0o600); // as the storage writes them: the owner alone
      filesRestored++;
      filesBytes += entry.bytes;
    }
  }
  return { rows: await tableRowCounts(database.target), filesRestored, filesBytes, setAside, notes };
}
