/**
 * Documents API on a real MariaDB with the local-disk storage in a temporary folder, then the
 * same flows against an S3 fake (s3rver) on loopback. Expected behaviour comes from docs/product.md (Documents and milk records) unless a check names another source.
 */
import { existsSync, mkdtempSync, readdirSync, rmSync } from 'node:fs';
import { createRequire } from 'node:module';
import type http from 'node:http';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { ListObjectsV2Command, S3Client } from '@aws-sdk/client-s3';
import ExcelJS from 'exceljs';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { documentsTable, scenariosTable } from '../../server/db/schema/index.js';
import { createTestApp, type TestApp } from '../helpers/app.js';
import { farmIdByName, signedIn } from '../helpers/scenarios.js';
import { eventually, exeBytes, pdfBytes, pngBytes, sessionCookie, sha256, startRawUpload } from '../helpers/uploads.js';

const MB = 1024 * 1024;

/** Inserts a scenario row whose document has one option with the given capital lines (the shape the scenarios table holds). */
async function insertScenario(t: TestApp, farmId: number, capitalLineIds: string[]): Promise<number> {
  const document = { name: 'Barn study', options: [{ id: 'option-a', name: 'Sand freestall', capitalLines: capitalLineIds.map((id) => ({ id })) }] };
  const [result] = await t.database.db.insert(scenariosTable).values({
    farmId,
    name: 'Barn study',
    version: 1,
    document,
    summary: { optionCount: 1, best: null },
    updatedAt: new Date(),
  });
  return result.insertId;
}

async function documentRowCount(t: TestApp): Promise<number> {
  return (await t.database.db.select({ id: documentsTable.id }).from(documentsTable)).length;
}

describe('documents API on the local disk', () => {
  let t: TestApp;
  let dataDir: string;
  let filesDir: string;
  let owner: request.Agent;
  let farmId: number;
  let base: string;
  let server: http.Server;

  const storedFiles = (): string[] => (existsSync(filesDir) ? readdirSync(filesDir) : []);

  beforeAll(async () => {
    dataDir = mkdtempSync(join(tmpdir(), 'byrecast-docs-'));
    filesDir = join(dataDir, 'files');
    t = await createTestApp({ seedDemo: true, config: { dataDir, documentQuotaBytes: 40 * MB } });
    owner = await signedIn(t, 'owner@byrecast.test');
    farmId = await farmIdByName(owner, 'Cairnbrook Farm');
    base = `/api/farms/${farmId}`;
    server = t.app.listen(0, '127.0.0.1');
    await new Promise((r) => server.once('listening', r));
  });
  afterAll(async () => {
    await new Promise((r) => server.close(r));
    await t.close();
    rmSync(dataDir, { recursive: true, force: true });
  });

  it('stores a PDF with its sha-256 and size, lists it and streams it back as an attachment', async () => {
    const bytes = pdfBytes(5000);
    const res = await owner.post(`${base}/documents`).attach('file', bytes, 'Contractor quote.pdf');
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ fileName: 'Contractor quote.pdf', mediaType: 'application/pdf', sizeBytes: 5000, sha256: sha256(bytes) });
    expect(typeof res.body.id).toBe('number');

    const list = await owner.get(`${base}/documents`);
    expect(list.body.map((d: { id: number }) => d.id)).toContain(res.body.id);

    const download = await owner.get(`${base}/documents/${res.body.id}/download`).buffer(true).parse((r, done) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => done(null, Buffer.concat(chunks)));
    });
    expect(download.status).toBe(200);
    expect(Buffer.compare(download.body as Buffer, bytes)).toBe(0);
    expect(download.headers['content-type']).toBe('application/pdf');
    expect(download.headers['content-disposition']).toMatch(/^attachment; filename="Contractor quote.pdf"/);
    expect(download.headers['x-content-type-options']).toBe('nosniff');
    // The stored file has a random name, not the user's.
    expect(storedFiles().every((name) => /^[0-9a-f]{32}$/.test(name))).toBe(true);
  });

  it('accepts PNG, XLSX and a UTF-8 CSV by their bytes', async () => {
    const png = await owner.post(`${base}/documents`).attach('file', pngBytes(), 'site photo.png');
    expect(png.status).toBe(201);
    expect(png.body.mediaType).toBe('image/png');

    const workbook = new ExcelJS.Workbook();
    workbook.addWorksheet('Quote').addRow(['Line', 'Amount']);
    const xlsx = Buffer.from(await workbook.xlsx.writeBuffer());
    const sheet = await owner.post(`${base}/documents`).attach('file', xlsx, 'prices.xlsx');
    expect(sheet.status).toBe(201);
    expect(sheet.body.mediaType).toBe('application/vnd.openxmlformats-officedocument.spreadsheetml.sheet');

    const csv = await owner.post(`${base}/documents`).attach('file', Buffer.from('\uFEFFitem;amount\nSand bedding;1200\nDividers;5400\n'), 'lines.csv');
    expect(csv.status).toBe(201);
    expect(csv.body.mediaType).toBe('text/csv');
  });

  it('refuses HTML or an executable renamed to .pdf, and binary or HTML named .csv, keeping nothing', async () => {
    const before = { rows: await documentRowCount(t), files: storedFiles().length };
    const cases: [Buffer, string][] = [
      [Buffer.from('<!DOCTYPE html><html><body><script>alert(1)</script></body></html>'), 'quote.pdf'],
      [exeBytes(), 'quote.pdf'],
      [Buffer.concat([Buffer.from('a,b\n'), Buffer.from([0, 1, 2, 3])]), 'data.csv'],
      [Buffer.from('<html>\n<body>hello</body>\n</html>\n'), 'page.csv'],
      [Buffer.from([0x61, 0x2c, 0x62, 0x0a, 0xc3, 0x28, 0x2c, 0x31, 0x0a]), 'latin.csv'],
    ];
    for (const [bytes, name] of cases) {
      const res = await owner.post(`${base}/documents`).attach('file', bytes, name);
      expect(res.status, name).toBe(415);
      expect(res.body.error.code).toBe('unsupported_type');
      expect(res.body.error.fields.file).toBeTruthy();
    }
    expect(await documentRowCount(t)).toBe(before.rows);
    expect(storedFiles()).toHaveLength(before.files);
  });

  it('neutralises path-traversal names: only the last segment is kept and nothing is written outside the folder', async () => {
    const res = await owner.post(`${base}/documents`).attach('file', pdfBytes(), '../../etc/passwd');
    expect(res.status).toBe(201);
    expect(res.body.fileName).toBe('passwd.pdf');
    const windows = await owner.post(`${base}/documents`).attach('file', pdfBytes(), '..\\..\\boot.ini.pdf');
    expect(windows.body.fileName).toBe('boot.ini.pdf');
    expect(existsSync(join(dataDir, 'etc'))).toBe(false);
    expect(existsSync(join(filesDir, '..', '..', 'etc', 'passwd'))).toBe(false);
    const download = await owner.get(`${base}/documents/${res.body.id}/download`);
    expect(download.headers['content-disposition']).toMatch(/^attachment; filename="?passwd\.pdf"?$/);
  });

  it('refuses a 16 MB file with 413 and has discarded what it stored while the client is still sending', async () => {
    const cookie = await sessionCookie(t.app, 'owner@byrecast.test');
    const rowsBefore = await documentRowCount(t);
    const filesBefore = storedFiles().length;
    const upload = startRawUpload(server, `${base}/documents`, cookie, 'huge.pdf');
    await upload.write(pdfBytes(64 * 1024));
    const chunk = Buffer.alloc(MB, 0x20);
    for (let i = 0; i < 15; i += 1) await upload.write(chunk);
    // 15 MB + 64 KB sent, 1 MB still to come: the limit has passed, the partial file must be gone already.
    const discarded = await eventually(() => storedFiles().length === filesBefore);
    expect(discarded).toBe(true);
    await upload.write(chunk);
    const res = await upload.finish();
    expect(res.status).toBe(413);
    expect((res.body as { error: { code: string; message: string } }).error.message).toMatch(/15 MB/);
    expect(await documentRowCount(t)).toBe(rowsBefore);
  });

  it('leaves no row and no file when the upload is interrupted mid-stream', async () => {
    const cookie = await sessionCookie(t.app, 'owner@byrecast.test');
    const rowsBefore = await documentRowCount(t);
    const filesBefore = storedFiles().length;
    const upload = startRawUpload(server, `${base}/documents`, cookie, 'interrupted.pdf');
    await upload.write(pdfBytes(128 * 1024));
    for (let i = 0; i < 3; i += 1) await upload.write(Buffer.alloc(MB, 0x20));
    // The partial file exists while the upload runs…
    expect(await eventually(() => storedFiles().some((f) => f.endsWith('.part')))).toBe(true);
    upload.abort();
    // …and is gone once the connection drops; no row was written.
    expect(await eventually(() => storedFiles().length === filesBefore)).toBe(true);
    expect(storedFiles().some((f) => f.endsWith('.part'))).toBe(false);
    expect(await documentRowCount(t)).toBe(rowsBefore);
  });

  it('lets only members list and download: a non-member gets 404, a lender sees no documents yet', async () => {
    const res = await owner.post(`${base}/documents`).attach('file', pdfBytes(), 'private.pdf');
    const admin = await signedIn(t, 'admin@byrecast.test');
    expect((await admin.get(`${base}/documents`)).status).toBe(404);
    expect((await admin.get(`${base}/documents/${res.body.id}/download`)).status).toBe(404);
    const anonymous = await request(t.app).get(`${base}/documents/${res.body.id}/download`);
    expect(anonymous.status).toBe(401);

    const lender = await signedIn(t, 'lender@byrecast.test');
    const list = await lender.get(`${base}/documents`);
    expect(list.status).toBe(200);
    expect(list.body).toEqual([]);
    expect((await lender.get(`${base}/documents/${res.body.id}/download`)).status).toBe(404);
    const upload = await lender.post(`${base}/documents`).attach('file', pdfBytes(), 'lender.pdf');
    expect(upload.status).toBe(403);

    const partner = await signedIn(t, 'partner@byrecast.test');
    expect((await partner.get(`${base}/documents/${res.body.id}/download`)).status).toBe(200);
  });

  it('deletes the row and the file in one step', async () => {
    const res = await owner.post(`${base}/documents`).attach('file', pdfBytes(3000), 'to delete.pdf');
    const filesBefore = storedFiles().length;
    const del = await owner.delete(`${base}/documents/${res.body.id}`);
    expect(del.status).toBe(204);
    expect(storedFiles()).toHaveLength(filesBefore - 1);
    expect((await owner.get(`${base}/documents/${res.body.id}/download`)).status).toBe(404);
    expect((await owner.get(`${base}/documents`)).body.some((d: { id: number }) => d.id === res.body.id)).toBe(false);
    expect((await owner.delete(`${base}/documents/${res.body.id}`)).status).toBe(404);
  });

  it('attaches a quote to a capital line, takes its amount and reports the line as quoted', async () => {
    const scenarioId = await insertScenario(t, farmId, ['barn-shell', 'sand-beds']);
    const quote = await owner
      .post(`${base}/documents`)
      .field('scenarioId', String(scenarioId))
      .field('capitalLineId', 'barn-shell')
      .attach('file', pdfBytes(), 'shell quote.pdf');
    expect(quote.status).toBe(201);
    expect(quote.body).toMatchObject({ scenarioId, capitalLineId: 'barn-shell', quoteAmount: null });

    const patched = await owner.patch(`${base}/documents/${quote.body.id}`).send({ quoteAmount: 182450.5 });
    expect(patched.status).toBe(200);
    expect(patched.body.quoteAmount).toBe(182450.5);

    const quotes = await owner.get(`${base}/scenarios/${scenarioId}/quotes`);
    expect(quotes.status).toBe(200);
    expect(quotes.body.lines).toEqual([
      { capitalLineId: 'barn-shell', quoted: true, quoteTotal: 182450.5, documents: [{ id: quote.body.id, fileName: 'shell quote.pdf', quoteAmount: 182450.5 }] },
    ]);
    const filtered = await owner.get(`${base}/documents`).query({ scenarioId, capitalLineId: 'barn-shell' });
    expect(filtered.body.map((d: { id: number }) => d.id)).toEqual([quote.body.id]);

    const negative = await owner.patch(`${base}/documents/${quote.body.id}`).send({ quoteAmount: -1 });
    expect(negative.status).toBe(400);
    expect(negative.body.error.fields.quoteAmount).toMatch(/negative/);

    const farmDoc = await owner.post(`${base}/documents`).attach('file', pdfBytes(), 'farm plan.pdf');
    const notOnLine = await owner.patch(`${base}/documents/${farmDoc.body.id}`).send({ quoteAmount: 10 });
    expect(notOnLine.status).toBe(409);
    expect(notOnLine.body.error.fields.quoteAmount).toBeTruthy();

    const unknownLine = await owner
      .post(`${base}/documents`)
      .field('scenarioId', String(scenarioId))
      .field('capitalLineId', 'no-such-line')
      .attach('file', pdfBytes(), 'x.pdf');
    expect(unknownLine.status).toBe(400);
    expect(unknownLine.body.error.fields.capitalLineId).toBeTruthy();
  });

  it('enforces the per-farm quota with a clear message and keeps nothing of the refused file', async () => {
    const small = await createTestApp({ seedDemo: true, config: { dataDir, documentQuotaBytes: 300 * 1024 } });
    try {
      const agent = await signedIn(small, 'owner@byrecast.test');
      const id = await farmIdByName(agent, 'Cairnbrook Farm');
      // An earlier test's aborted upload may still be discarding its partial file on a busy machine.
      expect(await eventually(() => !storedFiles().some((f) => f.endsWith('.part')))).toBe(true);
      const filesBefore = storedFiles().length;
      const first = await agent.post(`/api/farms/${id}/documents`).attach('file', pdfBytes(200 * 1024), 'first.pdf');
      expect(first.status).toBe(201);
      const second = await agent.post(`/api/farms/${id}/documents`).attach('file', pdfBytes(150 * 1024), 'second.pdf');
      expect(second.status).toBe(413);
      expect(second.body.error.code).toBe('quota_exceeded');
      expect(second.body.error.message).toMatch(/quota of 0\.3 MB/);
      expect(storedFiles(), storedFiles().join(' ')).toHaveLength(filesBefore + 1);
    } finally {
      await small.close();
    }
  });
});

interface S3rverInstance {
  run(): Promise<AddressInfo>;
  close(): Promise<void>;
}
type S3rverClass = new (options: Record<string, unknown>) => S3rverInstance;

describe('documents API on S3-compatible storage (s3rver on loopback)', () => {
  const bucket = 'byrecast-documents';
  let t: TestApp;
  let fake: S3rverInstance;
  let fakeDir: string;
  let s3: S3Client;
  let owner: request.Agent;
  let base: string;
  let server: http.Server;

  const objectKeys = async (): Promise<string[]> =>
    ((await s3.send(new ListObjectsV2Command({ Bucket: bucket }))).Contents ?? []).map((o) => o.Key ?? '');

  beforeAll(async () => {
    // s3rver ships CommonJS without types.
    const S3rver = createRequire(import.meta.url)('s3rver') as S3rverClass;
    fakeDir = mkdtempSync(join(tmpdir(), 'byrecast-s3rver-'));
    fake = new S3rver({ address: '127.0.0.1', port: 0, silent: true, directory: fakeDir, configureBuckets: [{ name: bucket }] });
    const { port } = await fake.run();
    const endpoint = `http://127.0.0.1:${port}`;
    const credentials = { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' };
    s3 = new S3Client({ region: 'us-east-1', endpoint, forcePathStyle: true, credentials });
    t = await createTestApp({
      seedDemo: true,
      config: { storage: { kind: 's3', endpoint, bucket, region: 'us-east-1', ...credentials }, documentQuotaBytes: 100 * MB },
    });
    owner = await signedIn(t, 'owner@byrecast.test');
    base = `/api/farms/${await farmIdByName(owner, 'Cairnbrook Farm')}`;
    server = t.app.listen(0, '127.0.0.1');
    await new Promise((r) => server.once('listening', r));
  });
  afterAll(async () => {
    await new Promise((r) => server?.close(r));
    await t?.close();
    await fake?.close();
    rmSync(fakeDir, { recursive: true, force: true });
  });

  it('uploads, downloads and deletes through the object store, a multipart-sized file included', async () => {
    for (const size of [4000, 9 * MB]) {
      const bytes = pdfBytes(size);
      const res = await owner.post(`${base}/documents`).attach('file', bytes, `quote-${size}.pdf`);
      expect(res.status).toBe(201);
      expect(await objectKeys()).toHaveLength(1);
      const download = await owner.get(`${base}/documents/${res.body.id}/download`).buffer(true).parse((r, done) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => done(null, Buffer.concat(chunks)));
      });
      expect(download.status).toBe(200);
      expect(sha256(download.body as Buffer)).toBe(sha256(bytes));
      expect((await owner.delete(`${base}/documents/${res.body.id}`)).status).toBe(204);
      expect(await objectKeys()).toEqual([]);
    }
  });

  it('leaves no object and no row when the upload is interrupted', async () => {
    const cookie = await sessionCookie(t.app, 'owner@byrecast.test');
    const upload = startRawUpload(server, `${base}/documents`, cookie, 'cut.pdf');
    await upload.write(pdfBytes(128 * 1024));
    for (let i = 0; i < 10; i += 1) await upload.write(Buffer.alloc(MB, 0x20));
    upload.abort();
    await new Promise((r) => setTimeout(r, 500));
    expect(await objectKeys()).toEqual([]);
    expect(await documentRowCount(t)).toBe(0);
  });

  it('refuses a 16 MB file with 413 and stores no object', async () => {
    const res = await owner.post(`${base}/documents`).attach('file', pdfBytes(16 * MB), 'huge.pdf');
    expect(res.status).toBe(413);
    expect(await objectKeys()).toEqual([]);
  });
});
