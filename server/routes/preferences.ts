/** /api/farms/:farmId/scenarios/:scenarioId/{preferences,decision,risk-result}: parse → service → respond. */
import type { Request, Router } from 'express';
import { z } from 'zod';
import type { AppDeps } from '../app.js';
import { actorOf, idParam } from '../http/params.js';
import { farmRouter } from '../auth/middleware.js';
import { parseOrThrow } from '../errors.js';
import * as preferences from '../services/preferences.js';

const optionId = z.string({ error: 'Option must be text' }).trim().min(1, 'Option must be chosen').max(60, 'Option id must be at most 60 characters');

export const preferenceBodySchema = z.object({
  optionId,
  reason: z.string({ error: 'Reason must be text' }).trim().max(500, 'Reason must be at most 500 characters').default(''),
});

export const decisionBodySchema = z.object({
  optionId,
  note: z.string({ error: 'Note must be text' }).trim().max(500, 'Note must be at most 500 characters').default(''),
});

const finite = (label: string) => z.number({ error: `${label} must be a number` }).finite(`${label} must be a finite number`);

/** A Monte Carlo result as the shared core returns it; checked for shape, kept whole. */
export const riskResultBodySchema = z.object({
  scenarioVersion: z.number({ error: 'Scenario version must be a number' }).int('Scenario version must be a whole number').min(1, 'Scenario version must be at least 1'),
  result: z.looseObject({
    seed: finite('Result seed'),
    drawsRequested: finite('Result draws requested'),
    drawsDone: finite('Result draws done'),
    cancelled: z.boolean({ error: 'Result cancelled must be true or false' }),
    coverageThreshold: finite('Result coverage threshold'),
    options: z.array(z.looseObject({ optionId: z.string({ error: 'Result option id must be text' }) })).min(1, 'Result options must not be empty').max(12, 'Result options: at most 12'),
  }),
});

const scenarioIdOf = (req: Request) => idParam(req, 'scenarioId', 'Scenario id');

export function preferenceRoutes({ db }: AppDeps): Router {
  const { router, route } = farmRouter(db);
  const base = '/scenarios/:scenarioId';

  route('get', `${base}/preferences`, 'preference:read', async (req, res) => {
    res.json(await preferences.readPreferences(db, actorOf(req), scenarioIdOf(req)));
  });
  route('put', `${base}/preferences/me`, 'preference:write', async (req, res) => {
    const input = parseOrThrow(preferenceBodySchema, req.body);
    res.json(await preferences.recordPreference(db, actorOf(req), scenarioIdOf(req), input));
  });
  route('delete', `${base}/preferences/me`, 'preference:write', async (req, res) => {
    res.json(await preferences.withdrawPreference(db, actorOf(req), scenarioIdOf(req)));
  });
  route('post', `${base}/decision`, 'scenario:decide', async (req, res) => {
    const input = parseOrThrow(decisionBodySchema, req.body);
    res.status(201).json(await preferences.decide(db, actorOf(req), scenarioIdOf(req), input));
  });
  route('get', `${base}/risk-result`, 'scenario:read', async (req, res) => {
    res.json(await preferences.readRiskResult(db, actorOf(req), scenarioIdOf(req)));
  });
  route('put', `${base}/risk-result`, 'scenario:write', async (req, res) => {
    const input = parseOrThrow(riskResultBodySchema, req.body);
    res.json(await preferences.keepRiskResult(db, actorOf(req), scenarioIdOf(req), input));
  });
  return router;
}
