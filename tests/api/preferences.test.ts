import { readFileSync } from 'node:fs';
import { eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { riskResultsTable } from '../../server/db/schema/index.js';
import { riskInputsHash } from '../../server/services/risk-inputs-hash.js';
import { ENGINE_VERSION } from '../../shared/engine/version.js';
import { scenarioSchema } from '../../shared/schema/index.js';
import { createTestApp, type TestApp } from '../helpers/app.js';

const PASSWORD = 'byrecast-demo';
const demoScenario = JSON.parse(readFileSync(new URL('../../scenarios/cairnbrook-five-systems.json', import.meta.url), 'utf8')) as unknown;

async function signedIn(t: TestApp, email: string) {
  const agent = request.agent(t.app);
  const res = await agent.post('/api/auth/sign-in').send({ email, password: PASSWORD });
  expect(res.status).toBe(200);
  return agent;
}

/** A small Monte Carlo result in the shape the shared core returns. */
function riskResult(optionIds: string[]) {
  return {
    seed: 7,
    drawsRequested: 100,
    drawsDone: 100,
    cancelled: false,
    coverageThreshold: 1.25,
    options: optionIds.map((optionId) => ({ optionId, npv: { mean: 1, p10: 0, p50: 1, p90: 2, histogram: [], probabilityNegative: 0.1 } })),
  };
}

describe('preferences, decisions and the saved risk result', () => {
  let t: TestApp;
  let farmId: number;
  let scenarioId: number;
  let version: number;
  let base: string;

  beforeAll(async () => {
    t = await createTestApp({ seedDemo: true });
    const owner = await signedIn(t, 'owner@byrecast.test');
    const farms = await owner.get('/api/farms');
    farmId = farms.body[0].id;
    const created = await owner.post(`/api/farms/${farmId}/scenarios`).send({ scenario: demoScenario });
    expect(created.status).toBe(201);
    scenarioId = created.body.id;
    version = created.body.version;
    base = `/api/farms/${farmId}/scenarios/${scenarioId}`;
  });
  afterAll(async () => {
    await t?.close();
  });

  it('records a partner preference with a reason and lists it with their name and role', async () => {
    const partner = await signedIn(t, 'partner@byrecast.test');
    const res = await partner.put(`${base}/preferences/me`).send({ optionId: 'sand-freestall', reason: 'Cows lie longest on sand' });
    expect(res.status).toBe(200);
    expect(res.body.preferences).toEqual([
      expect.objectContaining({ name: 'Ivo Holt', role: 'partner', optionId: 'sand-freestall', reason: 'Cows lie longest on sand' }),
    ]);
  });

  it('replaces a preference rather than adding a second one for the same person', async () => {
    const partner = await signedIn(t, 'partner@byrecast.test');
    await partner.put(`${base}/preferences/me`).send({ optionId: 'mattress-freestall', reason: 'Less sand in the slurry' });
    const res = await partner.get(`${base}/preferences`);
    expect(res.status).toBe(200);
    const mine = res.body.preferences.filter((p: { name: string }) => p.name === 'Ivo Holt');
    expect(mine).toHaveLength(1);
    expect(mine[0].optionId).toBe('mattress-freestall');
  });

  it('refuses a preference for an option the scenario does not have, naming the field', async () => {
    const partner = await signedIn(t, 'partner@byrecast.test');
    const res = await partner.put(`${base}/preferences/me`).send({ optionId: 'no-such-option' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.optionId).toContain('no-such-option');
  });

  it('refuses a reason longer than 500 characters', async () => {
    const partner = await signedIn(t, 'partner@byrecast.test');
    const res = await partner.put(`${base}/preferences/me`).send({ optionId: 'grazing', reason: 'x'.repeat(501) });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.reason).toMatch(/500/);
  });

  it('does not let a lender record a preference', async () => {
    const lender = await signedIn(t, 'lender@byrecast.test');
    const res = await lender.put(`${base}/preferences/me`).send({ optionId: 'grazing' });
    expect(res.status).toBe(403);
  });

  it('lets only the owner mark the scenario decided, and records who and when', async () => {
    const partner = await signedIn(t, 'partner@byrecast.test');
    expect((await partner.post(`${base}/decision`).send({ optionId: 'sand-freestall' })).status).toBe(403);

    const owner = await signedIn(t, 'owner@byrecast.test');
    const before = Date.now();
    const res = await owner.post(`${base}/decision`).send({ optionId: 'sand-freestall', note: 'Agreed at the kitchen table' });
    expect(res.status).toBe(201);
    expect(res.body.decision).toEqual(
      expect.objectContaining({ optionId: 'sand-freestall', optionName: 'Sand-bedded freestall', note: 'Agreed at the kitchen table', decidedBy: expect.objectContaining({ name: 'Maren Holt' }) }),
    );
    expect(new Date(res.body.decision.decidedAt).getTime()).toBeGreaterThanOrEqual(before - 1000);

    const scenario = await owner.get(base);
    expect(scenario.body.meta.status).toBe('decided');
  });

  it('keeps earlier decisions when the owner changes the decision', async () => {
    const owner = await signedIn(t, 'owner@byrecast.test');
    const res = await owner.post(`${base}/decision`).send({ optionId: 'mattress-freestall' });
    expect(res.status).toBe(201);
    expect(res.body.decision.optionId).toBe('mattress-freestall');
    expect(res.body.earlierDecisions.map((d: { optionId: string }) => d.optionId)).toContain('sand-freestall');
  });

  it('answers 404 for a scenario of a farm the caller is not on', async () => {
    const owner = await signedIn(t, 'owner@byrecast.test');
    const res = await owner.get(`/api/farms/${farmId + 999}/scenarios/${scenarioId}/preferences`);
    expect(res.status).toBe(404);
  });

  it('answers "no saved risk result yet" as 200 with null, not as an error', async () => {
    const owner = await signedIn(t, 'owner@byrecast.test');
    const res = await owner.get(`${base}/risk-result`);
    expect(res.status).toBe(200);
    expect(res.body).toBeNull();
  });

  it('keeps a Monte Carlo result with the hash of the scenario it was run on, fresh until the scenario changes', async () => {
    const owner = await signedIn(t, 'owner@byrecast.test');
    const ids = ['grazing', 'steel-freestall', 'flexible-freestall', 'mattress-freestall', 'sand-freestall'];
    const put = await owner.put(`${base}/risk-result`).send({ scenarioVersion: version, result: riskResult(ids) });
    expect(put.status).toBe(200);
    expect(put.body.fresh).toBe(true);
    // The hash is SHA-256 of the canonical inputs (FIPS 180-4 digest, 64 hex characters).
    expect(put.body.inputsHash).toBe(riskInputsHash(scenarioSchema.parse(demoScenario)));
    expect(put.body.result.options).toHaveLength(5);

    const current = await owner.get(base);
    const changed = structuredClone(current.body.scenario);
    changed.herd.milkPricePerKg = changed.herd.milkPricePerKg + 0.01;
    const saved = await owner.put(base).send({ version: current.body.version, scenario: changed });
    expect(saved.status).toBe(200);

    const after = await owner.get(`${base}/risk-result`);
    expect(after.status).toBe(200);
    expect(after.body.fresh).toBe(false);
    version = saved.body.version;
  });

  it('reads a result kept under an earlier engine as out of date', async () => {
    // A new engine version moves Monte Carlo figures (how draws are seeded, the model): the same
    // scenario run now would not give the kept numbers (shared/engine/version.ts).
    const owner = await signedIn(t, 'owner@byrecast.test');
    const put = await owner.put(`${base}/risk-result`).send({ scenarioVersion: version, result: riskResult(['grazing']) });
    expect(put.body.fresh).toBe(true);
    const current = await owner.get(base);
    const kept = scenarioSchema.parse(current.body.scenario);
    expect(riskInputsHash(kept)).toBe(put.body.inputsHash);
    const earlier = riskInputsHash(kept, ENGINE_VERSION - 1);
    expect(earlier).not.toBe(put.body.inputsHash);
    await t.database.db.update(riskResultsTable).set({ inputsHash: earlier }).where(eq(riskResultsTable.scenarioId, scenarioId));
    const after = await owner.get(`${base}/risk-result`);
    expect(after.body.fresh).toBe(false);
  });

  it('refuses to keep a result run on an older version of the scenario', async () => {
    const owner = await signedIn(t, 'owner@byrecast.test');
    const res = await owner.put(`${base}/risk-result`).send({ scenarioVersion: version - 1, result: riskResult(['grazing']) });
    expect(res.status).toBe(409);
  });

  it('refuses a result with a missing field, naming it', async () => {
    const owner = await signedIn(t, 'owner@byrecast.test');
    const broken = { ...riskResult(['grazing']), drawsDone: 'many' };
    const res = await owner.put(`${base}/risk-result`).send({ scenarioVersion: version, result: broken });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toContain('result.drawsDone');
  });

  it('lets a lender without a share see nothing of the scenario', async () => {
    const lender = await signedIn(t, 'lender@byrecast.test');
    expect((await lender.get(`${base}/risk-result`)).status).toBe(404);
    // Preferences are the family's own: a lender never reads them (permission table).
    expect((await lender.get(`${base}/preferences`)).status).toBe(403);
  });
});

describe('the saved risk result as a lender reads it', () => {
  let t: TestApp;
  let base: string;

  beforeAll(async () => {
    t = await createTestApp({ seedDemo: true });
    const lender = await signedIn(t, 'lender@byrecast.test');
    const farms = await lender.get('/api/farms');
    const farmId = farms.body[0].id as number;
    const mine = (await lender.get(`/api/farms/${farmId}/lender-shares/mine`)).body as { scenarioId: number }[];
    base = `/api/farms/${farmId}/scenarios/${mine[0]!.scenarioId}`;
  });
  afterAll(async () => {
    await t?.close();
  });

  it('shows the lender the run kept on the shared version, and withholds a run on a later save they were not shared', async () => {
    // docs/product.md (Lender package): the lender sees only what is shared — one version of one scenario.
    const owner = await signedIn(t, 'owner@byrecast.test');
    const lender = await signedIn(t, 'lender@byrecast.test');
    const shared = await lender.get(base);
    const current = await owner.get(base);
    expect(current.body.version).toBe(shared.body.version);
    const ids = (current.body.scenario.options as { id: string }[]).map((o) => o.id);
    expect((await owner.put(`${base}/risk-result`).send({ scenarioVersion: current.body.version, result: riskResult(ids) })).status).toBe(200);

    const seen = await lender.get(`${base}/risk-result`);
    expect(seen.status).toBe(200);
    expect(seen.body.fresh).toBe(true);
    expect(seen.body.scenarioVersion).toBe(shared.body.version);

    // The farm saves a change and keeps a run on it: that run belongs to a version the lender was not shared.
    const changed = structuredClone(current.body.scenario);
    changed.herd.milkPricePerKg = changed.herd.milkPricePerKg - 0.02;
    const saved = await owner.put(base).send({ version: current.body.version, scenario: changed });
    expect(saved.status).toBe(200);
    expect((await owner.put(`${base}/risk-result`).send({ scenarioVersion: saved.body.version, result: { ...riskResult(ids), seed: 99 } })).status).toBe(200);

    expect((await owner.get(`${base}/risk-result`)).body.fresh).toBe(true);
    const after = await lender.get(`${base}/risk-result`);
    expect(after.status).toBe(200);
    expect(after.body).toBeNull();
    // The lender still reads the version shared with them.
    expect((await lender.get(base)).body.version).toBe(shared.body.version);
  });
});
