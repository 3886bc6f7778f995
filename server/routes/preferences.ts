/** /api/farms/:farmId/scenarios/:scenarioId/{preferences,decision,risk-result}: parse → service → respond. */
import type { Request } from 'express';
import { decisionBodySchema, preferenceBodySchema, riskResultBodySchema } from '../../shared/schema/requests.js';
import type { AppDeps } from '../app.js';
import { actorOf, idParam } from '../http/params.js';
import { type FarmRoute } from '../auth/middleware.js';
import { parseOrThrow } from '../errors.js';
import * as preferences from '../services/preferences.js';

const scenarioIdOf = (req: Request) => idParam(req, 'scenarioId', 'Scenario id');

export function preferenceRoutes({ db }: AppDeps, route: FarmRoute): void {
  const base = '/scenarios/:scenarioId';

  route('get', `${base}/preferences`, 'preference:read', async (req, res) => {
    res.json(await preferences.readPreferences(db, actorOf(req), scenarioIdOf(req)));
  });
  route('put', `${base}/preferences/me`, 'preference:write', async (req, res) => {
    const scenarioId = scenarioIdOf(req);
    const input = parseOrThrow(preferenceBodySchema, req.body);
    res.json(await preferences.recordPreference(db, actorOf(req), scenarioId, input));
  });
  route('delete', `${base}/preferences/me`, 'preference:write', async (req, res) => {
    res.json(await preferences.withdrawPreference(db, actorOf(req), scenarioIdOf(req)));
  });
  route('post', `${base}/decision`, 'scenario:decide', async (req, res) => {
    const scenarioId = scenarioIdOf(req);
    const input = parseOrThrow(decisionBodySchema, req.body);
    res.status(201).json(await preferences.decide(db, actorOf(req), scenarioId, input));
  });
  route('get', `${base}/risk-result`, 'scenario:read', async (req, res) => {
    res.json(await preferences.readRiskResult(db, actorOf(req), scenarioIdOf(req)));
  });
  route('put', `${base}/risk-result`, 'scenario:write', async (req, res) => {
    const scenarioId = scenarioIdOf(req);
    const input = parseOrThrow(riskResultBodySchema, req.body);
    res.json(await preferences.keepRiskResult(db, actorOf(req), scenarioId, input));
  });
}
