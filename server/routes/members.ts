/** /api/farms/:farmId/members and /invitations: who is on the farm, and the owner's invitations. */
import type { Request, Router } from 'express';
import { changeRoleSchema, inviteSchema } from '../../shared/schema/accounts.js';
import type { AppDeps } from '../app.js';
import { farmAccess, farmRouter, requireUser } from '../auth/middleware.js';
import { notFound, parseOrThrow } from '../errors.js';
import { invitationJson, inviteToFarm, openInvitations, resendInvitation, withdrawInvitation } from '../services/invitations.js';
import { changeMemberRole, farmMembers, removeMember } from '../services/members.js';

/** A positive integer path parameter, or 404 (an id that cannot exist is simply not found). */
function idParam(req: Request, name: string): number {
  const value = Number(req.params[name]);
  if (!Number.isInteger(value) || value <= 0 || value > 4_294_967_295) throw notFound();
  return value;
}

export function memberRoutes({ db, mailer, config }: AppDeps): Router {
  const { router, route } = farmRouter(db);
  const ctx = { db, mailer, appOrigin: config.appOrigin };

  route('get', '/members', 'members:read', async (req, res) => {
    res.json(await farmMembers(db, farmAccess(req).farmId));
  });

  route('patch', '/members/:userId', 'members:manage', async (req, res) => {
    const userId = idParam(req, 'userId');
    const { role } = parseOrThrow(changeRoleSchema, req.body);
    await changeMemberRole(db, farmAccess(req).farmId, userId, role);
    res.json({ userId, role });
  });

  route('delete', '/members/:userId', 'members:manage', async (req, res) => {
    await removeMember(db, farmAccess(req).farmId, idParam(req, 'userId'));
    res.status(204).end();
  });

  route('get', '/invitations', 'members:manage', async (req, res) => {
    res.json((await openInvitations(db, farmAccess(req).farmId)).map(invitationJson));
  });

  route('post', '/invitations', 'members:manage', async (req, res) => {
    const input = parseOrThrow(inviteSchema, req.body);
    const invitation = await inviteToFarm(ctx, farmAccess(req).farmId, requireUser(req), input);
    res.status(201).json(invitationJson(invitation));
  });

  route('post', '/invitations/:invitationId/resend', 'members:manage', async (req, res) => {
    const invitation = await resendInvitation(ctx, farmAccess(req).farmId, idParam(req, 'invitationId'), requireUser(req));
    res.json(invitationJson(invitation));
  });

  route('delete', '/invitations/:invitationId', 'members:manage', async (req, res) => {
    await withdrawInvitation(db, farmAccess(req).farmId, idParam(req, 'invitationId'));
    res.status(204).end();
  });

  return router;
}
