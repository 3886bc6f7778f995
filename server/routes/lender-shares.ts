/**
 * Lender shares: the farm side (share a version, list, revoke, the lender's own shares, the
 * lender workbook download) under /api/farms/:farmId, and the link side under
 * /api/lender-shares/:token, open to anyone holding the link.
 */
import { Router, type Request } from 'express';
import { z } from 'zod';
import { acceptInvitationSchema, emailTokenSchema } from '../../shared/schema/accounts.js';
import { createShareSchema } from '../../shared/schema/lender.js';
import { idParamSchema } from '../../shared/scenario-api.js';
import type { AppDeps } from '../app.js';
import { farmAccess, farmRouter, requireUser } from '../auth/middleware.js';
import { issueSession } from '../auth/session.js';
import { AppError, parseOrThrow } from '../errors.js';
import { acceptShare, createShare, farmShares, mySharesOnFarm, previewShare, revokeFarmShare, type FarmActor } from '../services/lender-shares.js';
import { lenderWorkbook } from '../services/lender-workbook.js';
import { sessionOf } from '../services/session.js';

const tokenParams = z.object({ token: emailTokenSchema });
const scenarioFilter = z.object({ scenarioId: idParamSchema('Scenario id').optional() });

/** A numeric path parameter, or 400 naming it. */
export function pathId(req: Request, name: string, label: string): number {
  const result = idParamSchema(label).safeParse(req.params[name]);
  if (result.success) return result.data;
  const message = result.error.issues[0]?.message ?? `${label} must be a whole number`;
  throw new AppError(400, 'invalid_input', `${name}: ${message}`, { [name]: message });
}

export function farmActor(req: Request): FarmActor {
  return { farmId: farmAccess(req).farmId, user: requireUser(req) };
}

export function lenderShareRoutes({ db, mailer, config }: AppDeps): Router {
  const { router, route } = farmRouter(db);
  const ctx = { db, mailer, appOrigin: config.appOrigin };

  route('get', '/lender-shares', 'scenario:share', async (req, res) => {
    const { scenarioId } = parseOrThrow(scenarioFilter, req.query);
    res.json(await farmShares(db, farmAccess(req).farmId, scenarioId));
  });
  // Declared before /lender-shares/:shareId routes so "mine" is not read as an id.
  route('get', '/lender-shares/mine', 'review:write', async (req, res) => {
    res.json(await mySharesOnFarm(db, farmAccess(req).farmId, requireUser(req).id));
  });
  route('post', '/scenarios/:scenarioId/lender-shares', 'scenario:share', async (req, res) => {
    const scenarioId = pathId(req, 'scenarioId', 'Scenario id');
    const input = parseOrThrow(createShareSchema, req.body);
    res.status(201).json(await createShare(ctx, farmActor(req), scenarioId, input));
  });
  route('post', '/lender-shares/:shareId/revoke', 'scenario:share', async (req, res) => {
    res.json(await revokeFarmShare(db, farmActor(req), pathId(req, 'shareId', 'Share id')));
  });
  route('get', '/scenarios/:scenarioId/workbook.xlsx', 'scenario:read', async (req, res) => {
    const scenarioId = pathId(req, 'scenarioId', 'Scenario id');
    const { role } = farmAccess(req);
    const { fileName, workbook } = await lenderWorkbook(db, { ...farmActor(req), role }, scenarioId);
    res.attachment(fileName).type('application/vnd.openxmlformats-officedocument.spreadsheetml.sheet');
    await workbook.xlsx.write(res);
    res.end();
  });

  return router;
}

/** /api/lender-shares/:token — the lender's side of the e-mailed link. */
export function lenderShareLinkRoutes({ db, config }: AppDeps): Router {
  const router = Router();

  router.get('/:token', async (req, res) => {
    const { token } = parseOrThrow(tokenParams, req.params);
    res.json(await previewShare(db, token));
  });

  router.post('/:token/accept', async (req, res) => {
    const { token } = parseOrThrow(tokenParams, req.params);
    const input = parseOrThrow(acceptInvitationSchema, req.body);
    const accepted = await acceptShare(db, token, req.user ?? null, input, config.bcryptCost);
    if (accepted.created) issueSession(res, req, config.jwtSecret, accepted.user.id, accepted.user.tokenVersion);
    res.status(accepted.created ? 201 : 200).json({
      ...(await sessionOf(db, accepted.user)),
      farmId: accepted.farmId,
      scenarioId: accepted.scenarioId,
      shareId: accepted.shareId,
    });
  });

  return router;
}
