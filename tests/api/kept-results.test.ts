/**
 * Results kept per scenario version (server/services/scenario-results.ts): a read evaluates
 * nothing, a stale engine key is recomputed, answers are compressed when the client accepts it,
 * and the yearly lines and loan payments come from their own route, checked like every
 * scenario route (docs/product.md, Scenarios and versions: a farm's scenarios are reachable by
 * its members only, a lender only at the shared version).
 */
import { and, eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { evaluateScenario } from '../../shared/engine/evaluate.js';
import { joinOption, type OptionDetail, type ScenarioResultsSummary } from '../../shared/engine/result-parts.js';
import { ENGINE_VERSION, resultsCacheKey } from '../../shared/engine/version.js';
import type { Scenario } from '../../shared/schema/index.js';
import { scenarioResultsTable, scenariosTable } from '../../server/db/schema/index.js';
import { forgetEncodedTexts } from '../../server/http/json-text.js';
import { forgetRememberedResults as forgetKept, keptEvaluationCount } from '../../server/services/scenario-results.js';
import { createTestApp, type TestApp } from '../helpers/app.js';
import { asJson, demoScenarioFile, farmIdByName, signedIn } from '../helpers/scenarios.js';

describe('kept results', () => {
  let t: TestApp;
  let owner: request.Agent;
  let consultant: request.Agent;
  let lender: request.Agent;
  let farmId: number;
  let scenarioId: number;
  let sharedId: number;
  let otherFarmId: number;
  let otherScenarioId: number;

  beforeAll(async () => {
    t = await createTestApp({ seedDemo: true });
    owner = await signedIn(t, 'owner@byrecast.test');
    consultant = await signedIn(t, 'consultant@byrecast.test');
    lender = await signedIn(t, 'lender@byrecast.test');
    farmId = await farmIdByName(owner, 'Cairnbrook Farm');
    const imported = await owner.post(`/api/farms/${farmId}/scenarios`).send({ scenario: demoScenarioFile('cairnbrook-mattress-or-sand.json'), name: 'Kept results' });
    expect(imported.status).toBe(201);
    scenarioId = imported.body.id;
    const list = await owner.get(`/api/farms/${farmId}/scenarios`);
    // The demo seed shares the five-systems scenario with the lender at version 1.
    sharedId = (list.body as { id: number; name: string }[]).find((s) => s.name.includes('five'))!.id;

    const farm = await consultant.post('/api/farms').send({ name: 'Hollin Ridge (invented)', currency: 'GBP', locale: 'en-GB' });
    expect(farm.status).toBe(201);
    otherFarmId = farm.body.id;
    const other = await consultant.post(`/api/farms/${otherFarmId}/scenarios`).send({ scenario: demoScenarioFile('cairnbrook-mattress-or-sand.json') });
    expect(other.status).toBe(201);
    otherScenarioId = other.body.id;
  });
  afterAll(async () => {
    await t.close();
  });

  const path = (id = scenarioId, farm = farmId) => `/api/farms/${farm}/scenarios/${id}`;
  const keptRows = (id: number) => t.database.db.select({ version: scenarioResultsTable.version, engineKey: scenarioResultsTable.engineKey }).from(scenarioResultsTable).where(eq(scenarioResultsTable.scenarioId, id));

  it('evaluates a version once, at save: reads after it evaluate nothing', async () => {
    const before = keptEvaluationCount();
    const first = await owner.get(path());
    const second = await owner.get(path());
    await owner.get(`${path()}/results/detail`).expect(200);
    await owner.get(`${path()}/versions/1`).expect(200);
    expect(first.status).toBe(200);
    expect(second.body).toEqual(first.body);
    expect(keptEvaluationCount()).toBe(before);

    const edited = structuredClone(first.body.scenario as Scenario);
    edited.finance.interestRate = 0.07;
    await owner.put(path()).send({ version: 1, scenario: edited }).expect(200);
    expect(keptEvaluationCount()).toBe(before + 1);
    await owner.get(path()).expect(200);
    expect(keptEvaluationCount()).toBe(before + 1);
  });

  it('sends the kept text as it is: a kept summary is what the read answers, never re-evaluated', async () => {
    const read = await owner.get(path());
    const kept = JSON.parse(JSON.stringify(read.body.results)) as ScenarioResultsSummary;
    kept.options[0]!.npv = 123.45;
    const where = and(eq(scenarioResultsTable.scenarioId, scenarioId), eq(scenarioResultsTable.version, read.body.version), eq(scenarioResultsTable.engineKey, resultsCacheKey()));
    await t.database.db.update(scenarioResultsTable).set({ summary: JSON.stringify(kept) }).where(where);
    forgetKept();
    forgetEncodedTexts();
    expect((await owner.get(path())).body.results.options[0].npv).toBe(123.45);
    // Put the true summary back for the tests after this one.
    await t.database.db.update(scenarioResultsTable).set({ summary: JSON.stringify(read.body.results) }).where(where);
    forgetKept();
    forgetEncodedTexts();
  });

  it('recomputes results kept under another engine version once, and drops the stale row', async () => {
    const read = await owner.get(path());
    await t.database.db
      .update(scenarioResultsTable)
      .set({ engineKey: resultsCacheKey(ENGINE_VERSION + 1), summary: '{"stale":true}' })
      .where(and(eq(scenarioResultsTable.scenarioId, scenarioId), eq(scenarioResultsTable.version, read.body.version)));
    forgetKept();
    forgetEncodedTexts();
    const before = keptEvaluationCount();
    const again = await owner.get(path());
    expect(again.status).toBe(200);
    expect(again.body.results).toEqual(read.body.results);
    expect(keptEvaluationCount()).toBe(before + 1);
    await owner.get(path()).expect(200);
    expect(keptEvaluationCount()).toBe(before + 1);
    const rows = (await keptRows(scenarioId)).filter((r) => r.version === read.body.version);
    expect(rows).toEqual([{ version: read.body.version, engineKey: resultsCacheKey() }]);
  });

  it('remakes a list summary made under an older rule or engine once, from the kept results', async () => {
    // A row saved before the summary carried its engine key, naming the current option as the
    // best (the old rule): the list must show the best candidate by the NPV of its change.
    const read = await owner.get(path());
    const stale = { optionCount: 1, best: { optionId: 'old', name: 'Named by the old rule', npv: 1 } };
    await t.database.db.update(scenariosTable).set({ summary: stale }).where(eq(scenariosTable.id, scenarioId));
    const expected = evaluateScenario(read.body.scenario as Scenario).options
      .filter((o) => o.incremental !== null)
      .sort((a, b) => b.incremental!.npv - a.incremental!.npv)[0]!;
    const listed = async () => ((await owner.get(`/api/farms/${farmId}/scenarios`)).body as { id: number; optionCount: number; best: { optionId: string; npv: number } }[]).find((s) => s.id === scenarioId)!;
    const first = await listed();
    expect(first.optionCount).toBe((read.body.scenario as Scenario).options.length);
    expect(first.best.optionId).toBe(expected.id);
    expect(first.best.npv).toBeCloseTo(expected.incremental!.npv, 2);
    const [row] = await t.database.db.select({ summary: scenariosTable.summary }).from(scenariosTable).where(eq(scenariosTable.id, scenarioId));
    const written = (typeof row!.summary === 'string' ? JSON.parse(row!.summary) : row!.summary) as { engineKey: string; best: { optionId: string } };
    expect(written.engineKey).toBe(resultsCacheKey());
    expect(written.best.optionId).toBe(expected.id);
    expect(await listed()).toEqual(first);
  });

  it('answers 304 to a read that names the ETag it already has', async () => {
    const first = await owner.get(path());
    expect(first.headers.etag).toBeTruthy();
    expect((await owner.get(path()).set('If-None-Match', first.headers.etag as string)).status).toBe(304);
  });

  it('compresses the answer with gzip or brotli when the client accepts it, and not otherwise', async () => {
    const plain = await request(t.app).get(path()).set('Cookie', await cookieOf('owner@byrecast.test')).set('Accept-Encoding', 'identity');
    expect(plain.status).toBe(200);
    expect(plain.headers['content-encoding']).toBeUndefined();
    for (const encoding of ['gzip', 'br']) {
      const res = await owner.get(path()).set('Accept-Encoding', encoding);
      expect(res.status).toBe(200);
      expect(res.headers['content-encoding']).toBe(encoding);
      expect(res.body).toEqual(plain.body);
    }
  });

  it('leaves the yearly lines and loan payments out of the read, and the detail route gives them back whole', async () => {
    const read = await owner.get(path());
    const summary = read.body.results as ScenarioResultsSummary;
    expect(summary.options.every((o) => !('years' in o) && !('payments' in o.loan))).toBe(true);
    const detail = await owner.get(`${path()}/results/detail`);
    expect(detail.status).toBe(200);
    expect(detail.body.version).toBe(read.body.version);
    const joined = summary.options.map((o) => joinOption(o, (detail.body.options as OptionDetail[]).find((d) => d.id === o.id)!));
    // The summary and the detail together are the whole evaluation of the same document.
    expect(joined).toEqual(asJson(evaluateScenario(read.body.scenario as Scenario).options));
  });

  it('keeps a saved version\'s document once per copy from the head row, and its yearly lines at the first read that misses them', async () => {
    const seen = await owner.get(path());
    const edited = structuredClone(seen.body.scenario as Scenario);
    edited.finance.interestRate = 0.066;
    const saved = await owner.put(path()).send({ version: seen.body.version, scenario: edited });
    expect(saved.status).toBe(200);
    const version = saved.body.version as number;
    const where = and(eq(scenarioResultsTable.scenarioId, scenarioId), eq(scenarioResultsTable.version, version));
    const keptRow = async () => (await t.database.db.select({ document: scenarioResultsTable.document, detail: scenarioResultsTable.detail }).from(scenarioResultsTable).where(where))[0]!;
    // The save keeps the summary and the document (copied in the database from the scenario row, so
    // it is the version row's document too); the detail is left for its first read.
    expect(JSON.parse((await keptRow()).document)).toEqual(saved.body.scenario);
    expect((await owner.get(`${path()}/versions/${version}`)).body.scenario).toEqual(saved.body.scenario);
    expect((await keptRow()).detail).toBeNull();

    // While this process remembers the save, the detail read evaluates nothing.
    const before = keptEvaluationCount();
    const remembered = await owner.get(`${path()}/results/detail`);
    expect(remembered.status).toBe(200);
    expect(keptEvaluationCount()).toBe(before);

    // After a restart (nothing remembered) the first detail read evaluates once and keeps it.
    forgetKept();
    forgetEncodedTexts();
    const first = await owner.get(`${path()}/results/detail`);
    expect(first.status).toBe(200);
    expect(first.body).toEqual(remembered.body);
    expect(keptEvaluationCount()).toBe(before + 1);
    expect(JSON.parse((await keptRow()).detail!)).toEqual(first.body.options);
    forgetKept();
    forgetEncodedTexts();
    expect((await owner.get(`${path()}/results/detail`)).body).toEqual(first.body);
    expect(keptEvaluationCount()).toBe(before + 1);
  });

  it('answers the detail of a past version, and 404 for a version that does not exist', async () => {
    const v1 = await owner.get(`${path()}/results/detail?version=1`);
    expect(v1.status).toBe(200);
    expect(v1.body.version).toBe(1);
    expect((await owner.get(`${path()}/results/detail?version=99`)).status).toBe(404);
    const bad = await owner.get(`${path()}/results/detail?version=x`);
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields ?? {})).toContain('version');
  });

  it('answers 404 for another farm\'s scenario and 401 without sign-in on the detail route', async () => {
    expect((await owner.get(`${path(otherScenarioId)}/results/detail`)).status).toBe(404);
    expect((await owner.get(`${path(otherScenarioId, otherFarmId)}/results/detail`)).status).toBe(404);
    expect((await request(t.app).get(`${path()}/results/detail`)).status).toBe(401);
  });

  it('gives a lender the detail of the shared version only', async () => {
    expect((await lender.get(`${path()}/results/detail`)).status).toBe(404);
    const shared = await lender.get(`${path(sharedId)}/results/detail`);
    expect(shared.status).toBe(200);
    expect(shared.body.version).toBe(1);
    const seen = await owner.get(path(sharedId));
    const edited = structuredClone(seen.body.scenario as Scenario);
    edited.finance.interestRate = 0.071;
    await owner.put(path(sharedId)).send({ version: seen.body.version, scenario: edited }).expect(200);
    expect((await lender.get(`${path(sharedId)}/results/detail?version=${seen.body.version + 1}`)).status).toBe(404);
    expect((await lender.get(`${path(sharedId)}/results/detail`)).body.version).toBe(1);
  });

  async function cookieOf(email: string): Promise<string> {
    const res = await request(t.app).post('/api/auth/sign-in').send({ email, password: 'byrecast-demo' });
    return (res.headers['set-cookie'] as unknown as string[]).map((c) => c.split(';')[0]).join('; ');
  }
});
