/** /api/farms/:farmId/members and /invitations: who is on the farm, and the owner's invitations. */
import { changeRoleSchema, inviteSchema } from '../../shared/schema/accounts.js';
import type { AppDeps } from '../app.js';
import { idParam } from '../http/params.js';
import { farmAccess, requireUser, type FarmRoute } from '../auth/middleware.js';
import { parseOrThrow } from '../errors.js';
import { invitationJson, inviteToFarm, openInvitations, resendInvitation, withdrawInvitation } from '../services/invitations.js';
import { changeMemberRole, farmMembers, removeMember } from '../services/members.js';

export function memberRoutes({ db, mailer, config }: AppDeps, route: FarmRoute): void {
  const ctx = { db, mailer, appOrigin: config.appOrigin };

  route('get', '/members', 'members:read', async (req, res) => {
    res.json(await farmMembers(db, farmAccess(req).farmId));
  });

  route('patch', '/members/:userId', 'members:manage', async (req, res) => {
    const userId = idParam(req, 'userId', 'User id');
    const { role } = parseOrThrow(changeRoleSchema, req.body);
    await changeMemberRole(db, farmAccess(req).farmId, userId, role);
    res.json({ userId, role });
  });

  route('delete', '/members/:userId', 'members:manage', async (req, res) => {
    await removeMember(db, farmAccess(req).farmId, idParam(req, 'userId', 'User id'));
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
    const invitation = await resendInvitation(ctx, farmAccess(req).farmId, idParam(req, 'invitationId', 'Invitation id'), requireUser(req));
    res.json(invitationJson(invitation));
  });

  route('delete', '/invitations/:invitationId', 'members:manage', async (req, res) => {
    await withdrawInvitation(db, farmAccess(req).farmId, idParam(req, 'invitationId', 'Invitation id'));
    res.status(204).end();
  });
}
