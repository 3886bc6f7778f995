/**
 * Lender shares: an owner or consultant shares one scenario version with a lender by e-mail.
 * The link carries a random single-use token (only its sha-256 is stored); using it signs the
 * lender up or in and adds them to the farm as a lender, who then reads that version only, until
 * the share is revoked or its expiry date comes. Sharing a newer version is a new share; the old
 * one keeps pointing at the version it was given.
 */
import type { ErrorCode, ShareView } from '../../shared/responses.js';
import type { AcceptInvitationInput } from '../../shared/schema/accounts.js';
import { MAX_SHARE_DAYS, utcDate, utcDatePlusDays, type SharePreview } from '../../shared/schema/lender.js';
import type { z } from 'zod';
import type { createShareSchema } from '../../shared/schema/lender.js';
import { hashToken, newEmailToken } from '../auth/tokens.js';
import type { Database } from '../db/client.js';
import { findFarm, listMembers, upsertMembership } from '../db/repositories/farms.js';
import { claimShareToken, findShare, findShareByTokenHash, findOpenShareTo, insertShare, listShares, revokeShare, type ShareRecord } from '../db/repositories/lender.js';
import { findScenario, findVersion } from '../db/repositories/scenarios.js';
import { findMembership, findUserByEmail, insertUser, type User } from '../db/repositories/users.js';
import { AppError, notFound } from '../errors.js';
import { lenderShareMail } from '../mail/lender-templates.js';
import type { Mailer } from '../mail/mailer.js';
import { recordAudit } from './audit.js';
import { liveSharesOf, shareState } from './lender-access.js';
import type { Actor } from './access.js';
import { assertAddressee, insertedUser, invalidLink, prepareLinkAccount } from './link-accounts.js';

export interface LenderContext {
  db: Database;
  mailer: Mailer;
  appOrigin: string;
}

export type { ShareView };

/** The API shape of a share on `now`. */
export function toShareView(share: ShareRecord, now = new Date()): ShareView {
  return {
    id: share.id,
    scenarioId: share.scenarioId,
    scenarioName: share.scenarioName,
    version: share.version,
    lenderEmail: share.lenderEmail,
    lenderName: share.lenderName,
    state: shareState(share, now),
    expiresOn: share.expiresOn,
    acceptedAt: share.tokenUsedAt?.toISOString() ?? null,
    revokedAt: share.revokedAt?.toISOString() ?? null,
    reviewStatus: share.reviewStatus,
    reviewStatusAt: share.reviewStatusAt?.toISOString() ?? null,
    reviewStatusBy: share.reviewStatusByName,
    sharedBy: share.createdByName,
    createdAt: share.createdAt.toISOString(),
  };
}

function shareLink(appOrigin: string, token: string): string {
  return `${appOrigin}/lender-shares/${encodeURIComponent(token)}`;
}

const badField = (field: string, message: string, status = 400, code: ErrorCode = 'invalid_input') => new AppError(status, code, `${field}: ${message}`, { [field]: message });

/** The short words the audit log uses for a share's subject. */
export function shareSubject(share: Pick<ShareRecord, 'scenarioName' | 'version' | 'lenderEmail'>): string {
  return `"${share.scenarioName}" version ${share.version} with ${share.lenderEmail}`;
}

/**
 * Shares `input.version` (default the latest) of a scenario with a lender and e-mails the link.
 * Refuses an address that is already a member in another role (they see every scenario anyway),
 * an expiry not after today or more than MAX_SHARE_DAYS ahead, and a second open share of the
 * same version to the same address.
 */
export async function createShare(
  ctx: LenderContext,
  actor: Actor,
  scenarioId: number,
  input: z.output<typeof createShareSchema>,
  now = new Date(),
): Promise<ShareView> {
  const scenario = await findScenario(ctx.db, actor.farmId, scenarioId);
  if (!scenario) throw notFound('Scenario not found');
  const version = input.version ?? scenario.version;
  if (!(await findVersion(ctx.db, scenarioId, version))) throw badField('version', `This scenario has no version ${version}`);
  const today = utcDate(now);
  if (input.expiresOn <= today) throw badField('expiresOn', 'Choose an expiry date after today');
  if (input.expiresOn > utcDatePlusDays(now, MAX_SHARE_DAYS)) throw badField('expiresOn', `A share can run at most ${MAX_SHARE_DAYS} days; share again later`);

  const member = (await listMembers(ctx.db, actor.farmId)).find((m) => m.email === input.email);
  if (member && member.role !== 'lender') {
    throw badField('email', `Already a member of this farm as ${member.role}, who sees every scenario`, 409, 'already_member');
  }
  const open = (await findOpenShareTo(ctx.db, actor.farmId, scenarioId, version, input.email)).filter((s) => ['pending', 'live'].includes(shareState(s, now)));
  if (open.length > 0) throw badField('email', `Version ${version} is already shared with this address; revoke that share first to send a new link`, 409, 'already_shared');

  const farm = await findFarm(ctx.db, actor.farmId);
  if (!farm) throw notFound('Farm not found');
  const { token, hash } = newEmailToken();
  const id = await ctx.db.transaction(async (tx) => {
    const shareId = await insertShare(tx, { farmId: actor.farmId, scenarioId, version, lenderEmail: input.email, tokenHash: hash, expiresOn: input.expiresOn, createdBy: actor.userId });
    await recordAudit(tx, { farmId: actor.farmId, userId: actor.userId, name: actor.name }, 'share.created', shareSubject({ scenarioName: scenario.name, version, lenderEmail: input.email }), {
      shareId,
      scenarioId,
      version,
      lenderEmail: input.email,
      expiresOn: input.expiresOn,
    });
    return shareId;
  });
  await ctx.mailer.send(
    lenderShareMail({
      to: input.email,
      farmName: farm.name,
      scenarioName: scenario.name,
      version,
      sharerName: actor.name,
      expiresOn: input.expiresOn,
      ...(input.message ? { message: input.message } : {}),
      link: shareLink(ctx.appOrigin, token),
    }),
  );
  const created = await findShare(ctx.db, actor.farmId, id);
  if (!created) throw new Error('share vanished after insert');
  return toShareView(created, now);
}

/** The farm's shares (optionally of one scenario), newest first, with their state on `now`. */
export async function farmShares(db: Database, farmId: number, scenarioId?: number, now = new Date()): Promise<ShareView[]> {
  return (await listShares(db, farmId, scenarioId)).map((s) => toShareView(s, now));
}

/** The live shares the calling lender holds on this farm: their home screen. */
export async function mySharesOnFarm(db: Database, farmId: number, userId: number, now = new Date()): Promise<ShareView[]> {
  return (await liveSharesOf(db, farmId, userId, now)).map((s) => toShareView(s, now));
}

/** Revokes a share: the lender's next request no longer sees the version. */
export async function revokeFarmShare(db: Database, actor: Actor, shareId: number, now = new Date()): Promise<ShareView> {
  const share = await findShare(db, actor.farmId, shareId);
  if (!share) throw notFound('Share not found');
  await db.transaction(async (tx) => {
    if (!(await revokeShare(tx, shareId, now))) throw new AppError(409, 'already_revoked', 'This share was already revoked');
    await recordAudit(tx, { farmId: actor.farmId, userId: actor.userId, name: actor.name }, 'share.revoked', shareSubject(share), { shareId, scenarioId: share.scenarioId, version: share.version });
  });
  const revoked = await findShare(db, actor.farmId, shareId);
  if (!revoked) throw notFound('Share not found');
  return toShareView(revoked, now);
}

const INVALID = {
  unknown: 'This link is not valid. Check that you opened the whole link.',
  used: 'This link has already been used. Sign in to see what is shared with you.',
  revoked: 'The farm has withdrawn this share.',
  expired: 'This share has expired. Ask the farm to share the scenario again.',
} as const;

function invalidShareLink(reason: keyof typeof INVALID): AppError {
  return invalidLink(INVALID, reason);
}

async function openShareByToken(db: Database, token: string, now: Date) {
  const share = await findShareByTokenHash(db, hashToken(token));
  if (!share) throw invalidShareLink('unknown');
  const state = shareState(share, now);
  if (state === 'revoked') throw invalidShareLink('revoked');
  if (state === 'expired') throw invalidShareLink('expired');
  if (share.tokenUsedAt) throw invalidShareLink('used');
  return share;
}


/** What the accept page shows for a link; only someone holding the link learns it. */
export async function previewShare(db: Database, token: string, now = new Date()): Promise<SharePreview> {
  const share = await openShareByToken(db, token, now);
  return {
    farmName: share.farmName,
    scenarioName: share.scenarioName,
    version: share.version,
    email: share.lenderEmail,
    sharedBy: share.createdByName,
    expiresOn: share.expiresOn,
    accountExists: (await findUserByEmail(db, share.lenderEmail)) !== null,
  };
}

/**
 * Uses a share link. Signed in: the account's address must be the one shared with. Signed out:
 * creates the account (name and password in `input`) unless the address has one. The account
 * joins the farm as a lender unless it is a member already. Returns the user to sign in.
 */
export async function acceptShare(
  db: Database,
  token: string,
  caller: User | null,
  input: AcceptInvitationInput,
  bcryptCost: number,
  now = new Date(),
): Promise<{ user: User; farmId: number; scenarioId: number; shareId: number; created: boolean }> {
  const share = await openShareByToken(db, token, now);
  const audit = (tx: Parameters<Parameters<Database['transaction']>[0]>[0], user: { id: number; name: string }) =>
    recordAudit(tx, { farmId: share.farmId, userId: user.id, name: user.name }, 'share.accepted', shareSubject(share), { shareId: share.id, scenarioId: share.scenarioId, version: share.version });
  const result = { farmId: share.farmId, scenarioId: share.scenarioId, shareId: share.id };

  if (caller) {
    assertAddressee(caller, share.lenderEmail, 'share');
    await db.transaction(async (tx) => {
      if (!(await claimShareToken(tx, share.id, caller.id, now))) throw invalidShareLink('used');
      if (!(await findMembership(tx, share.farmId, caller.id))) await upsertMembership(tx, share.farmId, caller.id, 'lender');
      await audit(tx, caller);
    });
    return { user: caller, ...result, created: false };
  }

  const { name, passwordHash } = await prepareLinkAccount(db, share.lenderEmail, input, bcryptCost);
  const userId = await db.transaction(async (tx) => {
    const id = await insertUser(tx, { email: share.lenderEmail, name, passwordHash });
    if (!(await claimShareToken(tx, share.id, id, now))) throw invalidShareLink('used');
    await upsertMembership(tx, share.farmId, id, 'lender');
    await audit(tx, { id, name });
    return id;
  });
  return { user: await insertedUser(db, userId), ...result, created: true };
}
