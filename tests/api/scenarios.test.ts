/**
 * The scenario API on a real MariaDB: the demo scenarios, create → edit → save → versions →
 * compare → restore, option operations, optimistic locking, server results against the engine
 * run here, and export. Expected behaviour comes from docs/product.md (Scenarios and versions) unless a check names another source.
 */
import { execFile } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { promisify } from 'node:util';
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { evaluateScenario } from '../../shared/engine/evaluate.js';
import { splitResults } from '../../shared/engine/result-parts.js';
import type { ScenarioResults } from '../../shared/engine/results.js';

const summaryOf = (scenario: Scenario) => splitResults(evaluateScenario(scenario)).summary;
import { addOption, deleteOption, duplicateOption, markCurrent, reorderOptions } from '../../shared/option-operations.js';
import { scenarioSchema, type Scenario } from '../../shared/schema/index.js';
import { eq } from 'drizzle-orm';
import { scenarioResultsTable, scenariosTable, scenarioVersionsTable } from '../../server/db/schema/index.js';
import { forgetEncodedTexts } from '../../server/http/json-text.js';
import { forgetRememberedResults as forgetKept } from '../../server/services/scenario-results.js';
import { createTestApp, type TestApp } from '../helpers/app.js';
import { asJson, demoScenarioFile, farmIdByName, signedIn } from '../helpers/scenarios.js';

const run = promisify(execFile);

describe('scenario API', () => {
  let t: TestApp;
  let owner: request.Agent;
  let partner: request.Agent;
  let farmId: number;
  let base: string;

  beforeAll(async () => {
    t = await createTestApp({ seedDemo: true });
    owner = await signedIn(t, 'owner@byrecast.test');
    partner = await signedIn(t, 'partner@byrecast.test');
    farmId = await farmIdByName(owner, 'Cairnbrook Farm');
    base = `/api/farms/${farmId}`;
  });
  afterAll(async () => {
    await t.close();
  });

  /** Creates a scenario from the farm baseline and returns its id and the GET shape. */
  async function createScenario(name: string) {
    const res = await owner.post(`${base}/scenarios`).send({ name, startingPoint: 'grazing' });
    expect(res.status).toBe(201);
    return res.body as { id: number; scenario: Scenario; version: number; results: unknown };
  }

  describe('demo farm', () => {
    it('lists the two demo scenarios with their option counts and best option by the NPV of its change', async () => {
      const res = await owner.get(`${base}/scenarios`);
      expect(res.status).toBe(200);
      const byName = new Map((res.body as { name: string }[]).map((s) => [s.name, s]));
      // The fixtures in scenarios/ (five starting points; mattress against sand) are what the seed loads.
      for (const [file, optionCount] of [
        ['cairnbrook-five-systems.json', 5],
        ['cairnbrook-mattress-or-sand.json', 2],
      ] as const) {
        const fixture = demoScenarioFile(file);
        const results = evaluateScenario(fixture);
        // Best candidate by its change against the current option; the current option is the reference, never the pick.
        const candidates = results.options.filter((o) => !o.current);
        const change = (o: (typeof results.options)[number]) => o.incremental!.npv;
        const best = [...candidates].sort((a, b) => change(b) - change(a))[0]!;
        expect(byName.get(fixture.name)).toMatchObject({
          status: 'draft',
          version: 1,
          optionCount,
          best: { optionId: best.id, name: best.name, npv: change(best) },
          updatedBy: 'Maren Holt',
        });
      }
    });

    it('serves the farm baseline that new scenarios copy', async () => {
      const res = await owner.get(`${base}/baseline`);
      expect(res.status).toBe(200);
      // scenarios/demo-farm.json: an invented 190-cow herd in EUR, metric.
      expect(res.body).toMatchObject({ currency: 'EUR', locale: 'en-IE', units: 'metric', herd: { cows: 190, breedSize: 'large' } });
    });

    it('demo fixtures compare a grazing current option with the four freestalls, and mattress (current) with sand', () => {
      // docs/product.md (Scenarios and versions), Demo data; docs/product.md capability 3 (five starting points).
      const five = demoScenarioFile('cairnbrook-five-systems.json');
      expect(five.options.map((o) => [o.startingPoint, o.current])).toEqual([
        ['grazing', true],
        ['steel-freestall', false],
        ['flexible-freestall', false],
        ['mattress-freestall', false],
        ['sand-freestall', false],
      ]);
      const beds = demoScenarioFile('cairnbrook-mattress-or-sand.json');
      expect(beds.options.map((o) => [o.bed, o.current])).toEqual([
        ['mattress-topdressed', true],
        ['deep-sand', false],
      ]);
      // Plausible for a 150–250 cow herd (docs/product.md (Scenarios and versions), Demo data).
      for (const scenario of [five, beds]) expect(scenario.herd.cows).toBeGreaterThanOrEqual(150);
      for (const scenario of [five, beds]) expect(scenario.herd.cows).toBeLessThanOrEqual(250);
    });

    it('npm run evaluate accepts the five-systems file and prints the results the server returns', async () => {
      const list = await owner.get(`${base}/scenarios`);
      const five = (list.body as { id: number; name: string }[]).find((s) => s.name === demoScenarioFile('cairnbrook-five-systems.json').name)!;
      const { stdout } = await run('npx', ['tsx', 'server/cli/evaluate.ts', 'scenarios/cairnbrook-five-systems.json', '--json']);
      const served = await owner.get(`${base}/scenarios/${five.id}`);
      expect(served.body.results).toEqual(asJson(splitResults(JSON.parse(stdout) as ScenarioResults).summary));
    }, 60_000);
  });

  describe('create, edit, save, versions, compare, restore', () => {
    it('creates from the baseline with one current option from the starting point', async () => {
      const created = await createScenario('Roof over the collecting yard');
      expect(created.version).toBe(1);
      expect(created.scenario.name).toBe('Roof over the collecting yard');
      expect(created.scenario.herd.cows).toBe(190);
      expect(created.scenario.currency).toBe('EUR');
      expect(created.scenario.options).toHaveLength(1);
      expect(created.scenario.options[0]).toMatchObject({ startingPoint: 'grazing', current: true });
    });

    it('saves an edit as the next version; the list, the history and the comparison show it; restore brings the old figures back as a new version', async () => {
      const created = await createScenario('Milk price check');
      const edited = structuredClone(created.scenario);
      edited.herd.milkPricePerKg = 0.5;
      const saved = await partner.put(`${base}/scenarios/${created.id}`).send({ version: 1, scenario: edited, note: 'New milk contract' });
      expect(saved.status).toBe(200);
      expect(saved.body.version).toBe(2);
      expect(saved.body.scenario.herd.milkPricePerKg).toBe(0.5);
      expect(saved.body.meta.updatedBy).toBe('Ivo Holt');

      const history = await owner.get(`${base}/scenarios/${created.id}/versions`);
      expect(history.status).toBe(200);
      expect(history.body.map((v: { version: number; author: string; note: string }) => [v.version, v.author, v.note])).toEqual([
        [2, 'Ivo Holt', 'New milk contract'],
        [1, 'Maren Holt', 'Created from the farm baseline'],
      ]);

      const compared = await owner.get(`${base}/scenarios/${created.id}/versions/compare?from=1&to=2`);
      expect(compared.status).toBe(200);
      expect(compared.body.changes).toEqual([
        { path: 'herd.milkPricePerKg', kind: 'changed', from: 0.45, to: 0.5, display: { unit: 'per kg', from: 0.45, to: 0.5 } },
      ]);

      // 1 cwt = 100 lb = 45.359237 kg (NIST Handbook 44, Appendix C, from memory of a definition).
      const inUs = await owner.get(`${base}/scenarios/${created.id}/versions/compare?from=1&to=2&units=us`);
      const change = inUs.body.changes[0];
      expect(change.display.unit).toBe('per cwt');
      expect(change.display.from).toBeCloseTo(0.45 * 45.359237, 10);
      expect(change.display.to).toBeCloseTo(0.5 * 45.359237, 10);
      expect(change.from).toBe(0.45);

      const restored = await owner.post(`${base}/scenarios/${created.id}/versions/1/restore`).send({ version: 2 });
      expect(restored.status).toBe(200);
      expect(restored.body.version).toBe(3);
      expect(restored.body.scenario).toEqual(created.scenario);
      const v2 = await owner.get(`${base}/scenarios/${created.id}/versions/2`);
      expect(v2.status).toBe(200);
      expect(v2.body.scenario.herd.milkPricePerKg).toBe(0.5);
      const notes = await owner.get(`${base}/scenarios/${created.id}/versions`);
      expect(notes.body[0]).toMatchObject({ version: 3, note: 'Restored version 1', author: 'Maren Holt' });
    });

    it('reads a past version read-only with its own results', async () => {
      const created = await createScenario('Past version');
      const edited = structuredClone(created.scenario);
      edited.herd.cows = 200;
      await owner.put(`${base}/scenarios/${created.id}`).send({ version: 1, scenario: edited }).expect(200);
      const v1 = await owner.get(`${base}/scenarios/${created.id}/versions/1`);
      expect(v1.status).toBe(200);
      expect(v1.body).toMatchObject({ version: 1, author: 'Maren Holt', note: 'Created from the farm baseline' });
      expect(v1.body.scenario.herd.cows).toBe(190);
      expect(v1.body.results).toEqual(asJson(summaryOf(created.scenario)));
    });

    it('compares an added option and a reorder by option id, not position', async () => {
      const created = await createScenario('Compare options');
      const added = addOption(created.scenario, 'sand-freestall').scenario;
      const v2 = await owner.put(`${base}/scenarios/${created.id}`).send({ version: 1, scenario: added });
      const reordered = await owner.put(`${base}/scenarios/${created.id}`).send({ version: 2, scenario: reorderOptions(added, ['sand-freestall', 'grazing']) });
      expect(reordered.status).toBe(200);
      const changes = (await owner.get(`${base}/scenarios/${created.id}/versions/compare?from=2&to=3`)).body.changes;
      expect(changes).toEqual([{ path: 'options', kind: 'reordered', from: ['grazing', 'sand-freestall'], to: ['sand-freestall', 'grazing'], display: null }]);
      const addition = (await owner.get(`${base}/scenarios/${created.id}/versions/compare?from=1&to=2`)).body.changes;
      expect(addition).toHaveLength(1);
      expect(addition[0]).toMatchObject({ path: 'options.1', kind: 'added', to: { id: 'sand-freestall' } });
      expect(v2.body.version).toBe(2);
    });
  });

  describe('option operations', () => {
    /** Saves `scenario` over `version` and answers the next version's body. */
    async function save(id: number, version: number, scenario: Scenario) {
      const res = await owner.put(`${base}/scenarios/${id}`).send({ version, scenario });
      expect(res.status).toBe(200);
      return res.body as { version: number; scenario: Scenario; results: { currentOptionId: string; options: { stalls: number }[] } };
    }

    it('saves each option operation of shared/option-operations.ts whole, as a new version', async () => {
      const created = await createScenario('Options');
      const id = created.id;
      const add = await save(id, 1, addOption(created.scenario, 'sand-freestall', 'Sand beds').scenario);
      expect(add.version).toBe(2);
      expect(add.scenario.options.map((o) => [o.id, o.name, o.current])).toEqual([
        ['grazing', 'Grazing with seasonal housing', true],
        ['sand-freestall', 'Sand beds', false],
      ]);
      // The option is sized for the scenario's herd: one stall per cow at a stocking rate of 1 (common practice, no source).
      expect(add.results.options[1]?.stalls).toBe(190);

      const dup = await save(id, 2, duplicateOption(add.scenario, 'sand-freestall').scenario);
      expect(dup.scenario.options.map((o) => o.id)).toEqual(['grazing', 'sand-freestall', 'sand-freestall-2']);
      // The copy's lines are the original's under the copy's id: documents attach to scenario + capital line id.
      const copiedLines = add.scenario.options[1]!.capitalLines.map((line) => ({ ...line, id: line.id.replace(/^sand-freestall\./, 'sand-freestall-2.') }));
      expect(copiedLines.every((line) => line.id.startsWith('sand-freestall-2.'))).toBe(true);
      expect(dup.scenario.options[2]).toMatchObject({ name: 'Sand beds (copy)', current: false, capitalLines: copiedLines });

      const current = await save(id, 3, markCurrent(dup.scenario, 'sand-freestall'));
      expect(current.scenario.options.filter((o) => o.current).map((o) => o.id)).toEqual(['sand-freestall']);
      expect(current.results.currentOptionId).toBe('sand-freestall');

      const removed = await save(id, 4, deleteOption(current.scenario, 'grazing'));
      expect(removed.version).toBe(5);
      expect(removed.scenario.options.map((o) => o.id)).toEqual(['sand-freestall', 'sand-freestall-2']);
      expect((await owner.get(`${base}/scenarios/${id}/versions`)).body).toHaveLength(5);
    });

    it('has no option routes beside the whole save', async () => {
      const created = await createScenario('One way');
      const s = `${base}/scenarios/${created.id}`;
      const attempts = [
        owner.post(`${s}/options`).send({ version: 1, startingPoint: 'sand-freestall' }),
        owner.post(`${s}/options/reorder`).send({ version: 1, order: ['grazing'] }),
        owner.post(`${s}/options/grazing/duplicate`).send({ version: 1 }),
        owner.post(`${s}/options/grazing/current`).send({ version: 1 }),
        owner.delete(`${s}/options/grazing?version=1`),
      ];
      for (const res of await Promise.all(attempts)) expect(res.status).toBe(404);
      expect((await owner.get(s)).body.version).toBe(1);
    });

    it('refuses a saved thirteenth option with the field path of the options list', async () => {
      const created = await createScenario('Too many');
      const twelve = structuredClone(created.scenario);
      for (let i = 0; i < 11; i++) twelve.options.push({ ...structuredClone(twelve.options[0]!), id: `copy-${i}`, current: false, capitalLines: [] });
      await save(created.id, 1, twelve);
      const thirteen = { ...twelve, options: [...twelve.options, { ...twelve.options[1]!, id: 'one-too-many' }] };
      const res = await owner.put(`${base}/scenarios/${created.id}`).send({ version: 2, scenario: thirteen });
      expect(res.status).toBe(400);
      // shared/schema/scenario.ts: a scenario holds at most 12 options.
      expect(res.body.error.fields['scenario.options']).toMatch(/at most 12/);
      expect((await owner.get(`${base}/scenarios/${created.id}`)).body.version).toBe(2);
    });
  });

  describe('documents saved before a field existed', () => {
    it('reads and evaluates an older document, filling the fields added since with their defaults', async () => {
      const created = await createScenario('Saved long ago');
      // Strip fields the schema added later (insurance, existing housing, tax class, lying cap…)
      // from the stored version, as a document saved before them would be.
      const old = structuredClone(created.scenario) as unknown as Record<string, unknown> & Scenario;
      const herd = old.herd as unknown as Record<string, unknown>;
      delete herd.dryDaysPerCowYear;
      delete herd.lyingResponseCapHours;
      delete herd.land;
      for (const option of old.options as unknown as Record<string, unknown>[]) {
        delete option.insuranceRate;
        delete option.existingHousingValue;
        for (const line of option.capitalLines as Record<string, unknown>[]) delete line.taxClass;
      }
      await t.database.db.update(scenarioVersionsTable).set({ document: old }).where(eq(scenarioVersionsTable.scenarioId, created.id));
      await t.database.db.update(scenariosTable).set({ document: old }).where(eq(scenariosTable.id, created.id));
      // As before results were kept: nothing kept for this version yet.
      await t.database.db.delete(scenarioResultsTable).where(eq(scenarioResultsTable.scenarioId, created.id));
      forgetKept();
    forgetEncodedTexts();
      const read = await owner.get(`${base}/scenarios/${created.id}`);
      expect(read.status).toBe(200);
      expect(read.body.scenario.herd.dryDaysPerCowYear).toBe(60);
      expect(read.body.scenario.options[0].insuranceRate).toBe(0);
      expect(Number.isFinite(read.body.results.options[0].npv)).toBe(true);
    });
  });

  describe('optimistic locking', () => {
    it('gives the second of two saves based on the same version 409 with who saved first, and loses nothing', async () => {
      const created = await createScenario('Two editors');
      const mine = structuredClone(created.scenario);
      mine.herd.wagePerHour = 18;
      const theirs = structuredClone(created.scenario);
      const savedYield = created.scenario.herd.yieldKgPerCowDay;
      theirs.herd.yieldKgPerCowDay = savedYield + 1;

      const first = await partner.put(`${base}/scenarios/${created.id}`).send({ version: 1, scenario: mine });
      expect(first.status).toBe(200);
      const second = await owner.put(`${base}/scenarios/${created.id}`).send({ version: 1, scenario: theirs });
      expect(second.status).toBe(409);
      expect(second.body.error.code).toBe('version_conflict');
      expect(second.body.error.latest).toMatchObject({ version: 2, updatedBy: 'Ivo Holt' });
      expect(new Date(second.body.error.latest.updatedAt).toISOString()).toBe(first.body.meta.updatedAt);

      const latest = await owner.get(`${base}/scenarios/${created.id}`);
      expect(latest.body.version).toBe(2);
      expect(latest.body.scenario.herd.wagePerHour).toBe(18);
      expect(latest.body.scenario.herd.yieldKgPerCowDay).toBe(savedYield);

      // The refused copy is kept as a new scenario, as the client offers.
      const kept = await owner.post(`${base}/scenarios`).send({ scenario: theirs, name: 'Two editors (my copy)' });
      expect(kept.status).toBe(201);
      expect(kept.body.scenario.herd.yieldKgPerCowDay).toBe(savedYield + 1);
      expect(kept.body.version).toBe(1);
    });

    it('lets exactly one of two simultaneous saves of the same version through', async () => {
      const created = await createScenario('Race');
      const a = structuredClone(created.scenario);
      a.herd.milkPricePerKg = 0.41;
      const b = structuredClone(created.scenario);
      b.herd.milkPricePerKg = 0.49;
      const answers = await Promise.all([
        owner.put(`${base}/scenarios/${created.id}`).send({ version: 1, scenario: a }),
        partner.put(`${base}/scenarios/${created.id}`).send({ version: 1, scenario: b }),
      ]);
      expect(answers.map((r) => r.status).sort()).toEqual([200, 409]);
      const winner = answers.find((r) => r.status === 200)!;
      const versions = await owner.get(`${base}/scenarios/${created.id}/versions`);
      expect(versions.body.map((v: { version: number }) => v.version)).toEqual([2, 1]);
      expect((await owner.get(`${base}/scenarios/${created.id}`)).body.scenario.herd.milkPricePerKg).toBe(winner.body.scenario.herd.milkPricePerKg);
    });

    it('refuses an option operation saved on an old version', async () => {
      const created = await createScenario('Stale option');
      const document = created.scenario;
      await owner.put(`${base}/scenarios/${created.id}`).send({ version: 1, scenario: addOption(document, 'sand-freestall').scenario }).expect(200);
      const stale = await partner.put(`${base}/scenarios/${created.id}`).send({ version: 1, scenario: addOption(document, 'steel-freestall').scenario });
      expect(stale.status).toBe(409);
      expect(stale.body.error.latest.version).toBe(2);
    });
  });

  describe('results', () => {
    it('returns the results evaluateScenario gives on the same document, so the live preview and the saved result agree', async () => {
      const fixture = demoScenarioFile('cairnbrook-mattress-or-sand.json');
      const imported = await owner.post(`${base}/scenarios`).send({ scenario: fixture });
      expect(imported.status).toBe(201);
      expect(imported.body.results).toEqual(asJson(summaryOf(scenarioSchema.parse(imported.body.scenario))));

      const edited = structuredClone(imported.body.scenario as Scenario);
      edited.options[1]!.bedding.pricePerTonne = 22;
      edited.finance.interestRate = 0.065;
      const saved = await owner.put(`${base}/scenarios/${imported.body.id}`).send({ version: 1, scenario: edited });
      expect(saved.status).toBe(200);
      const local = summaryOf(scenarioSchema.parse(edited));
      expect(saved.body.results).toEqual(asJson(local));
      // Dearer sand and a dearer loan must move the sand option's NPV (otherwise the check proves nothing).
      expect(saved.body.results.options[1].npv).not.toBe(imported.body.results.options[1].npv);
    });
  });

  describe('export, import, duplicate, archive, delete', () => {
    it('exports a JSON file that the CLI validation accepts and that evaluates to the served results', async () => {
      const list = await owner.get(`${base}/scenarios`);
      const name = demoScenarioFile('cairnbrook-five-systems.json').name;
      const id = (list.body as { id: number; name: string }[]).find((s) => s.name === name)!.id;
      const served = await owner.get(`${base}/scenarios/${id}`);
      const res = await owner.get(`${base}/scenarios/${id}/export.json`).buffer(true).parse((response, done) => {
        let text = '';
        response.on('data', (chunk: Buffer) => (text += chunk.toString('utf8')));
        response.on('end', () => done(null, text));
      });
      expect(res.status).toBe(200);
      expect(res.headers['content-type']).toMatch(/^application\/json/);
      expect(res.headers['content-disposition']).toBe('attachment; filename=stay-on-grass-or-build-five-systems-v1.json');
      const parsed = scenarioSchema.safeParse(JSON.parse(res.body as string));
      expect(parsed.success).toBe(true);
      expect(asJson(parsed.data)).toEqual(served.body.scenario);

      const dir = mkdtempSync(join(tmpdir(), 'byrecast-export-'));
      try {
        const file = join(dir, 'export.json');
        writeFileSync(file, res.body as string);
        const { stdout } = await run('npx', ['tsx', 'server/cli/evaluate.ts', file, '--json']);
        expect(asJson(splitResults(JSON.parse(stdout) as ScenarioResults).summary)).toEqual(served.body.results);
      } finally {
        rmSync(dir, { recursive: true, force: true });
      }
    }, 60_000);

    it('duplicates a scenario as a new one at version 1', async () => {
      const created = await createScenario('Original');
      const copy = await owner.post(`${base}/scenarios/${created.id}/duplicate`).send({});
      expect(copy.status).toBe(201);
      expect(copy.body.id).not.toBe(created.id);
      expect(copy.body.version).toBe(1);
      expect(copy.body.scenario).toEqual({ ...created.scenario, name: 'Original (copy)' });
      const named = await owner.post(`${base}/scenarios/${created.id}/duplicate`).send({ name: 'Second copy' });
      expect(named.body.meta.name).toBe('Second copy');
    });

    it('archives a scenario (kept, with its versions) and deletes one with its versions', async () => {
      const created = await createScenario('To archive');
      const archived = await owner.post(`${base}/scenarios/${created.id}/archive`).send({});
      expect(archived.status).toBe(200);
      expect(archived.body).toEqual({ id: created.id, status: 'archived' });
      const read = await owner.get(`${base}/scenarios/${created.id}`);
      expect(read.body.meta.status).toBe('archived');
      const listed = (await owner.get(`${base}/scenarios`)).body.find((s: { id: number }) => s.id === created.id);
      expect(listed.status).toBe('archived');

      const doomed = await createScenario('To delete');
      expect((await owner.delete(`${base}/scenarios/${doomed.id}`)).status).toBe(204);
      expect((await owner.get(`${base}/scenarios/${doomed.id}`)).status).toBe(404);
      expect((await owner.get(`${base}/scenarios/${doomed.id}/versions/1`)).status).toBe(404);
      const [rows] = await t.database.pool.query('SELECT COUNT(*) AS n FROM scenario_versions WHERE scenario_id = ?', [doomed.id]);
      expect((rows as { n: number }[])[0]!.n).toBe(0);
    });

    it('updates the baseline; existing scenarios keep their own herd', async () => {
      const before = await createScenario('Before the baseline change');
      const baseline = (await owner.get(`${base}/baseline`)).body;
      const res = await owner.put(`${base}/baseline`).send({ ...baseline, units: 'us', herd: { ...baseline.herd, cows: 205 } });
      expect(res.status).toBe(200);
      expect(res.body.units).toBe('us');
      expect(res.body.herd.cows).toBe(205);
      expect((await owner.get(`${base}/scenarios/${before.id}`)).body.scenario.herd.cows).toBe(190);
      const after = await createScenario('After the baseline change');
      expect(after.scenario.herd.cows).toBe(205);
      expect(after.scenario.units).toBe('us');
      await owner.put(`${base}/baseline`).send(baseline).expect(200);
    });
  });
});
