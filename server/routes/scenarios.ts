/** /api/farms/:farmId/baseline and /api/farms/:farmId/scenarios/…: parse → service → respond. */
import type { Request } from 'express';
import {
  baselineBodySchema,
  compareQuerySchema,
  createScenarioBodySchema,
  duplicateScenarioBodySchema,
  importScenarioBodySchema,
  restoreVersionBodySchema,
  resultsDetailQuerySchema,
  saveScenarioBodySchema,
} from '../../shared/schema/requests.js';
import type { AppDeps } from '../app.js';
import { sendJsonText } from '../http/json-text.js';
import { actorOf, idParam } from '../http/params.js';
import { farmAccess, sessionScenarioHead, type FarmRoute } from '../auth/middleware.js';
import { parseOrThrow } from '../errors.js';
import { readBaseline, saveBaseline } from '../services/farm-baseline.js';
import * as scenarios from '../services/scenarios.js';

const scenarioIdOf = (req: Request) => idParam(req, 'scenarioId', 'Scenario id');
const versionOf = (req: Request) => idParam(req, 'version', 'Version');

export function scenarioRoutes({ db }: AppDeps, route: FarmRoute): void {
  route('get', '/baseline', 'baseline:read', async (req, res) => {
    res.json(await readBaseline(db, farmAccess(req).farmId));
  });
  route('put', '/baseline', 'farm:update', async (req, res) => {
    const input = parseOrThrow(baselineBodySchema, req.body);
    res.json(await saveBaseline(db, farmAccess(req).farmId, input));
  });

  route('get', '/scenarios', 'scenario:read', async (req, res) => {
    res.json(await scenarios.listFarmScenarios(db, actorOf(req)));
  });
  route('post', '/scenarios', 'scenario:write', async (req, res) => {
    // A body carrying a document is an import; otherwise the scenario starts from the farm baseline.
    const isImport = typeof req.body === 'object' && req.body !== null && 'scenario' in req.body;
    if (isImport) {
      const input = parseOrThrow(importScenarioBodySchema, req.body);
      sendJsonText(req, res, await scenarios.importScenario(db, actorOf(req), input.scenario, input.name), 201);
    } else {
      const input = parseOrThrow(createScenarioBodySchema, req.body);
      sendJsonText(req, res, await scenarios.createFromBaseline(db, actorOf(req), input), 201);
    }
  });

  route('get', '/scenarios/:scenarioId', 'scenario:read', async (req, res) => {
    const id = scenarioIdOf(req);
    sendJsonText(req, res, await scenarios.readScenario(db, actorOf(req), id, sessionScenarioHead(req, id)));
  });
  // The yearly lines and loan payments, which GET S leaves out: the tables fetch them when shown.
  route('get', '/scenarios/:scenarioId/results/detail', 'scenario:read', async (req, res) => {
    const id = scenarioIdOf(req);
    const query = parseOrThrow(resultsDetailQuerySchema, req.query);
    sendJsonText(req, res, await scenarios.readResultsDetail(db, actorOf(req), id, query.version, sessionScenarioHead(req, id)));
  });
  route('put', '/scenarios/:scenarioId', 'scenario:write', async (req, res) => {
    const id = scenarioIdOf(req);
    const input = parseOrThrow(saveScenarioBodySchema, req.body);
    sendJsonText(req, res, await scenarios.saveScenario(db, actorOf(req), id, input.version, input.scenario, input.note));
  });
  route('delete', '/scenarios/:scenarioId', 'scenario:write', async (req, res) => {
    await scenarios.deleteScenario(db, actorOf(req), scenarioIdOf(req));
    res.status(204).end();
  });
  route('post', '/scenarios/:scenarioId/duplicate', 'scenario:write', async (req, res) => {
    const id = scenarioIdOf(req);
    const input = parseOrThrow(duplicateScenarioBodySchema, req.body ?? {});
    sendJsonText(req, res, await scenarios.duplicateScenario(db, actorOf(req), id, input.name), 201);
  });
  route('post', '/scenarios/:scenarioId/archive', 'scenario:write', async (req, res) => {
    res.json(await scenarios.archiveScenario(db, actorOf(req), scenarioIdOf(req)));
  });
  route('get', '/scenarios/:scenarioId/export.json', 'scenario:read', async (req, res) => {
    const { fileName, document } = await scenarios.exportScenario(db, actorOf(req), scenarioIdOf(req));
    res.attachment(fileName).type('application/json').send(`${JSON.stringify(document, null, 2)}\n`);
  });

  route('get', '/scenarios/:scenarioId/versions', 'scenario:read', async (req, res) => {
    res.json(await scenarios.scenarioVersions(db, actorOf(req), scenarioIdOf(req)));
  });
  // Declared before /versions/:version so "compare" is not read as a version number.
  route('get', '/scenarios/:scenarioId/versions/compare', 'scenario:read', async (req, res) => {
    const id = scenarioIdOf(req);
    const query = parseOrThrow(compareQuerySchema, req.query);
    res.json(await scenarios.compareVersions(db, actorOf(req), id, query.from, query.to, query.units));
  });
  route('get', '/scenarios/:scenarioId/versions/:version', 'scenario:read', async (req, res) => {
    sendJsonText(req, res, await scenarios.readVersion(db, actorOf(req), scenarioIdOf(req), versionOf(req)));
  });
  route('post', '/scenarios/:scenarioId/versions/:version/restore', 'scenario:write', async (req, res) => {
    const id = scenarioIdOf(req);
    const version = versionOf(req);
    const input = parseOrThrow(restoreVersionBodySchema, req.body ?? {});
    sendJsonText(req, res, await scenarios.restoreVersion(db, actorOf(req), id, version, input.version, input.note));
  });
}
