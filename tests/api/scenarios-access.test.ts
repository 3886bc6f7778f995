/**
 * Who may reach which scenario, and bad input on every baseline and scenario route. Expected
 * behaviour comes from docs/product.md (Scenarios and versions) (a partner can edit, a lender cannot until shared;
 * another farm's scenario is never reachable by id; every route refuses bad input with a field
 * path) and docs/product.md's role table.
 */
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { farmRouteRegistry } from '../../server/auth/middleware.js';
import type { Scenario } from '../../shared/schema/index.js';
import { createTestApp, type TestApp } from '../helpers/app.js';
import { demoScenarioFile, farmIdByName, signedIn } from '../helpers/scenarios.js';

type Method = 'get' | 'post' | 'put' | 'delete';

describe('scenario access and input checks', () => {
  let t: TestApp;
  let owner: request.Agent;
  let partner: request.Agent;
  let consultant: request.Agent;
  let lender: request.Agent;
  let farmId: number;
  let scenarioId: number;
  let otherFarmId: number;
  let otherScenarioId: number;

  beforeAll(async () => {
    t = await createTestApp({ seedDemo: true });
    owner = await signedIn(t, 'owner@byrecast.test');
    partner = await signedIn(t, 'partner@byrecast.test');
    consultant = await signedIn(t, 'consultant@byrecast.test');
    lender = await signedIn(t, 'lender@byrecast.test');
    farmId = await farmIdByName(owner, 'Cairnbrook Farm');
    const list = await owner.get(`/api/farms/${farmId}/scenarios`);
    // The demo shares the five-systems scenario with the lender, not this one.
    scenarioId = (list.body as { id: number; name: string }[]).find((s) => s.name.includes('mattress or sand'))!.id;

    // A second farm, owned by the consultant, who is thus a member of both farms.
    const farm = await consultant.post('/api/farms').send({ name: 'Hollin Ridge (invented)', currency: 'GBP', locale: 'en-GB' });
    expect(farm.status).toBe(201);
    otherFarmId = farm.body.id;
    const imported = await consultant
      .post(`/api/farms/${otherFarmId}/scenarios`)
      .send({ scenario: demoScenarioFile('cairnbrook-mattress-or-sand.json'), name: 'Hollin Ridge barn' });
    expect(imported.status).toBe(201);
    otherScenarioId = imported.body.id;
  });
  afterAll(async () => {
    await t.close();
  });

  const scenarioPath = (id: number, farm = farmId) => `/api/farms/${farm}/scenarios/${id}`;

  async function latest(agent: request.Agent, id = scenarioId): Promise<{ version: number; scenario: Scenario }> {
    const res = await agent.get(scenarioPath(id));
    expect(res.status).toBe(200);
    return res.body;
  }

  describe('roles', () => {
    it('lets a partner and a consultant edit and save', async () => {
      for (const agent of [partner, consultant]) {
        const { version, scenario } = await latest(agent);
        scenario.herd.wagePerHour += 1;
        const res = await agent.put(scenarioPath(scenarioId)).send({ version, scenario });
        expect(res.status).toBe(200);
        expect(res.body.version).toBe(version + 1);
      }
    });

    it('shows a lender no scenario that is not shared with them, and refuses their writes', async () => {
      // docs/product.md: a loan officer is read-only on the scenarios shared with them, and nothing else.
      const list = await lender.get(`/api/farms/${farmId}/scenarios`);
      expect(list.status).toBe(200);
      expect((list.body as { id: number }[]).map((s) => s.id)).not.toContain(scenarioId);
      for (const path of ['', '/versions', '/versions/1', '/versions/compare?from=1&to=1', '/export.json']) {
        const res = await lender.get(`${scenarioPath(scenarioId)}${path}`);
        expect(res.status, path).toBe(404);
      }
      const { version, scenario } = await latest(owner);
      const writes: [Method, string, object][] = [
        ['put', scenarioPath(scenarioId), { version, scenario }],
        ['post', `/api/farms/${farmId}/scenarios`, { name: 'Lender scenario' }],
        ['post', `${scenarioPath(scenarioId)}/duplicate`, {}],
        ['post', `${scenarioPath(scenarioId)}/archive`, {}],
        ['post', `${scenarioPath(scenarioId)}/versions/1/restore`, {}],
        ['delete', scenarioPath(scenarioId), {}],
        ['put', `/api/farms/${farmId}/baseline`, {}],
      ];
      for (const [method, path, body] of writes) {
        const res = await lender[method](path).send(body);
        expect(res.status, `${method} ${path}`).toBe(403);
      }
      expect((await latest(owner)).version).toBe(version);
    });

    it('shows a lender neither the farm baseline nor its milk records, only the farm name', async () => {
      expect((await lender.get(`/api/farms/${farmId}/baseline`)).status).toBe(403);
      expect((await lender.get(`/api/farms/${farmId}/milk-records`)).status).toBe(403);
      const farm = await lender.get(`/api/farms/${farmId}`);
      expect(farm.status).toBe(200);
      expect(farm.body.name).toBe('Cairnbrook Farm');
      expect(farm.body.baseline).toBeNull();
    });
  });

  describe('another farm', () => {
    it('never reaches another farm’s scenario through this farm’s path, even for a member of both farms', async () => {
      const { version, scenario } = await latest(consultant, scenarioId);
      const paths: [Method, string, object?][] = [
        ['get', ''],
        ['put', '', { version, scenario }],
        ['delete', ''],
        ['post', '/duplicate', {}],
        ['post', '/archive', {}],
        ['get', '/export.json'],
        ['get', '/results/detail'],
        ['get', '/versions'],
        ['get', '/versions/1'],
        ['get', '/versions/compare?from=1&to=1'],
        ['post', '/versions/1/restore', {}],
      ];
      for (const [method, suffix, body] of paths) {
        const res = await consultant[method](`${scenarioPath(otherScenarioId, farmId)}${suffix}`).send(body);
        expect(res.status, `${method} ${suffix}`).toBe(404);
      }
      // Untouched: still version 1 on its own farm.
      const own = await consultant.get(scenarioPath(otherScenarioId, otherFarmId));
      expect(own.status).toBe(200);
      expect(own.body.version).toBe(1);
    });

    it('answers 404 to a non-member for the other farm and its scenario', async () => {
      expect((await owner.get(`/api/farms/${otherFarmId}/scenarios`)).status).toBe(404);
      expect((await owner.get(scenarioPath(otherScenarioId, otherFarmId))).status).toBe(404);
      expect((await owner.get(`/api/farms/${otherFarmId}/baseline`)).status).toBe(404);
    });

    it('keeps each farm’s list to its own scenarios', async () => {
      const mine = (await consultant.get(`/api/farms/${otherFarmId}/scenarios`)).body as { id: number }[];
      expect(mine.map((s) => s.id)).toEqual([otherScenarioId]);
      const cairnbrook = (await consultant.get(`/api/farms/${farmId}/scenarios`)).body as { id: number }[];
      expect(cairnbrook.map((s) => s.id)).not.toContain(otherScenarioId);
    });

    it('refuses to create from a baseline the farm has not set', async () => {
      const res = await consultant.post(`/api/farms/${otherFarmId}/scenarios`).send({ name: 'No baseline yet' });
      expect(res.status).toBe(409);
      expect(res.body.error.code).toBe('baseline_missing');
    });
  });

  describe('bad input', () => {
    /** One bad request per route: the field path the 400 must name. */
    async function badInputCases(): Promise<{ route: string; method: Method; path: string; body?: unknown; field: string }[]> {
      const { version, scenario } = await latest(owner);
      const baseline = (await owner.get(`/api/farms/${farmId}/baseline`)).body;
      const s = scenarioPath(scenarioId);
      const tooLong = structuredClone(scenario);
      tooLong.options[0]!.lyingHoursPerDay = 25;
      const badRate = structuredClone(scenario);
      badRate.finance.interestRate = 3;
      return [
        { route: 'put /baseline', method: 'put', path: `/api/farms/${farmId}/baseline`, body: { ...baseline, herd: { ...baseline.herd, cows: -5 } }, field: 'herd.cows' },
        { route: 'post /scenarios', method: 'post', path: `/api/farms/${farmId}/scenarios`, body: { name: '', startingPoint: 'grazing' }, field: 'name' },
        { route: 'post /scenarios', method: 'post', path: `/api/farms/${farmId}/scenarios`, body: { scenario: badRate }, field: 'scenario.finance.interestRate' },
        { route: 'get /scenarios/:scenarioId', method: 'get', path: `/api/farms/${farmId}/scenarios/abc`, field: 'scenarioId' },
        { route: 'put /scenarios/:scenarioId', method: 'put', path: s, body: { version, scenario: tooLong }, field: 'scenario.options.0.lyingHoursPerDay' },
        { route: 'put /scenarios/:scenarioId', method: 'put', path: s, body: { version: 'latest', scenario }, field: 'version' },
        { route: 'delete /scenarios/:scenarioId', method: 'delete', path: `/api/farms/${farmId}/scenarios/0`, field: 'scenarioId' },
        { route: 'post /scenarios/:scenarioId/duplicate', method: 'post', path: `${s}/duplicate`, body: { name: '' }, field: 'name' },
        { route: 'post /scenarios/:scenarioId/archive', method: 'post', path: `/api/farms/${farmId}/scenarios/1.5/archive`, body: {}, field: 'scenarioId' },
        { route: 'get /scenarios/:scenarioId/export.json', method: 'get', path: `/api/farms/${farmId}/scenarios/x/export.json`, field: 'scenarioId' },
        { route: 'get /scenarios/:scenarioId/versions', method: 'get', path: `/api/farms/${farmId}/scenarios/-1/versions`, field: 'scenarioId' },
        { route: 'get /scenarios/:scenarioId/versions/compare', method: 'get', path: `${s}/versions/compare?from=one&to=2`, field: 'from' },
        { route: 'get /scenarios/:scenarioId/versions/compare', method: 'get', path: `${s}/versions/compare?from=1&to=2&units=imperial`, field: 'units' },
        { route: 'get /scenarios/:scenarioId/versions/:version', method: 'get', path: `${s}/versions/first`, field: 'version' },
        { route: 'post /scenarios/:scenarioId/versions/:version/restore', method: 'post', path: `${s}/versions/1/restore`, body: { version: 'x' }, field: 'version' },
      ];
    }

    it('refuses bad input on every route with 400 and the field path, and changes nothing', async () => {
      const before = await latest(owner);
      for (const c of await badInputCases()) {
        const req = owner[c.method](c.path);
        const res = c.body === undefined ? await req : await req.send(c.body as object);
        expect(res.status, `${c.method} ${c.path}`).toBe(400);
        expect(res.body.error.code).toBe('invalid_input');
        expect(Object.keys(res.body.error.fields), `${c.method} ${c.path}`).toContain(c.field);
        expect(res.body.error.message).toContain(c.field);
      }
      expect((await latest(owner)).version).toBe(before.version);
    });

    it('has a bad-input case for every baseline and scenario route that takes input', async () => {
      const covered = new Set((await badInputCases()).map((c) => c.route));
      const prefix = '/api/farms/:farmId';
      // This routes; other areas (preferences, reviews, documents) hang their own under /scenarios/:scenarioId.
      const ours = /^\/(baseline|scenarios(\/:scenarioId(\/(duplicate|archive|export\.json|versions.*))?)?)$/;
      // GET /baseline and GET /scenarios take no input beyond the farm id, which the authorization layer checks.
      const withoutInput = new Set(['get /baseline', 'get /scenarios']);
      const routes = farmRouteRegistry
        .map((r) => `${r.method} ${r.path.slice(prefix.length)}`)
        .filter((route) => ours.test(route.split(' ')[1]!) && !withoutInput.has(route));
      expect(routes.length).toBeGreaterThan(10);
      for (const route of routes) expect(covered, route).toContain(route);
    });

    it('names the field of a missing body', async () => {
      const res = await owner.put(scenarioPath(scenarioId)).set('content-type', 'application/json').send('{}');
      expect(res.status).toBe(400);
      expect(Object.keys(res.body.error.fields).sort()).toEqual(['scenario', 'version']);
    });
  });
});
