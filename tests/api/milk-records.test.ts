/**
 * Milk-record import API on a real MariaDB: preview → refused rows → confirm sets the farm
 * baseline's herd size and yield, and the import is kept. Expected values are computed here
 * from the generated records; behaviour comes from docs/product.md (Documents and milk records) unless a check names another source.
 * The last test runs the real server in its own process and measures its memory.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { readFileSync, writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { farmsTable } from '../../server/db/schema/index.js';
import { createTestApp, type TestApp } from '../helpers/app.js';
import { createTestDatabase, type TestDatabase } from '../helpers/database.js';
import { expectedSummary, generateMilkCsv, isoDay } from '../helpers/milk-csv.js';
import { farmIdByName, signedIn } from '../helpers/scenarios.js';

// 1 lb = 0.45359237 kg exactly (NIST Handbook 44, Appendix C; docs/references.md, memory of a definition).
const KG_PER_LB = 0.45359237;
const MB = 1024 * 1024;

describe('milk-record import API', () => {
  let t: TestApp;
  let owner: request.Agent;
  let farmId: number;
  let base: string;

  beforeAll(async () => {
    t = await createTestApp({ seedDemo: true });
    owner = await signedIn(t, 'owner@byrecast.test');
    farmId = await farmIdByName(owner, 'Cairnbrook Farm');
    base = `/api/farms/${farmId}`;
  });
  afterAll(async () => {
    await t.close();
  });

  it('previews a comma file with bad rows, then confirm by token sets herd size and yield', async () => {
    const { text, records } = generateMilkCsv({ cows: 60, days: 45, intervalDays: 5 });
    const bad = ['C99999,2026-02-31,30', 'C00001,2026-03-02,-1', 'C00001,2026-03-02,31.0'];
    const file = `${text}${bad.join('\r\n')}\r\n`;
    const expected = expectedSummary(records, 1);
    const before = (await owner.get(`${base}/milk-records`)).body.baseline;

    const preview = await owner.post(`${base}/milk-records/preview`).attach('file', Buffer.from(file), 'october-tests.csv');
    expect(preview.status).toBe(200);
    const { summary, token } = preview.body;
    expect(token).toMatch(/^[0-9a-f]{32}$/);
    expect(summary.rowsRead).toBe(records.length + 3);
    expect(summary.rowsAccepted).toBe(records.length);
    const lastLine = records.length + 1; // header is line 1
    expect(summary.refused).toEqual([
      { line: lastLine + 1, reason: 'bad_date', detail: expect.stringContaining('2026-02-31') },
      { line: lastLine + 2, reason: 'negative_milk', detail: expect.any(String) },
      // Cow 1 is tested on day 1 (2026-03-02) in the generated file, so this row repeats it.
      { line: lastLine + 3, reason: 'duplicate_row', detail: expect.stringContaining('C00001') },
    ]);
    expect(summary.herdSize).toBe(expected.herdSize);

    // A preview changes nothing yet.
    expect((await owner.get(`${base}/milk-records`)).body.baseline).toEqual(before);

    const confirm = await owner.post(`${base}/milk-records/confirm`).send({ token });
    expect(confirm.status).toBe(201);
    expect(confirm.body).toMatchObject({
      fileName: 'october-tests.csv',
      rowsRead: records.length + 3,
      rowsAccepted: records.length,
      rowsRefused: 3,
      firstDate: '2026-03-01',
      lastDate: isoDay('2026-03-01', expected.lastDay),
      herdSize: expected.herdSize,
      previousHerdSize: before.cows,
      previousYieldKgPerCowDay: before.yieldKgPerCowDay,
      importedBy: { name: 'Maren Holt' },
    });
    expect(confirm.body.averageYieldKgPerCowDay).toBeCloseTo(expected.averageKg, 2);

    const history = await owner.get(`${base}/milk-records`);
    expect(history.body.baseline.cows).toBe(expected.herdSize);
    expect(history.body.baseline.yieldKgPerCowDay).toBeCloseTo(expected.averageKg, 2);
    expect(history.body.imports).toHaveLength(1);

    // The same token works once.
    const again = await owner.post(`${base}/milk-records/confirm`).send({ token });
    expect(again.status).toBe(409);
  });

  it('confirms a semicolon lb file with a BOM sent again as the file, keeping the rest of the baseline', async () => {
    await t.database.db.update(farmsTable).set({ baseline: { cows: 1, yieldKgPerCowDay: 1, milkPricePerKg: 0.41, breedSize: 'large' } });
    const { text, records } = generateMilkCsv({ cows: 30, days: 35, delimiter: ';', unit: 'lb', bom: true, fatProtein: true });
    const expected = expectedSummary(records, KG_PER_LB);
    const res = await owner.post(`${base}/milk-records/confirm`).attach('file', Buffer.from(text, 'utf8'), 'lb-records.csv');
    expect(res.status).toBe(201);
    expect(res.body.herdSize).toBe(expected.herdSize);
    expect(res.body.averageYieldKgPerCowDay).toBeCloseTo(expected.averageKg, 2);
    expect(res.body.previousHerdSize).toBe(1);
    const [farm] = await t.database.db.select({ baseline: farmsTable.baseline }).from(farmsTable);
    const baseline = (typeof farm?.baseline === 'string' ? JSON.parse(farm.baseline) : farm?.baseline) as Record<string, unknown>;
    expect(baseline).toMatchObject({ cows: expected.herdSize, milkPricePerKg: 0.41, breedSize: 'large' });
    expect(baseline.yieldKgPerCowDay as number).toBeCloseTo(expected.averageKg, 2);
  });

  it('answers a header it cannot read with 400 naming the column, and lets only editors import', async () => {
    const res = await owner.post(`${base}/milk-records/preview`).attach('file', Buffer.from('cow,date,milk\nA,2026-01-01,30\n'), 'no-unit.csv');
    expect(res.status).toBe(400);
    expect(res.body.error.fields.milk).toMatch(/unit/);

    const empty = await owner.post(`${base}/milk-records/preview`).attach('file', Buffer.alloc(0), 'empty.csv');
    expect(empty.status).toBe(400);

    const noFile = await owner.post(`${base}/milk-records/preview`).send({});
    expect(noFile.status).toBe(400);
    expect(noFile.body.error.fields.file).toBeTruthy();

    const badToken = await owner.post(`${base}/milk-records/confirm`).send({ token: 'nope' });
    expect(badToken.status).toBe(400);
    expect(badToken.body.error.fields.token).toBeTruthy();

    const lender = await signedIn(t, 'lender@byrecast.test');
    const { text } = generateMilkCsv({ cows: 3, days: 3 });
    expect((await lender.post(`${base}/milk-records/preview`).attach('file', Buffer.from(text), 'x.csv')).status).toBe(403);
    const admin = await signedIn(t, 'admin@byrecast.test');
    expect((await admin.post(`${base}/milk-records/preview`).attach('file', Buffer.from(text), 'x.csv')).status).toBe(404);
  });

  it('refuses to confirm a file with no accepted rows', async () => {
    const res = await owner.post(`${base}/milk-records/confirm`).attach('file', Buffer.from('cow,date,milk kg\nA,bad,1\n'), 'bad.csv');
    expect(res.status).toBe(409);
  });
});

/** Resident and peak resident memory of a process in bytes (Linux /proc; VmHWM is the peak). */
function memoryOf(pid: number): { rss: number; peak: number } {
  const status = readFileSync(`/proc/${pid}/status`, 'utf8');
  const kb = (name: string) => Number(new RegExp(`${name}:\\s+(\\d+) kB`).exec(status)?.[1] ?? Number.NaN) * 1024;
  return { rss: kb('VmRSS'), peak: kb('VmHWM') };
}

describe('a 200 000-row milk-record file on the real server process', () => {
  let database: TestDatabase;
  let child: ChildProcess;
  let url: string;

  beforeAll(async () => {
    database = await createTestDatabase();
    const serve = fileURLToPath(new URL('../../server/serve.ts', import.meta.url));
    const configModule = fileURLToPath(new URL('../../server/config.ts', import.meta.url));
    const script = `
      const { startServer } = await import(${JSON.stringify(serve)});
      const { loadConfig } = await import(${JSON.stringify(configModule)});
      const config = loadConfig({ NODE_ENV: 'test', LOG_LEVEL: 'silent', BCRYPT_COST: '4', PORT: '0' });
      const running = await startServer({ databaseUrl: process.env.DB_URL, config, seedDemo: true });
      process.stdout.write('LISTENING ' + running.url + '\\n');
    `;
    child = spawn(process.execPath, ['--import', 'tsx', '--input-type=module', '-e', script], {
      env: { ...process.env, DB_URL: database.url },
      stdio: ['ignore', 'pipe', 'inherit'],
    });
    url = await new Promise<string>((resolve, reject) => {
      let out = '';
      child.stdout?.on('data', (chunk: Buffer) => {
        out += chunk.toString();
        const match = /LISTENING (\S+)/.exec(out);
        if (match?.[1]) resolve(match[1]);
      });
      child.on('exit', (code) => reject(new Error(`server exited with ${code}`)));
    });
  }, 120_000);
  afterAll(async () => {
    child?.kill('SIGTERM');
    await database?.drop();
  });

  it('imports it with the server growing by less than 300 MB', async () => {
    const { text, records } = generateMilkCsv({ cows: 2000, days: 100, fatProtein: true });
    expect(records).toHaveLength(200_000);
    const expected = expectedSummary(records, 1);

    const signIn = await fetch(`${url}/api/auth/sign-in`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ email: 'owner@byrecast.test', password: 'byrecast-demo' }),
    });
    const cookie = (signIn.headers.getSetCookie()[0] ?? '').split(';')[0] ?? '';
    const farms = (await (await fetch(`${url}/api/farms`, { headers: { cookie } })).json()) as { id: number }[];
    const farmId = farms[0]?.id;

    const pid = child.pid ?? 0;
    // Writing 5 to clear_refs resets VmHWM (Linux proc(5)), so the peak is this import's alone.
    try {
      writeFileSync(`/proc/${pid}/clear_refs`, '5');
    } catch {
      // Without permission the peak also covers start-up, which only makes the figure larger.
    }
    const before = memoryOf(pid);
    const form = new FormData();
    form.append('file', new Blob([text], { type: 'text/csv' }), 'herd-200k.csv');
    const started = performance.now();
    const res = await fetch(`${url}/api/farms/${farmId}/milk-records/confirm`, { method: 'POST', headers: { cookie }, body: form });
    const seconds = (performance.now() - started) / 1000;
    const body = (await res.json()) as { herdSize: number; averageYieldKgPerCowDay: number; rowsAccepted: number };
    const after = memoryOf(pid);
    const growthMb = (after.peak - before.rss) / MB;
    console.log(
      `200 000-row import (${(text.length / MB).toFixed(1)} MB): ${seconds.toFixed(2)} s, server RSS ${(before.rss / MB).toFixed(0)} MB → peak ${(after.peak / MB).toFixed(0)} MB, growth ${growthMb.toFixed(0)} MB`,
    );

    expect(res.status).toBe(201);
    expect(body.rowsAccepted).toBe(200_000);
    expect(body.herdSize).toBe(expected.herdSize);
    expect(body.averageYieldKgPerCowDay).toBeCloseTo(expected.averageKg, 2);
    expect(growthMb).toBeLessThan(300);
  }, 120_000);
});
