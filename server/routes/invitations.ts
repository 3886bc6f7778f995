/** /api/invitations/:token — the invitee's side: open to anyone holding the link. */
import { Router } from 'express';
import { acceptInvitationSchema } from '../../shared/schema/accounts.js';
import { tokenParamsSchema } from '../../shared/schema/requests.js';
import type { AppDeps } from '../app.js';
import { issueSession } from '../auth/session.js';
import { parseOrThrow } from '../errors.js';
import { acceptInvitation, previewInvitation } from '../services/invitations.js';
import { sessionOf } from '../services/session.js';

export function invitationRoutes({ db, config }: AppDeps): Router {
  const router = Router();

  router.get('/:token', async (req, res) => {
    const { token } = parseOrThrow(tokenParamsSchema, req.params);
    res.json(await previewInvitation(db, token));
  });

  router.post('/:token/accept', async (req, res) => {
    const { token } = parseOrThrow(tokenParamsSchema, req.params);
    const input = parseOrThrow(acceptInvitationSchema, req.body);
    const { user, farmId, created } = await acceptInvitation(db, token, req.user ?? null, input, config.bcryptCost);
    if (created) issueSession(res, req, config.jwtSecret, user.id, user.tokenVersion);
    res.status(created ? 201 : 200).json({ ...(await sessionOf(db, user)), farmId });
  });

  return router;
}
