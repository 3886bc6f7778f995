/**
 * Invitations by e-mail. An owner invites an address with a role; the link carries a random
 * single-use token (only its sha-256 is stored) that expires after INVITATION_LIFETIME_DAYS.
 * Accepting adds the membership to the signed-in account with that address, or signs the
 * invitee up when the address has no account yet.
 */
import type { InvitationPreview, PendingInvitation } from '../../shared/responses.js';
import type { AcceptInvitationInput, InviteInput } from '../../shared/schema/accounts.js';
import { hashToken, newEmailToken } from '../auth/tokens.js';
import type { Database } from '../db/client.js';
import { findFarm, listMembers, upsertMembership } from '../db/repositories/farms.js';
import {
  claimInvitation,
  findInvitation,
  findInvitationByTokenHash,
  insertInvitation,
  listOpenInvitations,
  renewInvitation,
  revokeInvitation,
  revokeOpenInvitationsTo,
  type Invitation,
} from '../db/repositories/invitations.js';
import { findMembership, findUserByEmail, insertUser, type User } from '../db/repositories/users.js';
import type { FarmRole } from '../db/schema/index.js';
import { AppError, conflict, notFound } from '../errors.js';
import type { Mailer } from '../mail/mailer.js';
import { invitationMail } from '../mail/templates.js';
import { assertAddressee, insertedUser, invalidLink, prepareLinkAccount } from './link-accounts.js';

export const INVITATION_LIFETIME_DAYS = 7;
const DAY_MS = 24 * 60 * 60 * 1000;

export interface InvitationContext {
  db: Database;
  mailer: Mailer;
  appOrigin: string;
}

function invitationLink(appOrigin: string, token: string): string {
  return `${appOrigin}/invitations/${encodeURIComponent(token)}`;
}

function expiryFrom(now: Date): Date {
  return new Date(now.getTime() + INVITATION_LIFETIME_DAYS * DAY_MS);
}

async function mailInvitation(ctx: InvitationContext, invitation: { farmId: number; email: string; role: FarmRole }, inviter: User, token: string): Promise<void> {
  const farm = await findFarm(ctx.db, invitation.farmId);
  if (!farm) throw notFound('Farm not found');
  await ctx.mailer.send(
    invitationMail({
      to: invitation.email,
      farmName: farm.name,
      inviterName: inviter.name,
      role: invitation.role,
      link: invitationLink(ctx.appOrigin, token),
      expiresDays: INVITATION_LIFETIME_DAYS,
    }),
  );
}

/** Invites an address; a newer invitation to the same address replaces an open one. */
/** An invitation as the owner's list shows it (never the token or its hash). */
export function invitationJson(i: Invitation): PendingInvitation {
  return { id: i.id, email: i.email, role: i.role, expiresAt: i.expiresAt.toISOString(), createdAt: i.createdAt.toISOString() };
}

export async function inviteToFarm(ctx: InvitationContext, farmId: number, inviter: User, input: InviteInput, now = new Date()): Promise<Invitation> {
  const members = await listMembers(ctx.db, farmId);
  if (members.some((m) => m.email === input.email)) {
    throw new AppError(409, 'already_member', 'This person is already a member of the farm', { email: 'Already a member of this farm' });
  }
  await revokeOpenInvitationsTo(ctx.db, farmId, input.email, now);
  const { token, hash } = newEmailToken();
  const id = await insertInvitation(ctx.db, { farmId, email: input.email, role: input.role, tokenHash: hash, invitedBy: inviter.id, expiresAt: expiryFrom(now) });
  await mailInvitation(ctx, { farmId, email: input.email, role: input.role }, inviter, token);
  const created = await findInvitation(ctx.db, farmId, id);
  if (!created) throw new Error('invitation vanished after insert');
  return created;
}

export async function openInvitations(db: Database, farmId: number, now = new Date()): Promise<Invitation[]> {
  return listOpenInvitations(db, farmId, now);
}

/** Sends a fresh link (the old one stops working) and restarts the expiry. */
export async function resendInvitation(ctx: InvitationContext, farmId: number, invitationId: number, inviter: User, now = new Date()): Promise<Invitation> {
  const invitation = await findInvitation(ctx.db, farmId, invitationId);
  if (!invitation) throw notFound('Invitation not found');
  const { token, hash } = newEmailToken();
  if (!(await renewInvitation(ctx.db, invitation.id, hash, expiryFrom(now)))) throw conflict('This invitation was already accepted or withdrawn');
  await mailInvitation(ctx, invitation, inviter, token);
  return { ...invitation, expiresAt: expiryFrom(now) };
}

export async function withdrawInvitation(db: Database, farmId: number, invitationId: number, now = new Date()): Promise<void> {
  const invitation = await findInvitation(db, farmId, invitationId);
  if (!invitation) throw notFound('Invitation not found');
  if (!(await revokeInvitation(db, invitation.id, now))) throw conflict('This invitation was already accepted or withdrawn');
}

const INVALID = {
  unknown: 'This invitation link is not valid. Check that you opened the whole link.',
  used: 'This invitation has already been accepted.',
  revoked: 'This invitation was withdrawn by the farm owner.',
  expired: 'This invitation has expired. Ask the farm owner to send it again.',
} as const;

function invalidInvitation(reason: keyof typeof INVALID): AppError {
  return invalidLink(INVALID, reason);
}

async function openInvitationByToken(db: Parameters<typeof findInvitationByTokenHash>[0], token: string, now: Date) {
  const invitation = await findInvitationByTokenHash(db, hashToken(token));
  if (!invitation) throw invalidInvitation('unknown');
  if (invitation.acceptedAt) throw invalidInvitation('used');
  if (invitation.revokedAt) throw invalidInvitation('revoked');
  if (invitation.expiresAt.getTime() <= now.getTime()) throw invalidInvitation('expired');
  return invitation;
}

/** What the accept page shows for a token; only someone holding the link learns it. */
export async function previewInvitation(db: Database, token: string, now = new Date()): Promise<InvitationPreview> {
  const invitation = await openInvitationByToken(db, token, now);
  return {
    farmName: invitation.farmName,
    role: invitation.role,
    email: invitation.email,
    inviterName: invitation.inviterName,
    expiresAt: invitation.expiresAt.toISOString(),
    accountExists: (await findUserByEmail(db, invitation.email)) !== null,
  };
}

/**
 * Accepts an invitation. Signed in: the account's address must be the invited one. Signed out:
 * creates the account (name and password in `input`) unless the address already has one.
 * Someone already on the farm keeps the role they have. Returns the user to sign in.
 */
export async function acceptInvitation(
  db: Database,
  token: string,
  caller: User | null,
  input: AcceptInvitationInput,
  cost: number,
  now = new Date(),
): Promise<{ user: User; farmId: number; created: boolean }> {
  const invitation = await openInvitationByToken(db, token, now);
  if (caller) {
    assertAddressee(caller, invitation.email, 'invitation');
    await db.transaction(async (tx) => {
      if (!(await claimInvitation(tx, invitation.id, now))) throw invalidInvitation('used');
      if (!(await findMembership(tx, invitation.farmId, caller.id))) await upsertMembership(tx, invitation.farmId, caller.id, invitation.role);
    });
    return { user: caller, farmId: invitation.farmId, created: false };
  }

  const { name, passwordHash } = await prepareLinkAccount(db, invitation.email, input, cost);
  const userId = await db.transaction(async (tx) => {
    if (!(await claimInvitation(tx, invitation.id, now))) throw invalidInvitation('used');
    const id = await insertUser(tx, { email: invitation.email, name, passwordHash });
    await upsertMembership(tx, invitation.farmId, id, invitation.role);
    return id;
  });
  return { user: await insertedUser(db, userId), farmId: invitation.farmId, created: true };
}
