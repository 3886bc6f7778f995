/**
 * Lender shares: the farm side (share a version, list, revoke, the lender's own shares, the
 * lender workbook download) under /api/farms/:farmId, and the link side under
 * /api/lender-shares/:token, open to anyone holding the link.
 */
import { Router } from 'express';
import { acceptInvitationSchema } from '../../shared/schema/accounts.js';
import { createShareSchema } from '../../shared/schema/lender.js';
import { shareFilterQuerySchema, tokenParamsSchema } from '../../shared/schema/requests.js';
import type { AppDeps } from '../app.js';
import { actorOf, idParam } from '../http/params.js';
import { farmAccess, type FarmRoute } from '../auth/middleware.js';
import { issueSession } from '../auth/session.js';
import { parseOrThrow } from '../errors.js';
import { acceptShare, createShare, farmShares, mySharesOnFarm, previewShare, revokeFarmShare } from '../services/lender-shares.js';
import { lenderWorkbook } from '../services/lender-workbook.js';
import { sessionOf } from '../services/session.js';

export function lenderShareRoutes({ db, mailer, config }: AppDeps, route: FarmRoute): void {
  const ctx = { db, mailer, appOrigin: config.appOrigin };

  route('get', '/lender-shares', 'scenario:share', async (req, res) => {
    const { scenarioId } = parseOrThrow(shareFilterQuerySchema, req.query);
    res.json(await farmShares(db, farmAccess(req).farmId, scenarioId));
  });
  // Declared before /lender-shares/:shareId routes so "mine" is not read as an id.
  route('get', '/lender-shares/mine', 'review:write', async (req, res) => {
    const actor = actorOf(req);
    res.json(await mySharesOnFarm(db, actor.farmId, actor.userId));
  });
  route('post', '/scenarios/:scenarioId/lender-shares', 'scenario:share', async (req, res) => {
    const scenarioId = idParam(req, 'scenarioId', 'Scenario id');
    const input = parseOrThrow(createShareSchema, req.body);
    res.status(201).json(await createShare(ctx, actorOf(req), scenarioId, input));
  });
  route('post', '/lender-shares/:shareId/revoke', 'scenario:share', async (req, res) => {
    res.json(await revokeFarmShare(db, actorOf(req), idParam(req, 'shareId', 'Share id')));
  });
  route('get', '/scenarios/:scenarioId/workbook.xlsx', 'scenario:read', async (req, res) => {
    const scenarioId = idParam(req, 'scenarioId', 'Scenario id');
    const { fileName, workbook } = await lenderWorkbook(db, actorOf(req), scenarioId);
    res.attachment(fileName).type('application/vnd.openxmlformats-officedocument.spreadsheetml.sheet');
    await workbook.xlsx.write(res);
    res.end();
  });

}

/** /api/lender-shares/:token — the lender's side of the e-mailed link. */
export function lenderShareLinkRoutes({ db, config }: AppDeps): Router {
  const router = Router();

  router.get('/:token', async (req, res) => {
    const { token } = parseOrThrow(tokenParamsSchema, req.params);
    res.json(await previewShare(db, token));
  });

  router.post('/:token/accept', async (req, res) => {
    const { token } = parseOrThrow(tokenParamsSchema, req.params);
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
