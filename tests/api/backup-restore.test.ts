/**
 * `npm run backup` and `npm run restore` round trip, run as the commands (server/cli/backup.ts,
 * server/cli/restore.ts) on a test database given as DATABASE_URL: the demo farm plus an
 * uploaded document is backed up, then a scenario is changed, another deleted and the document
 * removed; the restore refuses without --yes and on the non-empty database without --force, and
 * with both brings back the rows and the document's very bytes (compared by sha-256, FIPS 180-4).
 */
import { execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { gunzipSync } from 'node:zlib';
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { referencedKeys } from '../../server/backup/archive.js';
import { optionFile } from '../../server/db/dump.js';
import { createTestApp, type TestApp } from '../helpers/app.js';
import { createTestDatabase, type TestDatabase } from '../helpers/database.js';
import { runChild } from '../helpers/processes.js';
import { farmIdByName, signedIn } from '../helpers/scenarios.js';
import { pdfBytes, sha256 } from '../helpers/uploads.js';

async function download(agent: request.Agent, path: string): Promise<{ status: number; bytes: Buffer }> {
  const res = await agent.get(path).buffer(true).parse((r, done) => {
    const chunks: Buffer[] = [];
    r.on('data', (c: Buffer) => chunks.push(c));
    r.on('end', () => done(null, Buffer.concat(chunks)));
  });
  return { status: res.status, bytes: res.body as Buffer };
}

/** True when `damaged` no longer inflates (RFC 1952 CRC or deflate error) or inflates to other bytes. */
function changesContents(original: Buffer, damaged: Buffer): boolean {
  try {
    return !gunzipSync(damaged).equals(gunzipSync(original));
  } catch {
    return true;
  }
}

describe('backup and restore', () => {
  const work = mkdtempSync(join(tmpdir(), 'byrecast-backup-'));
  const dataDir = join(work, 'data');
  let t: TestApp;
  let fresh: TestDatabase | null = null;
  let owner: request.Agent;
  let base: string;
  const env = (databaseUrl: string, dir = dataDir) => ({ ...process.env, DATABASE_URL: databaseUrl, DATA_DIR: dir, STORAGE: 'local' });

  beforeAll(async () => {
    t = await createTestApp({ seedDemo: true, config: { dataDir } });
    owner = await signedIn(t, 'owner@byrecast.test');
    base = `/api/farms/${await farmIdByName(owner, 'Cairnbrook Farm')}`;
  });
  afterAll(async () => {
    await t?.close();
    await fresh?.drop();
    rmSync(work, { recursive: true, force: true });
  });

  it('finds the storage keys a dump of documents holds', () => {
    const key = 'ab'.repeat(16);
    const sql = `INSERT INTO \`documents\` VALUES (1,2,NULL,'quote.pdf','${key}','${'f'.repeat(64)}')\nINSERT INTO \`farms\` VALUES (1,'${'cd'.repeat(16)}')`;
    expect(referencedKeys(sql)).toEqual([key]);
  });

  it('brings back the rows and the document bytes as they were at the backup', async () => {
    const bytes = pdfBytes(7_000);
    const upload = await owner.post(`${base}/documents`).attach('file', bytes, 'Contractor quote.pdf');
    expect(upload.status).toBe(201);
    const documentId = upload.body.id as number;
    const list = (await owner.get(`${base}/scenarios`)).body as { id: number; name: string; version: number }[];
    expect(list.length).toBeGreaterThanOrEqual(2);
    const [kept, doomed] = list as [(typeof list)[0], (typeof list)[0]];
    const before = (await owner.get(`${base}/scenarios/${kept.id}`)).body as { version: number; scenario: { name: string } };

    const out = join(work, 'backups', 'nightly.tar.gz');
    const backup = await runChild('server/cli/backup.ts', env(t.database.url), ['--out', out]);
    expect(backup.code, backup.output).toBe(0);
    expect(backup.output).toContain(`Backup written: ${out}`);
    // One archive: the manifest, the dump, the stored file under its key (GNU tar lists it).
    const members = execFileSync('tar', ['-tzf', out], { encoding: 'utf8' }).split('\n').filter(Boolean);
    expect(members).toEqual(expect.arrayContaining(['manifest.json', 'database.sql', 'files/']));
    expect(members.filter((m) => /^files\/[0-9a-f]{32}$/.test(m))).toHaveLength(1);
    expect(readdirSync(join(work, 'backups'))).toEqual(['nightly.tar.gz']);
    expect(readdirSync(dataDir).filter((n) => n.startsWith('.backup-'))).toEqual([]);

    // The day after: a scenario saved with another name, one deleted, the document removed.
    const saved = await owner.put(`${base}/scenarios/${kept.id}`).send({ version: before.version, scenario: { ...before.scenario, name: 'Renamed after the backup' } });
    expect(saved.status).toBe(200);
    expect((await owner.delete(`${base}/scenarios/${doomed.id}`)).status).toBe(204);
    expect((await owner.delete(`${base}/documents/${documentId}`)).status).toBe(204);
    expect((await download(owner, `${base}/documents/${documentId}/download`)).status).toBe(404);

    const unconfirmed = await runChild('server/cli/restore.ts', env(t.database.url), [out]);
    expect(unconfirmed.code).toBe(3);
    expect(unconfirmed.output).toMatch(/Nothing changed/);
    const notForced = await runChild('server/cli/restore.ts', env(t.database.url), [out, '--yes']);
    expect(notForced.code).toBe(1);
    expect(notForced.output).toMatch(/is not empty \(.*scenarios.*\)\. Nothing changed\. Add --force/);
    expect((await owner.get(`${base}/scenarios/${kept.id}`)).body.scenario.name).toBe('Renamed after the backup');

    const restored = await runChild('server/cli/restore.ts', env(t.database.url), [out, '--yes', '--force']);
    expect(restored.code, restored.output).toBe(0);
    expect(restored.output).toMatch(/Restored into database t_\w+ on 127\.0\.0\.1:\d+ \(DATABASE_URL\)/);
    expect(restored.output).toContain('Restored 1 stored files (7000 bytes)');

    // The app carries on against the restored tables: the same session, the old data.
    const back = (await owner.get(`${base}/scenarios/${kept.id}`)).body as { version: number; scenario: { name: string } };
    expect(back.version).toBe(before.version);
    expect(back.scenario.name).toBe(before.scenario.name);
    expect((await owner.get(`${base}/scenarios/${doomed.id}`)).status).toBe(200);
    const file = await download(owner, `${base}/documents/${documentId}/download`);
    expect(file.status).toBe(200);
    expect(sha256(file.bytes)).toBe(sha256(bytes));

    // What was there before the restore is kept, not lost: the tables as a dump.
    const aside = readdirSync(dataDir).find((n) => n.startsWith('before-restore-'));
    expect(aside).toBeDefined();
    expect(readFileSync(join(dataDir, aside!, 'database.sql'), 'utf8')).toContain('Renamed after the backup');
  }, 120_000);

  it('restores into an empty database without --force, and refuses a damaged file', async () => {
    fresh = await createTestDatabase();
    const out = join(work, 'backups', 'nightly.tar.gz');
    const otherData = join(work, 'other');
    const restored = await runChild('server/cli/restore.ts', env(fresh.url, otherData), [out, '--yes']);
    expect(restored.code, restored.output).toBe(0);
    const [rows] = (await fresh.pool.query('SELECT name FROM scenarios ORDER BY id')) as unknown as [{ name: string }[]];
    const [original] = (await t.database.pool.query('SELECT name FROM scenarios ORDER BY id')) as unknown as [{ name: string }[]];
    expect(rows).toEqual(original);
    expect(readdirSync(join(otherData, 'files'))).toHaveLength(1);

    const damaged = join(work, 'damaged.tar.gz');
    const bytes = readFileSync(out);
    const middle = Math.floor(bytes.length / 2);
    // One bit, not the whole byte: a few bytes of a deflate stream can be inverted whole and still
    // inflate to the very same archive (seen here, checked with zlib), which is no damage at all.
    bytes[middle] = bytes[middle]! ^ 0x01;
    expect(changesContents(readFileSync(out), bytes)).toBe(true);
    writeFileSync(damaged, bytes);
    const refused = await runChild('server/cli/restore.ts', env(fresh.url, otherData), [damaged, '--yes', '--force']);
    expect(refused.code, refused.output).toBe(1);
    expect(existsSync(join(otherData, 'files'))).toBe(true);
    const [still] = (await fresh.pool.query('SELECT COUNT(*) AS n FROM scenarios')) as unknown as [{ n: number }[]];
    expect(Number(still[0]!.n)).toBe(original.length);
  }, 120_000);

  it('writes a password with quotes, a backslash, a hash and spaces into the option file so MariaDB reads it back intact', () => {
    const password = `p"a\\ss #w'rd x`;
    const url = new URL('mysql://127.0.0.1:3306/byrecast');
    url.username = 'backup user';
    url.password = encodeURIComponent(password);
    const file = join(work, 'client.cnf');
    writeFileSync(file, optionFile({ url: url.toString() }));
    // my_print_defaults parses option files with the same code as the mariadb programs.
    const parsed = execFileSync('my_print_defaults', [`--defaults-file=${file}`, 'client'], { encoding: 'utf8' }).split('\n');
    expect(parsed).toContain(`--password=${password}`);
    expect(parsed).toContain('--user=backup user');
    expect(parsed).toContain('--port=3306');
  });
});
